using System.Text.Json.Nodes;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>Rules across fields and references, one malformed variant of the quickstart network each.</summary>
public class NetworkRuleTests
{
    [Fact]
    public void IdUsedTwiceAcrossKindsIsReportedAtTheSecondUse()
    {
        var result = LoadChanged(n => Tank(n)["id"] = "larkmoor");

        var problem = ProblemAt(result, "$.tanks[0].id");
        Assert.Contains("'larkmoor' is already the id of the plant at $.plants[0]", problem.What);
    }

    [Fact]
    public void TariffReferenceThatDoesNotResolveSuggestsTheNearestId()
    {
        var result = LoadChanged(n => Plant(n)["tariff"] = "larkmoor-gird");

        var problem = ProblemAt(result, "$.plants[0].tariff");
        Assert.Contains("'larkmoor-gird' is not the id of any tariff", problem.What);
        Assert.Contains("did you mean 'larkmoor-grid'?", problem.Fix);
    }

    [Fact]
    public void TankOfAnUnknownClassIsReported()
    {
        var result = LoadChanged(n => Tank(n)["class"] = "AA");

        Assert.Contains("'AA' is not the id of any quality class", ProblemAt(result, "$.tanks[0].class").What);
    }

    [Fact]
    public void PipelineToAnUnknownNodeIsReported()
    {
        var result = LoadChanged(n => Pipeline(n)["to"] = "hollins-orchad");

        var problem = ProblemAt(result, "$.pipelines[0].to");
        Assert.Contains("is not the id of any tank or customer", problem.What);
        Assert.Contains("did you mean 'hollins-orchard'?", problem.Fix);
    }

    [Fact]
    public void PipelineFromACustomerIsTheWrongKindOfNode()
    {
        var result = LoadChanged(n => Pipeline(n)["from"] = "hollins-orchard");

        Assert.Contains("'hollins-orchard' is a customer, not a tank", ProblemAt(result, "$.pipelines[0].from").What);
    }

    [Fact]
    public void PipelineCarryingWorseWaterToACustomerNeedingBetterIsRejected()
    {
        var result = LoadChanged(n =>
        {
            AddClassB(n);
            n["tanks"]!.AsArray().Add(JsonNode.Parse(
                """{ "id": "larkmoor-class-b", "name": "B tank", "plant": "larkmoor", "class": "B", "minM3": 0, "maxM3": 500, "initialM3": 100 }"""));
            n["pipelines"]!.AsArray().Add(JsonNode.Parse(
                """{ "id": "b-to-orchard", "name": "B line", "from": "larkmoor-class-b", "to": "hollins-orchard", "capacityM3PerHour": 50, "energyKWhPerM3": 0.05 }"""));
        });

        var problem = ProblemAt(result, "$.pipelines[1].to");
        Assert.Contains("customer 'hollins-orchard' needs class A but the pipeline carries class B", problem.What);
    }

    [Fact]
    public void StageFillingATankOfABetterClassIsRejected()
    {
        var result = LoadChanged(n =>
        {
            AddClassB(n);
            Stage(n)["producesClass"] = "B";
        });

        Assert.Contains("tank 'larkmoor-class-a' holds class A but the stage produces class B", ProblemAt(result, "$.plants[0].stages[0].tank").What);
    }

    [Fact]
    public void CustomerNeedingAClassNoStageProducesIsRejected()
    {
        var result = LoadChanged(n =>
        {
            n["qualityClasses"]!.AsArray().Insert(0, JsonNode.Parse("""{ "id": "AA", "name": "Potable-grade" }"""));
            Customer(n)["class"] = "AA";
        });

        Assert.Contains("no stage in the network produces class AA or a better class", ProblemAt(result, "$.customers[0].class").What);
    }

    [Fact]
    public void UnitMinimumFlowAboveMaximumIsRejected()
    {
        var result = LoadChanged(n => Stage(n)["unitMinFlowM3PerHour"] = 150);

        Assert.Contains("unitMinFlowM3PerHour 150 is above unitMaxFlowM3PerHour 120", ProblemAt(result, "$.plants[0].stages[0].unitMinFlowM3PerHour").What);
    }

    [Fact]
    public void TankMinimumAboveMaximumIsRejected()
    {
        var result = LoadChanged(n => Tank(n)["minM3"] = 3000);

        Assert.Contains("minM3 3000 is above maxM3 2500", ProblemAt(result, "$.tanks[0].minM3").What);
    }

