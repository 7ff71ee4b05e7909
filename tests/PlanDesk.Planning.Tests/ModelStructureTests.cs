using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Planning.Model;
using PlanDesk.Planning.Tests.Fixtures;

namespace PlanDesk.Planning.Tests;

/// <summary>The model's shape, without solving.</summary>
public class ModelStructureTests
{
    // One plant with two levels, one stage (3 units, 3 h minimum run), one tank, one pipeline with 2 pumps, one hourly
    // customer, a daily N cap, a biogas engine and a demand charge; 24 hourly periods, one day.
    private static PlanningCase TinyCase()
    {
        var stage = Build.Stage("larkmoor-filter", "store", units: 3, minFlowM3PerHour: 40, maxFlowM3PerHour: 120) with { MinRunHours = 3 };
        var plant = Build.Plant(influentM3PerHour: 500, levels: [Build.Level("standard"), Build.Level("tight")], stages: [stage],
            permit: new Permit { DailyTotalNitrogenKg = 200 }) with
        {
            Biogas = new Biogas(Series.Constant(50), 6, 500, 100, 150, 0.35),
        };
        var pipeline = Build.ToCustomer("to-farm", "store", "farm") with { Pumps = new PumpSet(2, 20, 80) };
        var network = Build.Network(Build.FlatTariff(100, demandChargePerKwMonth: 8), [plant],
            tanks: [Build.Tank("store")], pipelines: [pipeline], customers: [Build.HourlyCustomer("farm", 60)]);
        return Build.Case(network);
    }

    private static Dictionary<string, int> CountByFamily(IEnumerable<string> names) =>
        names.GroupBy(n => n[..n.IndexOf('[')]).ToDictionary(g => g.Key, g => g.Count());

    // Hand count, T = 24 periods, 1 day, 2 levels:
    // variables: level 2; treated, bypass 24 each; treated-at 48; units, feed, starts 24 each; secondary-to-outfall 24;
    // flow, pumps 24 each; volume, tank-below-min, tank-above-max 24 each; tank-end-deficit 1; short 24;
    // nutrient-volume-at 2; reuse-at 2; tn-daily-excess 1; tn-daily-excess-at 2; import, export, engine, gas-to-engine, flare, holder 24 each; peak 1.
    // Integers: 2 levels + 24 units + 24 pumps = 50.
    [Fact]
    public void VariableFamiliesHaveOneVariablePerKey()
    {
        using var solver = Solver.CreateSolver("SCIP");
        var model = PlanModel.Build(solver, TinyCase(), IntegerMode.Integer);

        var families = CountByFamily(solver.variables().Select(v => v.Name()));

        Assert.Equal(2, families["level"]);
        Assert.Equal(48, families["treated-at"]);
        Assert.Equal(24, families["units"]);
        Assert.Equal(24, families["pumps"]);
        Assert.Equal(24, families["holder"]);
        Assert.Equal(2, families["nutrient-volume-at"]);
        Assert.Equal(1, families["tn-daily-excess"]);
        Assert.Equal(2, families["tn-daily-excess-at"]);
        Assert.Equal(2, families["reuse-at"]);
        Assert.Equal(1, families["peak"]);
        Assert.Equal(1, families["tank-end-deficit"]);
        Assert.False(families.ContainsKey("tp-daily-excess"));
        Assert.Equal(50, model.IntegerVariables.Count());
        Assert.Equal(2 + 24 * 2 + 48 + 24 * 3 + 24 + 24 * 2 + 24 * 3 + 1 + 24 + 2 + 2 + 1 + 2 + 24 * 6 + 1, solver.NumVariables());
    }

