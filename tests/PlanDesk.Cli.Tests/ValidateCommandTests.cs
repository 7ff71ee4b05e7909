using System.Text.Json.Nodes;

namespace PlanDesk.Cli.Tests;

/// <summary><c>plandesk validate</c>: a summary and exit 0 for a good file; every problem, located, and exit 1 otherwise.</summary>
public sealed class ValidateCommandTests : IDisposable
{
    private readonly string folder = Directory.CreateDirectory(Path.Combine(Path.GetTempPath(), "plandesk-cli-" + Guid.NewGuid().ToString("N"))).FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private static string NetworksFolder()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "PlanDesk.sln")))
            {
                return Path.Combine(dir.FullName, "networks");
            }
        }
        throw new InvalidOperationException("PlanDesk.sln not found");
    }

    private static (int Exit, string[] Lines) Validate(string path)
    {
        var output = new StringWriter();
        var exit = ValidateCommand.Run(path, output);
        return (exit, output.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries));
    }

    // Copies networks/ (with its CSV folders) and plants three mistakes in a copy of the named network.
    private string CopyWithThreeMistakes(string networkFile)
    {
        var source = NetworksFolder();
        foreach (var file in Directory.GetFiles(source, "*", SearchOption.AllDirectories))
        {
            var target = Path.Combine(folder, Path.GetRelativePath(source, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
        var network = JsonNode.Parse(File.ReadAllText(Path.Combine(folder, networkFile)))!.AsObject();
        network["periodMinutes"] = 45;
        network["timeZone"] = "Europe/Nowhere";
        network["plants"]![0]!["tariff"] = "no-such-tariff";
        var path = Path.Combine(folder, "planted-" + networkFile);
        File.WriteAllText(path, network.ToJsonString());
        return path;
    }

    [Fact]
    public void ValidQuickstartPrintsItsSummaryAndExitsZero()
    {
        var (exit, lines) = Validate(Path.Combine(NetworksFolder(), "quickstart.json"));

        Assert.Equal(0, exit);
        Assert.Contains(lines, l => l.StartsWith("Plants") && l.Contains("1 with 1 polishing stage"));
        Assert.Contains(lines, l => l.StartsWith("Series") && l.Contains("2027-03-26 00:00 to 2027-03-27 00:00"));
        Assert.Contains(lines, l => l.StartsWith("Demand") && l.Contains("class A") && l.Contains("2,400 m3"));
    }

    [Fact]
    public void QuickstartWithThreePlantedMistakesPrintsThreeLocatedProblemsAndExitsOne()
    {
        var path = CopyWithThreeMistakes("quickstart.json");

        var (exit, lines) = Validate(path);

        Assert.Equal(1, exit);
        Assert.Equal($"{path}: 3 problems found; nothing was changed.", lines[0]);
        Assert.Equal(
            [$"{path}: $.periodMinutes:", $"{path}: $.plants[0].tariff:", $"{path}: $.timeZone:"],
            lines.Skip(1).Select(l => l[..(l.IndexOf(':', path.Length + 2) + 1)]).Order(StringComparer.Ordinal).ToArray());
    }

    [Fact]
    public void DemoRegionValidatesAndACopyWithThreeMistakesDoesNot()
    {
        var demo = Path.Combine(NetworksFolder(), "demo-region.json");
        Assert.True(File.Exists(demo), $"{demo} is missing: the demo region network should be in networks/ (it comes with the demo data)");

        var (goodExit, goodLines) = Validate(demo);
        var (badExit, badLines) = Validate(CopyWithThreeMistakes("demo-region.json"));

        Assert.True(goodExit == 0, string.Join("\n", goodLines));
        Assert.Contains(goodLines, l => l.StartsWith("Demand"));
        Assert.Equal(1, badExit);
        Assert.Equal(3, badLines.Length - 1);
    }

    [Fact]
    public void MissingFileIsOneProblemNotAStackTrace()
    {
        var (exit, lines) = Validate(Path.Combine(folder, "absent.json"));

        Assert.Equal(1, exit);
        Assert.Contains("the file does not exist", lines[1]);
        Assert.DoesNotContain(lines, l => l.Contains("   at "));
    }
}
