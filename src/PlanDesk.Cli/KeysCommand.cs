using System.CommandLine;
using System.Data.Common;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;

namespace PlanDesk.Cli;

/// <summary><c>plandesk keys add | list | revoke</c>: API keys in the service's store.</summary>
internal static class KeysCommand
{
    public static Command Create()
    {
        var command = new Command("keys", "Create, list and revoke the API keys of the target service.");
        command.Subcommands.Add(Add());
        command.Subcommands.Add(List());
        command.Subcommands.Add(Revoke());
        return command;
    }

    private static Command Add()
    {
        var store = new StoreOptions();
        var role = new Option<string>("--role") { Description = "scheduler (everything), plant (one plant's targets, acknowledgements and actuals) or viewer (read-only).", Required = true };
        role.AcceptOnlyFromAmong("scheduler", "plant", "viewer");
        var plant = new Option<string?>("--plant") { Description = "The plant id a plant key is for (as in the network file)." };
        var label = new Option<string?>("--label") { Description = "A note to recognise the key by, e.g. the controller's name." };
        var command = new Command("add", "Create a key and print it once; only its hash is stored.") { role, plant, label };
        store.AddTo(command);
        command.SetAction((parse, _) => WithStore(store.Read(parse), async keys =>
        {
            var chosenRole = Enum.Parse<Role>(parse.GetValue(role)!, ignoreCase: true);
            var plantId = parse.GetValue(plant);
            if (ApiKeys.CheckRoleAndPlant(chosenRole, plantId) is { } problem)
            {
                await Console.Error.WriteLineAsync($"keys add: {problem}");
                return 2;
            }
            var (key, record) = ApiKeys.Create(chosenRole, plantId, parse.GetValue(label) ?? "", SystemClock.Instance.GetCurrentInstant());
            await keys.AddKeyAsync(record);
            Console.WriteLine(key);
            await Console.Error.WriteLineAsync(
                $"Key {record.KeyId} ({Describe(record)}) stored in {keys.Description}. It is shown only now: keep it somewhere safe.");
            if (plantId is not null && await keys.LatestNetworkWithPlantAsync(plantId) is null)
            {
                await Console.Error.WriteLineAsync($"Note: no uploaded network has a plant '{plantId}' yet; check the id (it is case-sensitive).");
            }
            return 0;
        }));
        return command;
    }

    private static Command List()
    {
        var store = new StoreOptions();
        var command = new Command("list", "List every key (never the keys themselves).");
        store.AddTo(command);
        command.SetAction((parse, _) => WithStore(store.Read(parse), async keys =>
        {
            var all = await keys.ListKeysAsync();
            Console.WriteLine($"{"KEY ID",-12} {"ROLE",-10} {"PLANT",-20} {"CREATED (UTC)",-20} {"REVOKED (UTC)",-20} LABEL");
            foreach (var key in all)
            {
                Console.WriteLine($"{key.KeyId,-12} {key.Role.ToString().ToLowerInvariant(),-10} {key.PlantId ?? "-",-20} " +
                                  $"{Format(key.CreatedAt),-20} {(key.RevokedAt is { } at ? Format(at) : "-"),-20} {key.Label}");
            }
            if (all.Count == 0)
            {
                await Console.Error.WriteLineAsync("No keys yet; create one with 'plandesk keys add --role scheduler'.");
            }
            return 0;
        }));
        return command;
    }

    private static Command Revoke()
    {
        var store = new StoreOptions();
        var keyId = new Argument<string>("KEYID") { Description = "The key id shown by 'plandesk keys list'." };
        var command = new Command("revoke", "Revoke a key: requests with it are refused from now on.") { keyId };
        store.AddTo(command);
        command.SetAction((parse, _) => WithStore(store.Read(parse), async keys =>
        {
            var id = parse.GetValue(keyId)!;
            if (!await keys.RevokeKeyAsync(id, SystemClock.Instance.GetCurrentInstant()))
            {
                await Console.Error.WriteLineAsync($"keys revoke: there is no key '{id}'; 'plandesk keys list' shows the key ids.");
                return 1;
            }
            Console.WriteLine($"Key {id} revoked.");
            return 0;
        }));
        return command;
    }

    /// <summary>Runs <paramref name="work"/> on the migrated store, turning a store failure into a message and exit code 1.</summary>
    internal static async Task<int> WithStore(StoreSettings settings, Func<IPlanDeskStore, Task<int>> work)
    {
        var store = settings.CreateStore();
        try
        {
            await store.MigrateAsync();
            return await work(store);
        }
        catch (DbException error)
        {
            await Console.Error.WriteLineAsync($"plandesk: cannot use the store ({store.Description}): {error.Message}");
            return 1;
        }
        finally
        {
            (store as IDisposable)?.Dispose();
        }
    }

    private static string Describe(ApiKeyRecord key) =>
        key.Role == Role.Plant ? $"plant key for {key.PlantId}" : $"{key.Role.ToString().ToLowerInvariant()} key";

    private static string Format(Instant instant) => instant.ToString("uuuu-MM-dd HH:mm:ss", null);
}
