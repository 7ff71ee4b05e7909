using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>The decisions the baseline simulation has taken so far, per element and period.</summary>
internal sealed class BaselineState
{
    public BaselineState(PlanningCase planningCase, TankOrder order)
    {
        Case = planningCase;
        Expected = ExpectedDraw.Of(planningCase, order);
        var periods = planningCase.PeriodCount;
        var network = planningCase.Network;
        Treated = network.Plants.ToDictionary(p => p.Id, _ => new double[periods]);
        Bypass = network.Plants.ToDictionary(p => p.Id, _ => new double[periods]);
        SecondaryToOutfall = network.Plants.ToDictionary(p => p.Id, _ => new double[periods]);
        Feed = network.Stages.ToDictionary(s => s.Id, _ => new double[periods]);
        Units = network.Stages.ToDictionary(s => s.Id, _ => new int[periods]);
        Starts = network.Stages.ToDictionary(s => s.Id, _ => new int[periods]);
        Volume = network.Tanks.ToDictionary(t => t.Id, _ => new double[periods]);
        Flow = network.Pipelines.ToDictionary(l => l.Id, _ => new double[periods]);
        Pumps = network.Pipelines.Where(l => l.Pumps is not null).ToDictionary(l => l.Id, _ => new int[periods]);
        Delivered = network.Customers.ToDictionary(c => c.Id, _ => new double[periods]);
    }

    public PlanningCase Case { get; }
    /// <summary>The stages' forecast draw, which the unit rules look ahead at.</summary>
    public ExpectedDraw Expected { get; }
    public Dictionary<PlantId, double[]> Treated { get; }
    public Dictionary<PlantId, double[]> Bypass { get; }
    public Dictionary<PlantId, double[]> SecondaryToOutfall { get; }
    public Dictionary<StageId, double[]> Feed { get; }
    public Dictionary<StageId, int[]> Units { get; }
    public Dictionary<StageId, int[]> Starts { get; }
    public Dictionary<TankId, double[]> Volume { get; }
    public Dictionary<PipelineId, double[]> Flow { get; }
    public Dictionary<PipelineId, int[]> Pumps { get; }
    public Dictionary<CustomerId, double[]> Delivered { get; }

    /// <summary>Rules the simulation could not keep, in plain words; they become the plan's problems.</summary>
    public List<BaselineIssue> Issues { get; } = [];

    /// <summary>Volume of a tank at the end of period <paramref name="t"/> − 1 (the start volume for t = 0).</summary>
    public double VolumeBefore(Tank tank, int t) => t == 0 ? tank.InitialM3 : Volume[tank.Id][t - 1];

    /// <summary>Units of a stage running in period <paramref name="t"/> − 1 (the initial units for t = 0).</summary>
    public int UnitsBefore(Stage stage, int t) => t == 0 ? stage.InitialUnitsRunning : Units[stage.Id][t - 1];
}

/// <summary>A rule the baseline could not keep in one period (e.g. a tank it could not keep within its limits).</summary>
/// <param name="Kind">The checker's violation kind the issue will show as.</param>
internal sealed record BaselineIssue(string Kind, string Where, int Period, double Amount, string Unit, string Message);
