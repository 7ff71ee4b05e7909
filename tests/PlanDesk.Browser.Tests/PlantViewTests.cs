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

        await today.GetByLabel("Acknowledged by").FillAsync("shift lead");
        await today.GetByRole(AriaRole.Button, new() { Name = "Acknowledge version 1" }).ClickAsync();
        await Expect(today).ToContainTextAsync("Version 1 acknowledged");
        await Expect(today).ToContainTextAsync("by shift lead");
        await page.ScreenshotAsync("14-plant-view");
        await page.Page.EmulateMediaAsync(new() { Media = Media.Print });
        await page.ScreenshotAsync("15-plant-view-printed");
        await page.Page.EmulateMediaAsync(new() { Media = Media.Screen });

        await page.GoAsync("#/plant/pellmoor");
        var refusal = page.Page.GetByRole(AriaRole.Alert);
        await Expect(refusal).ToContainTextAsync("it cannot reach plant 'pellmoor'");
        Assert.DoesNotContain("Pellmoor WRRF", await page.Page.Locator("body").InnerTextAsync());
        await page.ScreenshotAsync("16-plant-key-refused-other-plant");
        Assert.Empty(page.ScriptErrors);
    }
}