    // Hand count of rows: one-level 1; influent, treated-split 24 each; level-gate 48; feed-min, feed-max, start-count,
    // min-run 24 each; secondary-effluent 24; pump-min, pump-max 24 each; tank-balance, tank-min, tank-max 24 each;
    // tank-end 1; deliver 24; nutrient-volume 1; nutrient-volume-gate 2; tn-daily 1; tn-daily-excess-split 1;
    // tn-daily-excess-level 2; reuse-split 1; reuse-gate 2; nutrient-volume-floor 2; power, engine-gas, holder-balance,
    // export-limit, peak-import 24 each. No outfall limit, no blend limit, no monthly cap.
    [Fact]
    public void ConstraintFamiliesHaveOneRowPerKey()
    {
        using var solver = Solver.CreateSolver("SCIP");
        PlanModel.Build(solver, TinyCase(), IntegerMode.Integer);

        var families = CountByFamily(solver.constraints().Select(c => c.Name()));

        Assert.Equal(1, families["one-level"]);
        Assert.Equal(48, families["level-gate"]);
        Assert.Equal(24, families["min-run"]);
        Assert.Equal(24, families["start-count"]);
        Assert.Equal(24, families["deliver"]);
        Assert.Equal(1, families["tn-daily"]);
        Assert.Equal(1, families["tn-daily-excess-split"]);
        Assert.Equal(2, families["tn-daily-excess-level"]);
        Assert.Equal(2, families["nutrient-volume-gate"]);
        Assert.Equal(1, families["reuse-split"]);
        Assert.Equal(2, families["reuse-gate"]);
        Assert.Equal(2, families["nutrient-volume-floor"]);
        Assert.False(families.ContainsKey("blend"));
        Assert.False(families.ContainsKey("outfall-max"));
        Assert.Equal(1 + 24 * 2 + 48 + 24 * 4 + 24 + 24 * 2 + 24 * 3 + 1 + 24 + 1 + 2 + 1 + 1 + 2 + 1 + 2 + 2 + 24 * 5, solver.NumConstraints());
    }

    // The minimum run row of period 5 with L = 3 periods: units[t5] − starts[t3] − starts[t4] − starts[t5] ≥ 0.
    [Fact]
    public void MinimumRunRowSumsTheStartsOfTheLastThreeHours()
    {
        using var solver = Solver.CreateSolver("SCIP");
        PlanModel.Build(solver, TinyCase(), IntegerMode.Integer);

        var row = solver.LookupConstraintOrNull("min-run[larkmoor-filter,t5]");
        Assert.NotNull(row);
        var coefficients = solver.variables().Where(v => row.GetCoefficient(v) != 0).ToDictionary(v => v.Name(), v => row.GetCoefficient(v));
        Assert.Equal(new Dictionary<string, double>
        {
            ["units[larkmoor-filter,t5]"] = 1,
            ["starts[larkmoor-filter,t3]"] = -1,
            ["starts[larkmoor-filter,t4]"] = -1,
            ["starts[larkmoor-filter,t5]"] = -1,
        }, coefficients);
        Assert.Equal(0, row.Lb());
    }

    // The LP export names rows and columns after the network (the LP format writes '-' as '_').
    [Fact]
    public void LpExportReadsLikeTheNetwork()
    {
        using var solver = Solver.CreateSolver("SCIP");
        PlanModel.Build(solver, TinyCase(), IntegerMode.Integer);

        var lp = solver.ExportModelAsLpFormat(false);

        Assert.Contains("units[larkmoor_filter,t17]", lp);
        Assert.Contains("level[mill,2027_03_24,tight]", lp);
        Assert.Contains("tank_balance[store,t0]:", lp);
        Assert.Contains("deliver[farm,t23]:", lp);
        Assert.Contains("tn_daily[mill,2027_03_24]:", lp);
    }

    // Relaxed: no integer variables in the solver; fixed: every integer variable has equal bounds at the given value.
    [Fact]
    public void FixedModeFixesEveryIntegerDecision()
    {
        var planningCase = TinyCase();
        using var solver = Solver.CreateSolver("GLOP");
        var values = new Dictionary<string, double> { ["units[larkmoor-filter,t3]"] = 2, ["level[mill,2027-03-24,tight]"] = 1 };

        var model = PlanModel.Build(solver, planningCase, IntegerMode.Fixed, values);

        var units = solver.LookupVariableOrNull("units[larkmoor-filter,t3]");
        Assert.Equal((2.0, 2.0), (units.Lb(), units.Ub()));
        var standard = solver.LookupVariableOrNull("level[mill,2027-03-24,standard]");
        Assert.Equal((0.0, 0.0), (standard.Lb(), standard.Ub()));
        Assert.All(model.IntegerVariables, v => Assert.Equal(v.Lb(), v.Ub()));
    }
}
