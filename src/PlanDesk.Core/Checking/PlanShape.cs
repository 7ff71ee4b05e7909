using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>
/// Checks that a plan covers the network and the horizon: one entry per network element, arrays of the
/// right length, finite numbers, known treatment levels. Nothing else can be checked until this holds,
/// so a malformed plan yields violations here instead of exceptions further on.
/// </summary>
internal static class PlanShape
{
    public static bool Check(Findings findings, Plan plan)
    {
        var before = findings.Items.Count;
        if (plan.Solve?.Status == SolveStatus.NoPlan)
        {
            findings.Overall(ViolationKind.NoPlan, "plan", 0, "", null, "the plan holds no decisions: its producer found no plan (status noPlan)");
            return false;
        }
        CheckHorizon(findings, plan);
        if (findings.Items.Count > before)
        {
            return false;
        }

        var network = findings.Case.Network;
        var plants = Entries(findings, plan.Plants, "plants", p => p.Plant.Value, network.Plants.Select(p => p.Id.Value));
        var stages = Entries(findings, plan.Stages, "stages", s => s.Stage.Value, network.Stages.Select(s => s.Id.Value));
        var tanks = Entries(findings, plan.Tanks, "tanks", t => t.Tank.Value, network.Tanks.Select(t => t.Id.Value));
        var pipelines = Entries(findings, plan.Pipelines, "pipelines", p => p.Pipeline.Value, network.Pipelines.Select(p => p.Id.Value));
        var customers = Entries(findings, plan.Customers, "customers", c => c.Customer.Value, network.Customers.Select(c => c.Id.Value));

        var periods = findings.Case.PeriodCount;
        var days = findings.Case.Horizon.Days.Count;
        foreach (var p in plants)
        {
            CheckPlant(findings, p, network.Plant(p.Plant), periods, days);
        }
        foreach (var s in stages)
        {
            var where = s.Stage.Value;
            Ints(findings, where, "unitsRunning", s.UnitsRunning, periods);
            Ints(findings, where, "unitStarts", s.UnitStarts, periods);
            Numbers(findings, where, "feedM3", s.FeedM3, periods);
        }
        foreach (var t in tanks)
        {
            Numbers(findings, t.Tank.Value, "endVolumeM3", t.EndVolumeM3, periods);
        }
        foreach (var p in pipelines)
        {
            Numbers(findings, p.Pipeline.Value, "flowM3", p.FlowM3, periods);
            var hasPumps = network.Pipelines.First(n => n.Id == p.Pipeline).Pumps is not null;
            if (hasPumps || p.PumpsRunning is not null)
            {
                Ints(findings, p.Pipeline.Value, "pumpsRunning", p.PumpsRunning, periods);
            }
        }
        foreach (var c in customers)
        {
            var daily = network.Customer(c.Customer).Demand is DailyDemand;
            Numbers(findings, c.Customer.Value, "deliveredM3", c.DeliveredM3, periods);
            Numbers(findings, c.Customer.Value, "shortfallM3", c.ShortfallM3, daily ? days : periods, daily ? "local day" : "period");
        }
        if (plan.Costs is null)
        {
            findings.Overall(ViolationKind.MissingEntry, "plan", 1, "entries", null, "the plan has no costs; give costs with every component");
        }
        if (plan.Solve is null)
        {
            findings.Overall(ViolationKind.MissingEntry, "plan", 1, "entries", null, "the plan has no solve information; give at least its status");
        }
        return findings.Items.Count == before;
    }

    private static void CheckHorizon(Findings findings, Plan plan)
    {
        var horizon = findings.Case.Horizon;
        void Mismatch(string field, object planValue, object expected) =>
            findings.Overall(ViolationKind.HorizonMismatch, "plan", 1, "", null,
                $"the plan's {field} is {planValue} but the horizon checked has {expected}; check the plan against the horizon it was made for");

        if (plan.StartDate != horizon.StartDate)
        {
            Mismatch("startDate", plan.StartDate, horizon.StartDate);
        }
        if (plan.Days != horizon.DayCount)
        {
            Mismatch("days", plan.Days, horizon.DayCount);
        }
        if (plan.PeriodMinutes != horizon.PeriodMinutes)
        {
            Mismatch("periodMinutes", plan.PeriodMinutes, $"{horizon.PeriodMinutes} (the network's period length)");
        }
        else if (plan.PeriodStarts is null || !plan.PeriodStarts.SequenceEqual(horizon.Periods.Select(p => p.Start)))
        {
            Mismatch("periodStarts", $"{plan.PeriodStarts?.Count ?? 0} starts", $"{horizon.Periods.Count} periods from {horizon.Start}");
        }
    }

