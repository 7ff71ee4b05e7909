using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>How many units of a stage the operator may run in a period, and recording what was run.</summary>
internal static class StageUnitRules
{
    /// <summary>
    /// Fewest units: those started within the minimum run time are kept on. Most: the units available; a unit
    /// is only started when it stays available for its whole minimum run (operators know planned outages) and
    /// its product tank has room for a minimum run at least flow (<paramref name="productRoomM3"/>) and, for a
    /// stage fed from a tank, that tank holds the water for it (<paramref name="feedStockM3"/>), so a unit never
    /// has to be stopped early, overfill its tank or empty its feed tank.
    /// </summary>
    public static (int Fewest, int Most, int CutByOutage) Allowed(BaselineState state, TankOrder order, Stage stage, int t,
        double productRoomM3 = double.PositiveInfinity, double feedStockM3 = double.PositiveInfinity)
    {
        if (!order.Uses(stage))
        {
            return (0, 0, 0);
        }
        var available = state.Case.AvailableUnits[stage.Id];
        var length = StageChecks.MinimumRunPeriods(stage, state.Case.PeriodHours);
        var starts = state.Starts[stage.Id];
        var fewest = 0;
        for (var k = Math.Max(0, t - length + 1); k < t; k++)
        {
            fewest += starts[k];
        }
        var cut = Math.Max(0, fewest - available[t]);
        fewest -= cut;
        var window = Enumerable.Range(t, Math.Max(length, 1)).Where(k => k < available.Length).Min(k => available[k]);
        var running = Math.Min(state.UnitsBefore(stage, t), available[t]);
        var most = Math.Max(running, Math.Min(window, available[t]));
        var runFeedM3 = length * stage.UnitMinFlowM3PerHour * state.Case.PeriodHours;
        if (length > 1 && runFeedM3 > 0)
        {
            // Compared in doubles: with no room or stock given the allowance is infinite, and adding it as an int
            // to the running units would overflow and stop every unit once its minimum run is over.
            var startable = Math.Floor(Math.Max(0, Math.Min(productRoomM3 / stage.RecoveryFraction, feedStockM3) / runFeedM3));
            if (startable < most - running)
            {
                most = running + (int)startable;
            }
        }
        return (fewest, Math.Max(most, fewest), cut);
    }

    public static void Record(BaselineState state, Stage stage, int t, FlowChoice choice)
    {
        state.Feed[stage.Id][t] = choice.FlowM3;
        state.Units[stage.Id][t] = choice.Count;
        state.Starts[stage.Id][t] = Math.Max(0, choice.Count - state.UnitsBefore(stage, t));
    }

    /// <summary>Chooses a stage's feed for the period within its unit rules, aiming at <paramref name="targetM3"/>.
    /// Units kept on for their minimum run are stopped early only when their least flow would take water that is
    /// not there (secondary effluent, feed tank) or overfill the product tank: tank limits and water come first.</summary>
    public static FlowChoice Choose(BaselineState state, TankOrder order, Stage stage, int t, double targetM3, double lowM3, double highM3,
        double productRoomM3, double feedStockM3 = double.PositiveInfinity)
    {
        var (fewest, most, cut) = Allowed(state, order, stage, t, productRoomM3, feedStockM3);
        var hours = state.Case.PeriodHours;
        var least = stage.UnitMinFlowM3PerHour * hours;
        var running = Math.Min(state.UnitsBefore(stage, t), most);
        var steady = Math.Clamp(state.Expected.SteadyUnits(stage, t, running), fewest, most);
        var choice = FlowChoices.Nearest(targetM3, lowM3, highM3, steady, most, least, stage.UnitMaxFlowM3PerHour * hours);
        if (steady > fewest && choice.FlowM3 > Math.Max(0, highM3) + 1e-9)
        {
            // Units held on across a dip yield to room and water without a problem: they are past their minimum run.
            choice = FlowChoices.Nearest(targetM3, lowM3, highM3, fewest, most, least, stage.UnitMaxFlowM3PerHour * hours);
        }
        if (choice.FlowM3 > Math.Max(0, highM3) + 1e-9)
        {
            choice = FlowChoices.Nearest(targetM3, lowM3, highM3, 0, most, least, stage.UnitMaxFlowM3PerHour * hours);
            cut += fewest - choice.Count;
        }
        if (cut > 0)
        {
            state.Issues.Add(new BaselineIssue(ViolationKind.MinimumRun, stage.Id.Value, t, cut, "units",
                $"stage {stage.Id} had to stop {cut} units inside their minimum run (outage, no water to feed them or no room for their product)"));
        }
        return choice;
    }

    /// <summary>The most a stage could be fed in the period with the units it may run.</summary>
    public static double MostFeedM3(BaselineState state, TankOrder order, Stage stage, int t, double productRoomM3 = double.PositiveInfinity) =>
        Allowed(state, order, stage, t, productRoomM3).Most * stage.UnitMaxFlowM3PerHour * state.Case.PeriodHours;
}
