using System.Text.Json;
using PlanDesk.Planning;

namespace PlanDesk.Cli.Tests;

/// <summary><c>plandesk solve</c> with the checker's verdict and the saving against the rule-based baseline, and <c>--method rules</c>.</summary>
public sealed class SolveBaselineTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("plandesk-solve-rules-").FullName;
    private readonly StringWriter _output = new();
    private readonly StringWriter _errors = new();

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private static string QuickstartPath => Path.Combine(RepoRoot.Path, "networks", "quickstart.json");
    private string PlanPath => Path.Combine(_folder, "plan.json");

    private SolveCommand.SolveRequest Request(string method) => new(
        QuickstartPath, null, null, new SolveOptions(), PlanPath, Path.Combine(_folder, "targets"), Path.Combine(_folder, "summary.json"), method);

    private JsonElement Summary() => JsonDocument.Parse(File.ReadAllText(Path.Combine(_folder, "summary.json"))).RootElement;

    [Fact]
    public void SummaryCarriesTheCheckersVerdictAndTheSavingAgainstTheRules()
    {
        var exit = SolveCommand.Run(Request("milp"), _output, _errors);

        Assert.Equal(SolveCommand.PlanWritten, exit);
        var summary = Summary();
        Assert.Equal(0, summary.GetProperty("checkViolations").GetInt32());
        var baseline = summary.GetProperty("baselineCost").GetDouble();
        var total = summary.GetProperty("costs").GetProperty("total").GetDouble();
        Assert.Equal((baseline - total) / baseline * 100, summary.GetProperty("savingPercent").GetDouble(), 6);
        Assert.True(total <= baseline, $"the least-cost plan ({total}) should not cost more than the rules ({baseline})");
        Assert.True(summary.TryGetProperty("operatingSavingPercent", out _));
        Assert.Contains("Check and baseline", _output.ToString());
    }

    [Fact]
    public void RulesMethodWritesTheBaselinePlanWhichPassesTheCheck()
    {
        var exit = SolveCommand.Run(Request("rules"), _output, _errors);

        Assert.Equal(SolveCommand.PlanWritten, exit);
        using (var plan = JsonDocument.Parse(File.ReadAllText(PlanPath)))
        {
            Assert.Equal("rules", plan.RootElement.GetProperty("method").GetString());
        }
        Assert.Equal(0, Summary().GetProperty("savingPercent").GetDouble(), 9);
        Assert.Equal(CheckCommand.NoViolations, CheckCommand.Run(QuickstartPath, PlanPath, new StringWriter(), new StringWriter()));
    }

    [Fact]
    public void UnknownMethodIsBadInputSaidPlainly()
    {
        var exit = SolveCommand.Run(Request("guess"), _output, _errors);

        Assert.Equal(SolveCommand.BadInput, exit);
        Assert.Equal("--method: 'guess' is not offered; choose milp (the default) or rules", _errors.ToString().Trim());
        Assert.False(File.Exists(PlanPath));
    }
}
