using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// What an operator expects each stage to be asked for, hour by hour, from the demand forecast alone (the
/// figures on the morning sheet): each customer's forecast demand, or its daily volume spread evenly over its
/// allowed hours, passed back through its pipelines and tanks to the stages, with no refilling and no tank
/// levels. The unit rules use it to keep units on across short dips; it never moves water itself.
/// </summary>
internal sealed class ExpectedDraw
{
    /// <summary>Hours ahead an operator looks before stopping a unit, when the stage's minimum run is shorter.</summary>
    public const double HoldHours = 4;

    private readonly Dictionary<StageId, int[]> _units;
    private readonly Dictionary<StageId, int> _holdPeriods;

    private ExpectedDraw(Dictionary<StageId, int[]> units, Dictionary<StageId, int> holdPeriods)
    {
        _units = units;
        _holdPeriods = holdPeriods;
    }

    public static ExpectedDraw Of(PlanningCase planningCase, TankOrder order)
    {
        var network = planningCase.Network;
        var hours = planningCase.PeriodHours;
        var feed = network.Stages.ToDictionary(s => s.Id, _ => new double[planningCase.PeriodCount]);
        for (var t = 0; t < planningCase.PeriodCount; t++)
        {
            var requests = Forecast(planningCase, order, t);
            foreach (var stage in network.Stages)
            {
                feed[stage.Id][t] = requests.StageFeed.GetValueOrDefault(stage.Id);
            }
        }
        var units = network.Stages.ToDictionary(s => s.Id, s => feed[s.Id].Select((m3, t) => UnitsFor(planningCase, s, t, m3 / hours)).ToArray());
        var hold = network.Stages.ToDictionary(s => s.Id,
            s => Math.Max(Checking.StageChecks.MinimumRunPeriods(s, hours), (int)Math.Ceiling(HoldHours / hours - 1e-9)));
        return new ExpectedDraw(units, hold);
    }

    /// <summary>
    /// Units the operator keeps on in period <paramref name="t"/> when <paramref name="running"/> ran before:
    /// a running unit stays on while the forecast needs it again within the hold (its minimum run or
    /// <see cref="HoldHours"/>, the longer), rather than being stopped and started again. Soft: it yields to
    /// water, room and availability.
    /// </summary>
    public int SteadyUnits(Stage stage, int t, int running)
    {
        var units = _units[stage.Id];
        var end = Math.Min(units.Length, t + _holdPeriods[stage.Id]);
        var neededSoon = 0;
        for (var k = t; k < end; k++)
        {
            neededSoon = Math.Max(neededSoon, units[k]);
        }
        return Math.Min(running, neededSoon);
    }

    private static int UnitsFor(PlanningCase planningCase, Stage stage, int t, double feedM3PerHour) =>
        stage.UnitMaxFlowM3PerHour <= 0 ? 0
            : Math.Min(planningCase.AvailableUnits[stage.Id][t], (int)Math.Ceiling(feedM3PerHour / stage.UnitMaxFlowM3PerHour - 1e-9));

    // One period of the forecast: customers' forecast draw to their pipelines, then each tank, downstream first,
    // asks its stages and then its incoming pipelines for what is drawn from it (no refilling).
    private static PeriodRequests Forecast(PlanningCase planningCase, TankOrder order, int t)
    {
        var network = planningCase.Network;
        var requests = new PeriodRequests();
        foreach (var tank in network.Tanks)
        {
            requests.Outflow[tank.Id] = 0;
        }
        foreach (var customer in network.Customers)
        {
            requests.Customer[customer.Id] = ForecastWant(planningCase, customer, t);
            PeriodRequests.SplitOverPipelines(planningCase, order, customer, requests);
        }
        foreach (var tank in order.UpstreamFirst.Reverse())
        {
            var need = requests.Outflow[tank.Id];
            foreach (var stage in network.Stages.Where(s => s.ProductTank == tank.Id && order.Uses(s)))
            {
                var most = planningCase.AvailableUnits[stage.Id][t] * stage.UnitMaxFlowM3PerHour * planningCase.PeriodHours;
                var feed = Math.Max(0, Math.Min(need / stage.RecoveryFraction, most));
                requests.StageFeed[stage.Id] = feed;
                need -= feed * stage.RecoveryFraction;
                if (stage.FeedTank is { } from)
                {
                    requests.Outflow[from] += feed;
                }
            }
            foreach (var pipeline in network.Pipelines.Where(l => l.To.Tank == tank.Id && order.Uses(l)))
            {
                var flow = Math.Max(0, Math.Min(need, PeriodRequests.PipelineMostM3(pipeline, planningCase.PeriodHours)));
                requests.Outflow[pipeline.From] += flow;
                need -= flow;
            }
        }
        return requests;
    }

    private static double ForecastWant(PlanningCase planningCase, Customer customer, int t)
    {
        if (customer.Demand is not DailyDemand)
        {
            return planningCase.DemandM3[customer.Id][t];
        }
        var most = planningCase.MaxDeliveryM3[customer.Id];
        var day = planningCase.Horizon.Days[planningCase.Horizon.Periods[t].Day];
        var allowed = day.PeriodIndices.Count(k => most[k] > 0);
        return most[t] <= 0 || allowed == 0 ? 0 : Math.Min(most[t], planningCase.DailyVolumeM3[customer.Id][day.Index] / allowed);
    }
}