    [Fact]
    public void InitialVolumeOutsideTheTankRangeIsRejected()
    {
        var result = LoadChanged(n => Tank(n)["initialM3"] = 100);

        Assert.Contains("100 m3 is outside the tank's range [200, 2500]", ProblemAt(result, "$.tanks[0].initialM3").What);
    }

    [Fact]
    public void StandardLevelMustBeOneOfThePlantsLevels()
    {
        var result = LoadChanged(n => Plant(n)["standardLevel"] = "standrd");

        var problem = ProblemAt(result, "$.plants[0].standardLevel");
        Assert.Contains("not one of this plant's treatment levels", problem.What);
        Assert.Contains("did you mean 'standard'?", problem.Fix);
    }

    [Fact]
    public void MoreUnitsRunningThanTheStageHasIsRejected()
    {
        var result = LoadChanged(n => Stage(n)["initialUnitsRunning"] = 4);

        Assert.Contains("4 units running but the stage has only 3", ProblemAt(result, "$.plants[0].stages[0].initialUnitsRunning").What);
    }

    [Fact]
    public void CustomerWithBothDemandFormsIsRejected()
    {
        var result = LoadChanged(n => Customer(n)["demandM3PerHour"] = 100);

        Assert.Contains("gives both demandM3PerHour and dailyVolume", ProblemAt(result, "$.customers[0]").What);
    }

    [Fact]
    public void PipelineWithoutPumpingEnergyIsRejected()
    {
        var result = LoadChanged(n => Pipeline(n).Remove("pumping"));

        Assert.Contains("gives neither energyKWhPerM3 nor pumping", ProblemAt(result, "$.pipelines[0]").What);
    }

    [Fact]
    public void PipelineFromARegionalReservoirNeedsPoweredBy()
    {
        var result = LoadChanged(n =>
        {
            Tank(n).Remove("plant");
            Pipeline(n).Remove("poweredBy");
        });

        Assert.Contains("regional reservoir with no plant", ProblemAt(result, "$.pipelines[0].poweredBy").What);
    }

    [Fact]
    public void SeasonsLeavingMonthsUncoveredAreRejected()
    {
        var result = LoadChanged(n => Tariff(n)["timeOfUse"]!["seasons"]![0]!["toMonth"] = 10);

        Assert.Contains("no season covers month(s) 11, 12", ProblemAt(result, "$.tariffs[0].timeOfUse.seasons").What);
    }

    [Fact]
    public void AvailabilityThatIsNotAWholeUnitCountIsRejected()
    {
        var result = LoadChanged(n => Stage(n)["availableUnits"] = JsonNode.Parse(
            """{ "start": "2027-03-26T00:00", "stepMinutes": 720, "values": [3, 1.5] }"""));

        Assert.Contains("1.5 is not a whole number of units from 0 to 3", ProblemAt(result, "$.plants[0].stages[0].availableUnits.values[1]").What);
    }

    [Fact]
    public void BlendLimitOnAParameterTheSourceClassLacksIsRejected()
    {
        var result = LoadChanged(n => n["qualityClasses"]![0]!["quality"]!.AsObject().Remove("conductivityUsPerCm"));

        var problem = ProblemAt(result, "$.qualityClasses[0].quality");
        Assert.Contains("class A gives no conductivityUsPerCm, but customer 'hollins-orchard' limits it", problem.What);
    }

    [Fact]
    public void SeriesNotCoveringTheDefaultHorizonIsRejected()
    {
        var result = LoadChanged(n => n["horizon"]!["days"] = 2);

        var problem = ProblemAt(result, "$.plants[0].influentM3PerHour");
        Assert.Contains("covers 2027-03-26 00:00 to 2027-03-27 00:00 but the default horizon needs 2027-03-26 00:00 to 2027-03-28 00:00", problem.What);
    }

    [Fact]
    public void ThreePlantedMistakesAreAllReportedAtOnce()
    {
        var result = LoadChanged(n =>
        {
            Stage(n)["recoveryFraction"] = 1.4;
            Tank(n)["class"] = "Z";
            n["periodMinutes"] = 20;
        });

        Assert.Null(result.Network);
        Assert.Equal(
            ["$.periodMinutes", "$.plants[0].stages[0].recoveryFraction", "$.tanks[0].class"],
            result.Problems.Select(p => p.Location).Order(StringComparer.Ordinal).ToArray());
        Assert.All(result.Problems, p => Assert.Equal(FileName, p.File));
    }
}
