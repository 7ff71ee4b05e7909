using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// The rule-based baseline's on/off decisions as the model's integer values by variable name (levels, units,
/// pumps), so that a fixed-integer LP can re-optimise its flows: the first plan of every solve, there within
/// seconds at every size, long before the LP relaxation at large sizes.
/// </summary>
internal static class BaselineStart
{
    private const double Tolerance = 1e-9;

    /// <summary>The baseline's levels, units and pumps fixed and the flows re-solved as an LP: never dearer than the
    /// baseline when its flows are feasible for the model. Null when the LP ends without a plan (out of time, or the
    /// baseline's decisions leave the model no way).</summary>
    public static KeptPlan? Solve(PlanningCase planningCase, Plan baseline, SolveOptions options, double timeLimitSeconds, List<string> notes)
    {
        var values = IntegerValues(planningCase, baseline);
        using var solved = FirstPlan.SolveFixed(planningCase, values, options, timeLimitSeconds, notes);
        if (solved is null)
        {
            return null;
        }
        var unknown = values.Keys.Except(solved.Model.IntegerVariables.Select(v => v.Name())).ToList();
        if (unknown.Count > 0)
        {
            notes.Add($"{unknown.Count} of the baseline's decisions name no variable of the model (e.g. {unknown[0]}); they were left out");
        }
        return KeptPlan.Read(solved, KeptPlan.BaselineDecisions);
    }

    /// <summary>Integer values by name for <paramref name="baseline"/>'s levels, units and pumps. Only variables the
    /// model builds are named: a level the model does not allow (it breaks a concentration limit) is replaced by the
    /// level the model plans instead.</summary>
    public static Dictionary<string, double> IntegerValues(PlanningCase planningCase, Plan baseline)
    {
        var network = planningCase.Network;
        var values = new Dictionary<string, double>();
        foreach (var plantPlan in baseline.Plants)
        {
            var plant = network.Plant(plantPlan.Plant);
            var allowed = LevelsTheModelAllows(plant);
            foreach (var day in planningCase.Horizon.Days)
            {
                var chosen = allowed.FirstOrDefault(l => l.Id == plantPlan.LevelByDay[day.Index]) ?? allowed[0];
                var date = day.Date.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture);
                foreach (var level in allowed)
                {
                    values[PlanModel.Name("level", plant.Id, date, level.Id)] = level == chosen ? 1 : 0;
                }
            }
        }
        foreach (var stagePlan in baseline.Stages)
        {
            for (var t = 0; t < stagePlan.UnitsRunning.Length; t++)
            {
                values[PlanModel.Name("units", stagePlan.Stage, $"t{t}")] = stagePlan.UnitsRunning[t];
            }
        }
        foreach (var pipelinePlan in baseline.Pipelines.Where(l => l.PumpsRunning is not null))
        {
            for (var t = 0; t < pipelinePlan.PumpsRunning!.Length; t++)
            {
                values[PlanModel.Name("pumps", pipelinePlan.Pipeline, $"t{t}")] = pipelinePlan.PumpsRunning[t];
            }
        }
        return values;
    }

    /// <summary>The model's rule for the levels it builds (PlanModel.LevelsWithinLimits, kept apart so the model's
    /// files stay untouched): those within the permit's concentration limits, else only the tightest. A test checks
    /// that every name given here is a variable of the model.</summary>
    private static IReadOnlyList<TreatmentLevel> LevelsTheModelAllows(Plant plant)
    {
        var permit = plant.Permit;
        var allowed = plant.Levels
            .Where(l => permit.MaxTotalNitrogenMgPerL is not { } maxN || l.EffluentTotalNitrogenMgPerL <= maxN + Tolerance)
            .Where(l => permit.MaxTotalPhosphorusMgPerL is not { } maxP || l.EffluentTotalPhosphorusMgPerL <= maxP + Tolerance)
            .ToList();
        return allowed.Count > 0
            ? allowed
            : [plant.Levels.OrderBy(l => l.EffluentTotalNitrogenMgPerL).ThenBy(l => l.EffluentTotalPhosphorusMgPerL).First()];
    }
}
