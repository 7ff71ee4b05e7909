using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// What a careful operator does without a planner, simulated period by period (no optimisation, no prices,
/// no shifting to cheap hours): the standard treatment level; each stage makes what its customers take in the
/// same period, keeping tanks near their start level, and keeps running units on across short dips in the
/// demand forecast rather than stopping and restarting them; pumps run on demand; the engine burns the gas as
/// it comes but draws on the holder to keep import from setting a new monthly peak; the rest goes to the
/// outfall; short water is rationed by contract priority. A yardstick that chased every hour would overstate
/// every plan's saving. The rules are listed with their reasons in docs/checker.md. Costed by
/// <see cref="PlanCosting"/> like any plan, with every problem named. The method is "rules".
/// </summary>
public static class RuleBasedBaseline
{
    public const string Method = "rules";

    public static Plan Build(PlanningCase planningCase)
    {
        var network = planningCase.Network;
        var order = TankOrder.Of(network);
        var state = new BaselineState(planningCase, order);
        for (var t = 0; t < planningCase.PeriodCount; t++)
        {
            BaselineFlows.Run(state, order, t);
        }
        // The engine's first draft burns nothing: the load does not depend on it, and the peak rule needs the load.
        var noGas = network.Plants.ToDictionary(p => p.Id, p => GasSchedule.None(planningCase.PeriodCount));

        // Levels depend on the day's nutrient-bearing outfall volume, the grid on the load: cost the flows
        // first with the standard levels and no grid, then settle levels, then import and export.
        var usual = network.Plants.ToDictionary(p => p.Id, p => Enumerable.Repeat(p.StandardLevel, planningCase.Horizon.Days.Count).ToArray());
        var noGrid = network.Plants.ToDictionary(p => p.Id, _ => (new double[planningCase.PeriodCount], new double[planningCase.PeriodCount]));
        var draft = PlanCosting.Compute(planningCase, Assemble(state, noGas, usual, noGrid, new CostBreakdown(), []));
        var levels = network.Plants.ToDictionary(p => p.Id,
            p => BaselineLevels.Choose(planningCase, p, draft.Plants[p.Id].NitrogenBearingM3, state.Bypass[p.Id]));
        var loaded = PlanCosting.Compute(planningCase, Assemble(state, noGas, levels, noGrid, new CostBreakdown(), []));
        var gas = network.Plants.ToDictionary(p => p.Id, p => BaselineEnergy.Gas(planningCase, p, loaded.Plants[p.Id].LoadKWh));
        var grid = network.Plants.ToDictionary(p => p.Id, p => BaselineEnergy.Grid(loaded.Plants[p.Id].LoadKWh, gas[p.Id].EngineKWh));

        var unpriced = Assemble(state, gas, levels, grid, new CostBreakdown(), []);
        var accounts = PlanCosting.Compute(planningCase, unpriced);
        var problems = BaselineProblems.Find(planningCase, unpriced, accounts, state.Issues);
        return Assemble(state, gas, levels, grid, accounts.Costs, problems);
    }

    private static Plan Assemble(BaselineState state, Dictionary<PlantId, GasSchedule> gas, Dictionary<PlantId, LevelId[]> levels,
        Dictionary<PlantId, (double[] ImportKWh, double[] ExportKWh)> grid, CostBreakdown costs, IReadOnlyList<PlanProblem> problems)
    {
        var planningCase = state.Case;
        var network = planningCase.Network;
        return Plan.For(planningCase, Method, new SolveInfo { Status = SolveStatus.Feasible, Solver = Method, Objective = costs.Total }) with
        {
            Plants = network.Plants.Select(p => new PlantPlan
            {
                Plant = p.Id,
                LevelByDay = levels[p.Id],
                TreatedM3 = state.Treated[p.Id],
                BypassM3 = state.Bypass[p.Id],
                SecondaryToOutfallM3 = state.SecondaryToOutfall[p.Id],
                GasToEngineNm3 = gas[p.Id].ToEngineNm3,
                GasFlaredNm3 = gas[p.Id].FlaredNm3,
                HolderEndNm3 = gas[p.Id].HolderEndNm3,
                EngineKWh = gas[p.Id].EngineKWh,
                ImportKWh = grid[p.Id].ImportKWh,
                ExportKWh = grid[p.Id].ExportKWh,
            }).ToList(),
            Stages = network.Stages.Select(s => new StagePlan
            {
                Stage = s.Id,
                UnitsRunning = state.Units[s.Id],
                UnitStarts = state.Starts[s.Id],
                FeedM3 = state.Feed[s.Id],
            }).ToList(),
            Tanks = network.Tanks.Select(t => new TankPlan { Tank = t.Id, EndVolumeM3 = state.Volume[t.Id] }).ToList(),
            Pipelines = network.Pipelines.Select(l => new PipelinePlan
            {
                Pipeline = l.Id,
                FlowM3 = state.Flow[l.Id],
                PumpsRunning = state.Pumps.GetValueOrDefault(l.Id),
            }).ToList(),
            Customers = network.Customers.Select(c => new CustomerPlan
            {
                Customer = c.Id,
                DeliveredM3 = state.Delivered[c.Id],
                ShortfallM3 = Shortfall(planningCase, c, state.Delivered[c.Id]),
            }).ToList(),
            Costs = costs,
            Problems = problems,
        };
    }

    private static double[] Shortfall(PlanningCase planningCase, Customer customer, double[] delivered) =>
        customer.Demand is DailyDemand
            ? planningCase.Horizon.Days.Select(d => Math.Max(0, planningCase.DailyVolumeM3[customer.Id][d.Index] - d.PeriodIndices.Sum(t => delivered[t]))).ToArray()
            : planningCase.DemandM3[customer.Id].Select((demand, t) => Math.Max(0, demand - delivered[t])).ToArray();
}
