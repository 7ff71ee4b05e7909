using System.CommandLine;
using NodaTime;
using PlanDesk.Core.Generation;
using PlanDesk.Core.Loading;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Store;

namespace PlanDesk.Cli;

/// <summary><c>plandesk networks add FILE</c>: puts a network file, with its CSV series, into the service's store.</summary>
internal static class NetworksCommand
{
    public static Command Create()
    {
        var command = new Command("networks", "Add network files to the target service's store.");
        command.Subcommands.Add(Add());
        return command;
    }

    private static Command Add()
    {
        var store = new StoreOptions();
        var file = new Argument<FileInfo>("NETWORK") { Description = "The network file (JSON); CSV series it refers to are read and stored inline." };
        var id = new Option<string?>("--id") { Description = "Network id in the service (default: the file name without .json, e.g. demo-region)." };
        var command = new Command("add", "Store a new version of a network, with every series inline, so the service can plan it.") { file, id };
        store.AddTo(command);
        command.SetAction((parse, _) =>
        {
            var path = parse.GetValue(file)!.FullName;
            var loaded = NetworkLoader.Load(path);
            if (loaded.Network is not { } network)
            {
                foreach (var problem in loaded.Problems)
                {
                    Console.Error.WriteLine(problem);
                }
                Console.Error.WriteLine($"networks add: the network was not stored: {loaded.Problems.Count} problem(s); fix them and run again.");
                return Task.FromResult(1);
            }
            var networkId = parse.GetValue(id) ?? Path.GetFileNameWithoutExtension(path).ToLowerInvariant();
            if (!NetworkIds.IsValid(networkId))
            {
                Console.Error.WriteLine($"networks add: '{networkId}' is not a network id: use 1 to 64 lower-case letters, digits and hyphens (give one with --id).");
                return Task.FromResult(2);
            }
            return KeysCommand.WithStore(store.Read(parse), async target =>
            {
                var plants = network.Plants.Select(p => new NetworkPlantRecord(p.Id.Value, p.Name)).ToList();
                var stored = await target.AddNetworkVersionAsync(
                    networkId, network.Name, NetworkFileWriter.Write(network), plants, SystemClock.Instance.GetCurrentInstant(), "cli");
                Console.WriteLine($"Network '{networkId}' version {stored.Version} ({network.Name}) stored in {target.Description}.");
                return 0;
            });
        });
        return command;
    }
}
