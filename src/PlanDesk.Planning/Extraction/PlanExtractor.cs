using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Planning.Model;

namespace PlanDesk.Planning.Extraction;

/// <summary>Reads a solved model into a <see cref="Plan"/>.</summary>
internal static class PlanExtractor
{
    // Solver values within this of zero are noise (feasibility tolerances are about 1e-6 to 1e-9).
    private const double Tolerance = 1e-6;

    public static Plan Extract(PlanModel model, SolveInfo info)
    {
        var planningCase = model.Case;
        var network = planningCase.Network;
        var periods = planningCase.PeriodCount;
        return Plan.For(planningCase, "milp", info) with
        {
            Plants = network.Plants.Select(p => ExtractPlant(model, p, periods)).ToList(),
            Stages = network.Stages.Select(s => ExtractStage(model, s, periods)).ToList(),
            Tanks = network.Tanks.Select(k => new TankPlan { Tank = k.Id, EndVolumeM3 = Values(periods, t => model.Volume[(k.Id, t)]) }).ToList(),
            Pipelines = network.Pipelines.Select(l => new PipelinePlan
            {
                Pipeline = l.Id,
                FlowM3 = Values(periods, t => model.Flow[(l.Id, t)]),
                PumpsRunning = l.Pumps is null ? null : Integers(periods, t => model.PumpsOn[(l.Id, t)]),
            }).ToList(),
            Customers = network.Customers.Select(c => ExtractCustomer(model, c, periods)).ToList(),
            Costs = model.Costs.ToBreakdown(),
        };
    }

    private static PlantPlan ExtractPlant(PlanModel model, Plant plant, int periods)
    {
        var id = plant.Id;
        var days = model.Case.Horizon.Days;
        var hasEngine = plant.Biogas is not null;
        return new PlantPlan
        {
            Plant = id,
            LevelByDay = days.Select(d => model.AllowedLevels[id].MaxBy(l => model.LevelOn[(id, d.Index, l.Id)].SolutionValue())!.Id).ToList(),
            TreatedM3 = Values(periods, t => model.Treated[(id, t)]),
            BypassM3 = Values(periods, t => model.Bypass[(id, t)]),
            SecondaryToOutfallM3 = Values(periods, t => model.SecondaryToOutfall[(id, t)]),
            GasToEngineNm3 = hasEngine ? Values(periods, t => model.GasToEngine[(id, t)]) : new double[periods],
            GasFlaredNm3 = hasEngine ? Values(periods, t => model.Flare[(id, t)]) : new double[periods],
            HolderEndNm3 = hasEngine ? Values(periods, t => model.Holder[(id, t)]) : new double[periods],
            EngineKWh = hasEngine ? Values(periods, t => model.Engine[(id, t)]) : new double[periods],
            ImportKWh = Values(periods, t => model.Import[(id, t)]),
            ExportKWh = Values(periods, t => model.Export[(id, t)]),
        };
    }

    private static StagePlan ExtractStage(PlanModel model, Stage stage, int periods)
    {
        var units = Integers(periods, t => model.Units[(stage.Id, t)]);
        // Starts are read from the units: the start variable may exceed the count when starting is free.
        var starts = units.Select((n, t) => Math.Max(0, n - (t == 0 ? stage.InitialUnitsRunning : units[t - 1]))).ToArray();
        return new StagePlan
        {
            Stage = stage.Id,
            UnitsRunning = units,
            UnitStarts = starts,
            FeedM3 = Values(periods, t => model.Feed[(stage.Id, t)]),
        };
    }

    private static CustomerPlan ExtractCustomer(PlanModel model, Customer customer, int periods)
    {
        var delivered = new double[periods];
        foreach (var pipeline in model.Case.Network.Pipelines.Where(l => l.To.Customer == customer.Id))
        {
            for (var t = 0; t < periods; t++)
            {
                delivered[t] += Clean(model.Flow[(pipeline.Id, t)].SolutionValue());
            }
        }
        var shortfall = customer.Demand is DailyDemand
            ? Values(model.Case.Horizon.DayCount, d => model.ShortOnDay[(customer.Id, d)])
            : Values(periods, t => model.ShortInPeriod[(customer.Id, t)]);
        return new CustomerPlan { Customer = customer.Id, DeliveredM3 = delivered, ShortfallM3 = shortfall };
    }

    internal static double Clean(double value) => Math.Abs(value) < Tolerance ? 0 : value;

    private static double[] Values(int count, Func<int, Variable> variable) =>
        Enumerable.Range(0, count).Select(i => Clean(variable(i).SolutionValue())).ToArray();

    private static int[] Integers(int count, Func<int, Variable> variable) =>
        Enumerable.Range(0, count).Select(i => (int)Math.Round(variable(i).SolutionValue())).ToArray();
}
