using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>
/// Draws customers around plants and reservoirs, with the pipelines that serve them. Demands are scaled
/// so each tank's customers together ask for about the supply it can give on average, which keeps most
/// demand servable while the storage and the tariffs still matter.
/// </summary>
internal static class CustomerFactory
{
    // Average use of a customer of relative size 1 at most, m3/h (a large farm or industrial site).
    private const double LargestAverageM3PerHour = 250;

    private sealed record Home(Site Site, IReadOnlyList<TankDraft> Tanks, PlantId PumpedBy, PlantDraft? Plant)
    {
        public TankDraft? WorstServing(ClassId required) =>
            Tanks.Where(t => RegionClasses.Serves(t.Class, required)).OrderByDescending(t => RegionClasses.Rank(t.Class)).FirstOrDefault();
    }

    private sealed record Draft(string Name, CustomerKind Kind, Home Home, Site Site, double Weight,
        IReadOnlyList<SupplyShare> Supplies, TankDraft? Backup, BlendLimit? Blend);

    public static (IReadOnlyList<Customer> Customers, IReadOnlyList<PipelineDraft> Pipelines) Create(SeededRandom random, PlaceNames names,
        IReadOnlyList<PlantDraft> plants, IReadOnlyList<ReservoirDraft> reservoirs, HourGrid hours, int count)
    {
        var homes = Homes(random, plants, reservoirs, count);
        var kinds = Shuffled(random, CustomerKind.All);
        var drafts = new List<Draft>();
        var servedAtHome = new Dictionary<Home, int>();
        var cursor = 0;
        foreach (var home in homes)
        {
            // A home's customers take its tanks in turn, so every stage has someone to produce for;
            // kinds are taken in turn too, skipping those the tank is not the natural source for.
            var served = servedAtHome.GetValueOrDefault(home);
            servedAtHome[home] = served + 1;
            var target = home.Tanks[served % home.Tanks.Count];
            var offset = Enumerable.Range(0, kinds.Count).FirstOrDefault(
                k => home.WorstServing(kinds[(cursor + k) % kinds.Count].Class) == target,
                Enumerable.Range(0, kinds.Count).First(k => home.WorstServing(kinds[(cursor + k) % kinds.Count].Class) is not null));
            var kind = kinds[(cursor + offset) % kinds.Count];
            cursor += offset + 1;
            drafts.Add(Draw(random, names, plants, home, kind));
        }

        var load = new Dictionary<TankId, double>();
        foreach (var draft in drafts)
        {
            foreach (var supply in draft.Supplies)
            {
                load[supply.Tank.Id] = load.GetValueOrDefault(supply.Tank.Id) + draft.Weight * supply.Share;
            }
        }

        var customers = new List<Customer>();
        var pipelines = new List<PipelineDraft>();
        foreach (var draft in drafts)
        {
            // Share out each tank's supply, but no customer grows beyond the usual size of its kind.
            var scale = draft.Supplies.Where(s => s.Share > 0).Min(s => Math.Max(1, s.Tank.BudgetM3PerHour) / load[s.Tank.Id]);
            var (customer, peakM3PerHour) = Build(random, hours, draft, draft.Weight * Math.Min(scale, LargestAverageM3PerHour));
            customers.Add(customer);
            foreach (var supply in draft.Supplies)
            {
                // The main line carries the whole peak; a blending line its share with some margin.
                var capacity = supply.Share >= 0.5 ? peakM3PerHour * 1.1 : peakM3PerHour * (supply.Share + 0.1);
                pipelines.Add(Line(random, draft, supply.Tank, customer, capacity, ResidualHead(draft.Kind)));
            }
            if (draft.Backup is not null)
            {
                pipelines.Add(Line(random, draft, draft.Backup, customer, peakM3PerHour * 0.5, ResidualHead(draft.Kind)));
            }
        }
        return (customers, pipelines);
    }

    // Every reservoir serves one or two customers; the rest are spread over the plants in turn.
    private static List<Home> Homes(SeededRandom random, IReadOnlyList<PlantDraft> plants, IReadOnlyList<ReservoirDraft> reservoirs, int count)
    {
        var homes = new List<Home>();
        foreach (var reservoir in reservoirs)
        {
            var home = new Home(reservoir.Tank.Site, [reservoir.Tank], reservoir.PumpedBy, null);
            var served = Math.Min(random.Int(1, 2), Math.Max(0, count - plants.Count - homes.Count));
            homes.AddRange(Enumerable.Repeat(home, served));
        }
        var plantHomes = plants.Select(p => new Home(p.Site, p.Tanks, p.Plant.Id, p)).ToList();
        for (var i = 0; homes.Count < count; i++)
        {
            homes.Add(plantHomes[i % plantHomes.Count]);
        }
        return homes;
    }

