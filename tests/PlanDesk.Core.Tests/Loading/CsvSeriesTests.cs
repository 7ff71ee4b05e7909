using System.Text.Json.Nodes;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>Series in CSV files: read relative to the network file; bad files, lines and cells are located.</summary>
public sealed class CsvSeriesTests : IDisposable
{
    private const string Header = "timestamp,larkmoor,fernbrook";
    private readonly TempFolder folder = new();

    public void Dispose() => folder.Dispose();

    // 24 hourly rows for 2027-03-26 in Europe/Madrid (UTC+1 that day), with an edit applied to the row list.
    private static string Influent(Func<List<string>, List<string>>? edit = null)
    {
        var rows = Enumerable.Range(0, 24).Select(h => $"2027-03-26T{h:00}:00:00+01:00,{400 + h},{200 + h}").ToList();
        return string.Join("\n", new[] { Header }.Concat(edit is null ? rows : edit(rows))) + "\n";
    }

    private NetworkLoadResult LoadWithCsv(string csvText, string column = "larkmoor")
    {
        folder.Write("series/influent.csv", csvText);
        var network = Quickstart();
        Plant(network)["influentM3PerHour"] = new JsonObject { ["csv"] = "series/influent.csv", ["column"] = column };
        var json = network.ToJsonString();
        folder.Write("net.json", json);
        return NetworkLoader.Load(Path.Combine(folder.Path, "net.json"));
    }

    [Fact]
    public void CsvColumnIsReadRelativeToTheNetworkFileWithItsOrigin()
    {
        var result = LoadWithCsv(Influent());

        Assert.Empty(result.Problems);
        var influent = Assert.IsType<StepSeries>(result.Network!.Plants[0].InfluentM3PerHour);
        Assert.Equal("series/influent.csv column larkmoor", influent.Origin);
        Assert.Equal(NodaTime.Duration.FromHours(1), influent.Step);
        Assert.Equal(423.0, influent.Values[^1]);
    }

    [Fact]
    public void MissingCsvFileIsReportedAtTheReference()
    {
        var network = Quickstart();
        Plant(network)["influentM3PerHour"] = new JsonObject { ["csv"] = "series/nowhere.csv", ["column"] = "larkmoor" };

        var result = Load(network, folder.Path);

        Assert.Contains("the CSV file 'series/nowhere.csv' does not exist", ProblemAt(result, "$.plants[0].influentM3PerHour.csv").What);
    }

    [Fact]
    public void MissingCsvColumnSuggestsTheNearestColumn()
    {
        var result = LoadWithCsv(Influent(), column: "larkmore");

        var problem = ProblemAt(result, "$.plants[0].influentM3PerHour.column");
        Assert.Contains("'larkmore' is not a column of", problem.What);
        Assert.Contains("did you mean 'larkmoor'?", problem.Fix);
    }

    [Fact]
    public void NonNumericCellIsReportedWithLineAndColumn()
    {
        var result = LoadWithCsv(Influent(rows =>
        {
            rows[2] = "2027-03-26T02:00:00+01:00,4o2,202";
            return rows;
        }));

        var problem = ProblemAt(result, "line 4, column 'larkmoor'");
        Assert.EndsWith("influent.csv", problem.File);
        Assert.Contains("'4o2' is not a number", problem.What);
    }

    [Fact]
    public void RepeatedTimestampIsReportedAtItsLine()
    {
        var result = LoadWithCsv(Influent(rows =>
        {
            rows.Insert(6, rows[5]);
            return rows;
        }));

        Assert.Contains("repeats line 7", ProblemAt(result, "line 8").What);
    }

    [Fact]
    public void MissingTimestampsAreReportedAsAGap()
    {
        var result = LoadWithCsv(Influent(rows =>
        {
            rows.RemoveRange(10, 2);
            return rows;
        }));

        var problem = ProblemAt(result, "line 12");
        Assert.Contains("2 timestamp(s) missing after line 11", problem.What);
        Assert.Contains("step is 60 min", problem.Fix);
    }

    [Fact]
    public void TimestampWithoutOffsetIsRejected()
    {
        var result = LoadWithCsv(Influent(rows =>
        {
            rows[0] = "2027-03-26 00:00,400,200";
            return rows;
        }));

        Assert.Contains("is not an ISO-8601 timestamp with an offset", ProblemAt(result, "line 2, column 'timestamp'").What);
    }

    [Fact]
    public void NegativeCsvValueIsReportedAtItsLine()
    {
        var result = LoadWithCsv(Influent(rows =>
        {
            rows[20] = "2027-03-26T20:00:00+01:00,-1,220";
            return rows;
        }));

        Assert.Contains("-1 is negative", ProblemAt(result, "line 22, column 'larkmoor'").What);
    }

    [Fact]
    public void CsvSeriesTextWithoutAFolderIsRefused()
    {
        var network = Quickstart();
        Plant(network)["influentM3PerHour"] = new JsonObject { ["csv"] = "influent.csv", ["column"] = "larkmoor" };

        var result = NetworkLoader.LoadText(network.ToJsonString(), "upload", baseDirectory: null);

        Assert.Contains("was not read from a folder", ProblemAt(result, "$.plants[0].influentM3PerHour.csv").What);
    }

    [Fact]
    public void RepeatedColumnNameInTheHeaderIsRejected()
    {
        var result = LoadWithCsv(Influent().Replace(Header, "timestamp,larkmoor,larkmoor"));

        Assert.Contains("the column 'larkmoor' appears twice in the header", ProblemAt(result, "line 1").What);
    }
}
