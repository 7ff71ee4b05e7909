using System.Globalization;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Collects violations while the check families run, and words them the same way.</summary>
internal sealed class Findings(PlanningCase planningCase, CheckTolerances tolerances)
{
    public List<Violation> Items { get; } = [];
    public CheckTolerances Tolerances { get; } = tolerances;
    public PlanningCase Case { get; } = planningCase;

    /// <summary>A rule broken in one period; the message is prefixed with the period's local time.</summary>
    public void AtPeriod(string kind, string where, int period, double amount, string unit, double? limit, string message, bool penalised = false)
    {
        var p = Case.Horizon.Periods[period];
        var day = Case.Horizon.Days[p.Day].Date;
        Items.Add(new Violation(kind, where, period, p.LocalStart, day, amount, unit, limit, $"{When(period)}: {message}", penalised));
    }

    /// <summary>A rule broken over one local day.</summary>
    public void AtDay(string kind, string where, int day, double amount, string unit, double? limit, string message, bool penalised = false)
    {
        var date = Case.Horizon.Days[day].Date;
        Items.Add(new Violation(kind, where, null, null, date, amount, unit, limit, $"{date:yyyy-MM-dd}: {message}", penalised));
    }

    /// <summary>A rule broken by the plan as a whole (its shape, its cost, a month).</summary>
    public void Overall(string kind, string where, double amount, string unit, double? limit, string message, bool penalised = false) =>
        Items.Add(new Violation(kind, where, null, null, null, amount, unit, limit, message, penalised));

    /// <summary>Reports every period where <paramref name="values"/> is below zero by more than the slack.</summary>
    public void NonNegative(string where, string field, double[] values, string unit)
    {
        for (var t = 0; t < values.Length; t++)
        {
            if (Tolerances.Below(values[t], 0))
            {
                AtPeriod(ViolationKind.NegativeValue, where, t, -values[t], unit, 0, $"{where}: {field} is {Q(values[t])} {unit}; it cannot be negative");
            }
        }
    }

    public string When(int period) => Case.Horizon.Periods[period].LocalStart.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    /// <summary>A quantity for a message: thousands separated, at most three decimals.</summary>
    public static string Q(double value) => value.ToString("#,0.###", CultureInfo.InvariantCulture);
}
