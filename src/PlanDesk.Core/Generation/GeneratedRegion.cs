using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>Static head and pump efficiency a pipeline's pumping energy was worked out from (E = ρ g H V / η).</summary>
public sealed record PumpingHead(double StaticHeadM, double PumpEfficiency);

/// <summary>
/// A generated region: the network, plus the pumping heads of its pipelines so the written file shows
/// head and efficiency rather than a bare kWh/m3.
/// </summary>
public sealed record GeneratedRegion(RegionSize Size, int Seed, Network Network, IReadOnlyDictionary<PipelineId, PumpingHead> Heads);
