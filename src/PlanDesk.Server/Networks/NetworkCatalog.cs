using System.Collections.Concurrent;
using PlanDesk.Core.Model;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Networks;

/// <summary>A stored network version read into the model.</summary>
public sealed record LoadedNetwork(NetworkVersionRecord Version, Network Network);

/// <summary>Reads stored network versions into the model once each: versions never change after upload.</summary>
internal sealed class NetworkCatalog(IPlanDeskStore store, INetworkReader reader)
{
    private readonly ConcurrentDictionary<(string, int), NetworkReading> readings = new();

    public static string SourceName(string networkId, int version) => $"network {networkId} version {version}";

    public async Task<LoadedNetwork?> GetAsync(string networkId, int? version) =>
        Load(await store.GetNetworkVersionAsync(networkId, version));

    /// <summary>The newest uploaded network that has the plant, or null for a plant no network has.</summary>
    public async Task<LoadedNetwork?> LatestWithPlantAsync(string plantId) =>
        Load(await store.LatestNetworkWithPlantAsync(plantId));

    private LoadedNetwork? Load(NetworkVersionRecord? record)
    {
        if (record?.Document is null)
        {
            return null;
        }
        var reading = readings.GetOrAdd((record.NetworkId, record.Version), _ => reader.Read(record.Document, SourceName(record.NetworkId, record.Version)));
        // A stored version was read without problems when it was uploaded; a reader that changed since is a server fault.
        var network = reading.Network ?? throw new InvalidOperationException(
            $"{SourceName(record.NetworkId, record.Version)} no longer reads: {string.Join("; ", reading.Problems)}");
        return new LoadedNetwork(record, network);
    }
}
