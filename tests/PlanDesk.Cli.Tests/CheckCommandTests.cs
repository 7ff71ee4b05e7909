using System.Text.Json.Nodes;
using PlanDesk.Cli;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Cli.Tests;

/// <summary><c>plandesk check</c> on the quickstart network: a good plan, a hand edit, malformed plan files.</summary>
public sealed class CheckCommandTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("plandesk-check-").FullName;
    private readonly StringWriter _output = new();
    private readonly StringWriter _errors = new();

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private static string QuickstartPath => Path.Combine(RepoRoot.Path, "networks", "quickstart.json");

    private static Plan BaselineOfQuickstart()
    {
        var network = NetworkLoader.Load(QuickstartPath).Network!;
        var planningCase = PlanningCase.Create(network, network.DefaultStartDate!.Value, network.DefaultDays).Case!;
        return RuleBasedBaseline.Build(planningCase);
    }

    private string Write(string json)
    {
        var path = Path.Combine(_folder, "plan.json");
        File.WriteAllText(path, json);
        return path;
    }

    [Fact]
    public void GoodPlanGivesOneLineWithTheRecomputedCostAndExitZero()
    {
        var plan = BaselineOfQuickstart();
        var path = Write(PlanJson.Serialize(plan));

        var exit = CheckCommand.Run(QuickstartPath, path, _output, _errors);

        Assert.Equal(CheckCommand.NoViolations, exit);
        var line = Assert.Single(_output.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains("no violations", line);
        Assert.Contains($"recomputed cost {plan.Costs.Total:#,0.00} EUR", line);
    }

    [Fact]
    public void PumpHourMovedOutsideTheDeliveryWindowIsListedInTheTable()
    {
        // A scheduler moves the orchard's 06:00 delivery to 12:00, outside its 21:00-07:00 window.
        var plan = JsonNode.Parse(PlanJson.Serialize(BaselineOfQuickstart()))!.AsObject();
        plan["method"] = "edited";
        var flow = plan["pipelines"]![0]!["flowM3"]!.AsArray();
        var delivered = plan["customers"]![0]!["deliveredM3"]!.AsArray();
        (flow[12], flow[6]) = (flow[6]!.GetValue<double>(), 0.0);
        (delivered[12], delivered[6]) = (delivered[6]!.GetValue<double>(), 0.0);
        var path = Write(plan.ToJsonString());

        var exit = CheckCommand.Run(QuickstartPath, path, _output, _errors);

        Assert.Equal(CheckCommand.Violations, exit);
        var lines = _output.ToString().Split('\n');
        Assert.StartsWith("kind", lines[1]);
        Assert.Contains(lines, l => l.StartsWith("deliveryWindow") && l.Contains("hollins-orchard") && l.Contains("2027-03-26 12:00"));
    }

    [Fact]
    public void ValueOfTheWrongTypeIsNamedByFileAndJsonPathWithoutAStackTrace()
    {
        var plan = JsonNode.Parse(PlanJson.Serialize(BaselineOfQuickstart()))!.AsObject();
        plan["plants"]![0]!["treatedM3"]![3] = "lots";
        var path = Write(plan.ToJsonString());

        var exit = CheckCommand.Run(QuickstartPath, path, _output, _errors);

        Assert.Equal(CheckCommand.CannotCheck, exit);
        var message = _errors.ToString();
        Assert.Contains(path, message);
        Assert.Contains("$.plants[0].treatedM3[3]", message);
        Assert.DoesNotContain(" at PlanDesk", message);
    }

    [Fact]
    public void BrokenJsonIsNamedWithItsLine()
    {
        var path = Write("{\n  \"networkName\": \"x\",\n  \"days\": ]\n}");

        var exit = CheckCommand.Run(QuickstartPath, path, _output, _errors);

        Assert.Equal(CheckCommand.CannotCheck, exit);
        Assert.Contains("(line 3)", _errors.ToString());
    }

    [Fact]
    public void PlanMissingARequiredFieldSaysWhichField()
    {
        var plan = JsonNode.Parse(PlanJson.Serialize(BaselineOfQuickstart()))!.AsObject();
        plan.Remove("costs");
        var path = Write(plan.ToJsonString());

        var exit = CheckCommand.Run(QuickstartPath, path, _output, _errors);

        Assert.Equal(CheckCommand.CannotCheck, exit);
        Assert.Contains("costs", _errors.ToString());
    }

    [Fact]
    public void MissingNetworkFileIsSaidAndNothingIsChecked()
    {
        var exit = CheckCommand.Run(Path.Combine(_folder, "nowhere.json"), Write("{}"), _output, _errors);

        Assert.Equal(CheckCommand.CannotCheck, exit);
        Assert.Contains("nowhere.json", _errors.ToString());
        Assert.Equal("", _output.ToString());
    }
}

/// <summary>The repository root, found from the test's folder.</summary>
internal static class RepoRoot
{
    public static string Path { get; } = Find();

    private static string Find()
    {
        var folder = new DirectoryInfo(AppContext.BaseDirectory);
        while (folder is not null && !File.Exists(System.IO.Path.Combine(folder.FullName, "PlanDesk.sln")))
        {
            folder = folder.Parent;
        }
        return folder?.FullName ?? throw new InvalidOperationException("PlanDesk.sln not found above " + AppContext.BaseDirectory);
    }
}
