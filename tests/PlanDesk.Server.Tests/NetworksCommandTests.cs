using System.Net;
using System.Text.Json;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;

namespace PlanDesk.Server.Tests;

/// <summary><c>plandesk networks add</c>: a network whose series are CSV files reaches the service inline.</summary>
public sealed class NetworksCommandTests
{
    private static string DemoRegion => Path.Combine(Repository.Root, "networks", "demo-region.json");

    [Fact]
    public async Task DemoRegionWithCsvSeriesIsStoredInlineAndServedWithItsPlants()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);
        var dir = database.DataDirectory!;

        var (exit, output, errors) = await ChildServer.RunAsync("networks", "add", DemoRegion, "--data-dir", dir);

        Assert.True(exit == 0, errors);
        Assert.Contains("Network 'demo-region' version 1", output);
        await using var factory = new PlanDeskFactory(database);
        var viewer = factory.ClientWith(await factory.AddKeyAsync(Role.Viewer));
        var response = await viewer.GetAsync("/api/networks/demo-region/versions/1");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var body = await response.Content.ReadAsStringAsync();
        // The stored document carries no CSV reference: every series travelled inline.
        Assert.DoesNotContain(".csv", body);
        using var json = JsonDocument.Parse(body);
        var plants = json.RootElement.GetProperty("version").GetProperty("plants").EnumerateArray().Select(p => p.GetProperty("plantId").GetString()).ToList();
        Assert.Equal(["ambrook", "dunmarrow", "tessford", "whinlow"], plants.Order().ToList());
    }

    [Fact]
    public async Task ABrokenNetworkIsNotStoredAndEveryProblemIsNamed()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);
        var broken = Path.Combine(database.DataDirectory!, "broken.json");
        File.WriteAllText(broken, File.ReadAllText(DemoRegion).Replace("\"timeZone\": \"Europe/Madrid\"", "\"timeZone\": \"Europe/Nowhere\""));

        var (exit, _, errors) = await ChildServer.RunAsync("networks", "add", broken, "--data-dir", database.DataDirectory!);

        Assert.Equal(1, exit);
        Assert.Contains("Europe/Nowhere", errors);
        Assert.Contains("was not stored", errors);
        var store = database.Settings.CreateStore();
        await store.MigrateAsync();
        Assert.Empty(await store.ListNetworkVersionsAsync());
    }
}
