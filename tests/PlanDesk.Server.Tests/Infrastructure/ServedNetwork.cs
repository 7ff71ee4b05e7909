using PlanDesk.Server.Store;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>A running service with the two-plant network uploaded, one plan solved and published for
/// <see cref="TestApi.Day"/>, and a key of every kind: shared by tests that only read it or add to it.</summary>
public sealed class ServedNetwork : IAsyncLifetime
{
    private readonly TestDatabase database = TestDatabase.Create(StoreKind.Sqlite);

    public PlanDeskFactory Factory { get; private set; } = null!;
    public long PlanId { get; private set; }
    public long PublicationId { get; private set; }
    public Dictionary<Caller, string?> Keys { get; } = new();

    public async Task InitializeAsync()
    {
        Factory = new PlanDeskFactory(database);
        Keys[Caller.None] = null;
        Keys[Caller.Viewer] = await Factory.AddKeyAsync(Role.Viewer);
        Keys[Caller.OtherPlant] = await Factory.AddKeyAsync(Role.Plant, "brindle");
        Keys[Caller.Plant] = await Factory.AddKeyAsync(Role.Plant, "ashby");
        Keys[Caller.Scheduler] = await Factory.AddKeyAsync(Role.Scheduler);
        var scheduler = Client(Caller.Scheduler);
        await UploadNetworkAsync(scheduler);
        PlanId = await SolveAsync(scheduler, Day);
        PublicationId = (await PublishAsync(scheduler, PlanId)).PublicationId;
    }

    public HttpClient Client(Caller caller) => Factory.ClientWith(Keys[caller]);

    public Task DisposeAsync()
    {
        Factory.Dispose();
        database.Dispose();
        return Task.CompletedTask;
    }
}

/// <summary>Who calls: no key, a viewer, the key of a plant other than the one in the URL, that plant's key, a scheduler.</summary>
public enum Caller
{
    None,
    Viewer,
    OtherPlant,
    Plant,
    Scheduler,
}
