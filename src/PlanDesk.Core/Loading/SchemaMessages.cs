using System.Globalization;
using System.Text.Json;

namespace PlanDesk.Core.Loading;

/// <summary>
/// Words schema failures the way a person fixing the file needs them: the value found, what the schema allows
/// (bounds, choices, fields), and the field's own description and example taken from the schema.
/// </summary>
internal sealed class SchemaMessages(JsonElement schemaRoot, JsonElement instanceRoot, string file)
{
    public IReadOnlyList<LoadProblem> Render(IReadOnlyList<SchemaFailure> failures)
    {
        // A misspelt field shows up twice: as unknown, and as the required field it was meant to be. Say it once.
        var misspelt = new HashSet<string>();
        var unknown = failures.Where(IsUnknownField).ToDictionary(f => f, f => UnknownField(f, misspelt));
        return failures.SelectMany(f => unknown.TryGetValue(f, out var problem) ? [problem] : Other(f, misspelt)).ToList();
    }

    private static bool IsUnknownField(SchemaFailure failure) =>
        failure.EvaluationPath.Count > 0 && failure.EvaluationPath[^1] == "additionalProperties";

    private LoadProblem UnknownField(SchemaFailure failure, HashSet<string> misspelt)
    {
        var parentPointer = failure.InstancePointer[..failure.InstancePointer.LastIndexOf('/')];
        var name = SchemaCheck.Segments(failure.InstancePointer)[^1];
        var owner = Resolve(failure.EvaluationPath.Take(failure.EvaluationPath.Count - 1).ToList());
        var allowed = owner.Count > 0 && owner[^1].TryGetProperty("properties", out var properties)
            ? properties.EnumerateObject().Select(p => p.Name).Where(n => n != "$schema").ToList()
            : [];
        var near = Suggest.Closest(name, allowed);
        if (near is not null)
        {
            misspelt.Add(parentPointer + "/" + near);
        }
        var fix = near is not null
            ? $"did you mean '{near}'?"
            : $"remove it, or use one of the fields here: {Suggest.List(allowed, 30)}";
        return new LoadProblem(file, Path(failure.InstancePointer), $"unknown field '{name}'", fix);
    }

    private IEnumerable<LoadProblem> Other(SchemaFailure failure, HashSet<string> misspelt)
    {
        var chain = Resolve(failure.EvaluationPath);
        var schema = chain.Count > 0 ? chain[^1] : default;
        var value = JsonPaths.At(instanceRoot, failure.InstancePointer);
        var shown = value is { ValueKind: not (JsonValueKind.Object or JsonValueKind.Array) } v ? JsonPaths.Show(v) : "the value";
        var path = Path(failure.InstancePointer);
        switch (failure.Keyword)
        {
            case "required":
                foreach (var missing in Strings(schema, "required"))
                {
                    var present = value is { ValueKind: JsonValueKind.Object } o && o.TryGetProperty(missing, out _);
                    if (!present && !misspelt.Contains(failure.InstancePointer + "/" + missing))
                    {
                        yield return new LoadProblem(file, JsonPaths.Child(path, missing), "missing", $"add {FieldHint(schema, missing)}");
                    }
                }
                yield break;
            case "type":
                yield return Problem(path, $"{shown} is {JsonPaths.KindOf(value)}, not {Expected(schema)}", chain);
                yield break;
            case "minimum" or "maximum" or "exclusiveMinimum" or "exclusiveMaximum":
                yield return Problem(path, $"{shown} is {Range(schema)}", chain);
                yield break;
            case "enum":
                yield return Problem(path, $"{shown} is not one of {Suggest.List(Raw(schema, "enum"))}", chain);
                yield break;
            case "pattern":
                yield return Problem(path, $"{shown} is not in the expected form", chain);
                yield break;
            case "minLength":
                yield return Problem(path, $"{shown} is empty", chain);
                yield break;
            case "minItems":
                yield return Problem(path, $"the list has {value?.GetArrayLength() ?? 0} entries but needs at least {Bound(schema, "minItems")}", chain);
                yield break;
            case "uniqueItems":
                yield return new LoadProblem(file, path, "the list names the same value twice", "list each value once");
                yield break;
            default:
                yield return new LoadProblem(file, path, failure.Message, "see docs/network-format.md for what is allowed here");
                yield break;
        }
    }

    private LoadProblem Problem(string path, string what, IReadOnlyList<JsonElement> chain) => new(file, path, what, $"give {Hint(chain)}");

    private string Path(string pointer) => JsonPaths.FromPointer(instanceRoot, pointer);

    // "the share of feed that becomes product, e.g. 0.97" from the nearest description and example on the way
    // to the failing keyword (a field's own description sits beside its $ref).
    private static string Hint(IReadOnlyList<JsonElement> chain)
    {
        var description = chain.Reverse().Select(s => s.TryGetProperty("description", out var d) ? d.GetString() : null).FirstOrDefault(d => d is not null);
        var example = chain.Reverse().Select(s => s.TryGetProperty("examples", out var e) && e.GetArrayLength() > 0 ? e[0].GetRawText() : null).FirstOrDefault(e => e is not null);
        var text = description is null ? "a valid value" : AsPhrase(description);
        return example is null ? text : $"{text}, e.g. {example}";
    }

