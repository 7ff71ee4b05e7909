using System.CommandLine;
using System.Diagnostics;
using System.Net;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.DependencyInjection;
using NodaTime;
using PlanDesk.Cli.LoadTest;
using PlanDesk.Core.Loading;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;

namespace PlanDesk.Cli;

/// <summary>
/// <c>plandesk loadtest</c>: simulated plant controllers polling their targets (with ETags), acknowledging new
/// versions and reporting actuals against a server on this machine, for a fixed time. Prints throughput and
/// latency percentiles. Only loopback addresses are accepted.
/// </summary>
internal static class LoadTestCommand
{
    public static Command Create()
    {
        var controllers = new Option<int>("--controllers") { Description = "Simulated plant controllers, 1 to 500.", DefaultValueFactory = _ => 20 };
        var seconds = new Option<int>("--seconds") { Description = "How long the load runs, 1 to 600 s.", DefaultValueFactory = _ => 30 };
        var thinkMs = new Option<int>("--think-ms") { Description = "Pause of each controller between polls, ms (0: as fast as answers come).", DefaultValueFactory = _ => 0 };
        var actualsEvery = new Option<int>("--actuals-every") { Description = "Each controller reports an hour of actuals every this many polls.", DefaultValueFactory = _ => 10 };
        var network = new Option<FileInfo>("--network") { Description = "Network file to upload, solve and publish (series inline).", DefaultValueFactory = _ => new FileInfo("networks/quickstart.json") };
        var url = new Option<string?>("--url") { Description = "A running server on this machine (http://127.0.0.1:PORT); without it a temporary server is started." };
        var key = new Option<string?>("--key") { Description = "A scheduler key of the server given by --url." };
        var postgres = new Option<string?>("--postgres")
        {
            Description = "Run the temporary server on this PostgreSQL database (in a schema of its own, dropped afterwards) instead of SQLite.",
        };
        var command = new Command("loadtest", "Load the target service with simulated plant controllers on this machine and report throughput and latency.")
        {
            controllers, seconds, thinkMs, actualsEvery, network, url, key, postgres,
        };
        AddRange(controllers, 1, 500);
        AddRange(seconds, 1, 600);
        AddRange(thinkMs, 0, 60_000);
        AddRange(actualsEvery, 1, 1_000_000);
        url.Validators.Add(result =>
        {
            if (result.GetValueOrDefault<string?>() is { } address && !IsLoopback(address))
            {
                result.AddError($"--url {address} is not a loopback address; the load test only runs against this machine (http://127.0.0.1:PORT).");
            }
        });
        command.Validators.Add(result =>
        {
            if (result.GetResult(url) is not null && result.GetResult(key) is null)
            {
                result.AddError("--url needs --key with a scheduler key of that server.");
            }
        });
        command.SetAction(async (parse, stop) =>
        {
            var file = parse.GetValue(network)!;
            var loaded = NetworkLoader.Load(file.FullName);
            if (loaded.Network is null)
            {
                await Console.Error.WriteLineAsync($"loadtest: {file.FullName} has problems:\n  {string.Join("\n  ", loaded.Problems)}");
                return 1;
            }
            var settings = new LoadSettings(parse.GetValue(controllers), TimeSpan.FromSeconds(parse.GetValue(seconds)),
                TimeSpan.FromMilliseconds(parse.GetValue(thinkMs)), parse.GetValue(actualsEvery));
            try
            {
                if (parse.GetValue(url) is { } address)
                {
                    return await RunAsync(new Uri(address), parse.GetValue(key)!, loaded.Network, File.ReadAllText(file.FullName), settings, stop);
                }
                return await RunSelfHostedAsync(parse.GetValue(postgres), loaded.Network, File.ReadAllText(file.FullName), settings, stop);
            }
            catch (LoadTestException problem)
            {
                await Console.Error.WriteLineAsync($"loadtest: {problem.Message}");
                return 1;
            }
        });
        return command;
    }

    private static void AddRange(Option<int> option, int least, int most) => option.Validators.Add(result =>
    {
        var value = result.GetValueOrDefault<int>();
        if (value < least || value > most)
        {
            result.AddError($"{option.Name} is {value}; give {least} to {most}.");
        }
    });

    private sealed record LoadSettings(int Controllers, TimeSpan Duration, TimeSpan Think, int ActualsEvery);

