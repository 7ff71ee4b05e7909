using NodaTime;

namespace PlanDesk.Core.Model;

/// <summary>
/// Everything one plan is computed from: the network, the horizon, and every time series resolved onto
/// the horizon's periods. Volumes are per period (m3 in the period), prices per MWh.
/// The planner, the checker and the baseline all read this and nothing else.
/// </summary>
public sealed class PlanningCase
{
    private PlanningCase(Network network, Horizon horizon)
    {
        Network = network;
        Horizon = horizon;
    }

    public Network Network { get; }
    public Horizon Horizon { get; }
    public int PeriodCount => Horizon.Periods.Count;
    public double PeriodHours => Horizon.PeriodHours;

    /// <summary>Influent per plant and period, m3.</summary>
    public IReadOnlyDictionary<PlantId, double[]> InfluentM3 { get; private init; } = null!;
    /// <summary>Biogas produced per plant and period, Nm3 (plants without an engine are absent).</summary>
    public IReadOnlyDictionary<PlantId, double[]> BiogasNm3 { get; private init; } = null!;
    /// <summary>Price of imported energy per plant and period, currency/MWh (from the plant's tariff).</summary>
    public IReadOnlyDictionary<PlantId, double[]> ImportPricePerMWh { get; private init; } = null!;
    /// <summary>Units available per stage and period.</summary>
    public IReadOnlyDictionary<StageId, int[]> AvailableUnits { get; private init; } = null!;
    /// <summary>Hourly-demand customers: demand per period, m3. Daily-volume customers: see <see cref="DailyVolumeM3"/>.</summary>
    public IReadOnlyDictionary<CustomerId, double[]> DemandM3 { get; private init; } = null!;
    /// <summary>Daily-volume customers: volume owed per local day of the horizon, m3.</summary>
    public IReadOnlyDictionary<CustomerId, double[]> DailyVolumeM3 { get; private init; } = null!;
    /// <summary>Most a customer may receive in each period, m3: 0 outside allowed hours.</summary>
    public IReadOnlyDictionary<CustomerId, double[]> MaxDeliveryM3 { get; private init; } = null!;
    /// <summary>Billing month of each period, 0 for the month the horizon starts in.</summary>
    public int[] BillingMonth { get; private init; } = [];
    public int BillingMonthCount => BillingMonth.Length == 0 ? 0 : BillingMonth[^1] + 1;

    public Plant PlantOf(Stage stage) => Network.Plant(stage.Plant);
    public Tariff TariffOf(Plant plant) => Network.Tariff(plant.Tariff);

    /// <summary>The case for one group of plants: its part of the network, the same horizon, and the series already
    /// resolved here for its elements (nothing is resolved again, so the values are the same).</summary>
    public PlanningCase Restrict(PlantGroup group)
    {
        var network = IndependentGroups.Subnetwork(Network, group);
        var plants = network.Plants.Select(p => p.Id).ToHashSet();
        var stages = network.Stages.Select(s => s.Id).ToHashSet();
        var customers = network.Customers.Select(c => c.Id).ToHashSet();
        return new PlanningCase(network, Horizon)
        {
            InfluentM3 = Subset(InfluentM3, plants),
            BiogasNm3 = Subset(BiogasNm3, plants),
            ImportPricePerMWh = Subset(ImportPricePerMWh, plants),
            AvailableUnits = Subset(AvailableUnits, stages),
            DemandM3 = Subset(DemandM3, customers),
            DailyVolumeM3 = Subset(DailyVolumeM3, customers),
            MaxDeliveryM3 = Subset(MaxDeliveryM3, customers),
            BillingMonth = BillingMonth,
        };
    }

    private static Dictionary<TKey, TValue> Subset<TKey, TValue>(IReadOnlyDictionary<TKey, TValue> all, HashSet<TKey> keys) where TKey : notnull =>
        all.Where(entry => keys.Contains(entry.Key)).ToDictionary(entry => entry.Key, entry => entry.Value);

