using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Checking;

/// <summary>A plan's entries by id. Built only for plans whose shape has been checked (one entry per element).</summary>
internal sealed class PlanIndex
{
    private PlanIndex(Plan plan)
    {
        Plants = plan.Plants.ToDictionary(p => p.Plant);
        Stages = plan.Stages.ToDictionary(s => s.Stage);
        Tanks = plan.Tanks.ToDictionary(t => t.Tank);
        Pipelines = plan.Pipelines.ToDictionary(p => p.Pipeline);
        Customers = plan.Customers.ToDictionary(c => c.Customer);
    }

    public IReadOnlyDictionary<PlantId, PlantPlan> Plants { get; }
    public IReadOnlyDictionary<StageId, StagePlan> Stages { get; }
    public IReadOnlyDictionary<TankId, TankPlan> Tanks { get; }
    public IReadOnlyDictionary<PipelineId, PipelinePlan> Pipelines { get; }
    public IReadOnlyDictionary<CustomerId, CustomerPlan> Customers { get; }

    public static PlanIndex Of(Plan plan) => new(plan);
}
