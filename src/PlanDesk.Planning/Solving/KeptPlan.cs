using PlanDesk.Core.Plans;
using PlanDesk.Planning.Extraction;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// A complete plan held as a record instead of a live solver, so that its solver can be disposed before the next
/// model is built (the relaxation, the first plans' LPs and the MILP are never in memory together). Its integer
/// values by name start fix-and-optimise, hint SCIP and fix the explanation LP.
/// </summary>
/// <param name="Source">What the plan is, in the words of the solve's notes.</param>
/// <param name="Plan">The plan with its problems; its <see cref="SolveInfo"/> is filled in when it is returned.</param>
internal sealed record KeptPlan(string Source, double Objective, IReadOnlyDictionary<string, double> IntegerValues, Plan Plan)
{
    public const string BaselineFlows = "the rule-based baseline's own plan (its on/off decisions and its flows)";
    public const string BaselineDecisions = "the rule-based baseline's on/off decisions with re-optimised flows";
    public const string RoundedRelaxation = "the first plan rounded from the LP relaxation";
    public const string WholeMilp = "the whole MILP's plan";
    public const string DayByDay = "the first plan improved by fix-and-optimise over days";

    /// <summary>Reads a solved model's plan and problems; the caller still disposes <paramref name="solved"/>.</summary>
    public static KeptPlan Read(SolvedModel solved, string source)
    {
        var plan = PlanExtractor.Extract(solved.Model, new SolveInfo { Status = SolveStatus.Feasible, Objective = solved.Objective });
        plan = plan with { Problems = [.. solved.Model.DataProblems, .. ProblemReport.Find(solved.Model, plan)] };
        return new KeptPlan(source, solved.Objective, solved.Model.IntegerValues(), plan);
    }

    /// <summary>The cheaper of two plans; the first when they cost the same (within a relative 1e-9).</summary>
    public static KeptPlan? Cheaper(KeptPlan? first, KeptPlan? second) =>
        first is null ? second
        : second is null ? first
        : second.Objective < first.Objective - 1e-9 * Math.Max(1, Math.Abs(first.Objective)) ? second : first;
}
