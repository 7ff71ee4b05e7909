using System.Text.Json;
using Microsoft.Playwright;

namespace PlanDesk.Browser.Tests.Infrastructure;

/// <summary>A browser page on the desk, with the checks every view must pass: no script errors, charts that
/// have data and axes titled with units, labels that do not overlap.</summary>
public sealed class DeskPage(IPage page, Uri baseAddress) : IAsyncDisposable
{
    private readonly List<string> scriptErrors = [];
    private bool listening;

    public IPage Page => page;

    public async Task OpenAsync(string hash = "")
    {
        if (!listening)
        {
            page.PageError += (_, error) => scriptErrors.Add(error);
            listening = true;
        }
        await page.GotoAsync(new Uri(baseAddress, "/" + hash).ToString());
    }

    public async Task SignInAsync(string key)
    {
        await OpenAsync();
        await page.GetByLabel("API key").FillAsync(key);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Button, new() { Name = "Sign out" })).ToBeVisibleAsync();
    }

    public Task GoAsync(string hash) => page.EvaluateAsync($"location.hash = {JsonSerializer.Serialize(hash)}");

    /// <summary>Saves a full-page screenshot under TestResults/screenshots for people to look at.</summary>
    public Task ScreenshotAsync(string name) =>
        page.ScreenshotAsync(new() { Path = Path.Combine(DeskFixture.ScreenshotFolder, $"{name}.png"), FullPage = true });

    /// <summary>Every chart on the page: its name, how many non-empty values it draws, and its axes' titles.</summary>
    public async Task<IReadOnlyList<ChartFacts>> ChartsAsync()
    {
        var json = await page.EvaluateAsync<JsonElement>(@"() => [...document.querySelectorAll('canvas')].map(canvas => {
            const chart = Chart.getChart(canvas);
            if (!chart) return { name: canvas.closest('figure')?.dataset.chart ?? '?', values: 0, labels: 0, axes: [] };
            return {
              name: canvas.closest('figure')?.dataset.chart ?? '?',
              values: chart.data.datasets.reduce((n, d) => n + d.data.filter(v => v !== null && v !== undefined && v !== 0).length, 0),
              labels: chart.data.labels?.length ?? 0,
              axes: Object.values(chart.scales).map(s => ({ id: s.id, type: s.type, title: s.options.title?.display ? s.options.title.text : '' })),
            };
          })");
        return json.Deserialize<List<ChartFacts>>(DeskApi.Web)!;
    }

    /// <summary>Asserts that the page's charts all draw data and title every axis, value axes with a unit in brackets.</summary>
    public async Task<IReadOnlyList<ChartFacts>> AssertChartsReadableAsync(int atLeast)
    {
        var charts = await ChartsAsync();
        Assert.True(charts.Count >= atLeast, $"expected at least {atLeast} charts, found {charts.Count}");
        foreach (var chart in charts)
        {
            Assert.True(chart.Values > 0, $"chart '{chart.Name}' draws no data");
            foreach (var axis in chart.Axes)
            {
                Assert.False(string.IsNullOrWhiteSpace(axis.Title), $"chart '{chart.Name}' axis {axis.Id} has no title");
                if (axis.Type == "linear")
                {
                    Assert.Matches(@"\(.+\)", axis.Title);
                }
            }
        }
        return charts;
    }

    /// <summary>Moves the mouse over a chart at a share of its width and returns the tooltip's title and lines.</summary>
    public async Task<IReadOnlyList<string>> HoverChartAsync(string chartName, double shareOfWidth)
    {
        var canvas = page.Locator($"figure[data-chart='{chartName}'] canvas");
        var box = (await canvas.BoundingBoxAsync())!;
        await page.Mouse.MoveAsync(box.X + box.Width * (float)shareOfWidth, box.Y + box.Height / 2);
        await page.WaitForTimeoutAsync(100);
        var json = await canvas.EvaluateAsync<JsonElement>(@"canvas => {
            const tooltip = Chart.getChart(canvas).tooltip;
            return tooltip.opacity > 0 ? [...tooltip.title, ...tooltip.body.flatMap(b => b.lines)] : [];
          }");
        return json.Deserialize<List<string>>()!;
    }

    /// <summary>Pairs of SVG labels of the schematic whose boxes overlap, as "text A / text B".</summary>
    public async Task<IReadOnlyList<string>> OverlappingSchematicLabelsAsync()
    {
        var json = await page.EvaluateAsync<JsonElement>(@"() => {
            const boxes = [...document.querySelectorAll('svg.schematic text')].map(t => ({ text: t.textContent, box: t.getBoundingClientRect() }))
              .filter(b => b.box.width > 0);
            const found = [];
            for (let i = 0; i < boxes.length; i++) {
              for (let j = i + 1; j < boxes.length; j++) {
                const a = boxes[i].box, b = boxes[j].box;
                const overlapX = Math.min(a.right, b.right) - Math.max(a.left, b.left);
                const overlapY = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
                if (overlapX > 0.5 && overlapY > 0.5) found.push(`${boxes[i].text} / ${boxes[j].text}`);
              }
            }
            return found;
          }");
        return json.Deserialize<List<string>>()!;
    }

    /// <summary>Script errors raised on the page since it was opened.</summary>
    public IReadOnlyList<string> ScriptErrors => scriptErrors;

    public async ValueTask DisposeAsync() => await page.Context.CloseAsync();
}

public sealed record ChartFacts(string Name, int Values, int Labels, IReadOnlyList<AxisFacts> Axes);

public sealed record AxisFacts(string Id, string Type, string Title);
