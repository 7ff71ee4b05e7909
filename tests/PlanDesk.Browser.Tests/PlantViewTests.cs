using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Playwright;
using PlanDesk.Browser.Tests.Infrastructure;
using PlanDesk.Server.Store;
using static Microsoft.Playwright.Assertions;

namespace PlanDesk.Browser.Tests;

[Collection(DeskCollection.Name)]
public sealed class PlantViewTests(DeskFixture desk)
{
    [Fact]
    public async Task PlantKeySeesItsOwnTargetsForTodayAndCannotOpenAnotherPlant()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var networkId = await desk.Api.UploadAsync(scheduler, DeskApi.ReadNetwork("plant-pair.json"), "pair");
        // The clock stands on Sunday 2027-03-28 (Madrid), so this is the plant's "today" and "tomorrow".
        var planId = await desk.Api.SolveAsync(scheduler, networkId, "2027-03-28", 2, timeLimitSeconds: 30);
        await desk.Api.PublishAsync(scheduler, planId);
        var plantKey = await desk.Api.AddKeyAsync(Role.Plant, "orrinford");
        await desk.Api.ReportActualsAsync(plantKey, "orrinford", new[]
        {
            new { hourStart = "2027-03-28T00:00:00Z", productionM3ByClass = new Dictionary<string, double> { ["A"] = 110 }, tankLevelsM3 = new Dictionary<string, double> { ["orrinford-tank"] = 790 } },
            new { hourStart = "2027-03-28T01:00:00Z", productionM3ByClass = new Dictionary<string, double> { ["A"] = 105 }, tankLevelsM3 = new Dictionary<string, double> { ["orrinford-tank"] = 795 } },
        });
        await using var page = await desk.OpenPageAsync();

        await page.SignInAsync(plantKey);

        await Expect(page.Page.Locator("#plant-name")).ToContainTextAsync("Orrinford WRRF");
        var today = page.Page.Locator("section.plant-day[data-date='2027-03-28']");
        await Expect(today.Locator("h2")).ToContainTextAsync("Today: Sun 28 Mar 2027");
        await Expect(today.Locator("table.hours tbody tr")).ToHaveCountAsync(23);
        await Expect(page.Page.Locator("section.plant-day[data-date='2027-03-29'] table.hours tbody tr")).ToHaveCountAsync(24);
        await Expect(today).ToContainTextAsync("water quality", new() { IgnoreCase = true });
        await Expect(today).ToContainTextAsync("licensed operators");
        await Expect(today.Locator("table.hours")).ToContainTextAsync("Actual production m3");
        await page.AssertChartsReadableAsync(atLeast: 4);
        Assert.DoesNotContain("Pellmoor", await page.Page.Locator("body").InnerTextAsync());
        // plant-pair.json: orrinford-tank holds 100 to 2 000 m3; the line runs over all 23 hours of the day.
        Assert.Equal(
            [new LimitLine("max", 2000, "maximum 2\u202f000 m3", 23, true), new LimitLine("min", 100, "minimum 100 m3", 23, true)],
            await LimitLinesAsync(page, "sheet-tanks-2027-03-28"));
        await Expect(today.Locator("figure[data-chart='sheet-tanks-2027-03-28']")).ToContainTextAsync("dashed: each tank's minimum and maximum");
        await today.Locator("figure[data-chart='sheet-tanks-2027-03-28']").ScreenshotAsync(new() { Path = Path.Combine(DeskFixture.ScreenshotFolder, "14a-plant-sheet-tank-limits.png") });

        await today.GetByLabel("Acknowledged by").FillAsync("shift lead");
        await today.GetByRole(AriaRole.Button, new() { Name = "Acknowledge version 1" }).ClickAsync();
        await Expect(today).ToContainTextAsync("Version 1 acknowledged");
        await Expect(today).ToContainTextAsync("by shift lead");
        await page.ScreenshotAsync("14-plant-view");
        await page.Page.EmulateMediaAsync(new() { Media = Media.Print });
        await page.ScreenshotAsync("15-plant-view-printed");
        await today.Locator("figure[data-chart='sheet-tanks-2027-03-28']").ScreenshotAsync(new() { Path = Path.Combine(DeskFixture.ScreenshotFolder, "15a-plant-sheet-tank-limits-printed.png") });
        await page.Page.EmulateMediaAsync(new() { Media = Media.Screen });

