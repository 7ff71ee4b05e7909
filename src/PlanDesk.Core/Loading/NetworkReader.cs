using System.Text.Json;
using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>
/// Builds the <see cref="Network"/> from a parsed network file, checking what the schema cannot: ids,
/// references, rules between fields and the quality-class rules. Problems go to the context; the caller
/// discards the network when there are any.
/// </summary>
internal static class NetworkReader
{
    public static Network? Read(JsonElement rootElement, LoadContext context)
    {
        var root = new Node(rootElement, JsonPaths.Root);
        if (!root.IsObject)
        {
            return null; // the schema reports a root that is not an object
        }
        var zone = ReadZone(root, context);
        DeclareIds(root, context);
        context.Catalog = Catalog.From(root);
        var classes = root.Items("qualityClasses").Select((item, rank) => new QualityClass(
            new ClassId(item.Text("id")), item.Text("name"), rank, ReadQuality(item))).ToList();
        var (startDate, days) = ReadHorizon(root, context);

        return new Network
        {
            Name = root.Text("name"),
            TimeZone = zone,
            Currency = root.Text("currency"),
            PeriodMinutes = root.Int("periodMinutes", 60),
            DefaultStartDate = startDate,
            DefaultDays = days,
            Classes = classes,
            Tariffs = root.Items("tariffs").Select(t => TariffReader.Read(t, context)).ToList(),
            Plants = root.Items("plants").Select(p => PlantReader.Read(p, context)).ToList(),
            Tanks = root.Items("tanks").Select(t => StorageReader.ReadTank(t, context)).ToList(),
            Pipelines = root.Items("pipelines").Select(p => StorageReader.ReadPipeline(p, context)).ToList(),
            Customers = root.Items("customers").Select(c => CustomerReader.Read(c, context)).ToList(),
            Penalties = ReadPenalties(root.Field("penalties")),
            CarbonPricePerTonne = root.NumberOr("carbonPricePerTonne", 0),
            SourcePath = context.File,
        };
    }

    private static DateTimeZone ReadZone(Node root, LoadContext context)
    {
        var id = root.Text("timeZone");
        if (id.Length == 0)
        {
            return DateTimeZone.Utc; // missing: the schema reports it
        }
        var zone = DateTimeZoneProviders.Tzdb.GetZoneOrNull(id);
        if (zone is null)
        {
            context.Add(root.PathOf("timeZone"), $"'{id}' is not an IANA time zone",
                $"{Suggest.DidYouMean(id, DateTimeZoneProviders.Tzdb.Ids)}give a zone such as Europe/Madrid or America/Los_Angeles");
            return DateTimeZone.Utc;
        }
        context.Zone = zone;
        return zone;
    }

    private static void DeclareIds(Node root, LoadContext context)
    {
        (string List, IdKind Kind)[] lists =
        [
            ("qualityClasses", IdKind.QualityClass), ("tariffs", IdKind.Tariff), ("plants", IdKind.Plant),
            ("tanks", IdKind.Tank), ("pipelines", IdKind.Pipeline), ("customers", IdKind.Customer),
        ];
        foreach (var (list, kind) in lists)
        {
            foreach (var item in root.Items(list))
            {
                context.Ids.Declare(context, kind, item);
                if (kind == IdKind.Plant)
                {
                    foreach (var stage in item.Items("stages"))
                    {
                        context.Ids.Declare(context, IdKind.Stage, stage);
                    }
                }
            }
        }
    }

    private static Dictionary<string, double> ReadQuality(Node qualityClass) =>
        qualityClass.Field("quality") is { IsObject: true } quality
            // A field named twice is reported by JsonSyntax; the last one is used meanwhile, as everywhere else.
            ? quality.Element.EnumerateObject().Where(p => p.Value.ValueKind == JsonValueKind.Number)
                .GroupBy(p => p.Name).ToDictionary(g => g.Key, g => g.Last().Value.GetDouble())
            : [];

    private static (LocalDate? Start, int Days) ReadHorizon(Node root, LoadContext context)
    {
        if (root.Field("horizon") is not { IsObject: true } horizon)
        {
            return (null, 1);
        }
        var text = horizon.Text("startDate");
        var start = TimeText.ParseDate(text);
        if (start is null && text.Length > 0 || start is { } date && !TimeText.IsPlausible(date))
        {
            context.Add(horizon.PathOf("startDate"), $"'{text}' is not a calendar date from {TimeText.FirstYear} to {TimeText.LastYear}",
                "give the first local day planned as YYYY-MM-DD, e.g. \"2027-03-26\"");
            return (null, horizon.Int("days", 1));
        }
        return (start, horizon.Int("days", 1));
    }

    private static Penalties ReadPenalties(Node? node)
    {
        var defaults = new Penalties();
        if (node is not { } penalties)
        {
            return defaults;
        }
        return new Penalties
        {
            BypassPerM3 = penalties.NumberOr("bypassPerM3", defaults.BypassPerM3),
            PermitExcessPerKg = penalties.NumberOr("permitExcessPerKg", defaults.PermitExcessPerKg),
            OutfallExcessPerM3 = penalties.NumberOr("outfallExcessPerM3", defaults.OutfallExcessPerM3),
            TankEndDeficitPerM3 = penalties.NumberOr("tankEndDeficitPerM3", defaults.TankEndDeficitPerM3),
            TankLimitPerM3 = penalties.NumberOr("tankLimitPerM3", defaults.TankLimitPerM3),
        };
    }

    /// <summary>Reports at <paramref name="location"/> when <paramref name="low"/> exceeds <paramref name="high"/>
    /// (NaN, from a missing or wrong value already reported, never does).</summary>
    public static void CheckOrder(LoadContext context, string location, string lowName, double low, string highName, double high)
    {
        if (low > high)
        {
            context.Add(location, $"{lowName} {low} is above {highName} {high}", $"make {lowName} at most {highName}");
        }
    }
}
