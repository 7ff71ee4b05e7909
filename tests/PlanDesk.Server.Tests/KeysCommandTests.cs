using System.Net;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;

namespace PlanDesk.Server.Tests;

/// <summary><c>plandesk keys add | list | revoke</c> on the store a server uses.</summary>
public sealed class KeysCommandTests
{
    [Fact]
    public async Task APrintedKeyOpensTheApiIsStoredOnlyAsItsHashAndStopsWorkingWhenRevoked()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);
        var dir = database.DataDirectory!;

        var (added, key, note) = await ChildServer.RunAsync("keys", "add", "--role", "viewer", "--label", "wall screen", "--data-dir", dir);
        key = key.Trim();
        var keyId = ApiKeys.KeyIdOf(key)!;
        var (listed, list, _) = await ChildServer.RunAsync("keys", "list", "--data-dir", dir);

        Assert.Equal(0, added);
        Assert.Contains("shown only now", note);
        Assert.Equal(0, listed);
        Assert.Contains(list.Split('\n'), l => l.StartsWith(keyId) && l.Contains("viewer") && l.Contains("wall screen"));
        Assert.DoesNotContain(key, list);
        var stored = (await database.Settings.CreateStore().FindKeyAsync(keyId))!;
        Assert.Equal(ApiKeys.Hash(key), stored.KeyHash);
        Assert.DoesNotContain(key, File.ReadAllText(Path.Combine(dir, SqliteStore.FileName)));

        await using var factory = new PlanDeskFactory(database);
        Assert.Equal(HttpStatusCode.OK, (await factory.ClientWith(key).GetAsync("/api/networks")).StatusCode);
        var (revoked, _, _) = await ChildServer.RunAsync("keys", "revoke", keyId, "--data-dir", dir);
        Assert.Equal(0, revoked);
        Assert.Equal(HttpStatusCode.Unauthorized, (await factory.ClientWith(key).GetAsync("/api/networks")).StatusCode);
    }

    [Fact]
    public async Task APlantKeyWithoutItsPlantIsRefusedWithTheFix()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);

        var (exit, output, errors) = await ChildServer.RunAsync("keys", "add", "--role", "plant", "--data-dir", database.DataDirectory!);

        Assert.Equal(2, exit);
        Assert.Equal("", output.Trim());
        Assert.Contains("a plant key needs the plant it is for", errors);
    }

    [Fact]
    public async Task RevokingAnUnknownKeyFailsWithAMessage()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);

        var (exit, _, errors) = await ChildServer.RunAsync("keys", "revoke", "0123456789", "--data-dir", database.DataDirectory!);

        Assert.Equal(1, exit);
        Assert.Contains("there is no key '0123456789'", errors);
    }
}