        await page.GoAsync("#/plant/pellmoor");
        var refusal = page.Page.GetByRole(AriaRole.Alert);
        await Expect(refusal).ToContainTextAsync("it cannot reach plant 'pellmoor'");
        Assert.DoesNotContain("Pellmoor WRRF", await page.Page.Locator("body").InnerTextAsync());
        await page.ScreenshotAsync("16-plant-key-refused-other-plant");
        Assert.Empty(page.ScriptErrors);
    }

    // A plant of its own (plant-pair.json renamed, so no other test's publication touches it) with a second,
    // smaller tank filled from the first: 100–2 000 m3 and 0–600 m3. Each limit line is named after its tank, and
    // the four labels stay inside the plot without covering each other.
    [Fact]
    public async Task PlantSheetNamesEachTanksLimitsWhenThePlantHasTwoTanks()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var network = JsonNode.Parse(DeskApi.ReadNetwork("plant-pair.json").ToJsonString()
            .Replace("orrinford", "brackenfold").Replace("Orrinford", "Brackenfold")
            .Replace("pellmoor", "hobhallow").Replace("Pellmoor", "Hobhallow"))!;
        network["tanks"]!.AsArray().Add(JsonNode.Parse(
            """{ "id": "brackenfold-store", "name": "Brackenfold store", "plant": "brackenfold", "class": "A", "minM3": 0, "maxM3": 600, "initialM3": 300, "lossFractionPerDay": 0 }"""));
        network["pipelines"]!.AsArray().Add(JsonNode.Parse(
            """{ "id": "brackenfold-to-store", "name": "Brackenfold tank to store", "from": "brackenfold-tank", "to": "brackenfold-store", "capacityM3PerHour": 50, "energyKWhPerM3": 0.05, "poweredBy": "brackenfold" }"""));
        var networkId = await desk.Api.UploadAsync(scheduler, network, "pair-store");
        await desk.Api.PublishAsync(scheduler, await desk.Api.SolveAsync(scheduler, networkId, "2027-03-28", 1, timeLimitSeconds: 30));
        await using var page = await desk.OpenPageAsync();

        await page.SignInAsync(await desk.Api.AddKeyAsync(Role.Plant, "brackenfold"));

        var chart = page.Page.Locator("section.plant-day[data-date='2027-03-28'] figure[data-chart='sheet-tanks-2027-03-28']");
        await Expect(chart.Locator("canvas")).ToBeVisibleAsync();
        Assert.Equal(
            [
                new LimitLine("max", 2000, "brackenfold-tank maximum 2\u202f000 m3", 23, true),
                new LimitLine("min", 100, "brackenfold-tank minimum 100 m3", 23, true),
                new LimitLine("max", 600, "brackenfold-store maximum 600 m3", 23, true),
                new LimitLine("min", 0, "brackenfold-store minimum 0 m3", 23, true),
            ],
            (await LimitLinesAsync(page, "sheet-tanks-2027-03-28")).OrderBy(l => l.Text.StartsWith("brackenfold-store", StringComparison.Ordinal)));
        var placed = await chart.Locator("canvas").EvaluateAsync<JsonElement>(@"canvas => {
            const chart = Chart.getChart(canvas);
            return { top: chart.chartArea.top, bottom: chart.chartArea.bottom, labels: chart.limitLabelBoxes };
          }");
        var labels = placed.GetProperty("labels").EnumerateArray().Select(b => new LabelBox(
            b.GetProperty("text").GetString()!, b.GetProperty("left").GetDouble(), b.GetProperty("right").GetDouble(),
            b.GetProperty("top").GetDouble(), b.GetProperty("bottom").GetDouble(), b.GetProperty("line").GetDouble())).ToList();
        Assert.Equal(4, labels.Count);
        Assert.All(labels, l => Assert.True(l.Top >= placed.GetProperty("top").GetDouble() && l.Bottom <= placed.GetProperty("bottom").GetDouble(), $"'{l.Text}' leaves the plot"));
        // Next to its own line: the box's nearer edge is at most 3 px from the line (the gap the chart leaves).
        Assert.All(labels, l => Assert.True(Math.Min(Math.Abs(l.Top - l.Line), Math.Abs(l.Bottom - l.Line)) <= 3.5, $"'{l.Text}' is away from its line"));
        Assert.Empty(labels.SelectMany((a, i) => labels.Skip(i + 1).Where(b => a.Overlaps(b)).Select(b => $"{a.Text} / {b.Text}")));
        await chart.ScreenshotAsync(new() { Path = Path.Combine(DeskFixture.ScreenshotFolder, "14b-plant-sheet-two-tanks.png") });
        Assert.Empty(page.ScriptErrors);
    }

    /// <summary>The dashed limit lines a chart draws: kind, value, label, how many periods, and whether it is dashed with every period at the value.</summary>
    private static async Task<IReadOnlyList<LimitLine>> LimitLinesAsync(DeskPage page, string chartName)
    {
        var json = await page.Page.Locator($"figure[data-chart='{chartName}'] canvas").EvaluateAsync<JsonElement>(@"canvas =>
            Chart.getChart(canvas).data.datasets.filter(d => d.limit).map(d => ({
              kind: d.limit.kind, value: d.limit.value, text: d.limit.text, periods: d.data.length,
              dashedAtValue: d.borderDash.length > 0 && d.data.every(v => v === d.limit.value),
            }))");
        return json.Deserialize<List<LimitLine>>(DeskApi.Web)!;
    }

    private sealed record LabelBox(string Text, double Left, double Right, double Top, double Bottom, double Line)
    {
        public bool Overlaps(LabelBox other) => Left < other.Right && other.Left < Right && Top < other.Bottom && other.Top < Bottom;
    }

    private sealed record LimitLine(string Kind, double Value, string Text, int Periods, bool DashedAtValue);
}
