using System.Text.Json.Nodes;

namespace PlanDesk.Browser.Tests.Infrastructure;

/// <summary>Synthetic networks built in code for layout tests: clearly test data, with long names on purpose.</summary>
public static class TestRegions
{
    /// <summary>A region of <paramref name="plants"/> plants, each with a class A stage and tank and a class B stage
    /// and tank, two customers per plant, and three regional reservoirs each filled by a third of the plants and
    /// serving two customers of their own. Constant series, so any day can be planned; one unit per stage without a
    /// minimum flow keeps the solve short.</summary>
    public static JsonObject Large(int plants)
    {
        var plantNodes = new JsonArray();
        var tanks = new JsonArray();
        var pipelines = new JsonArray();
        var customers = new JsonArray();
        for (var i = 1; i <= plants; i++)
        {
            var id = $"p{i:00}";
            plantNodes.Add(Plant(id, i));
            tanks.Add(Tank($"{id}-a", $"Test plant {i:00} class A storage tank", id, "A", 2000));
            tanks.Add(Tank($"{id}-b", $"Test plant {i:00} class B transfer tank", id, "B", 1500));
            customers.Add(Customer($"{id}-farm", $"Test customer {i:00} orchard irrigation cooperative", "A", 60 + i % 5 * 10));
            customers.Add(Customer($"{id}-park", $"Test customer {i:00} parks", "B", 30));
            pipelines.Add(Pipe($"{id}-to-farm", $"{id}-a", $"{id}-farm", 150));
            pipelines.Add(Pipe($"{id}-to-park", $"{id}-b", $"{id}-park", 100));
            pipelines.Add(Pipe($"{id}-to-res", $"{id}-b", $"res{(i - 1) % 3 + 1}", 200));
        }
        for (var r = 1; r <= 3; r++)
        {
            tanks.Add(Tank($"res{r}", $"Test regional reservoir {r}", null, "B", 20000));
            customers.Add(Customer($"res{r}-recharge", $"Test recharge basin {r}", "B", 80));
            customers.Add(Customer($"res{r}-farms", $"Test farm group {r}", "B", 120));
            pipelines.Add(Pipe($"res{r}-to-recharge", $"res{r}", $"res{r}-recharge", 300));
            pipelines.Add(Pipe($"res{r}-to-farms", $"res{r}", $"res{r}-farms", 300));
        }
        return new JsonObject
        {
            ["name"] = $"Layout test region with {plants} plants",
            ["timeZone"] = "Europe/Madrid",
            ["currency"] = "EUR",
            ["periodMinutes"] = 60,
            ["horizon"] = new JsonObject { ["startDate"] = "2027-03-26", ["days"] = 1 },
            ["qualityClasses"] = new JsonArray(
                new JsonObject { ["id"] = "A", ["name"] = "Class A", ["quality"] = new JsonObject { ["eColiPer100Ml"] = 10 } },
                new JsonObject { ["id"] = "B", ["name"] = "Class B", ["quality"] = new JsonObject { ["eColiPer100Ml"] = 100 } }),
            ["tariffs"] = new JsonArray(new JsonObject
            {
                ["id"] = "grid",
                ["name"] = "Test tariff",
                ["timeOfUse"] = JsonNode.Parse("""{ "seasons": [ { "name": "all year", "fromMonth": 1, "toMonth": 12, "defaultPricePerMWh": 100, "windows": [ { "dayTypes": ["weekday", "weekend", "holiday"], "from": "00:00", "to": "06:00", "pricePerMWh": 60 } ] } ] }"""),
                ["demandChargePerKwMonth"] = 5,
                ["feedInPricePerMWh"] = 30,
            }),
            ["plants"] = plantNodes,
            ["tanks"] = tanks,
            ["pipelines"] = pipelines,
            ["customers"] = customers,
        };
    }

    private static JsonObject Plant(string id, int i) => new()
    {
        ["id"] = id,
        ["name"] = $"Test plant {i:00} water resource recovery facility",
        ["tariff"] = "grid",
        ["influentM3PerHour"] = 400 + i % 4 * 50,
        ["secondaryCapacityM3PerHour"] = 800,
        ["rawTotalNitrogenMgPerL"] = 55,
        ["rawTotalPhosphorusMgPerL"] = 8,
        ["treatmentLevels"] = JsonNode.Parse("""[ { "id": "standard", "name": "Standard", "effluentTotalNitrogenMgPerL": 12, "effluentTotalPhosphorusMgPerL": 1.5, "aerationEnergyKWhPerM3": 0.2, "chemicalCostPerM3": 0.01 } ]"""),
        ["standardLevel"] = "standard",
        ["baseLoadKw"] = 50,
        ["stages"] = new JsonArray(
            Stage($"{id}-filter", $"Test plant {i:00} sand filters with ultraviolet disinfection", $"{id}-a", "A"),
            Stage($"{id}-uv", $"Test plant {i:00} chlorine contact", $"{id}-b", "B")),
        ["permit"] = JsonNode.Parse("""{ "dailyTotalNitrogenKg": 200, "maxOutfallM3PerHour": 900 }"""),
    };

    private static JsonObject Stage(string id, string name, string tank, string producesClass) => new()
    {
        ["id"] = id, ["name"] = name, ["feed"] = "secondary", ["tank"] = tank, ["producesClass"] = producesClass,
        ["recoveryFraction"] = 0.97, ["energyKWhPerM3"] = 0.05, ["units"] = 1, ["unitMinFlowM3PerHour"] = 0, ["unitMaxFlowM3PerHour"] = 200,
        ["initialUnitsRunning"] = 1,
    };

    private static JsonObject Tank(string id, string name, string? plant, string classId, double maxM3)
    {
        var tank = new JsonObject { ["id"] = id, ["name"] = name, ["class"] = classId, ["minM3"] = maxM3 / 20, ["maxM3"] = maxM3, ["initialM3"] = maxM3 / 2 };
        if (plant is not null)
        {
            tank["plant"] = plant;
        }
        return tank;
    }

    private static JsonObject Pipe(string id, string from, string to, double capacity) => new()
    {
        ["id"] = id, ["name"] = $"Test pipeline {id}", ["from"] = from, ["to"] = to, ["capacityM3PerHour"] = capacity, ["energyKWhPerM3"] = 0.1,
        ["poweredBy"] = from.StartsWith("res", StringComparison.Ordinal) ? "p01" : from[..3],
    };

    private static JsonObject Customer(string id, string name, string classId, double demand) => new()
    {
        ["id"] = id, ["name"] = name, ["kind"] = "test", ["class"] = classId, ["demandM3PerHour"] = demand, ["shortfallPenaltyPerM3"] = 1.5, ["priority"] = 1,
    };
}
