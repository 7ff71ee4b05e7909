using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>How many units of a stage the operator may run in a period, and recording what was run.</summary>
internal static class StageUnitRules
{
    /// <summary>
    /// Fewest units: those started within the minimum run time are kept on. Most: the units available; a unit
    /// is only started when it stays available for its whole minimum run (operators know planned outages).
    /// </summary>
    public static (int Fewest, int Most, int CutByOutage) Allowed(BaselineState state, TankOrder order, Stage stage, int t)
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
        var most = Math.Max(Math.Min(state.UnitsBefore(stage, t), available[t]), Math.Min(window, available[t]));
        return (fewest, Math.Max(most, fewest), cut);
    }

    public static void Record(BaselineState state, Stage stage, int t, FlowChoice choice)
    {
        state.Feed[stage.Id][t] = choice.FlowM3;
        state.Units[stage.Id][t] = choice.Count;
        state.Starts[stage.Id][t] = Math.Max(0, choice.Count - state.UnitsBefore(stage, t));
    }

    /// <summary>Chooses a stage's feed for the period within its unit rules, aiming at <paramref name="targetM3"/>.</summary>
    public static FlowChoice Choose(BaselineState state, TankOrder order, Stage stage, int t, double targetM3, double lowM3, double highM3)
    {
        var (fewest, most, cut) = Allowed(state, order, stage, t);
        if (cut > 0)
        {
            state.Issues.Add(new BaselineIssue(ViolationKind.MinimumRun, stage.Id.Value, t, cut, "units",
                $"stage {stage.Id} had to stop {cut} units inside their minimum run: only {state.Case.AvailableUnits[stage.Id][t]} are available"));
        }
        var hours = state.Case.PeriodHours;
        return FlowChoices.Nearest(targetM3, lowM3, highM3, fewest, most, stage.UnitMinFlowM3PerHour * hours, stage.UnitMaxFlowM3PerHour * hours);
    }

    /// <summary>The most a stage could be fed in the period with the units it may run.</summary>
    public static double MostFeedM3(BaselineState state, TankOrder order, Stage stage, int t) =>
        Allowed(state, order, stage, t).Most * stage.UnitMaxFlowM3PerHour * state.Case.PeriodHours;
}
