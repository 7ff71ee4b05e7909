using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Model;

// Polishing stages of identical units: commitment, start-ups, minimum run time, feed; and where secondary effluent goes.
internal sealed partial class PlanModel
{
    /// <summary>n[s,t]: units of stage s running in period t.</summary>
    public Dictionary<(StageId Stage, int Period), Variable> Units { get; } = [];
    /// <summary>u[s,t]: units started in period t (continuous: integral whenever the units are).</summary>
    public Dictionary<(StageId Stage, int Period), Variable> Starts { get; } = [];
    /// <summary>Volume fed to stage s in period t, m3.</summary>
    public Dictionary<(StageId Stage, int Period), Variable> Feed { get; } = [];
    /// <summary>Secondary effluent no stage takes, discharged at the outfall, m3.</summary>
    public Dictionary<(PlantId Plant, int Period), Variable> SecondaryToOutfall { get; } = [];

    /// <summary>
    /// n[s,t] ∈ [0, available units]; minFlow·n ≤ feed ≤ maxFlow·n; u[t] ≥ n[t] − n[t−1] (n[−1] = units running
    /// before the horizon); n[t] ≥ Σ u over the last L periods, which for identical units says that every unit
    /// started in the last L periods is still running. Start-ups cost, feed takes energy and chemicals.
    /// </summary>
    private void AddStageUnits()
    {
        foreach (var stage in Network.Stages)
        {
            var available = Case.AvailableUnits[stage.Id];
            var minRunPeriods = (int)Math.Ceiling(stage.MinRunHours / PeriodHours - 1e-9);
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var units = IntVar(0, available[t], UnitsName(stage.Id, t), period.Day);
                var feed = NumVar(0, stage.UnitMaxFlowM3PerHour * PeriodHours * available[t], Name("feed", stage.Id, P(t)));
                var starts = NumVar(0, double.PositiveInfinity, Name("starts", stage.Id, P(t)));
                Units[(stage.Id, t)] = units;
                Feed[(stage.Id, t)] = feed;
                Starts[(stage.Id, t)] = starts;

                AtLeastRow(0, Name("feed-min", stage.Id, P(t))).Add(feed, 1).Add(units, -stage.UnitMinFlowM3PerHour * PeriodHours);
                AtMostRow(0, Name("feed-max", stage.Id, P(t))).Add(feed, 1).Add(units, -stage.UnitMaxFlowM3PerHour * PeriodHours);

                var startRow = t == 0
                    ? AtLeastRow(-stage.InitialUnitsRunning, Name("start-count", stage.Id, P(t)))
                    : AtLeastRow(0, Name("start-count", stage.Id, P(t))).Add(Units[(stage.Id, t - 1)], 1);
                startRow.Add(starts, 1).Add(units, -1);

                if (minRunPeriods >= 2)
                {
                    var minRun = AtLeastRow(0, Name("min-run", stage.Id, P(t))).Add(units, 1);
                    for (var back = Math.Max(0, t - minRunPeriods + 1); back <= t; back++)
                    {
                        minRun.Add(Starts[(stage.Id, back)], -1);
                    }
                }

                Costs.Add(CostComponent.UnitStarts, starts, stage.StartupCost);
                Costs.Add(CostComponent.Chemicals, feed, stage.ChemicalCostPerM3);
                AddLoad(stage.Plant, t, feed, stage.EnergyKWhPerM3);
            }
        }
    }

    /// <summary>treated = Σ feed of stages taking secondary effluent + secondary effluent to the outfall.</summary>
    private void AddSecondaryEffluentSplit()
    {
        foreach (var plant in Network.Plants)
        {
            var secondaryStages = plant.Stages.Where(s => s.FeedTank is null).ToList();
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var toOutfall = NumVar(0, double.PositiveInfinity, Name("secondary-to-outfall", plant.Id, P(t)));
                SecondaryToOutfall[(plant.Id, t)] = toOutfall;
                var split = EqualRow(0, Name("secondary-effluent", plant.Id, P(t)))
                    .Add(Treated[(plant.Id, t)], 1)
                    .Add(toOutfall, -1);
                foreach (var stage in secondaryStages)
                {
                    split.Add(Feed[(stage.Id, t)], -1);
                }
            }
        }
    }
}
