using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Biogas engine and holder, and each plant's electricity balance.</summary>
internal static class EnergyChecks
{
    public static void Check(Findings findings, PlanIndex index, PlanAccounts accounts)
    {
        foreach (var plant in findings.Case.Network.Plants)
        {
            var p = index.Plants[plant.Id];
            var where = plant.Id.Value;
            foreach (var (field, values, unit) in new[]
            {
                ("gas to the engine", p.GasToEngineNm3, "Nm3"), ("gas flared", p.GasFlaredNm3, "Nm3"),
                ("engine output", p.EngineKWh, "kWh"), ("import", p.ImportKWh, "kWh"), ("export", p.ExportKWh, "kWh"),
            })
            {
                findings.NonNegative(where, field, values, unit);
            }
            CheckGas(findings, plant, p);
            CheckElectricity(findings, plant, p, accounts.Plants[plant.Id]);
        }
    }

    private static void CheckGas(Findings findings, Plant plant, Plans.PlantPlan p)
    {
        var tol = findings.Tolerances;
        var where = plant.Id.Value;
        var biogas = plant.Biogas;
        var produced = findings.Case.BiogasNm3.TryGetValue(plant.Id, out var gas) ? gas : new double[findings.Case.PeriodCount];
        var engineMostKWh = (biogas?.EngineKw ?? 0) * findings.Case.PeriodHours;
        var holderMost = biogas?.HolderNm3 ?? 0;
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var fromGas = p.GasToEngineNm3[t] * (biogas?.LowerHeatingValueKWhPerNm3 ?? 0) * (biogas?.EngineEfficiency ?? 0);
            if (tol.Differ(p.EngineKWh[t], fromGas))
            {
                findings.AtPeriod(ViolationKind.EngineBalance, where, t, Math.Abs(p.EngineKWh[t] - fromGas), "kWh", fromGas,
                    $"plant {where}'s engine makes {Findings.Q(p.EngineKWh[t])} kWh but {Findings.Q(p.GasToEngineNm3[t])} Nm3 of gas yields {Findings.Q(fromGas)} kWh");
            }
            if (tol.Above(p.EngineKWh[t], engineMostKWh))
            {
                findings.AtPeriod(ViolationKind.EngineSize, where, t, p.EngineKWh[t] - engineMostKWh, "kWh", engineMostKWh,
                    $"plant {where}'s engine makes {Findings.Q(p.EngineKWh[t])} kWh, above its size of {Findings.Q(engineMostKWh)} kWh in the period");
            }
            var before = t == 0 ? biogas?.InitialHolderNm3 ?? 0 : p.HolderEndNm3[t - 1];
            var expected = before + produced[t] - p.GasToEngineNm3[t] - p.GasFlaredNm3[t];
            if (tol.Differ(p.HolderEndNm3[t], expected))
            {
                findings.AtPeriod(ViolationKind.HolderBalance, where, t, Math.Abs(p.HolderEndNm3[t] - expected), "Nm3", expected,
                    $"plant {where}'s gas holder ends at {Findings.Q(p.HolderEndNm3[t])} Nm3, but {Findings.Q(before)} Nm3 before, " +
                    $"{Findings.Q(produced[t])} Nm3 made, {Findings.Q(p.GasToEngineNm3[t])} burnt and {Findings.Q(p.GasFlaredNm3[t])} flared leave {Findings.Q(expected)} Nm3");
            }
            if (tol.Below(p.HolderEndNm3[t], 0) || tol.Above(p.HolderEndNm3[t], holderMost))
            {
                var limit = p.HolderEndNm3[t] < 0 ? 0 : holderMost;
                findings.AtPeriod(ViolationKind.HolderLimits, where, t, Math.Abs(p.HolderEndNm3[t] - limit), "Nm3", limit,
                    $"plant {where}'s gas holder ends at {Findings.Q(p.HolderEndNm3[t])} Nm3, outside 0 to {Findings.Q(holderMost)} Nm3");
            }
        }
        var last = findings.Case.PeriodCount - 1;
        var startNm3 = Math.Min(biogas?.InitialHolderNm3 ?? 0, holderMost);
        if (last >= 0 && tol.Below(p.HolderEndNm3[last], startNm3))
        {
            findings.AtPeriod(ViolationKind.HolderEndBelowStart, where, last, startNm3 - p.HolderEndNm3[last], "Nm3", startNm3,
                $"plant {where}'s gas holder ends the horizon at {Findings.Q(p.HolderEndNm3[last])} Nm3, below the {Findings.Q(startNm3)} Nm3 " +
                "it started with: the plan burns stored gas that the next plan would miss");
        }
    }

    private static void CheckElectricity(Findings findings, Plant plant, Plans.PlantPlan p, PlantAccounts accounts)
    {
        for (var t = 0; t < findings.Case.PeriodCount; t++)
        {
            var net = p.ImportKWh[t] - p.ExportKWh[t];
            var needed = accounts.LoadKWh[t] - p.EngineKWh[t];
            if (findings.Tolerances.Differ(net, needed))
            {
                findings.AtPeriod(ViolationKind.ElectricityBalance, plant.Id.Value, t, Math.Abs(net - needed), "kWh", needed,
                    $"plant {plant.Id} imports {Findings.Q(p.ImportKWh[t])} kWh and exports {Findings.Q(p.ExportKWh[t])} kWh, but its load of " +
                    $"{Findings.Q(accounts.LoadKWh[t])} kWh less {Findings.Q(p.EngineKWh[t])} kWh from its engine needs a net import of {Findings.Q(needed)} kWh");
            }
        }
    }
}
