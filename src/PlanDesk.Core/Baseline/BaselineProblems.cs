using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Baseline;

/// <summary>The baseline's problems in plain words: shortfalls, bypass, permit and outfall excess, tank deficits,
/// and every rule the simulation could not keep, one per element and local day.</summary>
internal static class BaselineProblems
{
    private const double Noticeable = 1e-6;

    public static List<PlanProblem> Find(PlanningCase planningCase, Plan plan, PlanAccounts accounts, IEnumerable<BaselineIssue> issues)
    {
        var network = planningCase.Network;
        var days = planningCase.Horizon.Days;
        var problems = new List<PlanProblem>();
        void Add(string kind, string where, int day, double amount, string unit, string message)
        {
            if (amount > Noticeable)
            {
                var date = days[day].Date;
                problems.Add(new PlanProblem(kind, where, date, amount, unit, $"{date:yyyy-MM-dd}: {message}"));
            }
        }
        double DaySum(double[] values, PlanDay day) => day.PeriodIndices.Sum(t => values[t]);

        foreach (var c in plan.Customers)
        {
            var customer = network.Customer(c.Customer);
            foreach (var day in days)
            {
                var shortM3 = customer.Demand is DailyDemand ? c.ShortfallM3[day.Index] : DaySum(c.ShortfallM3, day);
                Add(ProblemKinds.Shortfall, customer.Id.Value, day.Index, shortM3, "m3",
                    $"customer {customer.Name} short {Findings.Q(shortM3)} m3 of class {customer.Class}");
            }
        }
        foreach (var p in plan.Plants)
        {
            var plant = network.Plant(p.Plant);
            var a = accounts.Plants[plant.Id];
            foreach (var day in days)
            {
                Add(ProblemKinds.Bypass, plant.Id.Value, day.Index, DaySum(p.BypassM3, day), "m3",
                    $"plant {plant.Name} bypasses {Findings.Q(DaySum(p.BypassM3, day))} m3 of influent above its secondary capacity");
                Add(ProblemKinds.OutfallExcess, plant.Id.Value, day.Index, DaySum(a.OutfallExcessM3, day), "m3",
                    $"plant {plant.Name} sends {Findings.Q(DaySum(a.OutfallExcessM3, day))} m3 more to its outfall than its permit's maximum flow");
                if (!BaselineLevels.Meets(plant.Level(p.LevelByDay[day.Index]), plant.Permit))
                {
                    Add(ProblemKinds.LevelLimit, plant.Id.Value, day.Index, 1, "level",
                        $"no treatment level of plant {plant.Name} meets its permit's concentration limits; it runs {p.LevelByDay[day.Index]}");
                }
            }
            AddLoadExcess(Add, planningCase, plant, a.TotalNitrogen, "total N", ProblemKinds.NitrogenDailyExcess, ProblemKinds.NitrogenMonthlyExcess);
            AddLoadExcess(Add, planningCase, plant, a.TotalPhosphorus, "total P", ProblemKinds.PhosphorusDailyExcess, ProblemKinds.PhosphorusMonthlyExcess);
        }
        foreach (var (tank, deficit) in accounts.TankEndDeficitM3)
        {
            Add(ProblemKinds.TankEndDeficit, tank.Value, days.Count - 1, deficit, "m3",
                $"tank {network.Tank(tank).Name} ends {Findings.Q(deficit)} m3 below its start volume");
        }
        foreach (var group in issues.GroupBy(i => (i.Kind, i.Where, Day: planningCase.Horizon.Periods[i.Period].Day)))
        {
            var first = group.First();
            Add(ProblemKinds.ForViolation(group.Key.Kind), group.Key.Where, group.Key.Day, group.Sum(i => i.Amount), first.Unit,
                $"{first.Message} ({group.Count()} period{(group.Count() == 1 ? "" : "s")})");
        }
        return problems;
    }

    private static void AddLoadExcess(Action<string, string, int, double, string, string> add, PlanningCase planningCase, Plant plant, LoadAccount load,
        string substance, string dailyKind, string monthlyKind)
    {
        for (var d = 0; d < load.DailyExcessKg.Length; d++)
        {
            add(dailyKind, plant.Id.Value, d, load.DailyExcessKg[d], "kg",
                $"plant {plant.Name} discharges {Findings.Q(load.DailyExcessKg[d])} kg of {substance} above its daily cap; no allowed treatment level keeps the day within every cap");
        }
        foreach (var (excess, month) in load.MonthlyExcessKg.Select((kg, m) => (kg, m)))
        {
            var firstDay = planningCase.Horizon.Days.First(d => planningCase.BillingMonth[d.FirstPeriod] == month);
            add(monthlyKind, plant.Id.Value, firstDay.Index, excess, "kg",
                $"plant {plant.Name} goes {Findings.Q(excess)} kg of {substance} over its monthly cap for {firstDay.Date:yyyy-MM}");
        }
    }
}
