namespace PlanDesk.Core.Model;

/// <summary>
/// Plants whose plans share nothing with the plants of any other group, with every tank, pipeline and customer
/// that belongs to them. Ids are in the network's order.
/// </summary>
/// <param name="Number">1 for the group holding the network's first plant, then in the order of each group's first plant.</param>
public sealed record PlantGroup(
    int Number,
    IReadOnlyList<PlantId> Plants,
    IReadOnlyList<TankId> Tanks,
    IReadOnlyList<PipelineId> Pipelines,
    IReadOnlyList<CustomerId> Customers)
{
    /// <summary>How big the group's model is, in elements (plants, stages, tanks, pipelines, customers): what
    /// time is shared by. Stages are counted through <paramref name="network"/>.</summary>
    public int Size(Network network) =>
        Plants.Count + network.Stages.Count(s => Plants.Contains(s.Plant)) + Tanks.Count + Pipelines.Count + Customers.Count;

    /// <summary>"group 2 (plants tessford, whinlow)": how notes and messages name the group.</summary>
    public string Label
    {
        get
        {
            const int namedAtMost = 6;
            var named = string.Join(", ", Plants.Take(namedAtMost));
            var more = Plants.Count > namedAtMost ? $" and {Plants.Count - namedAtMost} more" : "";
            return $"group {Number} ({(Plants.Count == 1 ? "plant" : "plants")} {named}{more})";
        }
    }
}

/// <summary>
/// Splits a network into groups of plants that no tank, stage, pipeline or customer joins. Every constraint and
/// cost of a plan is per plant or per element (a plant's demand charge is on its own peak; a tariff is only price
/// data), so the groups can be planned one by one and their plans joined without losing anything.
/// </summary>
public static class IndependentGroups
{
    /// <summary>
    /// The groups of <paramref name="network"/>, numbered by their first plant. A tank at a plant, a stage's feed and
    /// product tanks, and a pipeline's ends and powering plant join what they touch; a regional reservoir or a
    /// customer joins the plants whose water reaches it. Tanks, pipelines and customers that no plant reaches are
    /// independent of every plant; they go with group 1 so that nothing is lost. A network without plants is one group.
    /// </summary>
    public static IReadOnlyList<PlantGroup> Of(Network network)
    {
        var links = new UnionFind();
        foreach (var plant in network.Plants)
        {
            links.Add(PlantKey(plant.Id));
            foreach (var stage in plant.Stages)
            {
                links.Join(PlantKey(plant.Id), TankKey(stage.ProductTank));
                if (stage.FeedTank is { } feed)
                {
                    links.Join(PlantKey(plant.Id), TankKey(feed));
                }
            }
        }
        foreach (var tank in network.Tanks.Where(t => t.Plant is not null))
        {
            links.Join(TankKey(tank.Id), PlantKey(tank.Plant!.Value));
        }
        foreach (var pipeline in network.Pipelines)
        {
            links.Join(PipelineKey(pipeline.Id), TankKey(pipeline.From));
            links.Join(PipelineKey(pipeline.Id), PlantKey(pipeline.PoweredBy));
            links.Join(PipelineKey(pipeline.Id), pipeline.To.Tank is { } tank ? TankKey(tank) : CustomerKey(pipeline.To.Customer!.Value));
        }

        // Roots in the order of their first plant; anything whose root holds no plant goes with the first group.
        var roots = network.Plants.Select(p => links.Root(PlantKey(p.Id))).Distinct().ToList();
        int GroupOf(string key)
        {
            var index = roots.IndexOf(links.Root(key));
            return index < 0 ? 0 : index;
        }
        var count = Math.Max(1, roots.Count);
        return Enumerable.Range(0, count).Select(g => new PlantGroup(
                g + 1,
                network.Plants.Where(p => GroupOf(PlantKey(p.Id)) == g).Select(p => p.Id).ToList(),
                network.Tanks.Where(t => GroupOf(TankKey(t.Id)) == g).Select(t => t.Id).ToList(),
                network.Pipelines.Where(l => GroupOf(PipelineKey(l.Id)) == g).Select(l => l.Id).ToList(),
                network.Customers.Where(c => GroupOf(CustomerKey(c.Id)) == g).Select(c => c.Id).ToList()))
            .ToList();
    }

    /// <summary>The part of <paramref name="network"/> that <paramref name="group"/> holds, in the network's order;
    /// classes, tariffs, penalties and settings are kept whole.</summary>
    public static Network Subnetwork(Network network, PlantGroup group)
    {
        var plants = group.Plants.ToHashSet();
        var tanks = group.Tanks.ToHashSet();
        var pipelines = group.Pipelines.ToHashSet();
        var customers = group.Customers.ToHashSet();
        return network with
        {
            Plants = network.Plants.Where(p => plants.Contains(p.Id)).ToList(),
            Tanks = network.Tanks.Where(t => tanks.Contains(t.Id)).ToList(),
            Pipelines = network.Pipelines.Where(l => pipelines.Contains(l.Id)).ToList(),
            Customers = network.Customers.Where(c => customers.Contains(c.Id)).ToList(),
        };
    }

    // Element kinds have separate id spaces, so each key carries its kind.
    private static string PlantKey(PlantId id) => "plant:" + id.Value;
    private static string TankKey(TankId id) => "tank:" + id.Value;
    private static string PipelineKey(PipelineId id) => "pipeline:" + id.Value;
    private static string CustomerKey(CustomerId id) => "customer:" + id.Value;

    private sealed class UnionFind
    {
        private readonly Dictionary<string, string> parent = [];

        public void Add(string key) => parent.TryAdd(key, key);

        public string Root(string key)
        {
            Add(key);
            var root = key;
            while (parent[root] != root)
            {
                root = parent[root];
            }
            while (parent[key] != root)
            {
                (parent[key], key) = (root, parent[key]);
            }
            return root;
        }

        public void Join(string a, string b)
        {
            var (rootA, rootB) = (Root(a), Root(b));
            if (rootA != rootB)
            {
                parent[rootB] = rootA;
            }
        }
    }
}
