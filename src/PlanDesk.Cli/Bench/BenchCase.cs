using PlanDesk.Core.Generation;

namespace PlanDesk.Cli.Bench;

/// <summary>One benchmark case: a generated region of a size and seed, solved by one MIP backend.</summary>
/// <param name="TimeLimitSeconds">Time limit of the planner's solve.</param>
/// <param name="GapPercent">Relative gap at which the solve stops.</param>
/// <param name="MeasureFirstPlan">When the planner reports no early plan, solve a second time, stopping at the first plan found, to time it.</param>
internal sealed record BenchCase(RegionSize Size, int Seed, string Solver, double TimeLimitSeconds, double GapPercent, bool MeasureFirstPlan)
{
    public override string ToString() => $"{Size.Name} seed {Seed} {Solver}";
}
