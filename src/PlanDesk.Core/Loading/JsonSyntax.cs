using System.Buffers;
using System.Text;
using System.Text.Json;

namespace PlanDesk.Core.Loading;

/// <summary>What a first pass over the raw bytes found: a problem that stops loading, or fields named twice.</summary>
internal sealed record SyntaxScan(LoadProblem? Fatal, IReadOnlyList<LoadProblem> RepeatedFields);

/// <summary>Finds bytes that are not UTF-8, the first JSON syntax error, nesting deeper than
/// <see cref="NetworkLoader.MaxDepth"/>, and fields named twice in one object, each with its line and column.
/// Reads token by token without building anything, so a hostile file costs one linear pass.</summary>
internal static class JsonSyntax
{
    public static SyntaxScan Check(ReadOnlySpan<byte> utf8, string file)
    {
        if (IsBlank(utf8))
        {
            return Fatal(file, "", "the file is empty", "give a network as a JSON object; see docs/network-format.md and networks/quickstart.json");
        }
        if (FirstInvalidUtf8(utf8) is { } bad)
        {
            var (line, column) = Position(utf8, bad);
            return Fatal(file, $"line {line}, column {column}", $"byte 0x{utf8[bad]:X2} is not UTF-8 text", "save the file as UTF-8");
        }
        // The reader's own limit is set above ours so that our check, with its clearer message, fires first.
        var reader = new Utf8JsonReader(utf8, new JsonReaderOptions { MaxDepth = NetworkLoader.MaxDepth + 2 });
        var repeated = new List<LoadProblem>();
        var namesByDepth = new Stack<HashSet<string>>();
        try
        {
            while (reader.Read())
            {
                if (reader.CurrentDepth >= NetworkLoader.MaxDepth)
                {
                    var (line, column) = Position(utf8, (int)reader.TokenStartIndex);
                    return Fatal(file, $"line {line}, column {column}", $"the JSON is nested more than {NetworkLoader.MaxDepth} levels deep",
                        "a network file needs fewer than ten levels; look for brackets that are never closed or a generated file gone wrong");
                }
                switch (reader.TokenType)
                {
                    case JsonTokenType.StartObject:
                        namesByDepth.Push(new HashSet<string>(StringComparer.Ordinal));
                        break;
                    case JsonTokenType.EndObject:
                        namesByDepth.Pop();
                        break;
                    case JsonTokenType.PropertyName when !namesByDepth.Peek().Add(reader.GetString()!):
                        var (line, column) = Position(utf8, (int)reader.TokenStartIndex);
                        repeated.Add(new LoadProblem(file, $"line {line}, column {column}", $"the field '{reader.GetString()}' appears twice in the same object",
                            "keep one of them: only the last would be used"));
                        break;
                }
            }
            return new SyntaxScan(null, repeated);
        }
        catch (JsonException e)
        {
            var location = $"line {(e.LineNumber ?? 0) + 1}, column {(e.BytePositionInLine ?? 0) + 1}";
            var truncated = IndexOf(utf8, e.LineNumber ?? 0, e.BytePositionInLine ?? 0) >= TrimmedLength(utf8);
            return truncated
                ? Fatal(file, location, "the file ends before the JSON is complete (it may be cut short)", "close every open { and [, or copy the whole file again")
                : Fatal(file, location, $"not valid JSON: {Clean(e.Message)}",
                    "fix the syntax there; a missing comma, quote or bracket just before this point is the usual cause (JSON has no comments)");
        }
    }

    private static SyntaxScan Fatal(string file, string location, string what, string fix) => new(new LoadProblem(file, location, what, fix), []);

    private static int? FirstInvalidUtf8(ReadOnlySpan<byte> utf8)
    {
        if (System.Text.Unicode.Utf8.IsValid(utf8))
        {
            return null;
        }
        var index = 0;
        while (index < utf8.Length)
        {
            if (Rune.DecodeFromUtf8(utf8[index..], out _, out var consumed) != OperationStatus.Done)
            {
                return index;
            }
            index += consumed;
        }
        return null;
    }

    private static bool IsBlank(ReadOnlySpan<byte> utf8) => utf8.Trim(" \t\r\n"u8).IsEmpty;

    private static long TrimmedLength(ReadOnlySpan<byte> utf8) => utf8.TrimEnd(" \t\r\n"u8).Length;

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
