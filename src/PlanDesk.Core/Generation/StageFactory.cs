using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>Draws a plant's polishing stages and their product tanks.</summary>
internal static class StageFactory
{
    // Utilisation at which a stage's product is counted as available to customers on average, so demand
    // stays below capacity and the plan has room to shift production into cheap hours.
    private const double Utilisation = 0.6;

    private sealed record StageKind(string Suffix, string Name, ClassId Produces, double RecoveryMin, double RecoveryMax,
        double NutrientRejection, double EnergyMin, double EnergyMax, double ChemicalMin, double ChemicalMax,
        int UnitsMin, int UnitsMax, double StartupMin, double StartupMax, int MinRunMin, int MinRunMax);

    // Energies: filtration and UV about 0.01-0.05 kWh/m3 each, MF/UF + RO 0.6-1.1 kWh/m3 [mem, see REFERENCES.md];
    // RO recovery 75-85 % [trade]. Demo values drawn inside those ranges.
    private static readonly StageKind FilterUv = new("filter-uv", "Sand filters with UV", RegionClasses.A, 0.95, 0.98, 0, 0.04, 0.08, 0.005, 0.015, 2, 5, 10, 40, 2, 4);
    private static readonly StageKind Disinfection = new("disinfection", "UV disinfection", RegionClasses.B, 0.99, 1.0, 0, 0.015, 0.04, 0.004, 0.012, 2, 4, 5, 20, 1, 2);
    private static readonly StageKind DisinfectionC = Disinfection with { Name = "Chlorine contact tanks", Produces = RegionClasses.C, EnergyMin = 0.01, EnergyMax = 0.02, ChemicalMin = 0.01, ChemicalMax = 0.02 };
    private static readonly StageKind Membrane = new("membrane", "Ultrafiltration and reverse osmosis", RegionClasses.Membrane, 0.75, 0.85, 0.9, 0.7, 1.1, 0.03, 0.06, 2, 4, 150, 400, 4, 8);

    /// <summary>The stages and product tanks of plant <paramref name="plantId"/> for stage set <paramref name="set"/>,
    /// fed with up to <paramref name="reuseFeedM3PerHour"/> of secondary effluent in all.</summary>
    public static (IReadOnlyList<Stage> Stages, IReadOnlyList<TankDraft> Tanks) Create(SeededRandom random, PlantId plantId, string plantName,
        Site site, StageSet set, double reuseFeedM3PerHour, HourGrid hours, int horizonHours)
    {
        List<(StageKind Kind, double Share)> plan = set switch
        {
            StageSet.Filtration => [(FilterUv, 1.0)],
            StageSet.Disinfection => [(Disinfection, 1.0)],
            StageSet.FiltrationWithMembrane => [(FilterUv, 0.6), (Membrane, 0.4)],
            StageSet.MembraneAndDisinfection => [(Membrane, 0.45), (DisinfectionC, 0.55)],
            StageSet.FiltrationAndDisinfection => [(FilterUv, 0.5), (Disinfection, 0.5)],
            _ => throw new ArgumentOutOfRangeException(nameof(set)),
        };
        // Some membrane trains polish filtered water from the class A tank instead of taking secondary effluent.
        var membraneFromFilteredWater = set == StageSet.FiltrationWithMembrane && random.Chance(0.4);

        var tanks = plan.Select(p => p.Kind.Produces).Distinct().OrderBy(RegionClasses.Rank)
            .Select(c => new TankDraft
            {
                Id = new TankId($"{plantId}-class-{c.Value.ToLowerInvariant()}"),
                Name = $"{plantName} class {c.Value} tank",
                Class = c,
                Plant = plantId,
                Site = site,
            })
            .ToList();

        var stages = new List<Stage>();
        foreach (var (kind, share) in plan)
        {
            var feedTank = kind == Membrane && membraneFromFilteredWater ? tanks.First(t => t.Class == RegionClasses.A) : null;
            var feedM3PerHour = reuseFeedM3PerHour * share;
            var units = random.Int(kind.UnitsMin, kind.UnitsMax);
            var unitMax = Math.Max(10, SeededRandom.Round(feedM3PerHour / units, 0));
            var recovery = random.Uniform(kind.RecoveryMin, kind.RecoveryMax, 2);
            var stage = new Stage
            {
                Id = new StageId($"{plantId}-{kind.Suffix}"),
                Name = $"{plantName} {char.ToLowerInvariant(kind.Name[0])}{kind.Name[1..]}",
                Plant = plantId,
                FeedTank = feedTank?.Id,
                ProductTank = tanks.First(t => t.Class == kind.Produces).Id,
                ProducesClass = kind.Produces,
                RecoveryFraction = recovery,
                NutrientRejectionFraction = kind.NutrientRejection,
                EnergyKWhPerM3 = random.Uniform(kind.EnergyMin, kind.EnergyMax, 3),
                ChemicalCostPerM3 = random.Uniform(kind.ChemicalMin, kind.ChemicalMax, 3),
                Units = units,
                UnitMinFlowM3PerHour = SeededRandom.Round(unitMax * random.Uniform(0.25, 0.4), 0),
                UnitMaxFlowM3PerHour = unitMax,
                StartupCost = random.Uniform(kind.StartupMin, kind.StartupMax, 0),
                MinRunHours = random.Int(kind.MinRunMin, kind.MinRunMax),
                InitialUnitsRunning = kind == Membrane ? random.Int(0, 1) : random.Int(1, (units + 1) / 2),
                AvailableUnits = Outage(random, units, hours, horizonHours),
            };
            stages.Add(stage);

            var productCapacity = units * unitMax * recovery;
            var product = tanks.First(t => t.Id == stage.ProductTank);
            product.ProductCapacityM3PerHour += productCapacity;
            product.BudgetM3PerHour += productCapacity * Utilisation;
            if (feedTank is not null)
            {
                feedTank.BudgetM3PerHour -= units * unitMax * Utilisation;
            }
        }

        foreach (var tank in tanks)
        {
            // A plant tank holds several hours of full production.
            var maxM3 = SeededRandom.RoundTo(tank.ProductCapacityM3PerHour * random.Uniform(5, 10), 10);
            tank.Built = new Tank(tank.Id, tank.Name, tank.Plant, tank.Class,
                MinM3: SeededRandom.Round(maxM3 * 0.1, 0), MaxM3: maxM3,
                InitialM3: SeededRandom.Round(maxM3 * random.Uniform(0.35, 0.6), 0), LossFractionPerDay: 0);
        }
        return (stages, tanks);
    }

    // One unit out of service for part of the horizon on about one stage in eight.
    private static Series? Outage(SeededRandom random, int units, HourGrid hours, int horizonHours)
    {
        if (units < 2 || !random.Chance(0.12))
        {
            return null;
        }
        var from = random.Int(0, horizonHours - 1);
        var to = from + random.Int(6, 24);
        var values = Enumerable.Range(0, hours.Count).Select(h => h >= from && h < to ? units - 1.0 : units).ToArray();
        return hours.Series(values);
    }
}
