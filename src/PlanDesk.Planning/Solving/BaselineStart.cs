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
    /// <summary>The baseline's levels, units and pumps fixed and the flows re-solved as an LP: never dearer than the
    /// baseline when its flows are feasible for the model. Null when the LP ends without a plan (out of time, or the
    /// baseline's decisions leave the model no way).</summary>
    public static KeptPlan? Solve(PlanningCase planningCase, Plan baseline, double timeLimitSeconds, List<string> notes)
    {
        var values = IntegerValues(planningCase, baseline);
        using var solved = FirstPlan.SolveFixed(planningCase, values, timeLimitSeconds);
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
    /// level the model plans instead (<see cref="PlanModel.LevelsBuilt"/>).</summary>
    public static Dictionary<string, double> IntegerValues(PlanningCase planningCase, Plan baseline)
    {
        var network = planningCase.Network;
        var values = new Dictionary<string, double>();
        foreach (var plantPlan in baseline.Plants)
        {
            var plant = network.Plant(plantPlan.Plant);
            var allowed = PlanModel.LevelsBuilt(plant);
            foreach (var day in planningCase.Horizon.Days)
            {
                var chosen = allowed.FirstOrDefault(l => l.Id == plantPlan.LevelByDay[day.Index]) ?? allowed[0];
                foreach (var level in allowed)
                {
                    values[PlanModel.LevelName(plant.Id, day, level.Id)] = level == chosen ? 1 : 0;
                }
            }
        }
        foreach (var stagePlan in baseline.Stages)
        {
            for (var t = 0; t < stagePlan.UnitsRunning.Length; t++)
            {
                values[PlanModel.UnitsName(stagePlan.Stage, t)] = stagePlan.UnitsRunning[t];
            }
        }
        foreach (var pipelinePlan in baseline.Pipelines.Where(l => l.PumpsRunning is not null))
        {
            for (var t = 0; t < pipelinePlan.PumpsRunning!.Length; t++)
            {
                values[PlanModel.PumpsName(pipelinePlan.Pipeline, t)] = pipelinePlan.PumpsRunning[t];
            }
        }
        return values;
    }
}
