using PlanDesk.Core.Loading;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>Files that are not a network at all: empty, cut short, broken, huge or absurdly nested.</summary>
public sealed class FileLimitTests : IDisposable
{
    private readonly TempFolder folder = new();

    public void Dispose() => folder.Dispose();

    [Fact]
    public void EmptyFileIsReportedAsEmpty()
    {
        var result = NetworkLoader.Load(folder.Write("empty.json", "  \n"));

        var problem = Assert.Single(result.Problems);
        Assert.Equal("the file is empty", problem.What);
        Assert.EndsWith("empty.json", problem.File);
    }

    [Fact]
    public void TruncatedFileIsReportedWithLineAndColumn()
    {
        var text = File.ReadAllText(TestNetworks.QuickstartPath);
        var cut = text[..text.IndexOf("\"tanks\"", StringComparison.Ordinal)];

        var result = NetworkLoader.LoadText(cut, "networks/cut.json", null);

        var problem = Assert.Single(result.Problems);
        Assert.Matches(@"^line \d+, column \d+$", problem.Location);
        Assert.Contains("ends before the JSON is complete", problem.What);
    }

    [Fact]
    public void SyntaxErrorIsReportedAtItsLineAndColumn()
    {
        const string text = "{\n  \"name\": \"x\",\n  \"timeZone\" \"Europe/Madrid\"\n}";

        var result = NetworkLoader.LoadText(text, "networks/broken.json", null);

        var problem = Assert.Single(result.Problems);
        Assert.Equal("line 3, column 14", problem.Location);
        Assert.StartsWith("not valid JSON", problem.What);
    }

    [Fact]
    public void MissingFileIsAProblemNotAnException()
    {
        var result = NetworkLoader.Load(Path.Combine(folder.Path, "nowhere.json"));

        Assert.Equal("the file does not exist", Assert.Single(result.Problems).What);
    }

    [Fact]
    public void FileOverTheSizeLimitIsRefusedUnread()
    {
        var path = Path.Combine(folder.Path, "huge.json");
        using (var stream = File.Create(path))
        {
            stream.SetLength(NetworkLoader.MaxFileBytes + 1); // sparse: nothing is written
        }

        var result = NetworkLoader.Load(path);

        var problem = Assert.Single(result.Problems);
        Assert.Contains("over the 50 MB limit", problem.What);
    }

    [Fact]
    public void DeeplyNestedFileIsRefusedWithADepthMessage()
    {
        const int depth = 100_000;
        var text = "{\"name\": " + new string('[', depth) + new string(']', depth) + "}";

        var result = NetworkLoader.LoadText(text, "networks/deep.json", null);

        var problem = Assert.Single(result.Problems);
        Assert.Contains($"nested more than {NetworkLoader.MaxDepth} levels deep", problem.What);
        Assert.Equal($"line 1, column {10 + NetworkLoader.MaxDepth - 1}", problem.Location);
    }

    [Fact]
    public void BytesThatAreNotUtf8AreReportedWhereTheyAre()
    {
        var bytes = "{\n  \"name\": \"Lark"u8.ToArray().Concat(new byte[] { 0xFF }).Concat("moor\"\n}"u8.ToArray()).ToArray();

        var path = Path.Combine(folder.Path, "latin1.json");
        File.WriteAllBytes(path, bytes);

        var result = NetworkLoader.Load(path);

        var problem = Assert.Single(result.Problems);
        Assert.Equal("line 2, column 16", problem.Location);
        Assert.Equal("byte 0xFF is not UTF-8 text", problem.What);
    }

    [Fact]
    public void FieldNamedTwiceInOneObjectIsReportedAtTheSecond()
    {
        var text = File.ReadAllText(TestNetworks.QuickstartPath).Replace("\"currency\": \"EUR\",", "\"currency\": \"EUR\", \"currency\": \"USD\",");

        var result = NetworkLoader.LoadText(text, "networks/twice.json", TestNetworks.NetworksFolder);

        var problem = Assert.Single(result.Problems);
        Assert.Equal("line 4, column 22", problem.Location);
        Assert.Contains("the field 'currency' appears twice", problem.What);
    }

    [Fact]
    public void RootThatIsNotAnObjectIsAWrongType()
    {
        var result = NetworkLoader.LoadText("[1, 2]", "networks/list.json", null);

        var problem = Assert.Single(result.Problems);
        Assert.Equal("$", problem.Location);
        Assert.Contains("a list, not an object", problem.What);
    }
}
