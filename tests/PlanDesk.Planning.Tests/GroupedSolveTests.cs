using NodaTime;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Generation;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>
/// Regions that fall apart into independent groups of plants are solved one model per group and the plans joined.
/// That must be exact: the same optimum as one model of the whole region (within the asked gap), the same model
/// size, and a plan the checker passes on the whole case.
/// </summary>
public class GroupedSolveTests
{
    private static readonly SolveOptions Options = new() { TimeLimitSeconds = 60, GapPercent = 0.5, Explain = false };

    private static PlanningCase DemoRegion(int days)
    {
        var loaded = NetworkLoader.Load(Repository.Network("demo-region.json"));
        Assert.True(loaded.Succeeded, string.Join("\n", loaded.Problems));
        var created = PlanningCase.Create(loaded.Network!, new LocalDate(2027, 3, 25), days);
        Assert.True(created.Succeeded, string.Join("\n", created.Problems));
        return created.Case!;
    }

    private static void AssertPassesTheChecker(PlanningCase planningCase, Plan plan)
    {
        var report = PlanChecker.Check(planningCase, plan);
        Assert.Empty(report.HardViolations.Select(v => v.Message));
        Assert.Empty(report.Violations.Where(v => !ProblemKinds.Names(plan.Problems, v)).Select(v => v.Message));
    }

    [Fact]
    public void SplitSolveOfDemoRegionMatchesTheWholeRegionModel()
    {
        var planningCase = DemoRegion(2);

        var split = Planner.Solve(planningCase, Options);
        var whole = Planner.Solve(planningCase, Options with { SplitIntoGroups = false });

        Assert.Contains(split.Solve.Notes, n => n.StartsWith("the region was solved as 3 independent groups", StringComparison.Ordinal));
        Assert.DoesNotContain(whole.Solve.Notes, n => n.Contains("independent groups", StringComparison.Ordinal));
        Assert.Equal(SolveStatus.Optimal, split.Solve.Status);
        Assert.Equal(SolveStatus.Optimal, whole.Solve.Status);
        // Both bounds are proven lower bounds on the same optimum, so each plan's objective lies above the other's bound.
        Assert.True(split.Solve.BestBound <= whole.Solve.Objective + 1e-6, $"split bound {split.Solve.BestBound} above whole {whole.Solve.Objective}");
        Assert.True(whole.Solve.BestBound <= split.Solve.Objective + 1e-6, $"whole bound {whole.Solve.BestBound} above split {split.Solve.Objective}");
        Assert.True(Math.Abs(split.Solve.Objective - whole.Solve.Objective) <= Options.GapPercent / 100 * Math.Abs(whole.Solve.Objective),
            $"split {split.Solve.Objective:F2} against whole {whole.Solve.Objective:F2}");
        // Every family is per plant or per element, so the groups' models add up to the whole one.
        Assert.Equal(whole.Solve.Variables, split.Solve.Variables);
        Assert.Equal(whole.Solve.IntegerVariables, split.Solve.IntegerVariables);
        Assert.Equal(whole.Solve.Constraints, split.Solve.Constraints);
        Assert.Equal(split.Solve.Objective, split.Costs.Total, 1e-6 * Math.Max(1, Math.Abs(split.Solve.Objective)));
        AssertPassesTheChecker(planningCase, split);
    }

    [Fact]
    public void SplitSolveOfGeneratedMediumRegionPassesTheChecker()
    {
        var network = RegionGenerator.Generate(RegionSize.M, 1).Network;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, 1).Case!;
        Assert.Equal(2, IndependentGroups.Of(network).Count);

        var plan = Planner.Solve(planningCase, Options);

        Assert.NotEqual(SolveStatus.NoPlan, plan.Solve.Status);
        Assert.Contains(plan.Solve.Notes, n => n.StartsWith("the region was solved as 2 independent groups", StringComparison.Ordinal));
        Assert.Equal(network.Customers.Select(c => c.Id), plan.Customers.Select(c => c.Customer));
        AssertPassesTheChecker(planningCase, plan);
    }

    [Fact]
    public void SplitSolveWithExplanationsGivesMarginalCostsForCustomersOfEveryGroup()
    {
        var planningCase = DemoRegion(1);

        var plan = Planner.Solve(planningCase, Options with { Explain = true });

        var explained = plan.MarginalWaterCosts.Select(m => m.Customer).ToHashSet();
        Assert.Contains(new CustomerId("tessford-gardens"), explained);
        Assert.Contains(new CustomerId("whinlow-farms"), explained);
        Assert.Contains(new CustomerId("oxlip-golf"), explained);
    }

    [Fact]
    public void SplitSolveReportsOneProgressWhoseLastIncumbentIsThePlansObjective()
    {
        var planningCase = DemoRegion(1);
        var reports = new Recorder();

        var plan = Planner.Solve(planningCase, Options, reports);

        Assert.NotEmpty(reports.Items);
        Assert.All(reports.Items, r => Assert.EndsWith(" (3 independent groups)", r.Phase));
        Assert.Equal("rule-based baseline (3 independent groups)", reports.Items[0].Phase);
        // A plan from the first report on: every group's baseline, which together are the region's baseline.
        var baseline = Core.Baseline.RuleBasedBaseline.Build(planningCase).Costs.Total;
        Assert.NotNull(reports.Items[0].Incumbent);
        Assert.Equal(baseline, reports.Items[0].Incumbent!.Value, 1e-6 * Math.Max(1, baseline));
        var last = reports.Items[^1];
        Assert.Equal("joining the group plans (3 independent groups)", last.Phase);
        Assert.NotNull(last.Incumbent);
        Assert.Equal(plan.Solve.Objective, last.Incumbent!.Value, 1e-6 * Math.Max(1, Math.Abs(plan.Solve.Objective)));
        Assert.Equal(plan.Solve.BestBound, last.BestBound!.Value, 1e-6 * Math.Max(1, Math.Abs(plan.Solve.Objective)));
    }

    [Fact]
    public void CancelledSplitSolveStopsEveryGroup()
    {
        var planningCase = DemoRegion(1);
        using var cancellation = new CancellationTokenSource();
        cancellation.Cancel();

        Assert.ThrowsAny<OperationCanceledException>(() => Planner.Solve(planningCase, Options, null, cancellation.Token));
    }

    // Collects reports on the reporting thread (Progress<T> would post them later).
    private sealed class Recorder : IProgress<SolveProgress>
    {
        private readonly Lock gate = new();
        private readonly List<SolveProgress> items = [];

        public IReadOnlyList<SolveProgress> Items
        {
            get
            {
                lock (gate)
                {
                    return [.. items];
                }
            }
        }

        public void Report(SolveProgress value)
        {
            lock (gate)
            {
                items.Add(value);
            }
        }
    }
}
