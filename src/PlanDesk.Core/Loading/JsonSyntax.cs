using System.Text.Json;

namespace PlanDesk.Core.Loading;

/// <summary>Finds the first JSON syntax error, or nesting deeper than <see cref="NetworkLoader.MaxDepth"/>, with its line and column.
/// Reads token by token without building anything, so a hostile file costs one linear pass.</summary>
internal static class JsonSyntax
{
    public static LoadProblem? Check(ReadOnlySpan<byte> utf8, string file)
    {
        if (IsBlank(utf8))
        {
            return new LoadProblem(file, "", "the file is empty", "give a network as a JSON object; see docs/network-format.md and networks/quickstart.json");
        }
        // The reader's own limit is set one above ours so that our check, with its clearer message, fires first.
        var reader = new Utf8JsonReader(utf8, new JsonReaderOptions { MaxDepth = NetworkLoader.MaxDepth + 2 });
        try
        {
            while (reader.Read())
            {
                if (reader.CurrentDepth >= NetworkLoader.MaxDepth)
                {
                    var (line, column) = Position(utf8, (int)reader.TokenStartIndex);
                    return new LoadProblem(file, $"line {line}, column {column}",
                        $"the JSON is nested more than {NetworkLoader.MaxDepth} levels deep",
                        "a network file needs fewer than ten levels; look for brackets that are never closed or a generated file gone wrong");
                }
            }
            return null;
        }
        catch (JsonException e)
        {
            var line = (e.LineNumber ?? 0) + 1;
            var column = (e.BytePositionInLine ?? 0) + 1;
            var truncated = IndexOf(utf8, e.LineNumber ?? 0, e.BytePositionInLine ?? 0) >= TrimmedLength(utf8);
            return truncated
                ? new LoadProblem(file, $"line {line}, column {column}", "the file ends before the JSON is complete (it may be cut short)",
                    "close every open { and [, or copy the whole file again")
                : new LoadProblem(file, $"line {line}, column {column}", $"not valid JSON: {Clean(e.Message)}",
                    "fix the syntax there; a missing comma, quote or bracket just before this point is the usual cause");
        }
    }

    private static bool IsBlank(ReadOnlySpan<byte> utf8)
    {
        foreach (var b in utf8)
        {
            if (b is not ((byte)' ' or (byte)'\t' or (byte)'\r' or (byte)'\n'))
            {
                return false;
            }
        }
        return true;
    }

    private static long TrimmedLength(ReadOnlySpan<byte> utf8)
    {
        var end = utf8.Length;
        while (end > 0 && utf8[end - 1] is (byte)' ' or (byte)'\t' or (byte)'\r' or (byte)'\n')
        {
            end--;
        }
        return end;
    }

    // Byte index of a 0-based line and byte position, as the reader reports them.
    private static long IndexOf(ReadOnlySpan<byte> utf8, long line, long bytePosition)
    {
        var start = 0;
        for (var l = 0; l < line; l++)
        {
            var next = utf8[start..].IndexOf((byte)'\n');
            if (next < 0)
            {
                return utf8.Length;
            }
            start += next + 1;
        }
        return start + bytePosition;
    }

    private static (int Line, int Column) Position(ReadOnlySpan<byte> utf8, int index)
    {
        var before = utf8[..index];
        var line = before.Count((byte)'\n') + 1;
        var lastNewline = before.LastIndexOf((byte)'\n');
        return (line, index - lastNewline);
    }

    // The reader's message ends with its own position in a form meant for programmers; ours is in the location.
    private static string Clean(string message)
    {
        var cut = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
        var text = cut >= 0 ? message[..cut] : message;
        return text.TrimEnd('.', ' ');
    }
}
