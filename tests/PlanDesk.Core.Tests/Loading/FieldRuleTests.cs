using System.Text.Json.Nodes;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>One malformed variant of the quickstart network per rule on single fields; each problem must name its place.</summary>
public class FieldRuleTests
{
    [Fact]
    public void RecoveryAboveOneIsReportedWithTheRangeAndAnExample()
    {
        var result = LoadChanged(n => Stage(n)["recoveryFraction"] = 1.4);

        var problem = ProblemAt(result, "$.plants[0].stages[0].recoveryFraction");
        Assert.Equal(
            "networks/variant.json: $.plants[0].stages[0].recoveryFraction: 1.4 is outside (0, 1]; give the share of feed that becomes product, e.g. 0.97",
            problem.ToString());
    }

    [Fact]
    public void RecoveryOfZeroIsOutsideTheOpenInterval()
    {
        var result = LoadChanged(n => Stage(n)["recoveryFraction"] = 0);

        Assert.Contains("0 is outside (0, 1]", ProblemAt(result, "$.plants[0].stages[0].recoveryFraction").What);
    }

    [Fact]
    public void PeriodLengthOtherThan15Or30Or60IsRejected()
    {
        var result = LoadChanged(n => n["periodMinutes"] = 45);

        var problem = ProblemAt(result, "$.periodMinutes");
        Assert.Contains("45 is not one of 15, 30, 60", problem.What);
    }

    [Fact]
    public void UnknownTimeZoneIsRejectedWithTheNearestZone()
    {
        var result = LoadChanged(n => n["timeZone"] = "Europe/Madird");

        var problem = ProblemAt(result, "$.timeZone");
        Assert.Contains("'Europe/Madird' is not an IANA time zone", problem.What);
        Assert.Contains("did you mean 'Europe/Madrid'?", problem.Fix);
    }

    [Fact]
    public void NegativePipelineCapacityIsRejected()
    {
        var result = LoadChanged(n => Pipeline(n)["capacityM3PerHour"] = -260);

        Assert.Contains("-260 is below the minimum 0", ProblemAt(result, "$.pipelines[0].capacityM3PerHour").What);
    }

    [Fact]
    public void NegativeWindowPriceIsRejected()
    {
        var result = LoadChanged(n => Tariff(n)["timeOfUse"]!["seasons"]![0]!["windows"]![0]!["pricePerMWh"] = -150);

        Assert.Contains("-150 is below the minimum 0", ProblemAt(result, "$.tariffs[0].timeOfUse.seasons[0].windows[0].pricePerMWh").What);
    }

    [Fact]
    public void NegativeDailyVolumeIsRejected()
    {
        var result = LoadChanged(n => Customer(n)["dailyVolume"]!["volumeM3"] = -2400);

        Assert.Contains("-2400 is below the minimum 0", ProblemAt(result, "$.customers[0].dailyVolume.volumeM3").What);
    }

    [Fact]
    public void NegativeTankVolumeIsRejected()
    {
        var result = LoadChanged(n => Tank(n)["minM3"] = -5);

        Assert.Contains("-5 is below the minimum 0", ProblemAt(result, "$.tanks[0].minM3").What);
    }

    [Fact]
    public void MissingRequiredFieldIsReportedAtThePathItShouldHave()
    {
        var result = LoadChanged(n => Plant(n).Remove("tariff"));

        var problem = ProblemAt(result, "$.plants[0].tariff");
        Assert.Equal("missing", problem.What);
        Assert.Contains("the id of the plant's tariff", problem.Fix);
    }

    [Fact]
    public void NumberWrittenAsTextIsAWrongType()
    {
        var result = LoadChanged(n => Stage(n)["recoveryFraction"] = "0.97");

        Assert.Contains("\"0.97\" is text, not a number", ProblemAt(result, "$.plants[0].stages[0].recoveryFraction").What);
    }

    [Fact]
    public void FractionalUnitCountIsNotAWholeNumber()
    {
        var result = LoadChanged(n => Stage(n)["units"] = 2.5);

        Assert.Contains("not a whole number", ProblemAt(result, "$.plants[0].stages[0].units").What);
    }

