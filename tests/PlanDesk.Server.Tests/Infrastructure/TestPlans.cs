using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>Hand-made plans and sheets of the right shape for a planning case, so the service can be tested without a solve.</summary>
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

    /// <summary>One sheet per plant and local day, cut from the plan's arrays.</summary>
    public static IReadOnlyList<PlantDayTargets> Sheets(PlanningCase planningCase, Plan plan) =>
        planningCase.Horizon.Days.SelectMany(day => plan.Plants.Select(plantPlan =>
        {
            var plant = planningCase.Network.Plant(plantPlan.Plant);
            var level = plant.Level(plantPlan.LevelByDay[day.Index]);
            return new PlantDayTargets
            {
                Plant = plant.Id,
                PlantName = plant.Name,
                Date = day.Date,
                TimeZone = planningCase.Network.TimeZone.Id,
                Currency = plan.Currency,
                TreatmentLevel = level.Id,
                TreatmentLevelName = level.Name,
                EffluentTotalNitrogenMgPerL = level.EffluentTotalNitrogenMgPerL,
                EffluentTotalPhosphorusMgPerL = level.EffluentTotalPhosphorusMgPerL,
                Hours = day.PeriodIndices.Select(t => new HourTarget
                {
                    Start = planningCase.Horizon.Periods[t].Start,
                    LocalStart = planningCase.Horizon.Periods[t].LocalStart,
                    TreatedM3 = plantPlan.TreatedM3[t],
                    BypassM3 = plantPlan.BypassM3[t],
                    ProductionM3ByClass = new Dictionary<ClassId, double> { [planningCase.Network.Classes[0].Id] = 0 },
                    UnitsRunning = plant.Stages.ToDictionary(s => s.Id, s => plan.Stages.Single(x => x.Stage == s.Id).UnitsRunning[t]),
                    TankEndM3 = planningCase.Network.Tanks.Where(k => k.Plant == plant.Id)
                        .ToDictionary(k => k.Id, k => plan.Tanks.Single(x => x.Tank == k.Id).EndVolumeM3[t]),
                    OutfallM3 = plantPlan.SecondaryToOutfallM3[t],
                    ImportKWh = plantPlan.ImportKWh[t],
                    EngineKWh = plantPlan.EngineKWh[t],
                    ExportKWh = plantPlan.ExportKWh[t],
                }).ToList(),
                Permit = new PermitTargets(0, 0, plant.Permit.DailyTotalNitrogenKg, null, 0, null, null),
                Energy = new EnergyBudget(0, 0, 0, 0, 0),
                Deliveries = [],
            };
        })).ToList();
}
