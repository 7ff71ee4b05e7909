using PlanDesk.Core.Checking;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Baseline;

/// <summary>
/// One period of the operator's rules, walking the tanks upstream first: treat all influent the secondary
/// stage can take; from each tank serve its customers, the stages it feeds and its transfers in order of the
/// contract priority they serve; then run the tank's own stages on secondary effluent (shared between a
/// plant's stages) to bring it back towards its start level. Units and pumps keep to their flow ranges,
/// availability and minimum run times.
/// </summary>
internal sealed class BaselineFlows
{
    private readonly BaselineState _state;
    private readonly TankOrder _order;
    private readonly int _t;
    private readonly PeriodRequests _requests;
    private readonly Dictionary<PlantId, double> _pool = [];
    private readonly Dictionary<TankId, double> _inflow = [];
    private readonly Dictionary<CustomerId, double> _carry = [];
    private readonly Dictionary<CustomerId, double> _blendSlack = [];
    private readonly Dictionary<PlantId, double> _reserved = [];
    private readonly Dictionary<StageId, double> _share = [];

    private BaselineFlows(BaselineState state, TankOrder order, int t)
    {
        _state = state;
        _order = order;
        _t = t;
        Treat();
        _requests = PeriodRequests.Compute(state, order, t);
        ShareSecondaryEffluent();
    }

    // When a plant's stages ask for more secondary effluent than it treats, each gets the same share of its
    // request, but never less than its essential feed (draws it must serve, units it must keep on).
    private void ShareSecondaryEffluent()
    {
        foreach (var plant in Network.Plants)
        {
            var stages = plant.Stages.Where(s => s.FeedTank is null && _order.Uses(s)).ToList();
            var asked = stages.Sum(s => _requests.StageFeed.GetValueOrDefault(s.Id));
            var scale = asked > _pool[plant.Id] ? _pool[plant.Id] / asked : 1;
            foreach (var stage in stages)
            {
                _share[stage.Id] = Math.Max(_requests.EssentialFeed.GetValueOrDefault(stage.Id), _requests.StageFeed.GetValueOrDefault(stage.Id) * scale);
                _reserved[plant.Id] = _reserved.GetValueOrDefault(plant.Id) + _share[stage.Id];
            }
        }
    }

    // Secondary effluent a stage may take: what is left once the shares of the plant's other stages, not yet
    // served this period, are set aside.
    private double PoolFor(Stage stage, Dictionary<PlantId, double> pool) =>
        Math.Max(0, pool[stage.Plant] - (_reserved.GetValueOrDefault(stage.Plant) - _share.GetValueOrDefault(stage.Id)));

    private Network Network => _state.Case.Network;
    private double Hours => _state.Case.PeriodHours;

    public static void Run(BaselineState state, TankOrder order, int t)
    {
        var flows = new BaselineFlows(state, order, t);
        foreach (var tank in order.UpstreamFirst)
        {
            flows.ServeFrom(tank);
        }
        foreach (var plant in state.Case.Network.Plants)
        {
            state.SecondaryToOutfall[plant.Id][t] = Math.Max(0, flows._pool[plant.Id]);
        }
    }

    private void Treat()
    {
        foreach (var plant in Network.Plants)
        {
            var influent = _state.Case.InfluentM3[plant.Id][_t];
            var treated = Math.Min(influent, plant.SecondaryCapacityM3PerHour * Hours);
            _state.Treated[plant.Id][_t] = treated;
            _state.Bypass[plant.Id][_t] = influent - treated;
            _pool[plant.Id] = treated;
        }
    }

