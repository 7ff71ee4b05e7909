using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Influent, treatment and the split of secondary effluent between stages and the outfall.</summary>
internal static class SecondaryChecks
{
    public static void Check(Findings findings, PlanIndex index)
    {
        foreach (var plant in findings.Case.Network.Plants)
        {
            CheckBalances(findings, index, plant);
        }
    }

    private static void CheckBalances(Findings findings, PlanIndex index, Plant plant)
    {
        var tol = findings.Tolerances;
        var p = index.Plants[plant.Id];
        var where = plant.Id.Value;
        var influent = findings.Case.InfluentM3[plant.Id];
        var capacityM3 = plant.SecondaryCapacityM3PerHour * findings.Case.PeriodHours;
        var secondaryFed = plant.Stages.Where(s => s.FeedTank is null).Select(s => index.Stages[s.Id]).ToList();
        findings.NonNegative(where, "treated", p.TreatedM3, "m3");
        findings.NonNegative(where, "bypass", p.BypassM3, "m3");
        findings.NonNegative(where, "secondary effluent to the outfall", p.SecondaryToOutfallM3, "m3");
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var accounted = p.TreatedM3[t] + p.BypassM3[t];
            if (tol.Differ(accounted, influent[t]))
            {
                findings.AtPeriod(ViolationKind.SecondaryBalance, where, t, Math.Abs(accounted - influent[t]), "m3", influent[t],
                    $"plant {where} treats {Findings.Q(p.TreatedM3[t])} m3 and bypasses {Findings.Q(p.BypassM3[t])} m3, " +
                    $"but its influent is {Findings.Q(influent[t])} m3; treated + bypass must equal the influent");
            }
            if (tol.Above(p.TreatedM3[t], capacityM3))
            {
                findings.AtPeriod(ViolationKind.SecondaryCapacity, where, t, p.TreatedM3[t] - capacityM3, "m3", capacityM3,
                    $"plant {where} treats {Findings.Q(p.TreatedM3[t])} m3, above its secondary capacity of {Findings.Q(capacityM3)} m3 in the period");
            }
            var split = secondaryFed.Sum(s => s.FeedM3[t]) + p.SecondaryToOutfallM3[t];
            if (tol.Differ(split, p.TreatedM3[t]))
            {
                findings.AtPeriod(ViolationKind.SecondarySplit, where, t, Math.Abs(split - p.TreatedM3[t]), "m3", p.TreatedM3[t],
                    $"plant {where}'s stages take {Findings.Q(split - p.SecondaryToOutfallM3[t])} m3 of secondary effluent and " +
                    $"{Findings.Q(p.SecondaryToOutfallM3[t])} m3 goes to the outfall, but {Findings.Q(p.TreatedM3[t])} m3 is treated; the two must match");
            }
        }
    }
}
