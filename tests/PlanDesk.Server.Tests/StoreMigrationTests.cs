using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;

namespace PlanDesk.Server.Tests;

public sealed class StoreMigrationTests
{
    [Theory, OnSqlite, OnPostgres]
    public async Task MigratingAgainAtEveryStartAppliesEachStepOnce(StoreKind kind)
    {
        using var database = TestDatabase.Create(kind);
        var store = database.Settings.CreateStore();

        await store.MigrateAsync();
        await store.MigrateAsync();

        Assert.Equal(Migrations.All.Select(m => m.Version), await store.AppliedMigrationsAsync());
        (store as IDisposable)?.Dispose();
    }

    [PostgresFact]
    public async Task ServersStartingAtOnceOnOnePostgresDatabaseMigrateItOnce()
    {
        using var database = TestDatabase.Create(StoreKind.Postgres);
        var stores = Enumerable.Range(0, 4).Select(_ => database.Settings.CreateStore()).ToList();

        await Task.WhenAll(stores.Select(s => s.MigrateAsync()));

        Assert.Equal(Migrations.All.Select(m => m.Version), await stores[0].AppliedMigrationsAsync());
        stores.ForEach(s => (s as IDisposable)?.Dispose());
    }
}
