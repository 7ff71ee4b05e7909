using Microsoft.Playwright;
using PlanDesk.Browser.Tests.Infrastructure;
using PlanDesk.Server.Store;
using static Microsoft.Playwright.Assertions;

namespace PlanDesk.Browser.Tests;

// Tests share one service, so each uploads its own copy of the plant-pair network and plans its own local days
// (solve 2027-03-28, publish 2027-04-05, viewer 2027-04-06; the plant view has 2027-03-28/29 published by itself).
[Collection(DeskCollection.Name)]
public sealed class SolveAndPublishTests(DeskFixture desk)
{
    private static readonly LocatorAssertionsToContainTextOptions SolveTime = new() { Timeout = 90_000 };

    [Fact]
    public async Task SchedulerSubmitsASolveWatchesItFinishAndOpensTheDstDay()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var networkId = await desk.Api.UploadAsync(scheduler, DeskApi.ReadNetwork("plant-pair.json"), "pair");
        await using var page = await desk.OpenPageAsync();
        await page.SignInAsync(scheduler);

        await page.Page.GetByLabel("Network", new() { Exact = true }).SelectOptionAsync(networkId);
        await page.Page.GetByLabel("First local day").FillAsync("2027-03-28");
        await page.Page.GetByLabel("Days (1 to 7)").FillAsync("1");
        await page.Page.GetByLabel("Time limit (s)").FillAsync("20");
        await page.Page.GetByRole(AriaRole.Button, new() { Name = "Solve", Exact = true }).ClickAsync();

        await Expect(page.Page.Locator("#job-state")).ToBeVisibleAsync();
        await page.ScreenshotAsync("08-solve-progress");
        await Expect(page.Page.Locator("#job-state")).ToContainTextAsync("succeeded", SolveTime);
        await page.ScreenshotAsync("09-solve-finished");
        await page.Page.GetByRole(AriaRole.Link, new() { Name = "Open the plan" }).ClickAsync();
        await Expect(page.Page.Locator("svg.schematic .node.plant")).ToHaveCountAsync(2);

        await page.Page.GetByRole(AriaRole.Link, new() { Name = "Plants over time" }).ClickAsync();
        await Expect(page.Page.Locator("figure[data-chart='production'] canvas")).ToBeVisibleAsync();
        var charts = await page.AssertChartsReadableAsync(atLeast: 5);
        // Sunday 2027-03-28 in Madrid: 02:00 does not exist, so the day has 23 hourly periods.
        Assert.All(charts.Where(c => c.Name is "production" or "units" or "energy"), c => Assert.Equal(23, c.Labels));
        var tooltip = await page.HoverChartAsync("production", 0.5);
        Assert.Contains(tooltip, line => line.Contains("(UTC+02:00)"));
        Assert.Contains(tooltip, line => line.StartsWith("outfall: ") && line.EndsWith(" m3"));
        await page.ScreenshotAsync("10-dst-day-plant-over-time");
        Assert.Empty(page.ScriptErrors);
    }

    [Fact]
    public async Task SchedulerPublishesAfterAConfirmationNamingWhatItSupersedes()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var networkId = await desk.Api.UploadAsync(scheduler, DeskApi.ReadNetwork("plant-pair.json"), "pair");
        var earlier = await desk.Api.SolveAsync(scheduler, networkId, "2027-04-05", 1, timeLimitSeconds: 20);
        await desk.Api.PublishAsync(scheduler, earlier);
        var later = await desk.Api.SolveAsync(scheduler, networkId, "2027-04-05", 1, timeLimitSeconds: 20);
        await using var page = await desk.OpenPageAsync();
        await page.SignInAsync(scheduler);

        await page.GoAsync($"#/plan/{later}/publish");
        await page.Page.GetByRole(AriaRole.Button, new() { Name = "Publish this plan…" }).ClickAsync();
        var dialog = page.Page.GetByRole(AriaRole.Dialog);
        await Expect(dialog).ToContainTextAsync("Orrinford WRRF (Mon 5 Apr)");
        await Expect(dialog).ToContainTextAsync("Pellmoor WRRF (Mon 5 Apr)");
        await Expect(dialog.Locator("#publish-supersedes")).ToContainTextAsync($"Orrinford WRRF on Mon 5 Apr (version 1, from plan {earlier})");
        await page.ScreenshotAsync("11-publish-confirmation");
        await dialog.GetByRole(AriaRole.Button, new() { Name = "Publish 2 plant-days" }).ClickAsync();

        await Expect(page.Page.Locator("#publish-result")).ToContainTextAsync("2 plant-day targets are now current");
        await Expect(page.Page.Locator("table.preview")).ToContainTextAsync($"version 2 (plan {later})");
        var current = await desk.Api.GetAsync(scheduler, "/api/plants/orrinford/targets/2027-04-05");
        Assert.Equal(2, current["version"]!.GetValue<int>());
        Assert.Equal(later, current["planId"]!.GetValue<long>());
        await page.ScreenshotAsync("12-published");
        Assert.Empty(page.ScriptErrors);
    }

    [Fact]
    public async Task ViewerIsRefusedPublishingWithAReadableMessage()
    {
        var scheduler = await desk.Api.AddKeyAsync(Role.Scheduler);
        var viewer = await desk.Api.AddKeyAsync(Role.Viewer);
        var networkId = await desk.Api.UploadAsync(scheduler, DeskApi.ReadNetwork("plant-pair.json"), "pair");
        var planId = await desk.Api.SolveAsync(scheduler, networkId, "2027-04-06", 1, timeLimitSeconds: 20);
        await using var page = await desk.OpenPageAsync();
        await page.SignInAsync(viewer);

        await Expect(page.Page.GetByText("Solving, uploading networks and publishing need a scheduler key")).ToBeVisibleAsync();
        await Expect(page.Page.Locator("#solve-form")).ToHaveCountAsync(0);
        await page.GoAsync($"#/plan/{planId}/publish");
        await Expect(page.Page.GetByText("Publishing needs a scheduler key")).ToBeVisibleAsync();
        await page.Page.GetByRole(AriaRole.Button, new() { Name = "Publish this plan…" }).ClickAsync();
        await page.Page.GetByRole(AriaRole.Dialog).GetByRole(AriaRole.Button, new() { Name = "Publish 2 plant-days" }).ClickAsync();

        var refusal = page.Page.GetByRole(AriaRole.Dialog).GetByRole(AriaRole.Alert);
        await Expect(refusal).ToContainTextAsync("Not published");
        await Expect(refusal).ToContainTextAsync("A viewer key is read-only");
        Assert.DoesNotContain("{", await refusal.InnerTextAsync());
        await page.ScreenshotAsync("13-viewer-refused");
        var publications = await desk.Api.GetListAsync(scheduler, "/api/publications");
        Assert.DoesNotContain(publications, p => p!["planId"]!.GetValue<long>() == planId);
        Assert.Empty(page.ScriptErrors);
    }
}
