using System.Text.Json;
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

    private sealed record LimitLine(string Kind, double Value, string Text, int Periods, bool DashedAtValue);
}