    private static void CheckPlant(Findings findings, PlantPlan p, Plant plant, int periods, int days)
    {
        var where = p.Plant.Value;
        if (p.LevelByDay is null || p.LevelByDay.Count != days)
        {
            findings.Overall(ViolationKind.ArrayLength, where, Math.Abs((p.LevelByDay?.Count ?? 0) - days), "entries", days,
                $"plant {where}: levelByDay has {p.LevelByDay?.Count ?? 0} entries but the horizon has {days} local days; give one treatment level per day");
        }
        else
        {
            for (var d = 0; d < days; d++)
            {
                if (!plant.Levels.Any(l => l.Id == p.LevelByDay[d]))
                {
                    findings.AtDay(ViolationKind.UnknownLevel, where, d, 1, "levels", null,
                        $"plant {where} is set to treatment level '{p.LevelByDay[d]}', which it does not have; use one of {string.Join(", ", plant.Levels.Select(l => l.Id))}");
                }
            }
        }
        Numbers(findings, where, "treatedM3", p.TreatedM3, periods);
        Numbers(findings, where, "bypassM3", p.BypassM3, periods);
        Numbers(findings, where, "secondaryToOutfallM3", p.SecondaryToOutfallM3, periods);
        Numbers(findings, where, "gasToEngineNm3", p.GasToEngineNm3, periods);
        Numbers(findings, where, "gasFlaredNm3", p.GasFlaredNm3, periods);
        Numbers(findings, where, "holderEndNm3", p.HolderEndNm3, periods);
        Numbers(findings, where, "engineKWh", p.EngineKWh, periods);
        Numbers(findings, where, "importKWh", p.ImportKWh, periods);
        Numbers(findings, where, "exportKWh", p.ExportKWh, periods);
    }

    // Returns the entries that match a network element exactly once; reports the rest.
    private static List<T> Entries<T>(Findings findings, IReadOnlyList<T>? entries, string list, Func<T, string?> id, IEnumerable<string> networkIds)
        where T : class
    {
        var known = networkIds.ToHashSet();
        var seen = new Dictionary<string, T>();
        foreach (var (entry, index) in (entries ?? []).Select((e, i) => (e, i)))
        {
            var key = entry is null ? null : id(entry);
            if (key is null)
            {
                findings.Overall(ViolationKind.UnknownEntry, "plan", 1, "entries", null, $"{list}[{index}] is empty or has no id; remove it or give its id");
            }
            else if (!known.Contains(key))
            {
                findings.Overall(ViolationKind.UnknownEntry, key, 1, "entries", null, $"{list}: '{key}' is not in the network; remove it or check the network file");
            }
            else if (!seen.TryAdd(key, entry!))
            {
                findings.Overall(ViolationKind.DuplicateEntry, key, 1, "entries", null, $"{list}: '{key}' appears more than once; keep one entry per element");
            }
        }
        foreach (var missing in known.Where(k => !seen.ContainsKey(k)))
        {
            findings.Overall(ViolationKind.MissingEntry, missing, 1, "entries", null, $"{list}: the plan has no entry for '{missing}'; every network element needs one");
        }
        return seen.Values.ToList();
    }

    private static void Numbers(Findings findings, string where, string field, double[]? values, int expected, string per = "period")
    {
        if (!Length(findings, where, field, values?.Length, expected, per))
        {
            return;
        }
        for (var i = 0; i < expected; i++)
        {
            if (!double.IsFinite(values![i]))
            {
                findings.Overall(ViolationKind.NotFinite, where, 1, "values", null, $"{where}: {field}[{i}] is {values[i]}; give a finite number");
            }
        }
    }

    private static void Ints(Findings findings, string where, string field, int[]? values, int expected) =>
        Length(findings, where, field, values?.Length, expected, "period");

    private static bool Length(Findings findings, string where, string field, int? length, int expected, string per)
    {
        if (length == expected)
        {
            return true;
        }
        findings.Overall(ViolationKind.ArrayLength, where, Math.Abs((length ?? 0) - expected), "entries", expected,
            length is null
                ? $"{where}: {field} is missing; give one value per {per} ({expected})"
                : $"{where}: {field} has {length} values but the horizon has {expected}; give one value per {per}");
        return false;
    }
}
