using System.Text.Json;
using System.Text.RegularExpressions;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Physics;
using static PlanDesk.Core.Tests.TestNetworks;

namespace PlanDesk.Core.Tests.Loading;

/// <summary>The example networks load cleanly, and what they say reaches the model unchanged.</summary>
public class ExampleNetworkTests
{
    [Fact]
    public void QuickstartSatisfiesTheSchema()
    {
        using var document = JsonDocument.Parse(File.ReadAllText(QuickstartPath));

        Assert.Empty(SchemaCheck.Check(document.RootElement, QuickstartPath));
    }

    [Fact]
    public void QuickstartLoadsWithoutProblems()
    {
        var result = NetworkLoader.Load(QuickstartPath);

        Assert.Empty(result.Problems);
        var network = Assert.IsType<Network>(result.Network);
        Assert.Equal("Europe/Madrid", network.TimeZone.Id);
        Assert.Equal(new NodaTime.LocalDate(2027, 3, 26), network.DefaultStartDate);
        Assert.Equal(QuickstartPath, network.SourcePath);
    }

    [Fact]
    public void DemoRegionLoadsWithoutProblems()
    {
        var path = Path.Combine(NetworksFolder, "demo-region.json");
        Assert.True(File.Exists(path), $"{path} is missing: the demo region network should be in networks/ (it comes with the demo data)");

        var result = NetworkLoader.Load(path);

        Assert.True(result.Succeeded, string.Join("\n", result.Problems));
        Assert.True(result.Network!.Plants.Count >= 2, "the demo region has several plants");
    }

    [Fact]
    public void PipelinePumpingEnergyComesFromHeadAndEfficiency()
    {
        var network = NetworkLoader.Load(QuickstartPath).Network!;

        // quickstart: staticHeadM 28, pumpEfficiency 0.72 -> E = rho g H / eta per m3
        Assert.Equal(Pumping.EnergyKWhPerM3(28, 0.72), network.Pipelines[0].EnergyKWhPerM3, 12);
        Assert.Equal(PipelineEnd.ToCustomer(new CustomerId("hollins-orchard")), network.Pipelines[0].To);
    }

    [Fact]
    public void PoweredByDefaultsToThePlantOfTheSourceTank()
    {
        var result = LoadChanged(n => Pipeline(n).Remove("poweredBy"));

        Assert.Equal(new PlantId("larkmoor"), result.Network!.Pipelines[0].PoweredBy);
    }

    [Fact]
    public void DailyVolumeCustomerKeepsItsWrappingWindow()
    {
        var network = NetworkLoader.Load(QuickstartPath).Network!;

        var demand = Assert.IsType<DailyDemand>(network.Customers[0].Demand);
        Assert.Equal(2400, demand.VolumeM3PerDay);
        Assert.Equal(new NodaTime.LocalTime(21, 0), demand.From);
        Assert.Equal(new NodaTime.LocalTime(7, 0), demand.To);
        Assert.Equal(260, demand.MaxM3PerHour);
    }

    [Fact]
    public void InlineSeriesStartsAtLocalMidnightWithItsJsonPathAsOrigin()
    {
        var network = NetworkLoader.Load(QuickstartPath).Network!;

        var influent = Assert.IsType<StepSeries>(network.Plants[0].InfluentM3PerHour);
        Assert.Equal("$.plants[0].influentM3PerHour", influent.Origin);
        Assert.Equal(NodaTime.Instant.FromUtc(2027, 3, 25, 23, 0), influent.Start); // Madrid is UTC+1 on 26 March 2027
        Assert.Equal(NodaTime.Duration.FromMinutes(180), influent.Step);
    }

    [Fact]
    public void ConstantSeriesKeepsItsJsonPathAsOrigin()
    {
        var network = NetworkLoader.Load(QuickstartPath).Network!;

        var gas = Assert.IsType<ConstantSeries>(network.Plants[0].Biogas!.ProductionNm3PerHour);
        Assert.Equal(55, gas.Value);
        Assert.Equal("$.plants[0].biogas.productionNm3PerHour", gas.Origin);
    }

    [Fact]
    public void FormatDocumentNamesEveryFieldOfTheSchema()
    {
        var document = File.ReadAllText(Path.Combine(RepoRoot, "docs", "network-format.md"));
        using var schema = JsonDocument.Parse(File.ReadAllText(Path.Combine(RepoRoot, "docs", "network.schema.json")));

        var undocumented = PropertyNames(schema.RootElement).Distinct()
            .Where(name => !Regex.IsMatch(document, $"`{Regex.Escape(name)}`"))
            .ToList();

        Assert.Empty(undocumented);
    }

    private static IEnumerable<string> PropertyNames(JsonElement schema)
    {
        if (schema.ValueKind == JsonValueKind.Array)
        {
            return schema.EnumerateArray().SelectMany(PropertyNames);
        }
        if (schema.ValueKind != JsonValueKind.Object)
        {
            return [];
        }
        var own = schema.TryGetProperty("properties", out var properties) ? properties.EnumerateObject().Select(p => p.Name) : [];
        return own.Concat(schema.EnumerateObject().SelectMany(p => PropertyNames(p.Value)));
    }
}
