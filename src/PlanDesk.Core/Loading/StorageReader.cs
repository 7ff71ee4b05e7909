using PlanDesk.Core.Model;
using PlanDesk.Core.Physics;

namespace PlanDesk.Core.Loading;

/// <summary>Reads tanks and pipelines, with the class rule on every pipeline.</summary>
internal static class StorageReader
{
    public static Tank ReadTank(Node tank, LoadContext context)
    {
        var plant = tank.OptionalText("plant");
        if (plant is not null)
        {
            context.Ids.Resolve(context, plant, tank.PathOf("plant"), IdKind.Plant);
        }
        var classId = tank.Text("class");
        context.Ids.Resolve(context, classId, tank.PathOf("class"), IdKind.QualityClass);
        var min = tank.Number("minM3");
        var max = tank.Number("maxM3");
        var initial = tank.Number("initialM3");
        NetworkReader.CheckOrder(context, tank.PathOf("minM3"), "minM3", min, "maxM3", max);
        if (min <= max && (initial < min || initial > max))
        {
            context.Add(tank.PathOf("initialM3"), $"{initial} m3 is outside the tank's range [{min}, {max}]",
                $"give the volume at the start, from minM3 {min} to maxM3 {max}");
        }
        return new Tank(
            new TankId(tank.Text("id")),
            tank.Text("name"),
            plant is null ? null : new PlantId(plant),
            new ClassId(classId),
            min,
            max,
            initial,
            tank.NumberOr("lossFractionPerDay", 0));
    }

    public static Pipeline ReadPipeline(Node pipeline, LoadContext context)
    {
        var from = pipeline.Text("from");
        var to = pipeline.Text("to");
        var fromKnown = context.Ids.Resolve(context, from, pipeline.PathOf("from"), IdKind.Tank);
        var toKnown = context.Ids.Resolve(context, to, pipeline.PathOf("to"), IdKind.Tank, IdKind.Customer);
        if (fromKnown && from == to)
        {
            context.Add(pipeline.PathOf("to"), $"the pipeline runs from tank '{from}' back into itself", "give a different tank or a customer");
        }
        var source = fromKnown ? context.Catalog.Tank(from) : null;
        if (source is { } carried && toKnown)
        {
            CheckClass(pipeline, context, carried.Class, to);
        }
        return new Pipeline(
            new PipelineId(pipeline.Text("id")),
            pipeline.Text("name"),
            new TankId(from),
            context.Ids.Is(to, IdKind.Customer) ? PipelineEnd.ToCustomer(new CustomerId(to)) : PipelineEnd.ToTank(new TankId(to)),
            pipeline.Number("capacityM3PerHour"),
            ReadEnergy(pipeline, context),
            new PlantId(ReadPoweredBy(pipeline, context, source?.Plant)),
            ReadPumps(pipeline.Field("pumps"), context));
    }

    // Water may only flow to a node that needs the same or a worse class than the one it leaves.
    private static void CheckClass(Node pipeline, LoadContext context, string carried, string to)
    {
        var catalog = context.Catalog;
        var (needed, kind) = catalog.Tank(to) is { } tank ? (tank.Class, "tank") : (catalog.CustomerClass(to) ?? "", "customer");
        if (!catalog.Serves(carried, needed))
        {
            context.Add(pipeline.PathOf("to"), $"{kind} '{to}' needs class {needed} but the pipeline carries class {carried} from tank '{pipeline.Text("from")}'",
                $"draw from a tank holding class {needed} or better, or connect a {kind} that accepts class {carried}");
        }
        if (catalog.BlendParameter(to) is { } parameter && catalog.Rank(carried) is not null && !catalog.ClassDefines(carried, parameter))
        {
            context.Add(catalog.ClassPath(carried) is { } classPath ? JsonPaths.Child(classPath, "quality") : pipeline.Path,
                $"class {carried} gives no {parameter}, but customer '{to}' limits it and pipeline '{pipeline.Text("id")}' brings class-{carried} water",
                $"add {parameter} to the quality of class {carried}");
        }
    }

    private static double ReadEnergy(Node pipeline, LoadContext context)
    {
        var direct = pipeline.Has("energyKWhPerM3");
        var pumping = pipeline.Field("pumping");
        if (direct == pumping is not null)
        {
            context.Add(pipeline.Path, direct ? "gives both energyKWhPerM3 and pumping" : "gives neither energyKWhPerM3 nor pumping",
                "give exactly one: the pumping energy in kWh/m3, or pumping { staticHeadM, pumpEfficiency }");
            return double.NaN;
        }
        return direct
            ? pipeline.Number("energyKWhPerM3")
            : Pumping.EnergyKWhPerM3(pumping!.Value.Number("staticHeadM"), pumping.Value.Number("pumpEfficiency"));
    }

    // The plant that pays for pumping: as given, or the plant the source tank stands at.
    private static string ReadPoweredBy(Node pipeline, LoadContext context, string? sourcePlant)
    {
        if (pipeline.OptionalText("poweredBy") is { } given)
        {
            context.Ids.Resolve(context, given, pipeline.PathOf("poweredBy"), IdKind.Plant);
            return given;
        }
        if (sourcePlant is not null)
        {
            return sourcePlant;
        }
        if (context.Catalog.Tank(pipeline.Text("from")) is not null)
        {
            context.Add(pipeline.PathOf("poweredBy"), $"missing, and tank '{pipeline.Text("from")}' is a regional reservoir with no plant",
                $"add the id of the plant that pays for the pumping: {Suggest.List(context.Ids.IdsOf(IdKind.Plant))}");
        }
        return "";
    }

    private static PumpSet? ReadPumps(Node? node, LoadContext context)
    {
        if (node is not { IsObject: true } pumps)
        {
            return null;
        }
        var min = pumps.Number("minFlowM3PerHour");
        var max = pumps.Number("maxFlowM3PerHour");
        NetworkReader.CheckOrder(context, pumps.PathOf("minFlowM3PerHour"), "minFlowM3PerHour", min, "maxFlowM3PerHour", max);
        return new PumpSet(pumps.Int("count", 0), min, max);
    }
}