    [Fact]
    public void MisspeltFieldIsReportedOnceWithTheIntendedName()
    {
        var result = LoadChanged(n =>
        {
            Stage(n).Remove("recoveryFraction");
            Stage(n)["recoveryFracton"] = 0.97;
        });

        var problem = ProblemAt(result, "$.plants[0].stages[0].recoveryFracton");
        Assert.Equal("unknown field 'recoveryFracton'", problem.What);
        Assert.Contains("did you mean 'recoveryFraction'?", problem.Fix);
        Assert.DoesNotContain(result.Problems, p => p.Location == "$.plants[0].stages[0].recoveryFraction");
    }

    [Fact]
    public void UnknownFieldWithoutNearNameListsTheAllowedFields()
    {
        var result = LoadChanged(n => Tank(n)["colour"] = "blue");

        var problem = ProblemAt(result, "$.tanks[0].colour");
        Assert.Contains("initialM3", problem.Fix);
    }

    [Fact]
    public void TextInAnInlineSeriesIsReportedAtItsIndex()
    {
        var result = LoadChanged(n => Plant(n)["influentM3PerHour"]!["values"]![3] = "seven hundred");

        Assert.Contains("is text, not a number", ProblemAt(result, "$.plants[0].influentM3PerHour.values[3]").What);
    }

    [Fact]
    public void InlineSeriesWithoutValuesIsRejected()
    {
        var result = LoadChanged(n => Plant(n)["influentM3PerHour"]!["values"] = new JsonArray());

        Assert.Contains("the list has 0 entries but needs at least 1", ProblemAt(result, "$.plants[0].influentM3PerHour.values").What);
    }

    [Fact]
    public void NegativeInfluentValueIsReportedAtItsIndex()
    {
        var result = LoadChanged(n => Plant(n)["influentM3PerHour"]!["values"]![2] = -450);

        Assert.Contains("-450 is negative", ProblemAt(result, "$.plants[0].influentM3PerHour.values[2]").What);
    }

    [Fact]
    public void ImpossibleStartDateIsRejected()
    {
        var result = LoadChanged(n => n["horizon"]!["startDate"] = "2027-02-30");

        Assert.Contains("'2027-02-30' is not a calendar date", ProblemAt(result, "$.horizon.startDate").What);
    }

    [Fact]
    public void LocalSeriesStartInTheSkippedSpringHourIsRejected()
    {
        var result = LoadChanged(n => Plant(n)["influentM3PerHour"] = JsonNode.Parse(
            """{ "start": "2027-03-28T02:30", "stepMinutes": 60, "values": [400, 410] }"""));

        Assert.Contains("skipped when clocks go forward in Europe/Madrid", ProblemAt(result, "$.plants[0].influentM3PerHour.start").What);
    }

    [Fact]
    public void WindowTimeOutsideTheDayIsRejected()
    {
        var result = LoadChanged(n => Tariff(n)["timeOfUse"]!["seasons"]![0]!["windows"]![0]!["to"] = "24:00");

        var problem = ProblemAt(result, "$.tariffs[0].timeOfUse.seasons[0].windows[0].to");
        Assert.Contains("not in the expected form", problem.What);
        Assert.Contains("HH:mm", problem.Fix);
    }

    [Fact]
    public void AbsurdlyLargeNumberIsReportedAsATypingMistake()
    {
        var result = LoadChanged(n => Stage(n)["energyKWhPerM3"] = 1e308);

        Assert.Contains("is far too large", ProblemAt(result, "$.plants[0].stages[0].energyKWhPerM3").What);
    }

    [Fact]
    public void EmptyReferenceIsReportedAsEmpty()
    {
        var result = LoadChanged(n => Plant(n)["tariff"] = "");

        var problem = ProblemAt(result, "$.plants[0].tariff");
        Assert.Equal("\"\" is empty", problem.What);
        Assert.Contains("the id of the plant's tariff", problem.Fix);
    }

    [Fact]
    public void StartDateFarInTheFutureIsRejected()
    {
        var result = LoadChanged(n => n["horizon"]!["startDate"] = "9999-12-31");

        Assert.Contains("is not a calendar date from 1900 to 2200", ProblemAt(result, "$.horizon.startDate").What);
    }
}
