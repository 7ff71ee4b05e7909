using System.Text.Json;
using PlanDesk.Planning;

namespace PlanDesk.Cli.Tests;

/// <summary><c>plandesk solve</c> end to end on the quickstart network, and its answers to bad input.</summary>
public sealed class SolveCommandTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("plandesk-solve-").FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private static string Quickstart()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "networks", "quickstart.json");
            if (File.Exists(Path.Combine(dir.FullName, "PlanDesk.sln")))
            {
                return candidate;
            }
        }
        throw new InvalidOperationException("no PlanDesk.sln above the test binaries");
    }

    private SolveCommand.SolveRequest Request(string network, string? start = null) => new(
        network, start, null, new SolveOptions(),
        Path.Combine(folder, "plan.json"), Path.Combine(folder, "targets"), Path.Combine(folder, "summary.json"));

    // quickstart.json plans one day (2027-03-26) for one plant: one plan, three target files (JSON, CSV, text),
    // and a summary whose fields the server and the benchmark read.
    [Fact]
    public void SolveWritesPlanTargetsAndSummary()
    {
        var output = new StringWriter();
        var errors = new StringWriter();

        var exit = SolveCommand.Run(Request(Quickstart()), output, errors);

        Assert.Equal(SolveCommand.PlanWritten, exit);
        Assert.True(File.Exists(Path.Combine(folder, "plan.json")));
        Assert.Equal(["larkmoor_2027-03-26.csv", "larkmoor_2027-03-26.json", "larkmoor_2027-03-26.txt"],
            Directory.GetFiles(Path.Combine(folder, "targets")).Select(Path.GetFileName).Order());
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "summary.json")));
        var root = summary.RootElement;
        Assert.Contains(root.GetProperty("status").GetString(), new[] { "optimal", "feasible" });
        foreach (var field in new[] { "objective", "bestBound", "gapPercent", "solveSeconds", "costs", "shortfalls", "problems" })
        {
            Assert.True(root.TryGetProperty(field, out _), $"summary lacks {field}");
        }
        Assert.True(root.GetProperty("costs").GetProperty("total").GetDouble() > 0);
        Assert.Contains("Cost (EUR)", output.ToString());
        Assert.Contains("Caution: Decision support only.", output.ToString());
        Assert.Contains("solving", errors.ToString());
    }

    [Fact]
    public void MissingNetworkFileIsBadInputSaidPlainly()
    {
        var errors = new StringWriter();

        var exit = SolveCommand.Run(Request(Path.Combine(folder, "nowhere.json")), new StringWriter(), errors);

        Assert.Equal(SolveCommand.BadInput, exit);
        Assert.Contains("nowhere.json", errors.ToString());
        Assert.Contains("the file does not exist", errors.ToString());
        Assert.False(File.Exists(Path.Combine(folder, "plan.json")));
    }

    [Fact]
    public void StartThatIsNotADateIsBadInputSaidPlainly()
    {
        var errors = new StringWriter();

        var exit = SolveCommand.Run(Request(Quickstart(), start: "26/03/2027"), new StringWriter(), errors);

        Assert.Equal(SolveCommand.BadInput, exit);
        Assert.Equal("--start: '26/03/2027' is not a date; write it as YYYY-MM-DD, e.g. 2027-03-26", errors.ToString().Trim());
    }

    // The quickstart series cover 2027-03-26 only: a plan for the 27th cannot be made and the reason names the series.
    [Fact]
    public void HorizonTheSeriesDoNotCoverIsBadInput()
    {
        var errors = new StringWriter();

        var exit = SolveCommand.Run(Request(Quickstart(), start: "2027-03-27"), new StringWriter(), errors);

        Assert.Equal(SolveCommand.BadInput, exit);
        Assert.Contains("extend the series to cover the horizon", errors.ToString());
    }
}
