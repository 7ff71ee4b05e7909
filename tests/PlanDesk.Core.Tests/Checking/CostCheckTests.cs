using PlanDesk.Core.Model;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Tests.Fixtures;

namespace PlanDesk.Core.Tests.Checking;

/// <summary>The plan's stated cost against the checker's own accounting, and that accounting against hand-worked formulas.</summary>
public class CostCheckTests
{
    private readonly PlanningCase _case = SmallNetwork.Case();

    [Fact]
    public void MisstatedCostComponentIsACostMismatchNamingTheComponent()
    {
        var plan = RuleBasedBaseline.Build(_case);
        var misstated = plan with { Costs = plan.Costs with { EnergyImport = plan.Costs.EnergyImport + 5 } };

        var report = PlanChecker.Check(_case, misstated);

        var found = Assert.Single(report.Violations);
        Assert.Equal((ViolationKind.CostMismatch, "energyImport"), (found.Kind, found.Where));
        Assert.Equal(5, found.Amount, 6);
    }

    [Fact]
    public void CostWithinACentOfTheRecomputedCostAgrees()
    {
        var plan = RuleBasedBaseline.Build(_case);
        var rounded = plan with { Costs = plan.Costs with { Chemicals = plan.Costs.Chemicals + 0.009 } };

        Assert.Empty(PlanChecker.Check(_case, rounded).Violations);
    }

    [Fact]
    public void SolverObjectiveDifferingFromTheRecomputedCostIsAnObjectiveMismatch()
    {
        var plan = RuleBasedBaseline.Build(_case);
        var milp = plan with { Method = "milp", Solve = plan.Solve with { Status = SolveStatus.Optimal, Objective = plan.Costs.Total + 10 } };

        var report = PlanChecker.Check(_case, milp);

        var found = Assert.Single(report.Violations);
        Assert.Equal(ViolationKind.ObjectiveMismatch, found.Kind);
        Assert.Equal(10, found.Amount, 6);
    }

    [Fact]
    public void HandEditedPlanIsNotHeldToItsStatedCost()
    {
        var plan = RuleBasedBaseline.Build(_case);
        var edited = plan with { Method = "edited", Costs = plan.Costs with { Chemicals = 0 } };

        var report = PlanChecker.Check(_case, edited);

        Assert.Empty(report.Violations);
        Assert.Equal(plan.Costs.Chemicals, report.RecomputedCosts!.Chemicals, 9);
    }

    [Fact]
    public void DemandChargeBillsTheRiseOfThePeakAboveTheMonthToDatePeak()
    {
        var plan = RuleBasedBaseline.Build(_case);
        var peakKw = plan.Plants[0].ImportKWh.Max(); // one-hour periods: kWh in the hour = kW

        var costs = PlanCosting.Compute(_case, plan).Costs;

        // 8.5 per kW-month on the rise above the 100 kW already reached this month.
        Assert.Equal(8.5 * (peakKw - 100), costs.DemandCharge, 9);
    }

    [Fact]
    public void LaterBillingMonthInTheHorizonIsChargedOnItsWholePeak()
    {
        var planningCase = SmallNetwork.Case(start: new NodaTime.LocalDate(2027, 3, 31), days: 2);
        var plan = RuleBasedBaseline.Build(planningCase);
        var march = planningCase.Horizon.Days[0].PeriodIndices.Max(t => plan.Plants[0].ImportKWh[t]);
        var april = planningCase.Horizon.Days[1].PeriodIndices.Max(t => plan.Plants[0].ImportKWh[t]);

        var costs = PlanCosting.Compute(planningCase, plan).Costs;

        Assert.Equal(8.5 * (march - 100) + 8.5 * april, costs.DemandCharge, 9);
    }

    [Fact]
    public void EnergyAndCarbonFollowTheTariffPriceAndGridEmissions()
    {
        var plan = RuleBasedBaseline.Build(_case);
        var import = plan.Plants[0].ImportKWh;
        var prices = _case.ImportPricePerMWh[SmallNetwork.Norwick];

        var costs = PlanCosting.Compute(_case, plan).Costs;

        Assert.Equal(import.Select((kWh, t) => kWh / 1000 * prices[t]).Sum(), costs.EnergyImport, 9);
        // 250 kg CO2 per MWh at 30 per tonne.
        Assert.Equal(import.Sum() / 1000 * 250 / 1000 * 30, costs.Carbon, 9);
    }

    [Fact]
    public void TankEndingBelowItsStartVolumeIsPricedPerCubicMetre()
    {
        var plan = PlanRestate.Copy(RuleBasedBaseline.Build(_case));
        var park = plan.Pipelines.Single(l => l.Pipeline == SmallNetwork.ToPark);
        park.FlowM3[23] += 100; // 120 → 220 m3 with two pumps, drawn from the class-A tank
        park.PumpsRunning![23] = 2;

        var restated = PlanRestate.Flows(_case, plan);

        Assert.Equal(0.5 * 100, restated.Costs.TankEndPenalty, 6);
    }
}
