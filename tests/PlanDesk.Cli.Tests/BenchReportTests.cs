using PlanDesk.Cli.Bench;

namespace PlanDesk.Cli.Tests;

public sealed class BenchReportTests : IDisposable
{
    private readonly string path = Path.Combine(Path.GetTempPath(), "plandesk-bench-" + Guid.NewGuid().ToString("N") + ".csv");

    public void Dispose() => File.Delete(path);

    [Fact]
    public void CsvHasOneColumnPerFigureAndBlanksForFiguresNotMeasured()
    {
        var row = new BenchResult { Size = "S", Seed = 1, Solver = "HIGHS", Status = "optimal", Objective = 1234.56789, Variables = 1981 };

        BenchReport.WriteCsv([row], path);

        var lines = File.ReadAllLines(path);
        Assert.Equal(2, lines.Length);
        var header = lines[0].Split(',');
        var cells = lines[1].Split(',');
        Assert.Equal(header.Length, cells.Length);
        Assert.Equal("1234.5679", cells[Array.IndexOf(header, "Objective")]);
        Assert.Equal("1981", cells[Array.IndexOf(header, "Variables")]);
        Assert.Equal("", cells[Array.IndexOf(header, "BestBound")]);
        Assert.Equal("", cells[Array.IndexOf(header, "Violations")]);
    }

    [Fact]
    public void CsvQuotesNotesHoldingCommasAndQuotes()
    {
        var row = new BenchResult { Size = "M", Seed = 2, Solver = "SCIP", Status = "noPlan", Note = "no plan, \"status 99\"" };

        BenchReport.WriteCsv([row], path);

        Assert.EndsWith(",\"no plan, \"\"status 99\"\"\"", File.ReadAllLines(path)[1]);
    }

    [Fact]
    public void BenchOneArgumentsCarryEveryCaseSetting()
    {
        var benchCase = new BenchCase(PlanDesk.Core.Generation.RegionSize.M, 4, "SCIP", 90.5, 0.25, MeasureFirstPlan: true);

        var arguments = BenchOneCommand.Arguments(benchCase, "/tmp/row.json").ToList();

        Assert.Equal(
            ["bench-one", "--size", "M", "--seed", "4", "--solver", "SCIP", "--time-limit", "90.5", "--gap", "0.25", "--first-plan", "--result", "/tmp/row.json"],
            arguments);
    }
}
