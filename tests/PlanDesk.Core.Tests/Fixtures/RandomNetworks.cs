using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Tests.Fixtures;

/// <summary>A random network with the horizon it is to be planned over.</summary>
public sealed record RandomNetwork(int Seed, Network Network, LocalDate Start, int Days)
{
    public override string ToString() => $"seed {Seed}";
}

/// <summary>
/// Seeded generator of small valid networks (invented names, every rule of the network format kept): one to three
/// plants with one or two stages (a second one refining the first one's product), optional biogas, permits of
/// random tightness, optional regional reservoir, one to four customers with hourly or daily demand, pumps and
/// blend limits, on 60-, 30- or 15-minute periods, over one or two days that may include a daylight-saving
/// change or a month end. Sizes are random, so shortages, bypass and permit excess all occur.
/// </summary>
public static class RandomNetworks
{
    private static readonly DateTimeZone Zone = DateTimeZoneProviders.Tzdb["Europe/Madrid"];
    private static readonly LocalDate[] Starts =
        [new(2027, 3, 27), new(2027, 3, 28), new(2027, 4, 30), new(2027, 6, 15), new(2027, 10, 30), new(2027, 10, 31), new(2027, 12, 31)];
    private const string Conductivity = "conductivityUsPerCm";

    public static RandomNetwork Create(int seed)
    {
        var random = new Random(seed);
        var start = Starts[random.Next(Starts.Length)];
        var days = random.Next(1, 3);
        var builder = new Builder(random, start, days);
        return new RandomNetwork(seed, builder.Build(seed), start, days);
    }

    private sealed class Builder(Random random, LocalDate start, int days)
    {
        private readonly List<QualityClass> _classes = [];
        private readonly List<Tariff> _tariffs = [];
        private readonly List<Plant> _plants = [];
        private readonly List<Tank> _tanks = [];
        private readonly List<Pipeline> _pipelines = [];
        private readonly List<Customer> _customers = [];

        public Network Build(int seed)
        {
            var classCount = random.Next(1, 4);
            var conductivity = Between(300, 700);
            for (var rank = 0; rank < classCount; rank++)
            {
                _classes.Add(new QualityClass(new ClassId("Q" + (char)('A' + rank)), $"Class {(char)('A' + rank)}", rank,
                    new Dictionary<string, double> { [Conductivity] = conductivity }));
                conductivity += Between(200, 600);
            }
            for (var i = random.Next(1, 3); i > 0; i--)
            {
                _tariffs.Add(RandomTariff(_tariffs.Count));
            }
            for (var i = random.Next(1, 4); i > 0; i--)
            {
                AddPlant(_plants.Count);
            }
            if (random.NextDouble() < 0.4)
            {
                AddReservoir();
            }
            for (var i = random.Next(1, 5); i > 0; i--)
            {
                AddCustomer(_customers.Count);
            }
            return new Network
            {
                Name = $"Random network {seed}",
                TimeZone = Zone,
                Currency = "EUR",
                PeriodMinutes = new[] { 60, 60, 30, 15 }[random.Next(4)],
                Classes = _classes,
                Tariffs = _tariffs,
                Plants = _plants,
                Tanks = _tanks,
                Pipelines = _pipelines,
                Customers = _customers,
                CarbonPricePerTonne = random.NextDouble() < 0.5 ? 0 : Between(10, 60),
            };
        }

        private double Between(double low, double high) => low + random.NextDouble() * (high - low);

        private ClassId RandomClass(int bestRank = 0) => _classes[random.Next(bestRank, _classes.Count)].Id;

        private int Rank(ClassId id) => _classes.First(c => c.Id == id).Rank;

        // Hourly values from local midnight of the start day, two hours more than the horizon so DST days are covered.
        private Series Hourly(double mean, double swing, string origin)
        {
            var hours = days * 24 + 2;
            var values = Enumerable.Range(0, hours).Select(h => Math.Max(0, mean * (1 + swing * Math.Sin(h / 24.0 * 2 * Math.PI + 1) + 0.1 * (random.NextDouble() - 0.5)))).ToList();
            return new StepSeries(Zone.AtStartOfDay(start).ToInstant(), Duration.FromHours(1), values) { Origin = origin };
        }

