using Microsoft.Playwright;

namespace PlanDesk.Browser.Tests.Infrastructure;

/// <summary>One service and one chromium for every browser test; each test opens its own browser context,
/// so no session, storage or page is shared between tests.</summary>
public sealed class DeskFixture : IAsyncLifetime
{
    // Debian's chromium; Playwright never downloads a browser for these tests.
    public const string ChromiumPath = "/usr/bin/chromium";

    private IPlaywright? playwright;
    private IBrowser? browser;

    public DeskServer Server { get; } = new();
    public DeskApi Api => new(Server);

    public static string ScreenshotFolder { get; } = Path.Combine(AppContext.BaseDirectory, "TestResults", "screenshots");

    public async Task InitializeAsync()
    {
        // Only this run's pictures: a stale one would show a view as it no longer is.
        if (Directory.Exists(ScreenshotFolder))
        {
            Directory.Delete(ScreenshotFolder, recursive: true);
        }
        Directory.CreateDirectory(ScreenshotFolder);
        Assert.True(File.Exists(ChromiumPath), $"{ChromiumPath} is missing: run .ci/setup-chromium.sh (installs Debian's chromium).");
        playwright = await Playwright.CreateAsync();
        browser = await playwright.Chromium.LaunchAsync(new()
        {
            ExecutablePath = ChromiumPath,
            Args = ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
        });
    }

    /// <summary>A fresh page in its own context (no shared sign-in), sized like a control-room screen.</summary>
    public async Task<DeskPage> OpenPageAsync()
    {
        var context = await browser!.NewContextAsync(new() { ViewportSize = new() { Width = 1366, Height = 900 }, Locale = "en-GB" });
        var page = await context.NewPageAsync();
        return new DeskPage(page, Server.BaseAddress);
    }

    public async Task DisposeAsync()
    {
        if (browser is not null)
        {
            await browser.CloseAsync();
        }
        playwright?.Dispose();
        Server.Dispose();
    }
}

[CollectionDefinition(Name)]
public sealed class DeskCollection : ICollectionFixture<DeskFixture>
{
    public const string Name = "desk";
}
