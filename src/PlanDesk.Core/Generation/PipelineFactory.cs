using PlanDesk.Core.Model;
using PlanDesk.Core.Physics;

namespace PlanDesk.Core.Generation;

/// <summary>Draws pipelines: the lift from one site to another sets the static head, and E = ρ g H V / η.</summary>
internal static class PipelineFactory
{
    public static PipelineDraft Create(SeededRandom random, TankDraft from, string toId, string toName, Site toSite,
        PipelineEnd to, double capacityM3PerHour, PlantId poweredBy, PumpSet? pumps, double residualHeadM)
    {
        // Static lift plus an allowance of 0.5-1.5 m per km for the line and the pressure wanted at the far end.
        var lift = toSite.ElevationM - from.Site.ElevationM;
        var headM = SeededRandom.Round(Math.Max(8, lift + from.Site.DistanceKm(toSite) * random.Uniform(0.5, 1.5) + residualHeadM) * 2, 0) / 2;
        var efficiency = random.Uniform(0.65, 0.8, 2);
        var pipeline = new Pipeline(
            new PipelineId($"{from.Id}-to-{toId}"),
            $"{from.Name} to {toName}",
            from.Id,
            to,
            capacityM3PerHour,
            Pumping.EnergyKWhPerM3(headM, efficiency),
            poweredBy,
            pumps);
        return new PipelineDraft(pipeline, new PumpingHead(headM, efficiency));
    }

    /// <summary>A capacity rounded up to a tidy figure: whole m3/h below 100, else multiples of 5.</summary>
    public static double TidyCapacity(double m3PerHour) =>
        m3PerHour < 100 ? Math.Max(2, Math.Ceiling(m3PerHour)) : Math.Ceiling(m3PerHour / 5) * 5;
}
