using System.Globalization;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Model;

// Discharge permits: outfall flow and the daily and monthly nutrient loads.
internal sealed partial class PlanModel
{
    public Dictionary<(PlantId Plant, int Period), Variable> OutfallExcess { get; } = [];
    /// <summary>W[p,d,m]: the day's nutrient-bearing outfall volume if level m runs, else 0, m3.</summary>
    public Dictionary<(PlantId Plant, int Day, LevelId Level), Variable> NutrientVolumeAtLevel { get; } = [];
    public Dictionary<(PlantId Plant, string Nutrient, int Day), Variable> DailyLoadExcess { get; } = [];
    public Dictionary<(PlantId Plant, string Nutrient, int Month), Variable> MonthlyLoadExcess { get; } = [];

    /// <summary>outfall = secondary effluent to outfall + Σ (1 − recovery)·feed + bypass ≤ max outfall flow·Δh + excess.</summary>
    private void AddOutfallFlowLimits()
    {
        foreach (var plant in Network.Plants.Where(p => p.Permit.MaxOutfallM3PerHour.HasValue))
        {
            var maxM3 = plant.Permit.MaxOutfallM3PerHour!.Value * PeriodHours;
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var excess = NumVar(0, double.PositiveInfinity, Name("outfall-excess", plant.Id, P(t)));
                OutfallExcess[(plant.Id, t)] = excess;
                var row = AtMostRow(maxM3, Name("outfall-max", plant.Id, P(t)))
                    .Add(SecondaryToOutfall[(plant.Id, t)], 1)
                    .Add(Bypass[(plant.Id, t)], 1)
                    .Add(excess, -1);
                foreach (var stage in plant.Stages)
                {
                    row.Add(Feed[(stage.Id, t)], 1 - stage.RecoveryFraction);
                }
                Costs.Add(CostComponent.OutfallPenalty, excess, Penalties.OutfallExcessPerM3);
            }
        }
    }

    /// <summary>
    /// Exact linear daily and monthly load caps. The day's nutrient-bearing outfall volume W[d] (secondary effluent
    /// to the outfall + Σ rejection fraction × feed of nutrient-rejecting stages) is split by level,
    /// W[d] = Σm W[d,m] with W[d,m] ≤ Wmax·y[d,m], so load = Σm c_m·W[d,m]/1000 + raw·bypass/1000 kg is linear.
    /// Water delivered to customers carries its nutrients away, which is how reuse relieves the permit.
    /// The monthly cap of the start month is reduced by the month-to-date load; a later month gets its full cap.
    /// </summary>
    private void AddPermitLoadCaps()
    {
        foreach (var plant in Network.Plants)
        {
            var nutrients = PermitNutrient.Of(plant).Where(n => n.Capped).ToList();
            if (nutrients.Count == 0)
            {
                continue;
            }
            AddNutrientVolumeSplit(plant);
            foreach (var nutrient in nutrients)
            {
                AddNutrientCaps(plant, nutrient);
            }
        }
    }

    private void AddNutrientVolumeSplit(Plant plant)
    {
        var rejecting = PermitNutrient.RejectingStages(Network, plant).ToList();
        var influent = Case.InfluentM3[plant.Id];
        var sinks = SinksOf(plant);
        foreach (var day in Horizon.Days)
        {
            var date = DayLabel(day.Index);
            // Secondary effluent never exceeds what was treated; tank-fed stages add at most their full feed.
            var tankFedMaxM3 = day.PeriodIndices.Sum(t => rejecting.Where(s => s.FeedTank is not null)
                .Sum(s => s.NutrientRejectionFraction * s.UnitMaxFlowM3PerHour * PeriodHours * Case.AvailableUnits[s.Id][t]));
            var maxM3 = day.PeriodIndices.Sum(t => influent[t]) + tankFedMaxM3;
            var split = EqualRow(0, Name("nutrient-volume", plant.Id, date));
            foreach (var t in day.PeriodIndices)
            {
                split.Add(SecondaryToOutfall[(plant.Id, t)], 1);
                foreach (var stage in rejecting)
                {
                    split.Add(Feed[(stage.Id, t)], stage.NutrientRejectionFraction);
                }
            }
            foreach (var level in AllowedLevels[plant.Id])
            {
                var atLevel = NumVar(0, maxM3, Name("nutrient-volume-at", plant.Id, date, level.Id));
                NutrientVolumeAtLevel[(plant.Id, day.Index, level.Id)] = atLevel;
                split.Add(atLevel, -1);
                // W[d,m] ≤ Σt T[t,m] + tank-fed most·y[d,m]: at most what level m treated that day. It implies
                // W[d,m] ≤ Wmax·y[d,m] (T[t,m] is gated by y) and ties each level's share of the outfall volume to
                // its share of the treated volume, which keeps the relaxation from sending the volume to one level
                // and the level's fraction to another.
                var gate = AtMostRow(0, Name("nutrient-volume-gate", plant.Id, date, level.Id))
                    .Add(atLevel, 1)
                    .Add(LevelOn[(plant.Id, day.Index, level.Id)], -tankFedMaxM3);
                foreach (var t in day.PeriodIndices)
                {
                    gate.Add(TreatedAtLevel[(plant.Id, t, level.Id)], -1);
                }
            }
            if (AllowedLevels[plant.Id].Count > 1)
            {
                AddReuseByLevel(plant, day, sinks);
            }
        }
    }

    /// <summary>Where a plant's secondary-fed stages can send water, for a bound on the day's reuse: the tanks reachable
    /// from their product tanks (through pipelines and tank-fed stages), the customers those tanks serve, and the
    /// tank-fed stages whose reject leaves them.</summary>
    private sealed record ReuseSinks(List<Stage> SecondaryStages, List<Tank> Tanks, List<Customer> Customers, List<Stage> TankFedStages);

    private ReuseSinks SinksOf(Plant plant)
    {
        var secondary = plant.Stages.Where(s => s.FeedTank is null).ToList();
        var reached = new HashSet<TankId>();
        var queue = new Queue<TankId>(secondary.Select(s => s.ProductTank));
        while (queue.TryDequeue(out var tank))
        {
            if (!reached.Add(tank))
            {
                continue;
            }
            foreach (var pipeline in Network.Pipelines.Where(l => l.From == tank && l.To.Tank is not null))
            {
                queue.Enqueue(pipeline.To.Tank!.Value);
            }
            foreach (var stage in Network.Stages.Where(s => s.FeedTank == tank))
            {
                queue.Enqueue(stage.ProductTank);
            }
        }
        var customers = Network.Pipelines.Where(l => reached.Contains(l.From) && l.To.Customer is not null)
            .Select(l => l.To.Customer!.Value).Distinct().Select(Network.Customer).ToList();
        return new ReuseSinks(secondary, Network.Tanks.Where(t => reached.Contains(t.Id)).ToList(), customers,
            Network.Stages.Where(s => s.FeedTank is { } feed && reached.Contains(feed)).ToList());
    }

    /// <summary>
    /// The day's reuse R (Σ (1 − ρ)·feed of the secondary-fed stages: what leaves the nutrient-bearing outfall volume)
    /// split by level, R = Σm R[m], R[m] ≤ U·y[d,m] (+ tank-limit slack), and W[d,m] ≥ Σt T[t,m] − R[m]: the level that
    /// runs discharges what it treated less what was reused. U is the most the day can reuse: what the stages can take,
    /// or what the reachable customers, tanks and tank-fed stages' reject can absorb, whichever is less.
    /// </summary>
    private void AddReuseByLevel(Plant plant, PlanDay day, ReuseSinks sinks)
    {
        var date = DayLabel(day.Index);
        var periods = day.PeriodIndices.ToList();
        double StageMostM3(Stage stage) => periods.Sum(t => stage.UnitMaxFlowM3PerHour * PeriodHours * Case.AvailableUnits[stage.Id][t]);
        var capacityBound = sinks.SecondaryStages.Sum(s => (1 - s.NutrientRejectionFraction) * StageMostM3(s));

        // Sink bound: product = recovery·feed, so (1 − ρ)·feed ≤ k·product with k the largest (1 − ρ)/recovery.
        var k = sinks.SecondaryStages.Count == 0 ? 0 : sinks.SecondaryStages.Max(s => (1 - s.NutrientRejectionFraction) / Math.Max(s.RecoveryFraction, 1e-9));
        var demand = sinks.Customers.Sum(c => c.Demand is DailyDemand
            ? Case.DailyVolumeM3[c.Id][day.Index]
            : periods.Sum(t => Case.DemandM3[c.Id][t]));
        var reject = sinks.TankFedStages.Sum(s => (1 - s.RecoveryFraction) * StageMostM3(s));
        var slack = new List<(Variable Variable, double Coefficient)>();
        var storage = 0.0;
        foreach (var tank in sinks.Tanks)
        {
            // In − out over the day = V[end] − V[start] + Σ (1 − keep)·V[t−1], with V ≤ max + above-max slack and
            // V ≥ min − below-min slack.
            var lossShare = tank.LossFractionPerDay * PeriodHours / 24.0;
            storage += tank.MaxM3 - (day.Index == 0 ? tank.InitialM3 : tank.MinM3);
            slack.Add((AboveMaximum[(tank.Id, periods[^1])], k));
            if (day.Index > 0)
            {
                slack.Add((BelowMinimum[(tank.Id, periods[0] - 1)], k));
            }
            foreach (var t in periods)
            {
                storage += lossShare * (t == 0 ? tank.InitialM3 : tank.MaxM3);
                if (t > 0)
                {
                    slack.Add((AboveMaximum[(tank.Id, t - 1)], k * lossShare));
                }
            }
        }
        var sinkBound = k * (demand + reject + storage);
        var useSinks = sinkBound < capacityBound;

        var split = EqualRow(0, Name("reuse-split", plant.Id, date));
        foreach (var t in periods)
        {
            foreach (var stage in sinks.SecondaryStages)
            {
                split.Add(Feed[(stage.Id, t)], -(1 - stage.NutrientRejectionFraction));
            }
        }
        foreach (var level in AllowedLevels[plant.Id])
        {
            var reused = NumVar(0, double.PositiveInfinity, Name("reuse-at", plant.Id, date, level.Id));
            split.Add(reused, 1);
            var gate = AtMostRow(0, Name("reuse-gate", plant.Id, date, level.Id))
                .Add(reused, 1)
                .Add(LevelOn[(plant.Id, day.Index, level.Id)], -(useSinks ? sinkBound : capacityBound));
            if (useSinks)
            {
                foreach (var (variable, coefficient) in slack)
                {
                    gate.Add(variable, -coefficient);
                }
            }
            var floor = AtLeastRow(0, Name("nutrient-volume-floor", plant.Id, date, level.Id))
                .Add(NutrientVolumeAtLevel[(plant.Id, day.Index, level.Id)], 1)
                .Add(reused, 1);
            foreach (var t in periods)
            {
                floor.Add(TreatedAtLevel[(plant.Id, t, level.Id)], -1);
            }
        }
    }

    private void AddNutrientCaps(Plant plant, PermitNutrient nutrient)
    {
        if (nutrient.DailyCapKg is { } dailyCap)
        {
            foreach (var day in Horizon.Days)
            {
                var excess = NumVar(0, double.PositiveInfinity, Name($"{nutrient.Key}-daily-excess", plant.Id, DayLabel(day.Index)));
                DailyLoadExcess[(plant.Id, nutrient.Key, day.Index)] = excess;
                var row = AtMostRow(dailyCap, Name($"{nutrient.Key}-daily", plant.Id, DayLabel(day.Index))).Add(excess, -1);
                AddDayLoad(row, plant, nutrient, day);
                AddExcessByLevel(plant, nutrient, day, dailyCap, excess);
                Costs.Add(CostComponent.PermitPenalty, excess, Penalties.PermitExcessPerKg);
            }
        }
        if (nutrient.MonthlyCapKg is { } monthlyCap)
        {
            foreach (var month in Horizon.Days.GroupBy(d => Case.BillingMonth[d.FirstPeriod]))
            {
                var label = MonthLabel(month.Key);
                var allowance = month.Key == 0 ? monthlyCap - nutrient.MonthToDateKg : monthlyCap;
                var excess = NumVar(0, double.PositiveInfinity, Name($"{nutrient.Key}-monthly-excess", plant.Id, label));
                MonthlyLoadExcess[(plant.Id, nutrient.Key, month.Key)] = excess;
                var row = AtMostRow(allowance, Name($"{nutrient.Key}-monthly", plant.Id, label)).Add(excess, -1);
                foreach (var day in month)
                {
                    AddDayLoad(row, plant, nutrient, day);
                }
                Costs.Add(CostComponent.PermitPenalty, excess, Penalties.PermitExcessPerKg);
            }
        }
    }

    /// <summary>
    /// The day's excess split by level, ε ≥ Σm ε[m] with ε[m] ≥ c_m·W[d,m]/1000 − cap·y[d,m]: valid for every integer
    /// level choice (only the chosen level's term can be positive, and it leaves out the bypass) and the perspective
    /// of each level's own excess. Without it the relaxation blends a low-N and a low-P level on the same day and
    /// meets both caps, which no single level does (see docs/formulation.md, "Scaling").
    /// </summary>
    private void AddExcessByLevel(Plant plant, PermitNutrient nutrient, PlanDay day, double dailyCap, Variable excess)
    {
        var levels = AllowedLevels[plant.Id];
        if (levels.Count < 2)
        {
            return;
        }
        var date = DayLabel(day.Index);
        var sum = AtLeastRow(0, Name($"{nutrient.Key}-daily-excess-split", plant.Id, date)).Add(excess, 1);
        foreach (var level in levels)
        {
            var atLevel = NumVar(0, double.PositiveInfinity, Name($"{nutrient.Key}-daily-excess-at", plant.Id, date, level.Id));
            sum.Add(atLevel, -1);
            AtLeastRow(0, Name($"{nutrient.Key}-daily-excess-level", plant.Id, date, level.Id))
                .Add(atLevel, 1)
                .Add(NutrientVolumeAtLevel[(plant.Id, day.Index, level.Id)], -nutrient.EffluentMgPerL(level) / 1000.0)
                .Add(LevelOn[(plant.Id, day.Index, level.Id)], dailyCap);
        }
    }

    // kg = mg/L × m3 / 1000.
    private void AddDayLoad(Constraint row, Plant plant, PermitNutrient nutrient, PlanDay day)
    {
        foreach (var level in AllowedLevels[plant.Id])
        {
            row.Add(NutrientVolumeAtLevel[(plant.Id, day.Index, level.Id)], nutrient.EffluentMgPerL(level) / 1000.0);
        }
        foreach (var t in day.PeriodIndices)
        {
            row.Add(Bypass[(plant.Id, t)], nutrient.RawMgPerL / 1000.0);
        }
    }

    private string MonthLabel(int month)
    {
        var first = Horizon.Periods.First(p => Case.BillingMonth[p.Index] == month).LocalStart;
        return first.ToString("yyyy-MM", CultureInfo.InvariantCulture);
    }
}
