using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Model;

// Pipelines and tanks: where treated water is carried and held.
internal sealed partial class PlanModel
{
    /// <summary>Volume carried by pipeline l in period t, m3.</summary>
    public Dictionary<(PipelineId Pipeline, int Period), Variable> Flow { get; } = [];
    /// <summary>Pumps running on pipelines with discrete pumps.</summary>
    public Dictionary<(PipelineId Pipeline, int Period), Variable> PumpsOn { get; } = [];
    /// <summary>Volume in tank k at the end of period t, m3.</summary>
    public Dictionary<(TankId Tank, int Period), Variable> Volume { get; } = [];
    /// <summary>Volume below the tank's minimum (penalised; only the data can force it).</summary>
    public Dictionary<(TankId Tank, int Period), Variable> BelowMinimum { get; } = [];
    /// <summary>Volume above the tank's maximum (penalised; only the data can force it).</summary>
    public Dictionary<(TankId Tank, int Period), Variable> AboveMaximum { get; } = [];
    /// <summary>How far the tank ends the horizon below its starting volume, m3.</summary>
    public Dictionary<TankId, Variable> EndDeficit { get; } = [];

    /// <summary>0 ≤ f ≤ capacity·Δh; pumping energy per m3 billed to the powering plant; with discrete pumps
    /// n·min·Δh ≤ f ≤ n·max·Δh.</summary>
    private void AddPipelines()
    {
        foreach (var pipeline in Network.Pipelines)
        {
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var flow = NumVar(0, pipeline.CapacityM3PerHour * PeriodHours, Name("flow", pipeline.Id, P(t)));
                Flow[(pipeline.Id, t)] = flow;
                AddLoad(pipeline.PoweredBy, t, flow, pipeline.EnergyKWhPerM3);
                if (pipeline.Pumps is { } pumps)
                {
                    var on = IntVar(0, pumps.Count, PumpsName(pipeline.Id, t), period.Day);
                    PumpsOn[(pipeline.Id, t)] = on;
                    AtLeastRow(0, Name("pump-min", pipeline.Id, P(t))).Add(flow, 1).Add(on, -pumps.MinFlowM3PerHour * PeriodHours);
                    AtMostRow(0, Name("pump-max", pipeline.Id, P(t))).Add(flow, 1).Add(on, -pumps.MaxFlowM3PerHour * PeriodHours);
                }
            }
        }
    }

    /// <summary>
    /// V[t] = keep·V[t−1] + products in + pipelines in − pipelines out − stage feeds out, where keep =
    /// 1 − lossFractionPerDay·Δh/24 scales the daily loss to the period. min ≤ V ≤ max with penalised slack
    /// (a tank can start outside its limits), and V at the end not below the start (penalised), so the plan
    /// does not drain storage to look cheap.
    /// </summary>
    private void AddTankBalances()
    {
        foreach (var tank in Network.Tanks)
        {
            var keep = 1 - tank.LossFractionPerDay * PeriodHours / 24.0;
            var producers = Network.Stages.Where(s => s.ProductTank == tank.Id).ToList();
            var consumers = Network.Stages.Where(s => s.FeedTank == tank.Id).ToList();
            var inflows = Network.Pipelines.Where(l => l.To.Tank == tank.Id).ToList();
            var outflows = Network.Pipelines.Where(l => l.From == tank.Id).ToList();
            foreach (var period in Horizon.Periods)
            {
                var t = period.Index;
                var volume = NumVar(0, double.PositiveInfinity, Name("volume", tank.Id, P(t)));
                Volume[(tank.Id, t)] = volume;
                var balance = t == 0
                    ? EqualRow(keep * tank.InitialM3, Name("tank-balance", tank.Id, P(t)))
                    : EqualRow(0, Name("tank-balance", tank.Id, P(t))).Add(Volume[(tank.Id, t - 1)], -keep);
                balance.Add(volume, 1);
                foreach (var stage in producers)
                {
                    balance.Add(Feed[(stage.Id, t)], -stage.RecoveryFraction);
                }
                foreach (var stage in consumers)
                {
                    balance.Add(Feed[(stage.Id, t)], 1);
                }
                foreach (var pipeline in inflows)
                {
                    balance.Add(Flow[(pipeline.Id, t)], -1);
                }
                foreach (var pipeline in outflows)
                {
                    balance.Add(Flow[(pipeline.Id, t)], 1);
                }

                var below = NumVar(0, double.PositiveInfinity, Name("tank-below-min", tank.Id, P(t)));
                var above = NumVar(0, double.PositiveInfinity, Name("tank-above-max", tank.Id, P(t)));
                BelowMinimum[(tank.Id, t)] = below;
                AboveMaximum[(tank.Id, t)] = above;
                AtLeastRow(tank.MinM3, Name("tank-min", tank.Id, P(t))).Add(volume, 1).Add(below, 1);
                AtMostRow(tank.MaxM3, Name("tank-max", tank.Id, P(t))).Add(volume, 1).Add(above, -1);
                Costs.Add(CostComponent.TankLimitPenalty, below, Penalties.TankLimitPerM3);
                Costs.Add(CostComponent.TankLimitPenalty, above, Penalties.TankLimitPerM3);
            }

            var deficit = NumVar(0, double.PositiveInfinity, Name("tank-end-deficit", tank.Id));
            EndDeficit[tank.Id] = deficit;
            AtLeastRow(tank.InitialM3, Name("tank-end", tank.Id)).Add(Volume[(tank.Id, PeriodCount - 1)], 1).Add(deficit, 1);
            Costs.Add(CostComponent.TankEndPenalty, deficit, Penalties.TankEndDeficitPerM3);
        }
    }
}
