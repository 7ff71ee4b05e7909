using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>
/// Generates realistic reclaimed-water regions for benchmarks and tests: plants of 20 000 to 400 000 PE
/// with diurnal influent and a storm, two or three treatment levels, mixed polishing stages, biogas,
/// permits, plant tanks and regional reservoirs, pumped pipelines, customers of every kind and two or
/// three tariffs. The same size and seed always give the same region (all names are invented).
/// </summary>
public static class RegionGenerator
{
    public const string TimeZoneId = "Europe/Madrid";

    // Series cover a full week whatever the default horizon, so a user can plan any 1-7 days from the start.
    private const int SeriesDays = 7;

    // Consecutive entries always include a membrane train, so even three plants offer every class.
    private static readonly StageSet[] StageSetCycle =
    [
        StageSet.Filtration, StageSet.FiltrationWithMembrane, StageSet.Disinfection,
        StageSet.MembraneAndDisinfection, StageSet.FiltrationAndDisinfection,
    ];

    public static GeneratedRegion Generate(RegionSize size, int seed)
    {
        var random = new SeededRandom(seed);
        var names = new PlaceNames(random);
        var zone = DateTimeZoneProviders.Tzdb[TimeZoneId];
        // A Monday somewhere in 2027, so weeks fall in either tariff season and sometimes span a clock change.
        var startDate = new LocalDate(2027, 1, 4).PlusWeeks(random.Int(0, 50));
        var hours = new HourGrid(zone, startDate, SeriesDays);
        var horizonHours = Profiles.HoursOfDays(hours, size.Days);
        var stormDate = startDate.PlusDays(random.Int(0, size.Days - 1));

        var tariffs = TariffFactory.Create(random, hours, size.Plants < 5 ? 2 : random.Int(2, 3), size.Days);
        var cycleStart = random.Int(0, StageSetCycle.Length - 1);
        var plants = new List<PlantDraft>();
        for (var i = 0; i < size.Plants; i++)
        {
            var set = StageSetCycle[(cycleStart + i) % StageSetCycle.Length];
            plants.Add(PlantFactory.Create(random, names, set, random.Pick(tariffs).Id, hours, horizonHours, stormDate));
        }
        var (reservoirs, feederLines) = ReservoirFactory.Create(random, names, plants);
        var (customers, customerLines) = CustomerFactory.Create(random, names, plants, reservoirs, hours, size.Customers);
        var pipelines = feederLines.Concat(customerLines).ToList();

        var network = new Network
        {
            Name = $"Generated region {size.Name} seed {seed}",
            TimeZone = zone,
            Currency = "EUR",
            PeriodMinutes = 60,
            DefaultStartDate = startDate,
            DefaultDays = size.Days,
            Classes = RegionClasses.All,
            Tariffs = tariffs,
            Plants = plants.Select(p => p.Plant).ToList(),
            Tanks = plants.SelectMany(p => p.Tanks).Concat(reservoirs.Select(r => r.Tank)).Select(t => t.Built!).ToList(),
            Pipelines = pipelines.Select(p => p.Pipeline).ToList(),
            Customers = customers,
            CarbonPricePerTonne = random.Chance(0.5) ? random.Uniform(60, 90, 0) : 0,
        };
        return new GeneratedRegion(size, seed, network, pipelines.ToDictionary(p => p.Pipeline.Id, p => p.Head));
    }
}
