using System.Buffers;
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

    /// <summary>The schema's problems with <paramref name="root"/>. The values of inline series are left to
    /// <see cref="SeriesReader"/>: a schema library keeps a result per array item, which for a week of minute values
    /// costs gigabytes, while the reader checks them in one pass.</summary>
    public static IReadOnlyList<LoadProblem> Check(JsonElement root, string file)
    {
        using var view = WithoutSeriesValues(root);
        var schema = Loaded.Value.Schema;
        // The flag form stops at the first failure and keeps no results; the full form runs only for a bad file.
        if (schema.Evaluate(view.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.Flag }).IsValid)
        {
            return [];
        }
        var result = schema.Evaluate(view.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.Hierarchical });
        var failures = new List<SchemaFailure>();
        Collect(result, failures);
        return new SchemaMessages(SchemaRoot, view.RootElement, file).Render(failures);
    }

    // A copy of the document in which every non-empty "values" list holds a single 0.
    private static JsonDocument WithoutSeriesValues(JsonElement root)
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var writer = new Utf8JsonWriter(buffer))
        {
            Copy(root, writer);
        }
        return JsonDocument.Parse(buffer.WrittenMemory, new JsonDocumentOptions { MaxDepth = NetworkLoader.MaxDepth + 1 });
    }

    private static void Copy(JsonElement element, Utf8JsonWriter writer)
    {
        switch (element.ValueKind)
        {
            case JsonValueKind.Object:
                writer.WriteStartObject();
                foreach (var property in element.EnumerateObject())
                {
                    writer.WritePropertyName(property.Name);
                    if (property.Name == "values" && property.Value.ValueKind == JsonValueKind.Array && property.Value.GetArrayLength() > 0)
                    {
                        writer.WriteStartArray();
                        writer.WriteNumberValue(0);
                        writer.WriteEndArray();
                    }
                    else
                    {
                        Copy(property.Value, writer);
                    }
                }
                writer.WriteEndObject();
                break;
            case JsonValueKind.Array:
                writer.WriteStartArray();
                foreach (var item in element.EnumerateArray())
                {
                    Copy(item, writer);
                }
                writer.WriteEndArray();
                break;
            default:
                element.WriteTo(writer);
                break;
        }
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
