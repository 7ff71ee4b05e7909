using PlanDesk.Core.Generation;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Generation;

/// <summary>Generated regions obey the network rules and are mostly servable.</summary>
public class RegionPlausibilityTests
{
    public static TheoryData<string, int> Regions => new()
    {
        { "S", 1 }, { "S", 2 }, { "M", 1 }, { "M", 9 }, { "L", 4 }, { "XL", 1 },
    };

    [Theory]
    [MemberData(nameof(Regions))]
    public void PipelinesOnlyCarryWaterToUsesNeedingTheSameOrAWorseClass(string size, int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(size)!, seed).Network;

        Assert.All(network.Pipelines, p =>
        {
            var supplied = network.Tank(p.From).Class;
            var required = p.To.Tank is { } tank ? network.Tank(tank).Class : network.Customer(p.To.Customer!.Value).Class;
            Assert.True(network.Serves(supplied, required), $"{p.Id}: class {supplied} to a use needing {required}");
        });
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void StagesFillTanksOfTheirOwnPlantAndClass(string size, int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(size)!, seed).Network;

        Assert.All(network.Stages, s =>
        {
            var product = network.Tank(s.ProductTank);
            Assert.Equal(s.Plant, product.Plant);
            Assert.True(network.Serves(s.ProducesClass, product.Class));
            Assert.InRange(s.RecoveryFraction, 0.5, 1.0);
            Assert.InRange(s.UnitMinFlowM3PerHour, 0, s.UnitMaxFlowM3PerHour);
            Assert.InRange(s.InitialUnitsRunning, 0, s.Units);
        });
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void TanksStartBetweenTheirLimits(string size, int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(size)!, seed).Network;

        Assert.All(network.Tanks, t =>
        {
            Assert.InRange(t.MinM3, 0, t.MaxM3);
            Assert.InRange(t.InitialM3, t.MinM3, t.MaxM3);
        });
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void EveryCustomerIsReachedAndItsDailyVolumeFitsItsWindow(string size, int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(size)!, seed).Network;

        Assert.All(network.Customers, c =>
        {
            var lines = network.Pipelines.Where(p => p.To.Customer == c.Id).ToList();
            Assert.NotEmpty(lines);
            if (c.Demand is DailyDemand daily)
            {
                var windowHours = Enumerable.Range(0, 24).Count(h => daily.Allows(new NodaTime.LocalTime(h, 0)));
                Assert.True(daily.MaxM3PerHour!.Value * windowHours >= daily.VolumeM3PerDay, $"{c.Id}: volume does not fit its window");
                Assert.True(lines.Sum(l => l.CapacityM3PerHour) >= daily.MaxM3PerHour.Value, $"{c.Id}: pipelines narrower than its delivery rate");
            }
        });
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void AverageDemandStaysBelowWhatTheStagesCanProduce(string size, int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(size)!, seed).Network;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;

        var demandM3 = planningCase.DemandM3.Values.Sum(v => v.Sum()) + planningCase.DailyVolumeM3.Values.Sum(v => v.Sum());
        var productM3 = network.Stages.Sum(s => s.Units * s.UnitMaxFlowM3PerHour * s.RecoveryFraction) * planningCase.PeriodCount * planningCase.PeriodHours;
        var influentM3 = planningCase.InfluentM3.Values.Sum(v => v.Sum());

        Assert.InRange(demandM3, 0.2 * productM3, 0.8 * productM3);
        Assert.True(demandM3 < 0.5 * influentM3, $"demand {demandM3:F0} m3 against influent {influentM3:F0} m3");
    }

    [Theory]
    [MemberData(nameof(Regions))]
    public void PlantsAreSizedAtOneHundredEightyLitresPerPersonADay(string size, int seed)
    {
        var network = RegionGenerator.Generate(RegionSize.Parse(size)!, seed).Network;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;

        // 180 L/PE/day — Gujer, Siedlungswasserwirtschaft [pub]; plants of 20 000 to 400 000 PE, with a
        // storm on one day adding up to about a day and a half of extra flow.
        Assert.All(network.Plants, p =>
        {
            var dailyM3 = planningCase.InfluentM3[p.Id].Sum() / network.DefaultDays;
            Assert.InRange(dailyM3, 20_000 * 0.180 * 0.9, 400_000 * 0.180 * 1.6);
        });
    }
}
