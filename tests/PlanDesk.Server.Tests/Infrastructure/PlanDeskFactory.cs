using System.Net.Http.Headers;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using NodaTime;
using NodaTime.Testing;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>
/// The service in memory on a test database, with the planner and checker replaced by fakes and
/// the clock fixed at 2027-03-27 12:00 UTC (so actuals for 2027-03-26 are in the past).
/// </summary>
/// <param name="realEngine">Keep the real planner, checker and baseline (the clock stays fixed).</param>
public sealed class PlanDeskFactory(TestDatabase database, bool realEngine = false) : WebApplicationFactory<Program>
{
    public static readonly Instant Now = Instant.FromUtc(2027, 3, 27, 12, 0);

    public FakeSolver Solver { get; } = new();
    public FakeClock Clock { get; } = new(Now);
    public IPlanDeskStore Store => Services.GetRequiredService<IPlanDeskStore>();
    public TestDatabase Database => database;

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Production");
        if (database.Settings.PostgresConnection is { } connection)
        {
            builder.UseSetting(StoreSettings.PostgresKey, connection);
        }
        else
        {
            builder.UseSetting(StoreSettings.DataDirectoryKey, database.Settings.DataDirectory);
        }
        builder.ConfigureTestServices(services =>
        {
            services.Replace(ServiceDescriptor.Singleton<IClock>(Clock));
            if (!realEngine)
            {
                services.Replace(ServiceDescriptor.Singleton<IPlanSolver>(Solver));
                services.Replace(ServiceDescriptor.Singleton<IPlanReviewer>(new FakeReviewer()));
            }
        });
    }

    /// <summary>A client sending <paramref name="key"/> as a bearer token, or no key when null.</summary>
    public HttpClient ClientWith(string? key)
    {
        var client = CreateClient();
        if (key is not null)
        {
            client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        }
        return client;
    }

    public async Task<string> AddKeyAsync(Role role, string? plantId = null)
    {
        var (key, record) = ApiKeys.Create(role, plantId, "test", Clock.GetCurrentInstant());
        await Store.AddKeyAsync(record);
        return key;
    }
}
