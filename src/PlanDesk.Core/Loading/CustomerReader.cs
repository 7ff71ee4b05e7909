using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>Reads a customer and checks that some stage can produce the class it needs.</summary>
internal static class CustomerReader
{
    public static Customer Read(Node customer, LoadContext context)
    {
        var classId = customer.Text("class");
        if (context.Ids.Resolve(context, classId, customer.PathOf("class"), IdKind.QualityClass) && !context.Catalog.SomeStageProduces(classId))
        {
            context.Add(customer.PathOf("class"), $"no stage in the network produces class {classId} or a better class",
                $"add a stage producing class {classId} (or better), or give the class this customer can actually receive");
        }
        return new Customer
        {
            Id = new CustomerId(customer.Text("id")),
            Name = customer.Text("name"),
            Kind = customer.Text("kind"),
            Class = new ClassId(classId),
            Demand = ReadDemand(customer, context),
            ShortfallPenaltyPerM3 = customer.Number("shortfallPenaltyPerM3"),
            Priority = customer.Int("priority", 1),
            Blend = customer.Field("blendLimit") is { IsObject: true } blend
                ? new BlendLimit(blend.Text("parameter"), blend.Number("max"))
                : null,
        };
    }

    private static Demand ReadDemand(Node customer, LoadContext context)
    {
        var hourly = customer.Field("demandM3PerHour");
        var daily = customer.Field("dailyVolume");
        if (hourly is not null == daily is not null)
        {
            context.Add(customer.Path, hourly is not null ? "gives both demandM3PerHour and dailyVolume" : "gives neither demandM3PerHour nor dailyVolume",
                "give exactly one: an hourly demand series in m3/h, or dailyVolume { volumeM3, from, to }");
        }
        if (daily is { IsObject: true } volume && hourly is null)
        {
            return new DailyDemand(
                volume.Number("volumeM3"),
                TimeText.ParseTimeOfDay(volume.Text("from")) ?? NodaTime.LocalTime.Midnight,
                TimeText.ParseTimeOfDay(volume.Text("to")) ?? NodaTime.LocalTime.Midnight,
                volume.OptionalNumber("maxM3PerHour"));
        }
        return new HourlyDemand(SeriesReader.Read(hourly, context, ValueRule.NonNegative("a demand in m3/h")) ?? Series.Constant(double.NaN));
    }
}
