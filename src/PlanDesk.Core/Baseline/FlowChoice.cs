namespace PlanDesk.Core.Baseline;

/// <summary>A flow the baseline settles on and how many identical units (stage units or pumps) carry it.</summary>
internal readonly record struct FlowChoice(double FlowM3, int Count);

/// <summary>
/// Picks a flow that identical units can carry: with n units on, n·least ≤ flow ≤ n·most (and never above
/// the line's capacity), n between a required and an allowed count. The operator's aim is a target flow,
/// kept within [low, high] when any feasible flow lies there.
/// </summary>
internal static class FlowChoices
{
    /// <param name="target">The flow aimed at, m3 in the period.</param>
    /// <param name="low">Least acceptable flow (e.g. what keeps a tank above its minimum).</param>
    /// <param name="high">Most acceptable flow (source water left, room downstream).</param>
    /// <param name="fewestUnits">Units that must run (minimum run time).</param>
    /// <param name="mostUnits">Units that may run (availability).</param>
    /// <param name="unitLeastM3">Least flow of one running unit in the period.</param>
    /// <param name="unitMostM3">Most flow of one running unit in the period.</param>
    /// <param name="capacityM3">Most flow of the line whatever the units.</param>
    /// <param name="roundUp">Prefer the smallest feasible flow at or above the target (a daily delivery may
    /// come in larger lumps) over the closest one.</param>
    public static FlowChoice Nearest(double target, double low, double high, int fewestUnits, int mostUnits,
        double unitLeastM3, double unitMostM3, double capacityM3 = double.PositiveInfinity, bool roundUp = false)
    {
        // The most acceptable flow is physical (water there is, room there is); the least is a wish that yields to it.
        high = Math.Max(high, 0);
        low = Math.Min(low, high);
        var best = default(FlowChoice?);
        var bestScore = (Outside: double.MaxValue, Below: 1, Distance: double.MaxValue);
        for (var n = fewestUnits; n <= Math.Max(fewestUnits, mostUnits); n++)
        {
            var least = n * unitLeastM3;
            var most = Math.Min(n * unitMostM3, capacityM3);
            if (n > 0 && least > most)
            {
                continue;
            }
            double value;
            double outside;
            if (Math.Max(least, low) <= Math.Min(most, high))
            {
                value = Math.Clamp(target, Math.Max(least, low), Math.Min(most, high));
                outside = 0;
            }
            else
            {
                value = most < low ? most : least;
                outside = most < low ? low - most : least - high;
            }
            var below = roundUp && value < target - 1e-9 ? 1 : 0;
            var score = (outside, below, Math.Abs(value - target));
            // Fewer units win ties because n rises through the loop.
            if (score.CompareTo(bestScore) < 0)
            {
                best = new FlowChoice(value, n);
                bestScore = score;
            }
        }
        return best ?? new FlowChoice(0, fewestUnits);
    }
}
