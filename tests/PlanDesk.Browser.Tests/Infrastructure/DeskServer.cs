using System.Net;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using NodaTime;
using NodaTime.Testing;
using PlanDesk.Server;
using PlanDesk.Server.Store;

namespace PlanDesk.Browser.Tests.Infrastructure;

/// <summary>
/// The whole service as `plandesk serve` runs it (real planner, checker and sheet builder, SQLite store in a
/// temporary folder), listening with Kestrel on a free loopback port so a browser can reach it. The clock stands
/// at <see cref="Now"/>: Sunday 2027-03-28 12:00 in Madrid, a spring-forward day of 23 hours.
/// </summary>
public sealed class DeskServer : WebApplicationFactory<Program>
{
    public static readonly Instant Now = Instant.FromUtc(2027, 3, 28, 10, 0);

    private readonly DirectoryInfo dataDirectory = Directory.CreateTempSubdirectory("plandesk-browser-");

    public DeskServer()
    {
        UseKestrel(options => options.Listen(IPAddress.Loopback, 0));
        StartServer();
        var addresses = Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses;
        BaseAddress = new Uri(addresses.Single());
    }

    /// <summary>Where the desk is served, e.g. http://127.0.0.1:41235/.</summary>
    public Uri BaseAddress { get; }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Production");
        builder.UseSetting(StoreSettings.DataDirectoryKey, dataDirectory.FullName);
        builder.ConfigureTestServices(services => services.Replace(ServiceDescriptor.Singleton<IClock>(new FakeClock(Now))));
    }

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
        {
            try
            {
                dataDirectory.Delete(recursive: true);
            }
            catch (IOException)
            {
                // A SQLite file still held open by a closing connection; the temp folder is cleaned by the OS.
            }
        }
    }
}
