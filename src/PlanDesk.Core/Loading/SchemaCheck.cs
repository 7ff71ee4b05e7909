using System.Text.Json;
using Json.Schema;

namespace PlanDesk.Core.Loading;

/// <summary>
/// Checks a network document against docs/network.schema.json (embedded in this assembly) and turns every
/// failure into a <see cref="LoadProblem"/> at its JSON path. Shape, types, ranges and unknown fields are the
/// schema's job; references and rules across fields are checked in code by the readers.
/// </summary>
internal static class SchemaCheck
{
    public const string ResourceName = "PlanDesk.Core.network.schema.json";

    private static readonly Lazy<(JsonSchema Schema, JsonDocument Document)> Loaded = new(Build);

    /// <summary>The schema as a JSON document, for reading descriptions, examples and bounds into messages.</summary>
    public static JsonElement SchemaRoot => Loaded.Value.Document.RootElement;

    public static IReadOnlyList<LoadProblem> Check(JsonElement root, string file)
    {
        var result = Loaded.Value.Schema.Evaluate(root, new EvaluationOptions { OutputFormat = OutputFormat.Hierarchical });
        if (result.IsValid)
        {
            return [];
        }
        var failures = new List<SchemaFailure>();
        Collect(result, failures);
        return new SchemaMessages(SchemaRoot, root, file).Render(failures);
    }

    public static string Text()
    {
        using var stream = typeof(SchemaCheck).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidOperationException($"resource {ResourceName} is missing from the build");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }

    private static (JsonSchema, JsonDocument) Build()
    {
        var text = Text();
        return (JsonSchema.FromText(text), JsonDocument.Parse(text));
    }

    // Walks only failing nodes. The "if" of if/then/else is a test, not a rule, and the branches of oneOf are the
    // "exactly one of" choices that the readers report with a clearer message, so both are left out.
    private static void Collect(EvaluationResults node, List<SchemaFailure> failures)
    {
        if (node.IsValid)
        {
            return;
        }
        var segments = Segments(node.EvaluationPath.ToString());
        if (segments.Count > 0 && segments[^1] == "if" || segments.Contains("oneOf") || segments.Contains("anyOf") || segments.Contains("not"))
        {
            return;
        }
        foreach (var (keyword, message) in node.Errors ?? new Dictionary<string, string>())
        {
            failures.Add(new SchemaFailure(node.InstanceLocation.ToString(), segments, keyword, message));
        }
        foreach (var child in node.Details ?? [])
        {
            Collect(child, failures);
        }
    }

    public static List<string> Segments(string pointer) =>
        pointer.Split('/', StringSplitOptions.RemoveEmptyEntries).Select(s => s.Replace("~1", "/").Replace("~0", "~")).ToList();
}

/// <summary>One failed schema keyword: where in the instance, by which schema path, and the library's message.</summary>
internal sealed record SchemaFailure(string InstancePointer, IReadOnlyList<string> EvaluationPath, string Keyword, string Message);
