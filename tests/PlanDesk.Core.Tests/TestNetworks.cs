using System.Text.Json.Nodes;
using PlanDesk.Core.Loading;

namespace PlanDesk.Core.Tests;

/// <summary>The example networks of the repository, and variants of the quickstart network with one thing changed.</summary>
internal static class TestNetworks
{
    /// <summary>The name test variants are loaded under; messages must carry it.</summary>
    public const string FileName = "networks/variant.json";

    public static string RepoRoot { get; } = FindRoot();
    public static string NetworksFolder => Path.Combine(RepoRoot, "networks");
    public static string QuickstartPath => Path.Combine(NetworksFolder, "quickstart.json");

    public static JsonObject Quickstart() => JsonNode.Parse(File.ReadAllText(QuickstartPath))!.AsObject();

    public static NetworkLoadResult Load(JsonNode network, string? baseDirectory = null) =>
        NetworkLoader.LoadText(network.ToJsonString(), FileName, baseDirectory ?? NetworksFolder);

    /// <summary>Loads the quickstart network after <paramref name="change"/>.</summary>
    public static NetworkLoadResult LoadChanged(Action<JsonObject> change)
    {
        var network = Quickstart();
        change(network);
        return Load(network);
    }

    /// <summary>The one problem at <paramref name="location"/>; fails with the whole list when there is none or several.</summary>
    public static LoadProblem ProblemAt(NetworkLoadResult result, string location)
    {
        Assert.Null(result.Network);
        var matches = result.Problems.Where(p => p.Location == location).ToList();
        Assert.True(matches.Count == 1, $"expected one problem at {location}, found {matches.Count} among:\n{string.Join("\n", result.Problems)}");
        return matches[0];
    }

    public static JsonObject Plant(JsonObject network) => network["plants"]![0]!.AsObject();
    public static JsonObject Stage(JsonObject network) => Plant(network)["stages"]![0]!.AsObject();
    public static JsonObject Tank(JsonObject network) => network["tanks"]![0]!.AsObject();
    public static JsonObject Pipeline(JsonObject network) => network["pipelines"]![0]!.AsObject();
    public static JsonObject Customer(JsonObject network) => network["customers"]![0]!.AsObject();
    public static JsonObject Tariff(JsonObject network) => network["tariffs"]![0]!.AsObject();

    /// <summary>Adds a class B (worse than A) after class A.</summary>
    public static void AddClassB(JsonObject network) =>
        network["qualityClasses"]!.AsArray().Add(JsonNode.Parse("""{ "id": "B", "name": "Class B", "quality": { "eColiPer100Ml": 100 } }"""));

    private static string FindRoot()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(Path.Combine(folder.FullName, "PlanDesk.sln")))
            {
                return folder.FullName;
            }
        }
        throw new InvalidOperationException($"PlanDesk.sln not found above {AppContext.BaseDirectory}");
    }
}

/// <summary>A folder under the system temp folder, deleted after the test.</summary>
internal sealed class TempFolder : IDisposable
{
    public string Path { get; } = Directory.CreateDirectory(System.IO.Path.Combine(System.IO.Path.GetTempPath(), "plandesk-tests-" + Guid.NewGuid().ToString("N"))).FullName;

    public string Write(string name, string text)
    {
        var file = System.IO.Path.Combine(Path, name);
        Directory.CreateDirectory(System.IO.Path.GetDirectoryName(file)!);
        File.WriteAllText(file, text);
        return file;
    }

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