    /// <summary>Resolves every series of <paramref name="network"/> onto a horizon of <paramref name="days"/> local days
    /// from <paramref name="startDate"/>. Returns the problems instead when a series does not cover the horizon.</summary>
    public static PlanningCaseResult Create(Network network, LocalDate startDate, int days)
    {
        var problems = new List<string>();
        if (days < 1 || days > Horizon.MaxDays)
        {
            return new PlanningCaseResult(null, [$"days: {days} is outside 1 to {Horizon.MaxDays}; plan one to seven days"]);
        }
        var horizon = Horizon.Create(network.TimeZone, startDate, days, network.PeriodMinutes);
        var hours = horizon.PeriodHours;

        double[] Resolve(Series series, double scale)
        {
            var result = series.Resample(horizon);
            if (result.Error is not null)
            {
                problems.Add(result.Error);
                return new double[horizon.Periods.Count];
            }
            return result.Values!.Select(v => v * scale).ToArray();
        }

        var influent = network.Plants.ToDictionary(p => p.Id, p => Resolve(p.InfluentM3PerHour, hours));
        var biogas = network.Plants.Where(p => p.Biogas is not null)
            .ToDictionary(p => p.Id, p => Resolve(p.Biogas!.ProductionNm3PerHour, hours));
        var prices = new Dictionary<PlantId, double[]>();
        foreach (var plant in network.Plants)
        {
            var result = TariffPricing.EnergyPricePerMWh(network.Tariff(plant.Tariff), horizon);
            if (result.Error is not null)
            {
                problems.Add(result.Error);
            }
            prices[plant.Id] = result.Values ?? new double[horizon.Periods.Count];
        }
        var units = network.Stages.ToDictionary(
            s => s.Id,
            s => s.AvailableUnits is null
                ? Enumerable.Repeat(s.Units, horizon.Periods.Count).ToArray()
                : Resolve(s.AvailableUnits, 1.0).Select(u => Math.Clamp((int)Math.Floor(u + 1e-9), 0, s.Units)).ToArray());

        var demand = new Dictionary<CustomerId, double[]>();
        var daily = new Dictionary<CustomerId, double[]>();
        var maxDelivery = new Dictionary<CustomerId, double[]>();
        foreach (var customer in network.Customers)
        {
            switch (customer.Demand)
            {
                case HourlyDemand hourly:
                    var perPeriod = Resolve(hourly.M3PerHour, hours);
                    demand[customer.Id] = perPeriod;
                    maxDelivery[customer.Id] = perPeriod;
                    break;
                case DailyDemand dailyDemand:
                    daily[customer.Id] = Enumerable.Repeat(dailyDemand.VolumeM3PerDay, days).ToArray();
                    maxDelivery[customer.Id] = horizon.Periods
                        .Select(p => dailyDemand.Allows(p.LocalStart.TimeOfDay)
                            ? (dailyDemand.MaxM3PerHour ?? double.PositiveInfinity) * hours
                            : 0.0)
                        .ToArray();
                    break;
            }
        }

        if (problems.Count > 0)
        {
            return new PlanningCaseResult(null, problems);
        }
        return new PlanningCaseResult(
            new PlanningCase(network, horizon)
            {
                InfluentM3 = influent,
                BiogasNm3 = biogas,
                ImportPricePerMWh = prices,
                AvailableUnits = units,
                DemandM3 = demand,
                DailyVolumeM3 = daily,
                MaxDeliveryM3 = maxDelivery,
                BillingMonth = TariffPricing.BillingMonthIndex(horizon),
            },
            []);
    }
}

/// <summary>A planning case, or the reasons it could not be built.</summary>
public sealed record PlanningCaseResult(PlanningCase? Case, IReadOnlyList<string> Problems)
{
    public bool Succeeded => Case is not null;
}
