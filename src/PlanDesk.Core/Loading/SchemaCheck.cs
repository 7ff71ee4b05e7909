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

    /// <summary>No quantity in a network file comes near this; larger numbers are typing mistakes, and the schema
    /// library cannot compare numbers beyond the decimal range.</summary>
    public const double MaxMagnitude = 1e15;

    /// <summary>The schema's problems with <paramref name="root"/>. The values of inline series are left to
    /// <see cref="SeriesReader"/>: a schema library keeps a result per array item, which for a week of minute values
    /// costs gigabytes, while the reader checks them in one pass.</summary>
    public static IReadOnlyList<LoadProblem> Check(JsonElement root, string file)
    {
        var tooLarge = new List<LoadProblem>();
        using var view = SchemaView(root, file, tooLarge);
        var schema = Loaded.Value.Schema;
        // The flag form stops at the first failure and keeps no results; the full form runs only for a bad file.
        if (schema.Evaluate(view.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.Flag }).IsValid)
        {
            return tooLarge;
        }
        var result = schema.Evaluate(view.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.Hierarchical });
        var failures = new List<SchemaFailure>();
        Collect(result, failures);
        var replaced = tooLarge.Select(p => p.Location).ToHashSet();
        return [.. tooLarge, .. new SchemaMessages(SchemaRoot, view.RootElement, file).Render(failures).Where(p => !replaced.Contains(p.Location))];
    }

    // A copy of the document for the schema: every non-empty "values" list holds a single 0, and every number too
    // large to be meant is replaced by 0 and reported.
    private static JsonDocument SchemaView(JsonElement root, string file, List<LoadProblem> tooLarge)
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var writer = new Utf8JsonWriter(buffer))
        {
            Copy(root, JsonPaths.Root, writer, file, tooLarge);
        }
        return JsonDocument.Parse(buffer.WrittenMemory, new JsonDocumentOptions { MaxDepth = NetworkLoader.MaxDepth + 1 });
    }

    private static void Copy(JsonElement element, string path, Utf8JsonWriter writer, string file, List<LoadProblem> tooLarge)
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
                        Copy(property.Value, JsonPaths.Child(path, property.Name), writer, file, tooLarge);
                    }
                }
                writer.WriteEndObject();
                break;
            case JsonValueKind.Array:
                writer.WriteStartArray();
                var index = 0;
                foreach (var item in element.EnumerateArray())
                {
                    Copy(item, $"{path}[{index++}]", writer, file, tooLarge);
                }
                writer.WriteEndArray();
                break;
            case JsonValueKind.Number when !(Math.Abs(element.GetDouble()) <= MaxMagnitude):
                tooLarge.Add(new LoadProblem(file, path, $"{JsonPaths.Show(element)} is far too large", "check the number; no quantity in a network file is above 1e15"));
                writer.WriteNumberValue(0);
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
