using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>Where something stands in the generated region: km east and north, ground level in m.</summary>
internal readonly record struct Site(double EastKm, double NorthKm, double ElevationM)
{
    public double DistanceKm(Site other) => Math.Sqrt(Math.Pow(EastKm - other.EastKm, 2) + Math.Pow(NorthKm - other.NorthKm, 2));
}

/// <summary>A tank or reservoir while the region is being drawn, with the water it can supply on average.</summary>
internal sealed class TankDraft
{
    public required TankId Id { get; init; }
    public required string Name { get; init; }
    public required ClassId Class { get; init; }
    public PlantId? Plant { get; init; }
    public required Site Site { get; init; }
    /// <summary>Product the stages filling this tank can make at full capacity, m3/h.</summary>
    public double ProductCapacityM3PerHour { get; set; }
    /// <summary>Average supply left for customers, m3/h (customers are scaled to fit it).</summary>
    public double BudgetM3PerHour { get; set; }
    public Tank? Built { get; set; }
}

/// <summary>A plant while the region is being drawn.</summary>
internal sealed class PlantDraft
{
    public required Plant Plant { get; init; }
    public required Site Site { get; init; }
    /// <summary>The plant's product tanks, best class first.</summary>
    public required IReadOnlyList<TankDraft> Tanks { get; init; }

    /// <summary>The tank holding the worst class that still serves <paramref name="required"/>; null when none does.</summary>
    public TankDraft? WorstServing(ClassId required) =>
        Tanks.Where(t => RegionClasses.Serves(t.Class, required)).OrderByDescending(t => RegionClasses.Rank(t.Class)).FirstOrDefault();
}

/// <summary>A water source a customer draws from, with the share of its average demand counted on it.</summary>
internal sealed record SupplyShare(TankDraft Tank, double Share);

/// <summary>A pipeline while drawn: its pumping is kept as head and efficiency so the file can show them.</summary>
internal sealed record PipelineDraft(Pipeline Pipeline, PumpingHead Head);
