using PlanDesk.Server.Store;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>One test's own service on the given store: the two-plant network uploaded, a scheduler and an 'ashby'
/// plant key, and, when asked, a plan published for <see cref="TestApi.Day"/>.</summary>
public sealed class Served : IAsyncDisposable
{
    private readonly TestDatabase database;

    private Served(TestDatabase database)
    {
        this.database = database;
        Factory = new PlanDeskFactory(database);
    }

    public PlanDeskFactory Factory { get; }
    public HttpClient Scheduler { get; private set; } = null!;
    public HttpClient Plant { get; private set; } = null!;

    public static async Task<Served> StartAsync(StoreKind kind, bool publishDay = true)
    {
        var served = new Served(TestDatabase.Create(kind));
        served.Scheduler = served.Factory.ClientWith(await served.Factory.AddKeyAsync(Role.Scheduler));
        served.Plant = served.Factory.ClientWith(await served.Factory.AddKeyAsync(Role.Plant, "ashby"));
        await UploadNetworkAsync(served.Scheduler);
        if (publishDay)
        {
            await PublishAsync(served.Scheduler, await SolveAsync(served.Scheduler, Day));
        }
        return served;
    }

    public async ValueTask DisposeAsync()
    {
        await Factory.DisposeAsync();
        database.Dispose();
    }
}