    private static async Task<int> RunSelfHostedAsync(string? postgres, Core.Model.Network network, string networkJson, LoadSettings settings, CancellationToken stop)
    {
        var directory = Path.Combine(Path.GetTempPath(), "plandesk-loadtest-" + Guid.NewGuid().ToString("N"));
        await using var schema = postgres is null ? null : await TemporarySchema.CreateAsync(postgres);
        string[] store = schema is null
            ? ["--" + StoreSettings.DataDirectoryKey, directory]
            : ["--" + StoreSettings.PostgresKey, schema.ConnectionString];
        var app = PlanDesk.Server.Program.Create([.. store, "--urls", "http://127.0.0.1:0", "--Logging:LogLevel:Default", "Warning"]);
        try
        {
            await app.StartAsync(stop);
            var address = new Uri(app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First());
            var (key, record) = ApiKeys.Create(Role.Scheduler, null, "load test", SystemClock.Instance.GetCurrentInstant());
            await app.Services.GetRequiredService<IPlanDeskStore>().AddKeyAsync(record);
            Console.WriteLine($"temporary server at {address} with its store in {app.Services.GetRequiredService<IPlanDeskStore>().Description}");
            return await RunAsync(address, key, network, networkJson, settings, stop);
        }
        finally
        {
            await app.StopAsync(CancellationToken.None);
            await app.DisposeAsync();
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            if (Directory.Exists(directory))
            {
                Directory.Delete(directory, recursive: true);
            }
        }
    }

    private static async Task<int> RunAsync(Uri address, string schedulerKey, Core.Model.Network network, string networkJson, LoadSettings settings, CancellationToken stop)
    {
        using var handler = new SocketsHttpHandler { MaxConnectionsPerServer = settings.Controllers + 2, PooledConnectionLifetime = TimeSpan.FromMinutes(10) };
        using var scheduler = Client(handler, address, schedulerKey);
        var prepared = await LoadTestSetup.PrepareAsync(scheduler, network, networkJson, Console.Out, stop);
        var recorder = new LatencyRecorder();
        // Hours well in the past by the server's clock.
        var firstHour = Instant.FromUnixTimeSeconds(SystemClock.Instance.GetCurrentInstant().ToUnixTimeSeconds() / 3600 * 3600) - Duration.FromDays(30);
        using var timer = CancellationTokenSource.CreateLinkedTokenSource(stop);
        var clients = new List<HttpClient>();
        var runs = new List<Task>();
        Console.WriteLine($"{settings.Controllers} controllers for {settings.Duration.TotalSeconds:0} s against {address} (think {settings.Think.TotalMilliseconds:0} ms, actuals every {settings.ActualsEvery} polls) ...");
        var clock = Stopwatch.StartNew();
        timer.CancelAfter(settings.Duration);
        for (var i = 0; i < settings.Controllers; i++)
        {
            var (plantId, plantKey) = prepared.PlantKeys[i % prepared.PlantKeys.Count];
            var client = Client(handler, address, plantKey);
            clients.Add(client);
            var controller = new SimulatedController(client, plantId, prepared.Date, settings.ActualsEvery, settings.Think, recorder);
            runs.Add(controller.RunAsync(firstHour, timer.Token));
        }
        await Task.WhenAll(runs);
        var elapsed = clock.Elapsed;
        clients.ForEach(c => c.Dispose());
        Console.WriteLine();
        Console.WriteLine($"{recorder.TotalRequests} requests in {elapsed.TotalSeconds:0.0} s: {recorder.TotalRequests / elapsed.TotalSeconds:0} per second, {recorder.TotalErrors} errors");
        Console.WriteLine(recorder.Report(elapsed));
        return recorder.TotalErrors == 0 ? 0 : 1;
    }

    private static HttpClient Client(HttpMessageHandler handler, Uri address, string key)
    {
        var client = new HttpClient(handler, disposeHandler: false) { BaseAddress = address, Timeout = TimeSpan.FromSeconds(30) };
        client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", key);
        return client;
    }

    private static bool IsLoopback(string address) =>
        Uri.TryCreate(address, UriKind.Absolute, out var uri) && uri.Scheme == Uri.UriSchemeHttp &&
        (uri.IsLoopback || (IPAddress.TryParse(uri.Host, out var ip) && IPAddress.IsLoopback(ip)));
}
