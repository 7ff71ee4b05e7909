using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>Demand of all customers needing one class over a horizon, m3.</summary>
public sealed record ClassDemand(ClassId Class, string Name, double VolumeM3);

/// <summary>What a network holds, in a few numbers: for <c>plandesk validate</c> and the API.</summary>
/// <param name="SeriesStart">Start of the range every time series covers; null when no series limits it (all constant).</param>
/// <param name="SeriesEnd">End of that range; at or before <paramref name="SeriesStart"/> when the series share no range.</param>
/// <param name="DemandByClass">Total demand by class over the default horizon, best class first; empty without one.</param>
/// <param name="DemandProblems">Why the demand over the default horizon could not be computed, if it could not.</param>
public sealed record NetworkSummary(
    string Name,
    DateTimeZone Zone,
    string Currency,
    int PeriodMinutes,
    int Plants,
    int Stages,
    int Tanks,
    int Reservoirs,
    int Pipelines,
    int Customers,
    Instant? SeriesStart,
    Instant? SeriesEnd,
    LocalDate? DefaultStart,
    int DefaultDays,
    IReadOnlyList<ClassDemand> DemandByClass,
    IReadOnlyList<string> DemandProblems)
{
    public static NetworkSummary Of(Network network)
    {
        var (start, end) = NetworkSeries.CommonRange(network);
        var (demand, problems) = network.DefaultStartDate is { } date ? Demand(network, date, network.DefaultDays) : ([], []);
        return new NetworkSummary(
            network.Name,
            network.TimeZone,
            network.Currency,
            network.PeriodMinutes,
            network.Plants.Count,
            network.Stages.Count(),
            network.Tanks.Count,
            network.Tanks.Count(t => t.Plant is null),
            network.Pipelines.Count,
            network.Customers.Count,
            start,
            end,
            network.DefaultStartDate,
            network.DefaultDays,
            demand,
            problems);
    }

    /// <summary>Total demand by class over <paramref name="days"/> local days from <paramref name="startDate"/>:
    /// hourly demand summed over the periods plus daily volumes, best class first.</summary>
    public static (IReadOnlyList<ClassDemand> Demand, IReadOnlyList<string> Problems) Demand(Network network, LocalDate startDate, int days)
    {
        var result = PlanningCase.Create(network, startDate, days);
        if (result.Case is not { } planningCase)
        {
            return ([], result.Problems);
        }
        var byCustomer = network.Customers.ToDictionary(
            c => c.Id,
            c => (planningCase.DemandM3.TryGetValue(c.Id, out var hourly) ? hourly.Sum() : 0)
                + (planningCase.DailyVolumeM3.TryGetValue(c.Id, out var daily) ? daily.Sum() : 0));
        var demand = network.Classes
            .Select(k => new ClassDemand(k.Id, k.Name, network.Customers.Where(c => c.Class == k.Id).Sum(c => byCustomer[c.Id])))
            .Where(d => network.Customers.Any(c => c.Class == d.Class))
            .ToList();
        return (demand, []);
    }
}
