using Microsoft.Playwright;
using PlanDesk.Browser.Tests.Infrastructure;
using PlanDesk.Server.Store;
using static Microsoft.Playwright.Assertions;

namespace PlanDesk.Browser.Tests;

[Collection(DeskCollection.Name)]
public sealed class PlanOverviewTests(DeskFixture desk)
{
    [Fact]
    public async Task AWrongKeyIsRefusedWithAReadableMessage()
    {
        await using var page = await desk.OpenPageAsync();
        await page.OpenAsync();
        await page.Page.GetByLabel("API key").FillAsync("pdk_0000000000_not-a-real-key");
        await page.Page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();

        var alert = page.Page.GetByRole(AriaRole.Alert);
        await Expect(alert).ToContainTextAsync("Sign-in failed");
        await Expect(alert).ToContainTextAsync("not recognised");
        Assert.DoesNotContain("{", await alert.InnerTextAsync());
        await page.ScreenshotAsync("01-sign-in-refused");
        Assert.Empty(page.ScriptErrors);
    }

    [Fact]
    public async Task SchedulerOpensTheDemoPlanAndSeesTheSchematicAndATankChart()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var networkId = await desk.Api.UploadAsync(scheduler, DeskApi.ReadNetwork("quickstart.json"), "quickstart");
        var planId = await desk.Api.SolveAsync(scheduler, networkId, "2027-03-26", 1, timeLimitSeconds: 20);
        await using var page = await desk.OpenPageAsync();

        await page.SignInAsync(scheduler);
        await page.ScreenshotAsync("02-plans-and-solves");
        await page.Page.Locator($"tr:has-text('{networkId}')").GetByRole(AriaRole.Link, new() { Name = "Open" }).ClickAsync();

        var schematic = page.Page.Locator("svg.schematic");
        await Expect(schematic.Locator(".node.plant[data-id='larkmoor']")).ToBeVisibleAsync();
        await Expect(schematic.Locator(".node.tank[data-id='larkmoor-class-a']")).ToBeVisibleAsync();
        await Expect(schematic.Locator(".node.customer[data-id='hollins-orchard']")).ToBeVisibleAsync();
        await Expect(page.Page.Locator(".card").First).ToContainTextAsync("Total cost");
        await Expect(page.Page.GetByText("Saving against the rule-based plan")).ToBeVisibleAsync();
        Assert.Empty(await page.OverlappingSchematicLabelsAsync());
        await page.AssertChartsReadableAsync(atLeast: 1);
        await page.ScreenshotAsync("03-plan-overview");

        await page.Page.Locator(".node.tank[data-id='larkmoor-class-a']").ClickAsync();
        var tankChart = page.Page.Locator("figure[data-chart='tank-larkmoor-class-a'] canvas");
        await Expect(tankChart).ToBeVisibleAsync();
        var charts = await page.AssertChartsReadableAsync(atLeast: 5);
        Assert.Equal(24, charts.Single(c => c.Name == "tank-larkmoor-class-a").Labels);
        await page.ScreenshotAsync("04-plant-over-time");

        await page.GoAsync($"#/plan/{planId}/customers");
        await Expect(page.Page.Locator("figure[data-chart='customer-hourly'] canvas")).ToBeVisibleAsync();
        await page.AssertChartsReadableAsync(atLeast: 2);
        await page.ScreenshotAsync("05-customers");

        await page.GoAsync($"#/plan/{planId}/permits");
        await Expect(page.Page.Locator("figure[data-chart='permit-larkmoor'] canvas")).ToBeVisibleAsync();
        await Expect(page.Page.Locator("table.grid")).ToContainTextAsync("headroom");
        await page.AssertChartsReadableAsync(atLeast: 1);
        await page.ScreenshotAsync("06-permits");
        Assert.Empty(page.ScriptErrors);
    }

    [Fact]
    public async Task SchematicOfTwentyPlantsKeepsEveryLabelApart()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var networkId = await desk.Api.UploadAsync(scheduler, TestRegions.Large(20), "large");
        var planId = await desk.Api.SolveAsync(scheduler, networkId, "2027-03-26", 1, timeLimitSeconds: 40);
        await using var page = await desk.OpenPageAsync();

        await page.SignInAsync(scheduler);
        await page.GoAsync($"#/plan/{planId}");

        var plants = page.Page.Locator("svg.schematic .node.plant");
        await Expect(plants).ToHaveCountAsync(20);
        await Expect(page.Page.Locator("svg.schematic .node.customer")).ToHaveCountAsync(46);
        Assert.Empty(await page.OverlappingSchematicLabelsAsync());
        var smallestFontPx = await page.Page.EvaluateAsync<double>(
            "() => Math.min(...[...document.querySelectorAll('svg.schematic text')].map(t => t.getBoundingClientRect().height))");
        Assert.True(smallestFontPx >= 9, $"the smallest schematic label is {smallestFontPx:0.0} px high; at 20 plants labels must stay readable");
        await page.Page.Locator("#schematic").ScreenshotAsync(new() { Path = Path.Combine(DeskFixture.ScreenshotFolder, "07-schematic-20-plants.png") });
        Assert.Empty(page.ScriptErrors);
    }
}