    private static Draft Draw(SeededRandom random, PlaceNames names, IReadOnlyList<PlantDraft> plants, Home home, CustomerKind kind)
    {
        var place = names.Next();
        var name = $"{place} {random.Pick(kind.NameEndings)}";
        var angle = random.Uniform(0, 2 * Math.PI);
        var distance = random.Uniform(2, 12);
        var site = new Site(home.Site.EastKm + distance * Math.Cos(angle), home.Site.NorthKm + distance * Math.Sin(angle),
            Math.Max(0, home.Site.ElevationM + random.Uniform(-10, 60, 0)));
        var primary = home.WorstServing(kind.Class)!;
        var supplies = new List<SupplyShare> { new(primary, 1.0) };

        BlendLimit? blend = null;
        var membrane = home.Tanks.FirstOrDefault(t => t.Class == RegionClasses.Membrane);
        if (kind.MayHaveSalinityLimit && membrane is not null && primary != membrane && random.Chance(0.6))
        {
            // Irrigation water kept below a salinity limit by blending in membrane permeate.
            var max = SeededRandom.RoundTo(random.Uniform(850, 1000), 10);
            var primaryConductivity = RegionClasses.ConductivityOf(primary.Class);
            var permeateShare = (primaryConductivity - max) / (primaryConductivity - RegionClasses.ConductivityOf(RegionClasses.Membrane));
            supplies = [new(primary, 1 - permeateShare), new(membrane, permeateShare)];
            blend = new BlendLimit(RegionClasses.Conductivity, max);
        }

        TankDraft? backup = null;
        if (home.Plant is not null && random.Chance(0.25))
        {
            backup = plants.Where(p => p != home.Plant && p.WorstServing(kind.Class) is not null)
                .OrderBy(p => p.Site.DistanceKm(site)).Select(p => p.WorstServing(kind.Class)).FirstOrDefault();
        }
        return new Draft(name, kind, home, site, kind.RelativeSize * random.Uniform(0.6, 1.4), supplies, backup, blend);
    }

    private static (Customer Customer, double PeakM3PerHour) Build(SeededRandom random, HourGrid hours, Draft draft, double averageM3PerHour)
    {
        Demand demand;
        double peak;
        if (draft.Kind.Hourly is { } pattern)
        {
            var values = Profiles.Demand(random, hours.Local, pattern, averageM3PerHour);
            demand = new HourlyDemand(hours.Series(values));
            peak = values.Max();
        }
        else
        {
            var volume = Math.Max(10, SeededRandom.RoundTo(averageM3PerHour * 24, 10));
            peak = SeededRandom.Round(volume / draft.Kind.WindowHours * random.Uniform(1.3, 1.8), 0);
            demand = new DailyDemand(volume, draft.Kind.WindowFrom!.Value, draft.Kind.WindowTo!.Value, peak);
        }
        var penalty = draft.Kind.Priority switch
        {
            1 => random.Uniform(2.0, 3.0, 2),
            2 => random.Uniform(1.0, 1.6, 2),
            _ => random.Uniform(0.4, 0.8, 2),
        };
        var customer = new Customer
        {
            Id = new CustomerId(PlaceNames.Slug(draft.Name)),
            Name = draft.Name,
            Kind = draft.Kind.Kind,
            Class = draft.Kind.Class,
            Demand = demand,
            ShortfallPenaltyPerM3 = penalty,
            Priority = draft.Kind.Priority,
            Blend = draft.Blend,
        };
        return (customer, peak);
    }

    private static PipelineDraft Line(SeededRandom random, Draft draft, TankDraft from, Customer customer, double capacityM3PerHour, double residualHeadM)
    {
        var poweredBy = from.Plant ?? draft.Home.PumpedBy;
        return PipelineFactory.Create(random, from, customer.Id.Value, customer.Name, draft.Site,
            PipelineEnd.ToCustomer(customer.Id), PipelineFactory.TidyCapacity(capacityM3PerHour), poweredBy, null, residualHeadM);
    }

    // Sprinklers want more pressure at the far end than a tank or a drip line.
    private static double ResidualHead(CustomerKind kind) => kind.Kind switch
    {
        "golf course" or "city parks" or "farm irrigation" or "field crop irrigation" => 30,
        "aquifer recharge" => 5,
        _ => 15,
    };

    private static List<T> Shuffled<T>(SeededRandom random, IReadOnlyList<T> items)
    {
        var list = items.ToList();
        for (var i = list.Count - 1; i > 0; i--)
        {
            var j = random.Int(0, i);
            (list[i], list[j]) = (list[j], list[i]);
        }
        return list;
    }
}
