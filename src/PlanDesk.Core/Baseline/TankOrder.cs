using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// The order in which the baseline walks the tanks: upstream before downstream, where a tank is upstream
/// of another when a pipeline or a stage takes water from it into the other. Pipelines and stages the
/// rules never use are set aside: those that break the class rule, and those that would close a loop
/// (operators run a loop one way; the baseline keeps the first direction met in network order).
/// </summary>
internal sealed class TankOrder
{
    private TankOrder(Network network, IReadOnlyList<Tank> upstreamFirst, IReadOnlySet<PipelineId> unusedPipelines, IReadOnlySet<StageId> unusedStages)
    {
        UpstreamFirst = upstreamFirst;
        UnusedPipelines = unusedPipelines;
        UnusedStages = unusedStages;
        var served = new Dictionary<TankId, int>();
        foreach (var tank in upstreamFirst.Reverse())
        {
            var customers = network.Pipelines.Where(l => l.From == tank.Id && l.To.Customer is not null && Uses(l))
                .Select(l => network.Customer(l.To.Customer!.Value).Priority);
            var tanks = network.Pipelines.Where(l => l.From == tank.Id && l.To.Tank is not null && Uses(l)).Select(l => served[l.To.Tank!.Value])
                .Concat(network.Stages.Where(s => s.FeedTank == tank.Id && Uses(s)).Select(s => served[s.ProductTank]));
            served[tank.Id] = customers.Concat(tanks).DefaultIfEmpty(int.MaxValue).Min();
        }
        ServedPriority = served;
    }

    /// <summary>The highest contract priority (lowest number) among the customers a tank's water reaches,
    /// directly or through other tanks; int.MaxValue when it reaches none.</summary>
    public IReadOnlyDictionary<TankId, int> ServedPriority { get; }

    public IReadOnlyList<Tank> UpstreamFirst { get; }
    public IReadOnlySet<PipelineId> UnusedPipelines { get; }
    public IReadOnlySet<StageId> UnusedStages { get; }

    public bool Uses(Pipeline pipeline) => !UnusedPipelines.Contains(pipeline.Id);
    public bool Uses(Stage stage) => !UnusedStages.Contains(stage.Id);

    public static TankOrder Of(Network network)
    {
        var unusedPipelines = network.Pipelines.Where(l => !network.Serves(network.Tank(l.From).Class, Destination(network, l))).Select(l => l.Id).ToHashSet();
        var unusedStages = network.Stages.Where(s => !network.Serves(s.ProducesClass, network.Tank(s.ProductTank).Class)).Select(s => s.Id).ToHashSet();

        // Edges between tanks, in network order: (from, to, pipeline or stage).
        var edges = network.Pipelines.Where(l => l.To.Tank is not null && !unusedPipelines.Contains(l.Id))
            .Select(l => (From: l.From, To: l.To.Tank!.Value, Pipeline: (PipelineId?)l.Id, Stage: (StageId?)null))
            .Concat(network.Stages.Where(s => s.FeedTank is not null && !unusedStages.Contains(s.Id))
                .Select(s => (From: s.FeedTank!.Value, To: s.ProductTank, Pipeline: (PipelineId?)null, Stage: (StageId?)s.Id)))
            .ToList();

        // Keep an edge only when it does not close a loop with the edges kept before it.
        var kept = new Dictionary<TankId, List<TankId>>();
        foreach (var edge in edges)
        {
            if (edge.From == edge.To || Reaches(kept, edge.To, edge.From))
            {
                if (edge.Pipeline is { } p)
                {
                    unusedPipelines.Add(p);
                }
                if (edge.Stage is { } s)
                {
                    unusedStages.Add(s);
                }
                continue;
            }
            (kept.TryGetValue(edge.From, out var list) ? list : kept[edge.From] = []).Add(edge.To);
        }

        // Topological order over the kept edges; among tanks that are ready, network order decides.
        var waiting = network.Tanks.ToDictionary(t => t.Id, t => kept.Values.Sum(list => list.Count(to => to == t.Id)));
        var order = new List<Tank>();
        while (order.Count < network.Tanks.Count)
        {
            var next = network.Tanks.First(t => waiting[t.Id] == 0 && !order.Contains(t));
            order.Add(next);
            foreach (var to in kept.TryGetValue(next.Id, out var list) ? list : [])
            {
                waiting[to]--;
            }
        }
        return new TankOrder(network, order, unusedPipelines, unusedStages);
    }

    private static ClassId Destination(Network network, Pipeline pipeline) =>
        pipeline.To.Tank is { } tank ? network.Tank(tank).Class : network.Customer(pipeline.To.Customer!.Value).Class;

    private static bool Reaches(Dictionary<TankId, List<TankId>> edges, TankId from, TankId to)
    {
        var stack = new Stack<TankId>([from]);
        var seen = new HashSet<TankId>();
        while (stack.Count > 0)
        {
            var id = stack.Pop();
            if (id == to)
            {
                return true;
            }
            if (seen.Add(id) && edges.TryGetValue(id, out var next))
            {
                next.ForEach(stack.Push);
            }
        }
        return false;
    }
}
