using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Tank volume balances (with losses) and volume limits (priced soft limits: the data may start a tank
/// outside them, or losses may draw it down with nothing to refill it).</summary>
internal static class TankChecks
{
    public static void Check(Findings findings, PlanIndex index)
    {
        foreach (var tank in findings.Case.Network.Tanks)
        {
            CheckBalance(findings, index, tank);
            CheckLimits(findings, index, tank);
        }
    }

    // Each period's end volume is compared with the previous end volume as the plan states it, so one
    // wrong number shows as one violation instead of spreading over the rest of the horizon.
    private static void CheckBalance(Findings findings, PlanIndex index, Tank tank)
    {
        var network = findings.Case.Network;
        var volume = index.Tanks[tank.Id].EndVolumeM3;
        var keep = 1 - tank.LossFractionPerDay * findings.Case.PeriodHours / 24.0;
        var producers = network.Stages.Where(s => s.ProductTank == tank.Id).ToList();
        var feeds = network.Stages.Where(s => s.FeedTank == tank.Id).ToList();
        var inflows = network.Pipelines.Where(l => l.To.Tank == tank.Id).ToList();
        var outflows = network.Pipelines.Where(l => l.From == tank.Id).ToList();
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var before = t == 0 ? tank.InitialM3 : volume[t - 1];
            var inM3 = producers.Sum(s => s.RecoveryFraction * index.Stages[s.Id].FeedM3[t]) + inflows.Sum(l => index.Pipelines[l.Id].FlowM3[t]);
            var outM3 = feeds.Sum(s => index.Stages[s.Id].FeedM3[t]) + outflows.Sum(l => index.Pipelines[l.Id].FlowM3[t]);
            var expected = before * keep + inM3 - outM3;
            if (findings.Tolerances.Differ(volume[t], expected))
            {
                findings.AtPeriod(ViolationKind.TankBalance, tank.Id.Value, t, Math.Abs(volume[t] - expected), "m3", expected,
                    $"tank {tank.Id} ends at {Findings.Q(volume[t])} m3, but {Findings.Q(before)} m3 before, {Findings.Q(inM3)} m3 in, " +
                    $"{Findings.Q(outM3)} m3 out and losses leave {Findings.Q(expected)} m3");
            }
        }
    }

    private static void CheckLimits(Findings findings, PlanIndex index, Tank tank)
    {
        var volume = index.Tanks[tank.Id].EndVolumeM3;
        for (var t = 0; t < volume.Length; t++)
        {
            if (findings.Tolerances.Below(volume[t], tank.MinM3))
            {
                findings.AtPeriod(ViolationKind.TankMin, tank.Id.Value, t, tank.MinM3 - volume[t], "m3", tank.MinM3,
                    $"tank {tank.Id} ends at {Findings.Q(volume[t])} m3, below its minimum of {Findings.Q(tank.MinM3)} m3", penalised: true);
            }
            if (findings.Tolerances.Above(volume[t], tank.MaxM3))
            {
                findings.AtPeriod(ViolationKind.TankMax, tank.Id.Value, t, volume[t] - tank.MaxM3, "m3", tank.MaxM3,
                    $"tank {tank.Id} ends at {Findings.Q(volume[t])} m3, above its maximum of {Findings.Q(tank.MaxM3)} m3", penalised: true);
            }
        }
    }
}
