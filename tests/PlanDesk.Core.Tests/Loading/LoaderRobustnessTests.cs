using System.Text.Json.Nodes;
using CsCheck;
using PlanDesk.Core.Loading;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>Whatever a person does to a network file, the loader answers with a network or with problems, never an exception.</summary>
public class LoaderRobustnessTests
{
    // Values a careless edit might leave anywhere: wrong types, extremes, other ids, odd series.
    private static readonly string[] Replacements =
    [
        "\"\"", "\"x\"", "-1", "0", "1e308", "-1e308", "1.5", "2147483648", "true", "null", "{}", "[]", "[1,\"a\"]",
        "{\"csv\":\"missing.csv\",\"column\":\"b\"}", "{\"start\":\"9999-12-31T23:00\",\"stepMinutes\":60,\"values\":[1,2]}",
        "{\"start\":\"2027-03-26T00:00\",\"stepMinutes\":44640,\"values\":[1,2]}", "{\"start\":\"0001-01-01T00:00Z\",\"stepMinutes\":60,\"values\":[1,2]}",
        "\"9999-12-31\"", "\"00:00\"", "\"secondary\"", "\"A\"", "\"larkmoor\"", "\"larkmoor-class-a\"", "\"hollins-orchard\"",
        "\"larkmoor-grid\"", "\"standard\"", "60", "7", "13", "{\"timeOfUse\":{\"seasons\":[]}}", "[{\"id\":\"A\"}]",
    ];

    private static readonly Gen<(int Place, int Value, int Kind)[]> Edits =
        Gen.Select(Gen.Int[0, 100_000], Gen.Int[0, Replacements.Length - 1], Gen.Int[0, 2]).Array[1, 4];

    [Fact]
    public void AnyEditOfTheQuickstartGivesANetworkOrLocatedProblemsNeverAnException()
    {
        Edits.Sample(edits =>
        {
            var network = TestNetworks.Quickstart();
            foreach (var edit in edits)
            {
                Apply(network, edit);
            }

            var result = NetworkLoader.LoadText(network.ToJsonString(), TestNetworks.FileName, TestNetworks.NetworksFolder);

            Assert.True(result.Network is null != (result.Problems.Count == 0), "either a network or problems");
            Assert.All(result.Problems, p => Assert.False(string.IsNullOrEmpty(p.What)));
            if (result.Network is { } loaded)
            {
                NetworkSummary.Of(loaded);
            }
        }, iter: 400, threads: 1);
    }

    // Replaces, removes, or adds beside, the node numbered Place (in document order, modulo the node count).
    private static void Apply(JsonObject root, (int Place, int Value, int Kind) edit)
    {
        var places = new List<(JsonNode Parent, object Key)>();
        void Walk(JsonNode node)
        {
            if (node is JsonObject obj)
            {
                foreach (var (name, child) in obj.ToList())
                {
                    places.Add((obj, name));
                    if (child is not null)
                    {
                        Walk(child);
                    }
                }
            }
            else if (node is JsonArray array)
            {
                for (var i = 0; i < array.Count; i++)
                {
                    places.Add((array, i));
                    if (array[i] is { } child)
                    {
                        Walk(child);
                    }
                }
            }
        }
        Walk(root);
        if (places.Count == 0)
        {
            return;
        }
        var (parent, key) = places[edit.Place % places.Count];
        var value = JsonNode.Parse(Replacements[edit.Value]);
        switch (parent, key, edit.Kind)
        {
            case (JsonObject obj, string name, 0):
                obj.Remove(name);
                break;
            case (JsonObject obj, string name, 1):
                obj[name + "Extra"] = value;
                break;
            case (JsonObject obj, string name, _):
                obj[name] = value;
                break;
            case (JsonArray array, int index, 0):
                array.RemoveAt(index);
                break;
            case (JsonArray array, _, 1):
                array.Add(value);
                break;
            case (JsonArray array, int index, _):
                array[index] = value;
                break;
        }
    }
}
