using System.Globalization;

namespace PlanDesk.Core.Plans;

/// <summary>Numbers as people read them in messages and sheets: "1 240", "12.5".</summary>
public static class Amounts
{
    private static readonly NumberFormatInfo Grouped = new() { NumberGroupSeparator = " ", NumberDecimalSeparator = "." };

    /// <summary>A number with a space between thousands and at most <paramref name="decimals"/> decimals.</summary>
    public static string Format(double value, int decimals = 0)
    {
        var rounded = Math.Round(value, decimals);
        if (rounded == 0)
        {
            rounded = 0; // no "-0"
        }
        var pattern = decimals == 0 ? "#,0" : "#,0." + new string('#', decimals);
        return rounded.ToString(pattern, Grouped);
    }

    /// <summary>Money with two decimals and grouped thousands, e.g. "1 234.50 EUR".</summary>
    public static string Money(double value, string currency) =>
        (Math.Round(value, 2) == 0 ? 0 : value).ToString("#,0.00", Grouped) + " " + currency;
}
