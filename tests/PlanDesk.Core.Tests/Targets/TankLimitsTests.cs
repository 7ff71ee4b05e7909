using System.Text.Json;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Core.Tests.Fixtures;
using static PlanDesk.Core.Tests.Fixtures.SmallNetwork;

namespace PlanDesk.Core.Tests.Targets;

/// <summary>
/// Each tank's minimum and maximum volume on a plant's day targets and in their JSON, CSV and text forms. The
/// small network's Norwick plant has a class-A tank (200–2 500 m3) and a class-C tank (0–1 000 m3); the Hillcrest
/// reservoir (100–1 500 m3) stands at no plant. The plan is the rule-based baseline, so no solver is needed.
/// </summary>
public class TankLimitsTests
{
    private static PlantDayTargets NorwickDay()
    {
        var planningCase = SmallNetwork.Case();
        return Assert.Single(PlantDayTargetsBuilder.Build(planningCase, RuleBasedBaseline.Build(planningCase)));
    }

    [Fact]
    public void TargetsCarryTheMinimumAndMaximumOfEachTankAtThePlantOnly()
    {
        var targets = NorwickDay();

        Assert.Equal(
            [
                new TankLimits(ClassATank, "Norwick class A tank", new ClassId("A"), 200, 2500),
                new TankLimits(ClassCTank, "Norwick class C tank", new ClassId("C"), 0, 1000),
            ],
            targets.Tanks);
    }

    [Fact]
    public void JsonNamesTheLimitsInCamelCaseWithTheirUnit()
    {
        using var json = JsonDocument.Parse(TargetWriters.ToJson(NorwickDay()));

        var tank = json.RootElement.GetProperty("tanks")[0];
        Assert.Equal("norwick-a", tank.GetProperty("tank").GetString());
        Assert.Equal("Norwick class A tank", tank.GetProperty("tankName").GetString());
        Assert.Equal(200, tank.GetProperty("minM3").GetDouble());
        Assert.Equal(2500, tank.GetProperty("maxM3").GetDouble());
        Assert.Contains("monitoring under its permit", json.RootElement.GetProperty("caution").GetString());
    }

    [Fact]
    public void JsonWithTheLimitsReadsBackToTheSameLimits()
    {
        var targets = NorwickDay();

        var read = JsonSerializer.Deserialize<PlantDayTargets>(TargetWriters.ToJson(targets), PlanJson.Options)!;

        Assert.Equal(targets.Tanks, read.Tanks);
    }

    // Sheets stored before the limits were added have no "tanks" field; they must still read, with no limits.
    [Fact]
    public void JsonWithoutTheLimitsReadsWithNoLimits()
    {
        var json = JsonSerializer.SerializeToNode(NorwickDay(), PlanJson.Options)!.AsObject();
        json.Remove("tanks");

        var read = json.Deserialize<PlantDayTargets>(PlanJson.Options)!;

        Assert.Empty(read.Tanks);
        Assert.Equal(24, read.Hours.Count);
    }

    [Fact]
    public void CsvEndsEachRowWithEachTanksMinimumAndMaximum()
    {
        var lines = TargetWriters.ToCsv(NorwickDay()).TrimEnd('\n').Split('\n');

        var header = lines[0].Split(',');
        Assert.Equal(["exportKWh", "tankMin:norwick-aM3", "tankMax:norwick-aM3", "tankMin:norwick-cM3", "tankMax:norwick-cM3"], header[^5..]);
        Assert.Equal(25, lines.Length);
        Assert.All(lines[1..], row => Assert.Equal(["200", "2500", "0", "1000"], row.Split(',')[^4..]));
    }

    [Fact]
    public void TextSheetStatesTheLimitsInWordsAndKeepsTheCautionFirstAndLast()
    {
        var text = TargetWriters.ToText(NorwickDay());

        Assert.Contains("Tank limits: Norwick class A tank (norwick-a), class A: 200–2 500 m3", text);
        Assert.Contains("Tank limits: Norwick class C tank (norwick-c), class C: 0–1 000 m3", text);
        Assert.DoesNotContain("hillcrest", text);
        Assert.StartsWith("CAUTION: " + Cautions.TargetSheet, text.Split('\n')[2]);
        Assert.EndsWith("CAUTION: " + Cautions.TargetSheet, text.TrimEnd());
    }
}
