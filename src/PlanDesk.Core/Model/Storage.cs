using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>A tank or reservoir holding water of one quality class.</summary>
/// <param name="Plant">The plant the tank stands at; null for a regional reservoir.</param>
/// <param name="LossFractionPerDay">Share of the volume lost per day to evaporation and seepage, [0, 1).</param>
public sealed record Tank(
    TankId Id,
    string Name,
    PlantId? Plant,
    ClassId Class,
    double MinM3,
    double MaxM3,
    double InitialM3,
    double LossFractionPerDay);

/// <summary>A pipeline from a tank to a tank or a customer, with the pumping it needs.</summary>
/// <param name="EnergyKWhPerM3">Pumping energy per m3 carried; from head and efficiency when the file gives those.</param>
/// <param name="PoweredBy">The plant whose electricity meter pays for the pumping.</param>
public sealed record Pipeline(
    PipelineId Id,
    string Name,
    TankId From,
    PipelineEnd To,
    double CapacityM3PerHour,
    double EnergyKWhPerM3,
    PlantId PoweredBy,
    PumpSet? Pumps);

/// <summary>Where a pipeline delivers: a tank or a customer (exactly one is set).</summary>
public readonly record struct PipelineEnd(TankId? Tank, CustomerId? Customer)
{
    public static PipelineEnd ToTank(TankId id) => new(id, null);
    public static PipelineEnd ToCustomer(CustomerId id) => new(null, id);
    public override string ToString() => Tank?.Value ?? Customer?.Value ?? "";
}

/// <summary>Identical discrete pumps: with n pumps on, n·min ≤ flow ≤ n·max (m3/h).</summary>
public sealed record PumpSet(int Count, double MinFlowM3PerHour, double MaxFlowM3PerHour);

/// <summary>A reclaimed-water customer.</summary>
public sealed record Customer
{
    public required CustomerId Id { get; init; }
    public required string Name { get; init; }
    /// <summary>Free text: farm irrigation, industrial cooling, golf course, city parks, aquifer recharge ...</summary>
    public string Kind { get; init; } = "";
    public required ClassId Class { get; init; }
    public required Demand Demand { get; init; }
    /// <summary>Cost counted per m3 not delivered, currency/m3; higher for higher contract priority.</summary>
    public required double ShortfallPenaltyPerM3 { get; init; }
    /// <summary>Contract priority, 1 the highest; informs messages and the baseline's rationing order.</summary>
    public int Priority { get; init; } = 1;
    public BlendLimit? Blend { get; init; }
}

/// <summary>A customer's demand: an hourly series, or a daily volume delivered inside allowed local hours.</summary>
public abstract record Demand;

/// <summary>Demand as a forecast rate, m3/h.</summary>
public sealed record HourlyDemand(Series M3PerHour) : Demand;

/// <summary>A volume per local day delivered in the periods of that day whose local start time lies in the
/// window [<paramref name="From"/>, <paramref name="To"/>); when To ≤ From the window wraps, so 22:00–06:00
/// allows 00:00–06:00 and 22:00–24:00 of the same day. <paramref name="MaxM3PerHour"/> limits the delivery rate.</summary>
public sealed record DailyDemand(double VolumeM3PerDay, LocalTime From, LocalTime To, double? MaxM3PerHour = null) : Demand
{
    public bool Allows(LocalTime time) => From < To ? time >= From && time < To : time >= From || time < To;
}

/// <summary>Upper limit on a flow-weighted blend of a quality parameter over the water a customer receives.</summary>
public sealed record BlendLimit(string Parameter, double Max);
