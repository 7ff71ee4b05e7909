using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>Hand-made plans of the right shape for a planning case, so the service can be tested without a solve.</summary>
public static class TestPlans
{
    /// <summary>A plan whose plants treat <paramref name="treatedM3"/> in every period: the value tells plans apart.</summary>
    public static Plan Simple(PlanningCase planningCase, double treatedM3)
    {
        var n = planningCase.PeriodCount;
        double[] Fill(double value) => Enumerable.Repeat(value, n).ToArray();
        var network = planningCase.Network;
        return new Plan
        {
            NetworkName = network.Name,
            StartDate = planningCase.Horizon.StartDate,
            Days = planningCase.Horizon.DayCount,
            PeriodMinutes = planningCase.Horizon.PeriodMinutes,
            PeriodStarts = planningCase.Horizon.Periods.Select(p => p.Start).ToList(),
            Method = "milp",
            Currency = network.Currency,
            Solve = new SolveInfo { Status = SolveStatus.Optimal, Solver = "test", Objective = 1000 + treatedM3, BestBound = 1000 + treatedM3, GapPercent = 0 },
            Plants = network.Plants.Select(p => new PlantPlan
            {
                Plant = p.Id,
                LevelByDay = Enumerable.Repeat(p.StandardLevel, planningCase.Horizon.DayCount).ToList(),
                TreatedM3 = Fill(treatedM3),
                BypassM3 = Fill(0),
                SecondaryToOutfallM3 = Fill(treatedM3),
                GasToEngineNm3 = Fill(0),
                GasFlaredNm3 = Fill(0),
                HolderEndNm3 = Fill(p.Biogas?.InitialHolderNm3 ?? 0),
                EngineKWh = Fill(0),
                ImportKWh = Fill(100),
                ExportKWh = Fill(0),
            }).ToList(),
            Stages = network.Stages.Select(s => new StagePlan
            {
                Stage = s.Id, UnitsRunning = new int[n], UnitStarts = new int[n], FeedM3 = Fill(0),
            }).ToList(),
            Tanks = network.Tanks.Select(t => new TankPlan { Tank = t.Id, EndVolumeM3 = Fill(t.InitialM3) }).ToList(),
            Pipelines = network.Pipelines.Select(p => new PipelinePlan { Pipeline = p.Id, FlowM3 = Fill(0) }).ToList(),
            Customers = network.Customers.Select(c => new CustomerPlan { Customer = c.Id, DeliveredM3 = Fill(0), ShortfallM3 = Fill(0) }).ToList(),
            Costs = new CostBreakdown { EnergyImport = 1000 + treatedM3 },
            Problems = [new PlanProblem("shortfall", network.Customers[0].Id.Value, planningCase.Horizon.StartDate, 12.5, "m3", "test shortfall")],
            MarginalWaterCosts = [new MarginalWaterCost(network.Customers[0].Id, 0, 0.42)],
        };
    }
}
