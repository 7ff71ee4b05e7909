using Google.OrTools.LinearSolver;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Solving;

// The plan a solve starts from: the rule-based baseline at once, its on/off decisions with re-optimised flows,
// then the plan rounded from the LP relaxation; the cheapest is kept. Each solver is disposed before the next
// model is built, so at most one model is in memory (the repair rounds of the rounded plan hold two LPs).
internal sealed partial class SolveRun
{
    // Shares of the time left that the baseline's LP, the LP relaxation and the rounded plan's LPs may use at most:
    // generous, because without them there is no bound and no better start, and they normally take a small part of it.
    private const double BaselineLpTimeShare = 0.5;
    private const double RelaxationTimeShare = 0.5;
    // At size M in a 10 s solve the rounded plan's LPs need about 3.5 s of the 6.7 s left: with half, a slower run cut
    // the last level repairs short (29,501 EUR instead of 27,760, measured).
    private const double FirstPlanTimeShare = 0.7;

    // Seconds the LP with the baseline's decisions took, to judge how long the explanation LP may need.
    private double? baselineLpSeconds;

    /// <summary>The cheapest of the starting plans; never null, since the baseline always gives one. The baseline's
    /// own cost is reported as soon as it is known, so there is a plan within seconds at every size.</summary>
    private KeptPlan StartPlan()
    {
        Report(SolvePhases.Baseline);
        var baseline = knownBaseline ?? RuleBasedBaseline.Build(planningCase);
        // The baseline's cost comes from PlanCosting, the checker's accounting, which agrees with the objective.
        var start = new KeptPlan(KeptPlan.BaselineFlows, baseline.Costs.Total, BaselineStart.IntegerValues(planningCase, baseline), baseline);
        incumbent = start.Objective;
        Report(SolvePhases.BaselineDecisions);
        cancellation.ThrowIfCancellationRequested();

        // On a tie the model's plan is kept: its problems are explained from the model (reasons, binding limits).
        start = KeptPlan.Cheaper(BaselineDecisions(baseline), start)!;
        incumbent = start.Objective;
        Report(SolvePhases.FirstPlan);
        cancellation.ThrowIfCancellationRequested();

        start = KeptPlan.Cheaper(RelaxAndRound(), start)!;
        incumbent = start.Objective;
        return start;
    }

    // The baseline's decisions with the flows re-solved (see BaselineStart.Solve).
    private KeptPlan? BaselineDecisions(Plan baseline)
    {
        var started = clock.Elapsed.TotalSeconds;
        var kept = BaselineStart.Solve(planningCase, baseline, Remaining() * BaselineLpTimeShare, notes);
        if (kept is null)
        {
            notes.Add("the LP with the baseline's on/off decisions gave no plan (out of time, or the baseline's decisions leave the model no way)");
            return null;
        }
        baselineLpSeconds = clock.Elapsed.TotalSeconds - started;
        MemoryRelease.AfterModel();
        return kept;
    }

    // The relaxation's optimum is a true lower bound (kept for HiGHS, whose own bound is not); its rounding is a
    // first plan. The relaxation's solver is disposed before the rounded plan's LPs are built.
    private KeptPlan? RelaxAndRound()
    {
        var started = clock.Elapsed.TotalSeconds;
        Dictionary<string, double> rounded;
        using (var lp = SolverBackend.CreateRelaxation(Remaining() * RelaxationTimeShare))
        {
            var relaxed = PlanModel.Build(lp, planningCase, IntegerMode.Relaxed);
            NoteModel(relaxed);
            var status = lp.Solve();
            if (status != Solver.ResultStatus.OPTIMAL)
            {
                notes.Add($"the LP relaxation was not solved within {clock.Elapsed.TotalSeconds - started:0.#} s ({SolverBackend.Describe(status)}): " +
                          "no bound from it and no plan rounded from it");
                return null;
            }
            relaxationBound = lp.Objective().Value();
            relaxationSeconds = clock.Elapsed.TotalSeconds - started;
            rounded = FirstPlan.Round(relaxed);
        }
        Report(SolvePhases.RoundedPlan);
        MemoryRelease.AfterModel();
        var first = FirstPlan.Build(planningCase, rounded, Remaining() * FirstPlanTimeShare, notes);
        MemoryRelease.AfterModel();
        return first;
    }

    // The model's size and its notes about the data, taken from the first model built (every model has the same shape).
    private void NoteModel(PlanModel model)
    {
        if (modelSize is not null)
        {
            return;
        }
        modelSize = (model.Solver.NumVariables(), model.IntegerDecisions.Count, model.Solver.NumConstraints());
        notes.AddRange(model.Notes);
    }
}
