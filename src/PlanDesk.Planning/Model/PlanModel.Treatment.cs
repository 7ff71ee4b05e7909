using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Model;

// Secondary (biological) treatment: the daily treatment level and the split of influent into treated and bypassed.
internal sealed partial class PlanModel
{
    /// <summary>Levels each plant may run at: those within the permit's concentration limits.</summary>
    public Dictionary<PlantId, IReadOnlyList<TreatmentLevel>> AllowedLevels { get; } = [];
    /// <summary>y[p,d,m] = 1 when plant p runs level m on local day d.</summary>
    public Dictionary<(PlantId Plant, int Day, LevelId Level), Variable> LevelOn { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> Treated { get; } = [];
    public Dictionary<(PlantId Plant, int Period), Variable> Bypass { get; } = [];
    /// <summary>Treated volume disaggregated by level: zero for every level but the day's.</summary>
    public Dictionary<(PlantId Plant, int Period, LevelId Level), Variable> TreatedAtLevel { get; } = [];
    /// <summary>Problems the data force whatever the plan (e.g. no level meets a concentration limit).</summary>
    public List<PlanProblem> DataProblems { get; } = [];

    // Electrical load terms per plant and period, kWh per unit of the variable; the energy family sums them.
    private readonly Dictionary<(PlantId Plant, int Period), List<(Variable Variable, double KWhPerUnit)>> loadTerms = [];

    private void AddLoad(PlantId plant, int period, Variable variable, double kWhPerUnit)
    {
        if (kWhPerUnit == 0)
        {
            return;
        }
        if (!loadTerms.TryGetValue((plant, period), out var terms))
        {
            terms = [];
            loadTerms[(plant, period)] = terms;
        }
        terms.Add((variable, kWhPerUnit));
    }

    /// <summary>True for the name of a treatment-level decision y[p,d,m].</summary>
    public static bool IsLevelDecision(string variableName) => variableName.StartsWith(LevelFamily + "[", StringComparison.Ordinal);

    private const string LevelFamily = "level";

    /// <summary>Exactly one treatment level per plant and local day, among the levels the permit allows.</summary>
    private void AddTreatmentLevels()
    {
        foreach (var plant in Network.Plants)
        {
            var allowed = LevelsWithinLimits(plant);
            AllowedLevels[plant.Id] = allowed;
            foreach (var day in Horizon.Days)
            {
                var oneLevel = EqualRow(1, Name("one-level", plant.Id, DayLabel(day.Index)));
                foreach (var level in allowed)
                {
                    var on = IntVar(0, 1, LevelName(plant.Id, day, level.Id), day.Index);
                    LevelOn[(plant.Id, day.Index, level.Id)] = on;
                    oneLevel.Add(on, 1);
                }
            }
        }
    }

    /// <summary>
    /// The levels the model builds for a plant: a level whose effluent breaks a concentration limit is never chosen.
    /// When none meets it the data leave no lawful choice: only the tightest level is built (and the plan says so).
    /// </summary>
    public static IReadOnlyList<TreatmentLevel> LevelsBuilt(Plant plant)
    {
        var within = LevelsMeetingLimits(plant);
        return within.Count > 0 ? within : [Tightest(plant)];
    }

    private static List<TreatmentLevel> LevelsMeetingLimits(Plant plant)
    {
        const double tolerance = 1e-9;
        var permit = plant.Permit;
        return plant.Levels
            .Where(l => permit.MaxTotalNitrogenMgPerL is not { } maxN || l.EffluentTotalNitrogenMgPerL <= maxN + tolerance)
            .Where(l => permit.MaxTotalPhosphorusMgPerL is not { } maxP || l.EffluentTotalPhosphorusMgPerL <= maxP + tolerance)
            .ToList();
    }

    private static TreatmentLevel Tightest(Plant plant) =>
        plant.Levels.OrderBy(l => l.EffluentTotalNitrogenMgPerL).ThenBy(l => l.EffluentTotalPhosphorusMgPerL).First();

    // The levels built, and a data problem when no level meets the concentration limits.
    private IReadOnlyList<TreatmentLevel> LevelsWithinLimits(Plant plant)
    {
        var built = LevelsBuilt(plant);
        if (LevelsMeetingLimits(plant).Count > 0)
        {
            return built;
        }
        var tightest = built[0];
        var permit = plant.Permit;
        DataProblems.Add(new PlanProblem(
            "levelLimit", plant.Id.Value, null, tightest.EffluentTotalNitrogenMgPerL, "mg/L",
            $"plant {plant.Name}: no treatment level meets the permit's concentration limits " +
            $"(total N {permit.MaxTotalNitrogenMgPerL?.ToString() ?? "none"} mg/L, total P {permit.MaxTotalPhosphorusMgPerL?.ToString() ?? "none"} mg/L); " +
            $"the tightest level '{tightest.Name}' ({tightest.EffluentTotalNitrogenMgPerL} mg/L N, {tightest.EffluentTotalPhosphorusMgPerL} mg/L P) is planned"));
        return built;
    }

    /// <summary>
    /// influent = treated + bypass, treated within capacity. Treated volume is split by level,
    /// treated[p,t] = Σm T[p,t,m] with T[p,t,m] ≤ capacity·y[p,d(t),m], which makes aeration energy and
    /// chemicals (linear in T) exact without a product of treated volume and level.
    /// </summary>
    private void AddSecondaryBalance()
    {
        foreach (var plant in Network.Plants)
        {
            var influent = Case.InfluentM3[plant.Id];
            var capacityM3 = plant.SecondaryCapacityM3PerHour * PeriodHours;
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var treated = NumVar(0, capacityM3, Name("treated", plant.Id, P(t)));
                var bypass = NumVar(0, double.PositiveInfinity, Name("bypass", plant.Id, P(t)));
                Treated[(plant.Id, t)] = treated;
                Bypass[(plant.Id, t)] = bypass;
                EqualRow(influent[t], Name("influent", plant.Id, P(t))).Add(treated, 1).Add(bypass, 1);
                Costs.Add(CostComponent.BypassPenalty, bypass, Penalties.BypassPerM3);

                // The gate's big-M is the most that can be treated in the period: the tighter, the better the relaxation.
                var mostTreatedM3 = Math.Min(capacityM3, influent[t]);
                var split = EqualRow(0, Name("treated-split", plant.Id, P(t))).Add(treated, 1);
                foreach (var level in AllowedLevels[plant.Id])
                {
                    var atLevel = NumVar(0, mostTreatedM3, Name("treated-at", plant.Id, P(t), level.Id));
                    TreatedAtLevel[(plant.Id, t, level.Id)] = atLevel;
                    split.Add(atLevel, -1);
                    AtMostRow(0, Name("level-gate", plant.Id, P(t), level.Id))
                        .Add(atLevel, 1)
                        .Add(LevelOn[(plant.Id, period.Day, level.Id)], -mostTreatedM3);
                    AddLoad(plant.Id, t, atLevel, level.AerationEnergyKWhPerM3);
                    Costs.Add(CostComponent.Chemicals, atLevel, level.ChemicalCostPerM3);
                }
            }
        }
    }
}
