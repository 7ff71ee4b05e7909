using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>
/// A kind of reclaimed-water customer: the class its use needs, how its demand is given (an hourly
/// pattern or a daily volume inside allowed hours), its usual contract priority and whether its water
/// may carry a salinity limit (irrigation).
/// </summary>
internal sealed record CustomerKind(
    string Kind,
    IReadOnlyList<string> NameEndings,
    ClassId Class,
    DemandPattern? Hourly,
    LocalTime? WindowFrom,
    LocalTime? WindowTo,
    int Priority,
    bool MayHaveSalinityLimit,
    double RelativeSize)
{
    public bool IsDailyVolume => Hourly is null;

    /// <summary>Hours in the allowed delivery window of a daily-volume customer.</summary>
    public double WindowHours
    {
        get
        {
            var from = WindowFrom!.Value.Hour;
            var to = WindowTo!.Value.Hour;
            return to > from ? to - from : 24 - from + to;
        }
    }

    // Classes after the uses of Regulation (EU) 2020/741 Annex I Table 1 [pub]; sizes and hours are demo choices.
    public static IReadOnlyList<CustomerKind> All { get; } =
    [
        new("farm irrigation", ["Farms", "Market Gardens"], RegionClasses.A, null, new LocalTime(20, 0), new LocalTime(8, 0), 1, true, 1.2),
        new("industrial cooling", ["Chemical Works", "Steelworks", "Power Station"], RegionClasses.C, DemandPattern.Cooling, null, null, 1, false, 1.0),
        new("golf course", ["Golf Club"], RegionClasses.B, null, new LocalTime(21, 0), new LocalTime(6, 0), 2, false, 0.4),
        new("process water", ["Paper Mill", "Electronics Works", "Food Plant"], RegionClasses.Membrane, DemandPattern.Process, null, null, 1, false, 0.6),
        new("city parks", ["Parks Department", "Green Spaces"], RegionClasses.A, DemandPattern.NightIrrigation, null, null, 2, false, 0.5),
        new("orchard drip irrigation", ["Orchards", "Vineyards"], RegionClasses.C, null, new LocalTime(6, 0), new LocalTime(18, 0), 2, true, 0.8),
        new("street cleaning", ["Street Services"], RegionClasses.B, DemandPattern.DayShift, null, null, 3, false, 0.1),
        new("aquifer recharge", ["Recharge Basins"], RegionClasses.A, null, new LocalTime(0, 0), new LocalTime(0, 0), 3, false, 1.0),
        new("field crop irrigation", ["Growers", "Cooperative"], RegionClasses.B, null, new LocalTime(19, 0), new LocalTime(7, 0), 2, true, 1.0),
    ];
}
