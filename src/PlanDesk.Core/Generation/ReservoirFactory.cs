using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>A regional reservoir and the plant whose meter pays for pumping out of it.</summary>
internal sealed record ReservoirDraft(TankDraft Tank, PlantId PumpedBy);

/// <summary>
/// Draws regional reservoirs on high ground, each filled by one or two nearby plants through pumped lines,
/// sized for one to two days of the supply the plants set aside for it.
/// </summary>
internal static class ReservoirFactory
{
    // Share of a feeding tank's average supply set aside for the reservoir.
    private const double FeederShare = 0.3;

    public static (IReadOnlyList<ReservoirDraft> Reservoirs, IReadOnlyList<PipelineDraft> Pipelines) Create(SeededRandom random, PlaceNames names,
        IReadOnlyList<PlantDraft> plants)
    {
        var count = Math.Max(1, (int)Math.Round(plants.Count / 5.0, MidpointRounding.AwayFromZero));
        var reservoirs = new List<ReservoirDraft>();
        var pipelines = new List<PipelineDraft>();
        for (var r = 0; r < count; r++)
        {
            var wanted = random.Chance(0.4) ? RegionClasses.A : RegionClasses.B;
            var spot = new Site(random.Uniform(0, 40, 1), random.Uniform(0, 30, 1), 0);
            var feeders = plants.Where(p => p.WorstServing(wanted) is not null).OrderBy(p => p.Site.DistanceKm(spot)).Take(2).ToList();
            if (feeders.Count == 0)
            {
                // Every stage set produces class B or better, so a class B reservoir always has feeders.
                wanted = RegionClasses.B;
                feeders = plants.OrderBy(p => p.Site.DistanceKm(spot)).Take(2).ToList();
            }
            var place = names.Next();
            var site = spot with { ElevationM = feeders.Max(f => f.Site.ElevationM) + random.Uniform(20, 60, 0) };
            var tank = new TankDraft
            {
                Id = new TankId($"{PlaceNames.Slug(place)}-reservoir"),
                Name = $"{place} reservoir",
                Class = wanted,
                Site = site,
            };
            foreach (var feeder in feeders)
            {
                var source = feeder.WorstServing(wanted)!;
                var allotment = Math.Max(1, source.BudgetM3PerHour * FeederShare);
                source.BudgetM3PerHour -= allotment;
                tank.BudgetM3PerHour += allotment;
                // Lines sized at 2.5 times the average let the plant fill the reservoir in cheap hours.
                var capacity = PipelineFactory.TidyCapacity(allotment * 2.5);
                var pumps = random.Chance(0.7) ? Pumps(random, capacity) : null;
                pipelines.Add(PipelineFactory.Create(random, source, tank.Id.Value, tank.Name, site,
                    PipelineEnd.ToTank(tank.Id), pumps is null ? capacity : pumps.Count * pumps.MaxFlowM3PerHour, feeder.Plant.Id, pumps, 5));
            }
            var maxM3 = Math.Max(500, SeededRandom.RoundTo(tank.BudgetM3PerHour * random.Uniform(24, 48), 100));
            tank.Built = new Tank(tank.Id, tank.Name, null, tank.Class,
                MinM3: SeededRandom.Round(maxM3 * 0.1, 0), MaxM3: maxM3,
                InitialM3: SeededRandom.Round(maxM3 * random.Uniform(0.4, 0.6), 0),
                LossFractionPerDay: random.Uniform(0.002, 0.008, 3));
            reservoirs.Add(new ReservoirDraft(tank, feeders[0].Plant.Id));
        }
        return (reservoirs, pipelines);
    }

    private static PumpSet Pumps(SeededRandom random, double capacityM3PerHour)
    {
        var count = random.Int(2, 3);
        var max = SeededRandom.Round(capacityM3PerHour / count, 0);
        return new PumpSet(count, SeededRandom.Round(max * random.Uniform(0.3, 0.45), 0), max);
    }
}
