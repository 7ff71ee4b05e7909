using System.Globalization;
using System.Text.Json;

namespace PlanDesk.Core.Loading;

/// <summary>
/// A JSON value with its JSON path. Reading is forgiving on purpose: a missing field or one of the wrong type
/// gives NaN, "" or nothing, because the schema check has already reported it; the model built from such
/// values is discarded whenever there is any problem.
/// </summary>
internal readonly record struct Node(JsonElement Element, string Path)
{
    public bool IsObject => Element.ValueKind == JsonValueKind.Object;

    public bool Has(string name) => IsObject && Element.TryGetProperty(name, out _);

    public string PathOf(string name) => JsonPaths.Child(Path, name);

    public Node? Field(string name) =>
        IsObject && Element.TryGetProperty(name, out var value) && value.ValueKind != JsonValueKind.Null
            ? new Node(value, PathOf(name))
            : null;

    /// <summary>The string field, or "" when missing or not a string.</summary>
    public string Text(string name) =>
        Field(name) is { Element.ValueKind: JsonValueKind.String } field ? field.Element.GetString()! : "";

    /// <summary>The string field, or null when missing or not a string.</summary>
    public string? OptionalText(string name) =>
        Field(name) is { Element.ValueKind: JsonValueKind.String } field ? field.Element.GetString() : null;

    /// <summary>The number field; NaN when missing or not a number, so comparisons with it are false.</summary>
    public double Number(string name) =>
        Field(name) is { Element.ValueKind: JsonValueKind.Number } field ? field.Element.GetDouble() : double.NaN;

    /// <summary>The number field, <paramref name="fallback"/> when missing, NaN when not a number.</summary>
    public double NumberOr(string name, double fallback) => Has(name) ? Number(name) : fallback;

    /// <summary>The optional number field: null when missing, NaN when not a number.</summary>
    public double? OptionalNumber(string name) => Has(name) ? Number(name) : null;

    /// <summary>A whole number; <paramref name="fallback"/> when missing or not whole (the schema reports those).</summary>
    public int Int(string name, int fallback)
    {
        var value = Number(name);
        return double.IsFinite(value) && value == Math.Floor(value) && Math.Abs(value) <= int.MaxValue ? (int)value : fallback;
    }

    public IEnumerable<Node> Items(string name)
    {
        if (Field(name) is not { Element.ValueKind: JsonValueKind.Array } array)
        {
            yield break;
        }
        var index = 0;
        foreach (var item in array.Element.EnumerateArray())
        {
            yield return new Node(item, $"{array.Path}[{index++}]");
        }
    }

    public IEnumerable<string> Strings(string name) =>
        Items(name).Where(i => i.Element.ValueKind == JsonValueKind.String).Select(i => i.Element.GetString()!);
}

/// <summary>JSON paths as people read them: <c>$.plants[1].stages[0].recoveryFraction</c>.</summary>
internal static class JsonPaths
{
    public const string Root = "$";

    public static string Child(string parent, string name) =>
        IsPlainName(name) ? $"{parent}.{name}" : $"{parent}['{name.Replace("'", "\\'")}']";

    /// <summary>Turns a JSON Pointer into a path, walking <paramref name="root"/> to tell array indices from names.</summary>
    public static string FromPointer(JsonElement root, string pointer)
    {
        var path = Root;
        var current = root;
        var known = true;
        foreach (var raw in pointer.Split('/', StringSplitOptions.RemoveEmptyEntries))
        {
            var segment = raw.Replace("~1", "/").Replace("~0", "~");
            if (known && current.ValueKind == JsonValueKind.Array && int.TryParse(segment, NumberStyles.None, CultureInfo.InvariantCulture, out var index))
            {
                path += $"[{index}]";
                known = index < current.GetArrayLength();
                current = known ? current[index] : default;
            }
            else
            {
                path = Child(path, segment);
                known = known && current.ValueKind == JsonValueKind.Object && current.TryGetProperty(segment, out current);
            }
        }
        return path;
    }

    /// <summary>The value at a JSON Pointer, or null when it is not there.</summary>
    public static JsonElement? At(JsonElement root, string pointer)
    {
        var current = root;
        foreach (var raw in pointer.Split('/', StringSplitOptions.RemoveEmptyEntries))
        {
            var segment = raw.Replace("~1", "/").Replace("~0", "~");
            if (current.ValueKind == JsonValueKind.Array && int.TryParse(segment, NumberStyles.None, CultureInfo.InvariantCulture, out var index) && index < current.GetArrayLength())
            {
                current = current[index];
            }
            else if (current.ValueKind != JsonValueKind.Object || !current.TryGetProperty(segment, out current))
            {
                return null;
            }
        }
        return current;
    }

    /// <summary>A short rendering of a value for messages: numbers and strings as written, containers by kind.</summary>
    public static string Show(JsonElement value)
    {
        var text = value.ValueKind switch
        {
            JsonValueKind.Object => "an object",
            JsonValueKind.Array => "a list",
            _ => value.GetRawText(),
        };
        return text.Length > 60 ? text[..57] + "..." : text;
    }

    /// <summary>The kind of a value in words: "text", "a number", "a list" ...</summary>
    public static string KindOf(JsonElement? value) => value?.ValueKind switch
    {
        JsonValueKind.String => "text",
        JsonValueKind.Number => "a number",
        JsonValueKind.True or JsonValueKind.False => "true/false",
        JsonValueKind.Object => "an object",
        JsonValueKind.Array => "a list",
        JsonValueKind.Null => "null",
        _ => "missing",
    };

    private static bool IsPlainName(string name) =>
        name.Length > 0 && (char.IsLetter(name[0]) || name[0] is '_' or '$') && name.All(c => char.IsLetterOrDigit(c) || c is '_' or '$');
}