        private Tariff RandomTariff(int index)
        {
            EnergyPrice price = random.NextDouble() < 0.7
                ? new TimeOfUsePrice([new TouSeason("all year", 1, 12, Between(60, 110),
                [
                    new TouWindow(new HashSet<DayType> { DayType.Weekday }, new LocalTime(8, 0), new LocalTime(20, 0), Between(130, 220)),
                    new TouWindow(new HashSet<DayType> { DayType.Weekday, DayType.Weekend, DayType.Holiday }, new LocalTime(23, 0), new LocalTime(6, 0), Between(40, 80)),
                ])])
                : new SeriesPrice(Hourly(Between(70, 140), 0.4, $"tariff {index} price"));
            return new Tariff
            {
                Id = new TariffId($"grid-{index}"),
                Name = $"Grid tariff {index}",
                Price = price,
                DemandChargePerKwMonth = random.NextDouble() < 0.3 ? 0 : Between(2, 15),
                FeedInPricePerMWh = Between(0, 60),
                GridEmissionsKgPerMWh = Between(0, 400),
            };
        }

        private void AddPlant(int index)
        {
            var id = new PlantId($"plant-{index}");
            var influent = Between(150, 1200);
            var levels = new List<TreatmentLevel>();
            var nitrogen = Between(9, 14);
            for (var i = random.Next(1, 4); i > 0; i--)
            {
                levels.Add(new TreatmentLevel(new LevelId($"level-{levels.Count}"), $"Level {levels.Count}", nitrogen, nitrogen / 8,
                    Between(0.15, 0.32), Between(0.004, 0.025)));
                nitrogen *= Between(0.6, 0.9);
            }
            var stages = new List<Stage>();
            var firstTank = AddPlantTank(id, RandomClass(), influent);
            stages.Add(RandomStage(id, $"{id}-stage-0", null, firstTank, influent));
            if (random.NextDouble() < 0.35 && Rank(firstTank.Class) > 0)
            {
                var refined = AddPlantTank(id, _classes[random.Next(0, Rank(firstTank.Class))].Id, influent);
                stages.Add(RandomStage(id, $"{id}-stage-1", firstTank.Id, refined, influent / 3));
            }
            // Expected daily outfall load at the first level, to size caps that sometimes bind.
            var dailyN = influent * 24 * levels[0].EffluentTotalNitrogenMgPerL / 1000;
            var monthToDateN = random.NextDouble() < 0.5 ? 0 : dailyN * Between(5, 25);
            _plants.Add(new Plant
            {
                Id = id,
                Name = $"Plant {index}",
                Tariff = _tariffs[random.Next(_tariffs.Count)].Id,
                InfluentM3PerHour = random.NextDouble() < 0.3 ? Series.Constant(influent) : Hourly(influent, 0.3, $"{id} influent"),
                SecondaryCapacityM3PerHour = influent * Between(0.9, 1.6),
                RawTotalNitrogenMgPerL = Between(40, 70),
                RawTotalPhosphorusMgPerL = Between(6, 10),
                Levels = levels,
                StandardLevel = levels[random.Next(levels.Count)].Id,
                Stages = stages,
                BaseLoadKw = Between(20, 150),
                MonthToDatePeakKw = random.NextDouble() < 0.5 ? 0 : Between(50, 400),
                Biogas = random.NextDouble() < 0.5 ? null : new Biogas(Hourly(Between(15, 80), 0.2, $"{id} biogas"), Between(5.5, 6.5),
                    Between(100, 800), Between(0, 100), Between(40, 250), Between(0.3, 0.4)),
                Permit = new Permit
                {
                    DailyTotalNitrogenKg = random.NextDouble() < 0.5 ? null : dailyN * Between(0.5, 1.5),
                    MonthlyTotalNitrogenKg = random.NextDouble() < 0.6 ? null : monthToDateN + dailyN * Between(1, 40),
                    MonthToDateTotalNitrogenKg = monthToDateN,
                    DailyTotalPhosphorusKg = random.NextDouble() < 0.6 ? null : dailyN / 8 * Between(0.5, 1.5),
                    // Concentration limits leave at least the tightest level allowed, as a loader would require.
                    MaxTotalNitrogenMgPerL = random.NextDouble() < 0.6 ? null : levels[^1].EffluentTotalNitrogenMgPerL * Between(1, 1.5),
                    MaxTotalPhosphorusMgPerL = random.NextDouble() < 0.7 ? null : levels[^1].EffluentTotalPhosphorusMgPerL * Between(1, 1.5),
                    MaxOutfallM3PerHour = random.NextDouble() < 0.5 ? null : influent * Between(1.0, 2.0),
                },
            });
        }

        private Tank AddPlantTank(PlantId plant, ClassId holds, double influent)
        {
            var max = influent * Between(1, 6);
            var min = max * Between(0, 0.2);
            var tank = new Tank(new TankId($"{plant}-tank-{_tanks.Count}"), $"Tank {_tanks.Count}", plant, holds, min, max,
                min + (max - min) * Between(0.1, 0.9), random.NextDouble() < 0.5 ? 0 : Between(0, 0.03));
            _tanks.Add(tank);
            return tank;
        }

