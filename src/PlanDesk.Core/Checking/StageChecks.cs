using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Stage units: availability, per-unit flow range, start-ups, minimum run time and the product's class.</summary>
internal static class StageChecks
{
    public static void Check(Findings findings, PlanIndex index)
    {
        foreach (var stage in findings.Case.Network.Stages)
        {
            CheckUnitsAndFlows(findings, index, stage);
            CheckStarts(findings, index, stage);
            CheckMinimumRun(findings, index, stage);
            CheckProductClass(findings, index, stage);
        }
    }

    /// <summary>Periods a started unit must keep running: ceil(minimum run hours / period hours).</summary>
    public static int MinimumRunPeriods(Stage stage, double periodHours) =>
        stage.MinRunHours <= 0 ? 0 : (int)Math.Ceiling(stage.MinRunHours / periodHours - 1e-9);

    private static void CheckUnitsAndFlows(Findings findings, PlanIndex index, Stage stage)
    {
        var tol = findings.Tolerances;
        var s = index.Stages[stage.Id];
        var where = stage.Id.Value;
        var hours = findings.Case.PeriodHours;
        var available = findings.Case.AvailableUnits[stage.Id];
        findings.NonNegative(where, "feed", s.FeedM3, "m3");
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var n = s.UnitsRunning[t];
            if (n < 0 || n > available[t])
            {
                var limit = n < 0 ? 0 : available[t];
                findings.AtPeriod(ViolationKind.UnitsAvailable, where, t, Math.Abs(n - limit), "units", limit,
                    $"stage {where} runs {n} units but {available[t]} of its {stage.Units} are available");
            }
            var least = stage.UnitMinFlowM3PerHour * n * hours;
            var most = stage.UnitMaxFlowM3PerHour * n * hours;
            if (tol.Below(s.FeedM3[t], least))
            {
                findings.AtPeriod(ViolationKind.StageFlowMin, where, t, least - s.FeedM3[t], "m3", least,
                    $"stage {where} is fed {Findings.Q(s.FeedM3[t])} m3 with {n} units running, below their least flow of {Findings.Q(least)} m3");
            }
            if (tol.Above(s.FeedM3[t], most))
            {
                findings.AtPeriod(ViolationKind.StageFlowMax, where, t, s.FeedM3[t] - most, "m3", most,
                    $"stage {where} is fed {Findings.Q(s.FeedM3[t])} m3 with {n} units running, above their capacity of {Findings.Q(most)} m3");
            }
        }
    }

    private static void CheckStarts(Findings findings, PlanIndex index, Stage stage)
    {
        var s = index.Stages[stage.Id];
        var where = stage.Id.Value;
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var before = t == 0 ? stage.InitialUnitsRunning : s.UnitsRunning[t - 1];
            var least = Math.Max(0, s.UnitsRunning[t] - before);
            if (s.UnitStarts[t] < least || s.UnitStarts[t] < 0)
            {
                findings.AtPeriod(ViolationKind.UnitStarts, where, t, least - s.UnitStarts[t], "starts", least,
                    $"stage {where} goes from {before} to {s.UnitsRunning[t]} units running but the plan counts {s.UnitStarts[t]} starts; " +
                    $"at least {least} units start");
            }
        }
    }

    // n[t] ≥ starts over the last L periods: every unit started in that window is still running.
    // Starts are taken as at least the rise in units, so a plan that under-counts starts cannot dodge the rule.
    private static void CheckMinimumRun(Findings findings, PlanIndex index, Stage stage)
    {
        var length = MinimumRunPeriods(stage, findings.Case.PeriodHours);
        if (length <= 1)
        {
            return;
        }
        var s = index.Stages[stage.Id];
        var starts = new int[findings.Case.PeriodCount];
        for (var t = 0; t < starts.Length; t++)
        {
            var before = t == 0 ? stage.InitialUnitsRunning : s.UnitsRunning[t - 1];
            starts[t] = Math.Max(Math.Max(0, s.UnitStarts[t]), s.UnitsRunning[t] - before);
        }
        for (var t = 0; t < starts.Length; t++)
        {
            var first = Math.Max(0, t - length + 1);
            var recent = starts[first..(t + 1)].Sum();
            if (s.UnitsRunning[t] < recent)
            {
                findings.AtPeriod(ViolationKind.MinimumRun, stage.Id.Value, t, recent - s.UnitsRunning[t], "units", recent,
                    $"stage {stage.Id} runs {s.UnitsRunning[t]} units but {recent} were started in the last {length} periods " +
                    $"and must run at least {Findings.Q(stage.MinRunHours)} h");
            }
        }
    }

    private static void CheckProductClass(Findings findings, PlanIndex index, Stage stage)
    {
        var network = findings.Case.Network;
        var tank = network.Tank(stage.ProductTank);
        if (network.Serves(stage.ProducesClass, tank.Class))
        {
            return;
        }
        var s = index.Stages[stage.Id];
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            if (findings.Tolerances.Above(s.FeedM3[t], 0))
            {
                findings.AtPeriod(ViolationKind.ClassRule, stage.Id.Value, t, s.FeedM3[t] * stage.RecoveryFraction, "m3", 0,
                    $"stage {stage.Id} makes class {stage.ProducesClass} water but fills tank {tank.Id}, which holds class {tank.Class}");
            }
        }
    }
}