    private void ServeFrom(Tank tank)
    {
        var start = _state.VolumeBefore(tank, _t) * PeriodRequests.Keep(tank, Hours);
        var fixedIn = _inflow.GetValueOrDefault(tank.Id);
        var ownStages = Network.Stages.Where(s => s.ProductTank == tank.Id && s.FeedTank is null && _order.Uses(s)).ToList();
        var poolLeft = new Dictionary<PlantId, double>(_pool);
        var ownMostProduct = 0.0;
        var roomIfServed = tank.MaxM3 - start - fixedIn + _requests.Outflow[tank.Id];
        foreach (var stage in ownStages)
        {
            var feed = Math.Min(StageUnitRules.MostFeedM3(_state, _order, stage, _t, roomIfServed - ownMostProduct), PoolFor(stage, poolLeft));
            poolLeft[stage.Plant] -= feed;
            ownMostProduct += feed * stage.RecoveryFraction;
        }
        var floor = Floor(tank);
        var available = Math.Max(0, start + fixedIn + ownMostProduct - floor);
        var outM3 = ServeOutflows(tank, available, start + fixedIn - floor);
        var product = Produce(tank, ownStages, start, fixedIn, outM3, floor);
        var volume = start + fixedIn + product - outM3;
        _state.Volume[tank.Id][_t] = volume;
        if (volume < tank.MinM3 - 1e-6 || volume > tank.MaxM3 + 1e-6)
        {
            var below = volume < tank.MinM3;
            _state.Issues.Add(new BaselineIssue(below ? ViolationKind.TankMin : ViolationKind.TankMax, tank.Id.Value, _t,
                below ? tank.MinM3 - volume : volume - tank.MaxM3, "m3",
                $"tank {tank.Id} could not be kept {(below ? "above its minimum" : "below its maximum")}: units kept on for their minimum run"));
        }
    }

    // What the tank gives, by the contract priority of the customers it serves: its own customers, stages it
    // feeds and transfers it makes (these by the best priority downstream). Units kept on for their minimum run
    // have their least flow set aside first.
    private double ServeOutflows(Tank tank, double available, double storedM3)
    {
        var committed = Network.Stages.Where(s => s.FeedTank == tank.Id && _order.Uses(s))
            .ToDictionary(s => s.Id, s => StageUnitRules.Allowed(_state, _order, s, _t).Fewest * s.UnitMinFlowM3PerHour * Hours);
        var committedLeft = committed.Values.Sum();
        var claims = Network.Pipelines.Where(l => l.From == tank.Id && _order.Uses(l))
            .Select(l => l.To.Customer is { } c
                ? (Priority: Network.Customer(c).Priority, Kind: 0, Line: (Pipeline?)l, Stage: (Stage?)null)
                : (Priority: _order.ServedPriority[l.To.Tank!.Value], Kind: 2, Line: (Pipeline?)l, Stage: null))
            .Concat(Network.Stages.Where(s => s.FeedTank == tank.Id && _order.Uses(s))
                .Select(s => (Priority: _order.ServedPriority[s.ProductTank], Kind: 1, Line: (Pipeline?)null, Stage: (Stage?)s)))
            .OrderBy(c => c.Priority).ThenBy(c => c.Kind)
            .ToList();
        var outM3 = 0.0;
        foreach (var claim in claims)
        {
            if (claim.Stage is { } stage)
            {
                committedLeft -= committed[stage.Id];
                outM3 += FeedStage(stage, available - outM3 - committedLeft, storedM3 - outM3 - committedLeft);
            }
            else if (claim.Line!.To.Customer is not null)
            {
                outM3 += Deliver(claim.Line, available - outM3 - committedLeft);
            }
            else
            {
                outM3 += Transfer(claim.Line, available - outM3 - committedLeft);
            }
        }
        return outM3;
    }

    // A customer's pipeline is asked for its share plus what the customer's other pipelines could not bring,
    // never more than the customer may take or its blend limit allows.
    private double Deliver(Pipeline line, double available)
    {
        var customer = Network.Customer(line.To.Customer!.Value);
        var sent = _state.Delivered[customer.Id][_t];
        var wants = Math.Max(0, _requests.Customer[customer.Id] - sent);
        var mayTake = customer.Demand is DailyDemand
            ? Math.Min(PeriodRequests.DayRemainingM3(_state, customer, _t) - sent, _state.Case.MaxDeliveryM3[customer.Id][_t] - sent)
            : wants;
        var high = Math.Min(available, Math.Max(0, mayTake));
        double? value = customer.Blend is { } blend ? PeriodRequests.BlendValue(Network, line, blend.Parameter) : null;
        if (customer.Blend is { } limit && value > limit.Max)
        {
            high = Math.Min(high, _blendSlack.GetValueOrDefault(customer.Id) / (value.Value - limit.Max));
        }
        var asked = _requests.Pipeline.GetValueOrDefault(line.Id);
        var target = Math.Min(asked + _carry.GetValueOrDefault(customer.Id), wants);
        var flow = Carry(line, target, high, roundUp: customer.Demand is DailyDemand);
        _carry[customer.Id] = Math.Max(0, _carry.GetValueOrDefault(customer.Id) + asked - flow);
        _state.Delivered[customer.Id][_t] += flow;
        if (customer.Blend is { } b && value is { } v)
        {
            _blendSlack[customer.Id] = _blendSlack.GetValueOrDefault(customer.Id) + flow * (b.Max - v);
        }
        return flow;
    }

