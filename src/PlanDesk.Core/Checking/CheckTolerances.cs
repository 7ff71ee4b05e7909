namespace PlanDesk.Core.Checking;

/// <summary>
/// How far a plan may stray from an equality or a bound before the checker calls it a violation.
/// A quantity q is within tolerance of a target x when |q − x| ≤ absolute + relative·max(|q|, |x|):
/// the absolute part covers rounding near zero, the relative part a solver's feasibility tolerance on
/// large volumes. Costs agree when they differ by at most the larger of <see cref="CostAbsolute"/> and
/// <see cref="CostRelative"/>·max(|a|, |b|).
/// </summary>
public sealed record CheckTolerances
{
    /// <summary>Absolute slack on volumes (m3), gas (Nm3), energy (kWh) and loads (kg). Default 1e-3.</summary>
    public double Absolute { get; init; } = 1e-3;

    /// <summary>Relative slack on the same quantities. Default 1e-6.</summary>
    public double Relative { get; init; } = 1e-6;

    /// <summary>Absolute slack on a money amount, currency. Default 0.01.</summary>
    public double CostAbsolute { get; init; } = 0.01;

    /// <summary>Relative slack on a money amount. Default 1e-4 (0.01 %).</summary>
    public double CostRelative { get; init; } = 1e-4;

    public static CheckTolerances Default { get; } = new();

    /// <summary>The slack allowed between two quantities of size <paramref name="a"/> and <paramref name="b"/>.</summary>
    public double Slack(double a, double b) => Absolute + Relative * Math.Max(Math.Abs(a), Math.Abs(b));

    /// <summary>The slack allowed between two money amounts.</summary>
    public double CostSlack(double a, double b) => Math.Max(CostAbsolute, CostRelative * Math.Max(Math.Abs(a), Math.Abs(b)));

    /// <summary>True when <paramref name="value"/> is above <paramref name="limit"/> by more than the slack.</summary>
    public bool Above(double value, double limit) => value - limit > Slack(value, limit);

    /// <summary>True when <paramref name="value"/> is below <paramref name="limit"/> by more than the slack.</summary>
    public bool Below(double value, double limit) => limit - value > Slack(value, limit);

    /// <summary>True when the two quantities differ by more than the slack.</summary>
    public bool Differ(double a, double b) => Math.Abs(a - b) > Slack(a, b);

    /// <summary>True when the two money amounts differ by more than the cost slack.</summary>
    public bool CostsDiffer(double a, double b) => Math.Abs(a - b) > CostSlack(a, b);
}