    private string FieldHint(JsonElement owner, string field)
    {
        if (!owner.TryGetProperty("properties", out var properties) || !properties.TryGetProperty(field, out var property))
        {
            return "it";
        }
        var chain = new List<JsonElement> { property };
        if (property.TryGetProperty("$ref", out var reference) && Follow(reference.GetString()) is { } target)
        {
            chain.Insert(0, target);
        }
        return Hint(chain);
    }

    // Descriptions are sentences ("The share of feed that becomes product."); messages want a phrase.
    private static string AsPhrase(string description)
    {
        var text = description.TrimEnd('.');
        return text.Length > 1 && char.IsUpper(text[0]) && (char.IsLower(text[1]) || text[1] == ' ') ? char.ToLowerInvariant(text[0]) + text[1..] : text;
    }

    private static string Expected(JsonElement schema)
    {
        var types = schema.TryGetProperty("type", out var t)
            ? t.ValueKind == JsonValueKind.Array ? t.EnumerateArray().Select(x => x.GetString()!).ToList() : [t.GetString()!]
            : [];
        return string.Join(" or ", types.Select(type => type switch
        {
            "integer" => "a whole number",
            "number" => "a number",
            "string" => "text",
            "object" => "an object { ... }",
            "array" => "a list [ ... ]",
            "boolean" => "true or false",
            _ => type,
        }));
    }

    // "outside (0, 1]", "below the minimum 1", "not above 0": says the whole allowed range where the schema has one.
    private static string Range(JsonElement schema)
    {
        var (low, lowOpen) = schema.TryGetProperty("exclusiveMinimum", out var em) ? (Num(em), true)
            : schema.TryGetProperty("minimum", out var mi) ? (Num(mi), false) : ((string?)null, false);
        var (high, highOpen) = schema.TryGetProperty("exclusiveMaximum", out var eM) ? (Num(eM), true)
            : schema.TryGetProperty("maximum", out var ma) ? (Num(ma), false) : ((string?)null, false);
        return (low, high) switch
        {
            ({ } l, { } h) => $"outside {(lowOpen ? "(" : "[")}{l}, {h}{(highOpen ? ")" : "]")}",
            ({ } l, null) => lowOpen ? $"not above {l}" : $"below the minimum {l}",
            (null, { } h) => highOpen ? $"not below {h}" : $"above the maximum {h}",
            _ => "out of range",
        };
    }

    private static string Num(JsonElement number) => number.GetDouble().ToString(CultureInfo.InvariantCulture);

    private static string Bound(JsonElement schema, string keyword) =>
        schema.TryGetProperty(keyword, out var value) ? value.GetRawText() : "?";

    private static IEnumerable<string> Strings(JsonElement schema, string keyword) =>
        schema.ValueKind == JsonValueKind.Object && schema.TryGetProperty(keyword, out var list)
            ? list.EnumerateArray().Select(x => x.GetString()!)
            : [];

    private static IEnumerable<string> Raw(JsonElement schema, string keyword) =>
        schema.ValueKind == JsonValueKind.Object && schema.TryGetProperty(keyword, out var list)
            ? list.EnumerateArray().Select(x => x.GetRawText())
            : [];

    /// <summary>The schema objects along an evaluation path since the last step into a child value, deepest last.</summary>
    private List<JsonElement> Resolve(IReadOnlyList<string> evaluationPath)
    {
        var chain = new List<JsonElement> { schemaRoot };
        var node = schemaRoot;
        for (var i = 0; i < evaluationPath.Count; i++)
        {
            var segment = evaluationPath[i];
            JsonElement? next = segment switch
            {
                "properties" when i + 1 < evaluationPath.Count => Child(Child(node, "properties"), evaluationPath[++i]),
                "items" or "additionalProperties" => Child(node, segment),
                "$ref" => Child(node, "$ref") is { ValueKind: JsonValueKind.String } reference ? Follow(reference.GetString()) : null,
                "then" or "else" => Child(node, segment),
                _ => null, // oneOf and if branches are never reported (see SchemaCheck.Collect)
            };
            if (next is not { } found)
            {
                break;
            }
            if (segment is "properties" or "items" or "additionalProperties")
            {
                chain.Clear();
                // JsonSchema.Net 8 writes "items" twice in evaluation paths (keyword, then subschema).
                if (segment == "items" && i + 1 < evaluationPath.Count && evaluationPath[i + 1] == "items")
                {
                    i++;
                }
            }
            node = found;
            chain.Add(node);
        }
        return chain;
    }

    private static JsonElement? Child(JsonElement? node, string name) =>
        node is { ValueKind: JsonValueKind.Object } o && o.TryGetProperty(name, out var child) ? child : null;

    private JsonElement? Follow(string? reference) =>
        reference is not null && reference.StartsWith('#') ? JsonPaths.At(schemaRoot, reference[1..]) : null;
}