    // A stage fed from this tank gets what it asked for, as far as the tank has water and its product tank has
    // room; a unit is started only on water already stored, since the tank's own stages may not keep up for the whole run.
    private double FeedStage(Stage stage, double available, double storedM3)
    {
        var room = Room(Network.Tank(stage.ProductTank));
        var high = Math.Min(available, room / stage.RecoveryFraction);
        var choice = StageUnitRules.Choose(_state, _order, stage, _t, _requests.StageFeed.GetValueOrDefault(stage.Id), 0, high, room, storedM3);
        StageUnitRules.Record(_state, stage, _t, choice);
        _inflow[stage.ProductTank] = _inflow.GetValueOrDefault(stage.ProductTank) + choice.FlowM3 * stage.RecoveryFraction;
        return choice.FlowM3;
    }

    // A transfer to a downstream tank gets what that tank asked for, as far as there is water and room.
    private double Transfer(Pipeline line, double available)
    {
        var to = line.To.Tank!.Value;
        var flow = Carry(line, _requests.Pipeline.GetValueOrDefault(line.Id), Math.Min(available, Room(Network.Tank(to))), roundUp: false);
        _inflow[to] = _inflow.GetValueOrDefault(to) + flow;
        return flow;
    }

    // The tank's own stages refill it towards its start level: at least enough to stay above the minimum,
    // at most what fits below the maximum.
    private double Produce(Tank tank, List<Stage> stages, double start, double fixedIn, double outM3, double floor)
    {
        var low = Math.Max(0, outM3 + floor - start - fixedIn);
        var high = outM3 + tank.MaxM3 - start - fixedIn;
        var want = Math.Clamp(outM3 + tank.InitialM3 - start - fixedIn, low, Math.Max(low, high));
        var product = 0.0;
        foreach (var stage in stages)
        {
            var r = stage.RecoveryFraction;
            var pool = PoolFor(stage, _pool);
            var choice = StageUnitRules.Choose(_state, _order, stage, _t, (want - product) / r, (low - product) / r, Math.Min((high - product) / r, pool),
                high - product);
            StageUnitRules.Record(_state, stage, _t, choice);
            _pool[stage.Plant] -= choice.FlowM3;
            _reserved[stage.Plant] -= _share.GetValueOrDefault(stage.Id);
            product += choice.FlowM3 * r;
        }
        return product;
    }

    // The least volume the operator leaves in a tank: its minimum plus what it will lose by the end of the
    // horizon, so losses alone never take it below the minimum when no water comes in later.
    private double Floor(Tank tank)
    {
        var keep = PeriodRequests.Keep(tank, Hours);
        var periodsLeft = _state.Case.PeriodCount - 1 - _t;
        return keep >= 1 ? tank.MinM3 : Math.Min(tank.MinM3 / Math.Pow(keep, periodsLeft), (tank.MinM3 + tank.MaxM3) / 2);
    }

    // Room a receiving tank has, counting on it passing on what was asked of it this period.
    private double Room(Tank tank) =>
        Math.Max(0, tank.MaxM3 - _state.VolumeBefore(tank, _t) * PeriodRequests.Keep(tank, Hours) - _inflow.GetValueOrDefault(tank.Id)
            + _requests.Outflow[tank.Id]);

    private double Carry(Pipeline line, double target, double high, bool roundUp)
    {
        FlowChoice choice;
        if (line.Pumps is { } pumps)
        {
            choice = FlowChoices.Nearest(target, 0, high, 0, pumps.Count, pumps.MinFlowM3PerHour * Hours, pumps.MaxFlowM3PerHour * Hours,
                line.CapacityM3PerHour * Hours, roundUp);
            _state.Pumps[line.Id][_t] = choice.Count;
        }
        else
        {
            choice = new FlowChoice(Math.Clamp(target, 0, Math.Max(0, Math.Min(high, line.CapacityM3PerHour * Hours))), 0);
        }
        _state.Flow[line.Id][_t] = choice.FlowM3;
        return choice.FlowM3;
    }
}
