using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Generation;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Model;
using PlanDesk.Planning.Solving;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>
/// The first plan of every solve: the rule-based baseline's on/off decisions with the flows re-solved as an LP.
/// It must be a whole, checked plan, never dearer than the baseline, and it must reach the model's variables by name.
/// </summary>
public class BaselineStartTests
{
    private static PlanningCase DemoRegionTwoDays()
    {
        var loaded = NetworkLoader.Load(Repository.Network("demo-region.json"));
        Assert.True(loaded.Succeeded, string.Join("\n", loaded.Problems));
        var network = loaded.Network!;
        var created = PlanningCase.Create(network, network.DefaultStartDate!.Value, 2);
        Assert.True(created.Succeeded, string.Join("\n", created.Problems));
        return created.Case!;
    }

    private static PlanningCase Generated(RegionSize size, int seed)
    {
        var network = RegionGenerator.Generate(size, seed).Network;
        var created = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays);
        Assert.True(created.Succeeded, string.Join("\n", created.Problems));
        return created.Case!;
    }

    // Levels that no level meets (N ≤ 6 mg/L, P ≤ 0.5 mg/L). Hand working: "low-n" misses by 1 + 2.5 = 3.5 mg/L,
    // "low-p" by 2 + 0.1 = 2.1, so the rules pick low-p (the smallest miss) while the model builds only the tightest
    // in N, low-n: the baseline's level has no variable of its own in the model.
    private static PlanningCase NoLawfulLevel() => Build.Case(Build.Network(Build.FlatTariff(100),
        [Build.Plant(influentM3PerHour: 1000,
            levels: [Build.Level("low-p", nitrogenMgPerL: 8, phosphorusMgPerL: 0.6), Build.Level("low-n", nitrogenMgPerL: 7, phosphorusMgPerL: 3)],
            permit: new Permit { MaxTotalNitrogenMgPerL = 6, MaxTotalPhosphorusMgPerL = 0.5 })]));

    public static TheoryData<string> Regions => ["demo-2-days", "generated-S-1"];

    private static PlanningCase Region(string name) => name == "demo-2-days" ? DemoRegionTwoDays() : Generated(RegionSize.S, 1);

    [Theory]
    [MemberData(nameof(Regions))]
    public void BaselineStartIsNeverDearerThanTheBaselineAndPassesTheChecker(string region)
    {
        var planningCase = Region(region);
        var baseline = RuleBasedBaseline.Build(planningCase);
        var notes = new List<string>();

        var start = BaselineStart.Solve(planningCase, baseline, 60, notes);

        Assert.NotNull(start);
        Assert.Empty(notes);
        // Both sides costed by the checker's own accounting (PlanCosting), not by the producers' sums.
        var baselineCost = PlanCosting.Compute(planningCase, baseline).Costs.Total;
        var report = PlanChecker.Check(planningCase, start.Plan);
        Assert.NotNull(report.RecomputedCosts);
        Assert.True(report.RecomputedCosts.Total <= baselineCost + 1e-6 * baselineCost,
            $"baseline-start plan {report.RecomputedCosts.Total:F2} dearer than the baseline {baselineCost:F2}");
        // The model's objective and the checker's accounting agree on the same plan (an objectiveMismatch would be hard).
        Assert.Empty(report.HardViolations.Select(v => v.Message));
        Assert.Empty(report.Violations.Where(v => !ProblemKinds.Names(start.Plan.Problems, v)).Select(v => v.Message));
        // The levels, units and pumps are the baseline's: only the flows were re-solved.
        Assert.Equal(baseline.Stages.Select(s => s.UnitsRunning), start.Plan.Stages.Select(s => s.UnitsRunning));
        Assert.Equal(baseline.Plants.Select(p => p.LevelByDay), start.Plan.Plants.Select(p => p.LevelByDay));
    }

    [Theory]
    [InlineData("demo-2-days")]
    [InlineData("generated-S-1")]
    [InlineData("no-lawful-level")]
    public void BaselineValuesNameEveryIntegerVariableOfTheModelAndNothingElse(string region)
    {
        var planningCase = region == "no-lawful-level" ? NoLawfulLevel() : Region(region);
        var baseline = RuleBasedBaseline.Build(planningCase);
        using var solver = Google.OrTools.LinearSolver.Solver.CreateSolver("GLOP");
        var model = PlanModel.Build(solver, planningCase, IntegerMode.Relaxed);

        var values = BaselineStart.IntegerValues(planningCase, baseline);

        var modelNames = model.IntegerVariables.Select(v => v.Name()).ToHashSet();
        Assert.Empty(values.Keys.Except(modelNames));
        Assert.Empty(modelNames.Except(values.Keys));
        // One level per plant and day, as the model's one-level rows require.
        Assert.All(planningCase.Network.Plants, plant => Assert.All(planningCase.Horizon.Days, day =>
            Assert.Equal(1.0, values.Where(v => v.Key.StartsWith($"level[{plant.Id},{day.Date:yyyy-MM-dd},", StringComparison.Ordinal)).Sum(v => v.Value))));
    }

    // Hand working: the model plans low-n (the tightest in N); the rules chose low-p, which the model does not build.
    [Fact]
    public void ABaselineLevelTheModelDoesNotBuildIsReplacedByTheModelsLevel()
    {
        var planningCase = NoLawfulLevel();
        var baseline = RuleBasedBaseline.Build(planningCase);
        Assert.Equal(new LevelId("low-p"), baseline.Plants[0].LevelByDay[0]);

        var values = BaselineStart.IntegerValues(planningCase, baseline);

        Assert.Equal(1.0, values["level[mill,2027-03-24,low-n]"]);
        Assert.Single(values);
    }
}
