using PlanDesk.Core.Model;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Core.Tests.Checking;

/// <summary>Engine, gas holder and electricity balance, broken one way at a time.</summary>
public class EnergyMutationTests
{
    private readonly PlanningCase _case = SmallNetwork.Case();
    private static readonly string Plant = SmallNetwork.Norwick.Value;

    private Plan Valid() => PlanRestate.Copy(RuleBasedBaseline.Build(_case));

    [Fact]
    public void ImportThatDoesNotCoverTheLoadIsAnElectricityBalanceViolation()
    {
        var plan = Valid();
        plan.Plants[0].ImportKWh[4] -= 50;

        var report = PlanChecker.Check(_case, PlanRestate.Costs(_case, plan));

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.ElectricityBalance, Plant, (int?)4), (found.Kind, found.Where, found.Period));
        Assert.Equal(50, found.Amount, 6);
    }

    [Fact]
    public void EngineRunAboveItsSizeIsAnEngineSizeViolation()
    {
        var plan = Valid();
        var p = plan.Plants[0];
        // 100 Nm3 × 6 kWh/Nm3 × 0.36 = 216 kWh in an hour from a 180 kW engine; the holder gives the extra 50 Nm3.
        // The last hour burns 50 Nm3 less (108 kWh less), so the holder ends where it started.
        p.GasToEngineNm3[2] = 100;
        p.EngineKWh[2] = 216;
        var last = p.HolderEndNm3.Length - 1;
        for (var t = 2; t < last; t++)
        {
            p.HolderEndNm3[t] -= 50;
        }
        p.GasToEngineNm3[last] -= 50;
        p.EngineKWh[last] -= 108;

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.EngineSize, Plant, (int?)2), (found.Kind, found.Where, found.Period));
        Assert.Equal(36, found.Amount, 6);
    }

    [Fact]
    public void HolderEmptiedByTheEndOfTheHorizonIsAHolderEndViolation()
    {
        var plan = Valid();
        var p = plan.Plants[0];
        var last = p.HolderEndNm3.Length - 1;
        var start = SmallNetwork.Case().Network.Plant(SmallNetwork.Norwick).Biogas!.InitialHolderNm3;
        // Burn 20 Nm3 more in the last hour than arrives (20 Nm3 × 6 kWh/Nm3 × 0.36 = 43.2 kWh more, still within
        // the engine's 180 kWh): the rules keep the holder at its start level, so it now ends 20 Nm3 below it.
        p.GasToEngineNm3[last] += 20;
        p.EngineKWh[last] += 43.2;
        p.HolderEndNm3[last] -= 20;

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.HolderEndBelowStart, Plant, (int?)last), (found.Kind, found.Where, found.Period));
        Assert.Equal(start - p.HolderEndNm3[last], found.Amount, 6);
    }

    [Fact]
    public void GasFlaredWithoutLeavingTheHolderIsAHolderBalanceViolation()
    {
        var plan = Valid();
        plan.Plants[0].GasFlaredNm3[3] = 10;

        var report = PlanChecker.Check(_case, plan);

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.HolderBalance, Plant, (int?)3), (found.Kind, found.Where, found.Period));
    }

    [Fact]
    public void HolderFilledBeyondItsSizeIsAHolderLimitViolationFromThePeriodItOverflows()
    {
        var plan = Valid();
        var p = plan.Plants[0];
        // Stop the engine for 8 h: 250 Nm3 + 8 × 50 Nm3 = 650 Nm3 in a 600 Nm3 holder from 07:00 on.
        for (var t = 0; t < p.HolderEndNm3.Length; t++)
        {
            if (t < 8)
            {
                p.GasToEngineNm3[t] = 0;
                p.EngineKWh[t] = 0;
            }
            p.HolderEndNm3[t] = 250 + 50 * Math.Min(t + 1, 8);
        }

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        Assert.All(report.Violations, v => Assert.Equal((ViolationKind.HolderLimits, Plant), (v.Kind, v.Where)));
        Assert.Equal(Enumerable.Range(7, 17), report.Violations.Select(v => v.Period!.Value));
        Assert.Equal(50, report.Violations[0].Amount, 6);
    }

    [Fact]
    public void EngineOutputNotMatchingItsGasIsAnEngineBalanceViolation()
    {
        var plan = Valid();
        plan.Plants[0].EngineKWh[6] += 20;

        var report = PlanChecker.Check(_case, PlanRestate.Flows(_case, plan));

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.EngineBalance, Plant, (int?)6), (found.Kind, found.Where, found.Period));
    }
}