        private Stage RandomStage(PlantId plant, string id, TankId? feed, Tank product, double scale)
        {
            var membrane = random.NextDouble() < 0.3;
            var unitMax = scale * Between(0.1, 0.5);
            var units = random.Next(1, 5);
            return new Stage
            {
                Id = new StageId(id),
                Name = $"Stage {id}",
                Plant = plant,
                FeedTank = feed,
                ProductTank = product.Id,
                ProducesClass = _classes[random.Next(0, Rank(product.Class) + 1)].Id,
                RecoveryFraction = membrane ? Between(0.75, 0.85) : Between(0.95, 1.0),
                NutrientRejectionFraction = membrane ? Between(0.8, 0.95) : 0,
                EnergyKWhPerM3 = membrane ? Between(0.5, 1.0) : Between(0.01, 0.06),
                ChemicalCostPerM3 = Between(0, 0.03),
                Units = units,
                UnitMinFlowM3PerHour = unitMax * Between(0.1, 0.5),
                UnitMaxFlowM3PerHour = unitMax,
                StartupCost = Between(0, 25),
                MinRunHours = random.Next(0, 5),
                InitialUnitsRunning = random.Next(0, units + 1),
                AvailableUnits = random.NextDouble() < 0.25 ? Outage(units) : null,
            };
        }

        private Series Outage(int units)
        {
            var hours = days * 24 + 2;
            var from = random.Next(0, hours);
            var length = random.Next(2, 10);
            var values = Enumerable.Range(0, hours).Select(h => h >= from && h < from + length ? (double)random.Next(0, units) : units).ToList();
            return new StepSeries(Zone.AtStartOfDay(start).ToInstant(), Duration.FromHours(1), values) { Origin = "outage" };
        }

        private void AddReservoir()
        {
            var source = _tanks[random.Next(_tanks.Count)];
            var holds = _classes[random.Next(Rank(source.Class), _classes.Count)].Id;
            var max = Between(500, 5000);
            var reservoir = new Tank(new TankId("reservoir"), "Regional reservoir", null, holds, max * 0.05, max, max * Between(0.2, 0.8), Between(0, 0.02));
            _tanks.Add(reservoir);
            _pipelines.Add(RandomPipeline("to-reservoir", source, PipelineEnd.ToTank(reservoir.Id), Between(50, 400)));
        }

        private void AddCustomer(int index)
        {
            var id = new CustomerId($"customer-{index}");
            var tanks = _tanks.OrderBy(_ => random.Next()).ToList();
            var needs = RandomClass(Rank(tanks[0].Class));
            var rate = Between(20, 300);
            var served = tanks.Where(t => Rank(t.Class) <= Rank(needs)).Take(random.Next(1, 3)).ToList();
            foreach (var tank in served)
            {
                _pipelines.Add(RandomPipeline($"{tank.Id}-to-{id}", tank, PipelineEnd.ToCustomer(id), rate * Between(0.8, 2)));
            }
            var values = served.Select(t => _classes[Rank(t.Class)].Quality[Conductivity]).ToList();
            var from = new LocalTime(random.Next(0, 24), 0);
            _customers.Add(new Customer
            {
                Id = id,
                Name = $"Customer {index}",
                Kind = "test use",
                Class = needs,
                Demand = random.NextDouble() < 0.6
                    ? new HourlyDemand(Hourly(rate, 0.5, $"{id} demand"))
                    : new DailyDemand(rate * Between(4, 14), from, from.PlusHours(random.Next(4, 16)), random.NextDouble() < 0.5 ? null : rate * Between(1, 2)),
                ShortfallPenaltyPerM3 = Between(0.3, 3),
                Priority = random.Next(1, 4),
                Blend = random.NextDouble() < 0.3 ? new BlendLimit(Conductivity, Between(values.Min(), values.Max() + 200)) : null,
            });
        }

        private Pipeline RandomPipeline(string id, Tank from, PipelineEnd to, double capacity)
        {
            var pumps = random.NextDouble() < 0.35 ? new PumpSet(random.Next(1, 4), capacity * Between(0.05, 0.2), capacity * Between(0.3, 0.6)) : null;
            var poweredBy = from.Plant ?? _plants[random.Next(_plants.Count)].Id;
            return new Pipeline(new PipelineId(id), $"Pipeline {id}", from.Id, to, capacity, Between(0.01, 0.3), poweredBy, pumps);
        }
    }
}
