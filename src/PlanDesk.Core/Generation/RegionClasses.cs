using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>
/// The quality classes of every generated region, best first: a low-salinity membrane class and three
/// irrigation classes after the pattern of Regulation (EU) 2020/741 Annex I (demo data, not a check).
/// </summary>
internal static class RegionClasses
{
    public static readonly ClassId Membrane = new("R");
    public static readonly ClassId A = new("A");
    public static readonly ClassId B = new("B");
    public static readonly ClassId C = new("C");

    public const string Conductivity = "conductivityUsPerCm";

    public static IReadOnlyList<QualityClass> All { get; } =
    [
        new(Membrane, "Class R (membrane permeate, low salinity)", 0, Quality(1, 2, 1, 0.2, 2, 120)),
        new(A, "Class A (unrestricted irrigation, urban use)", 1, Quality(10, 10, 10, 5, 10, 1300)),
        new(B, "Class B (crops not eaten raw, golf, street cleaning)", 2, Quality(100, 25, 35, double.NaN, 12, 1350)),
        new(C, "Class C (drip irrigation, industrial cooling)", 3, Quality(1000, 25, 35, double.NaN, 14, 1400)),
    ];

    public static int Rank(ClassId id) => All.First(c => c.Id == id).Rank;

    public static double ConductivityOf(ClassId id) => All.First(c => c.Id == id).Quality[Conductivity];

    /// <summary>True when water of class <paramref name="supplied"/> may serve a use needing <paramref name="required"/>.</summary>
    public static bool Serves(ClassId supplied, ClassId required) => Rank(supplied) <= Rank(required);

    private static IReadOnlyDictionary<string, double> Quality(double eColi, double bod5, double tss, double turbidity, double totalNitrogen, double conductivity)
    {
        var values = new Dictionary<string, double>
        {
            ["eColiPer100Ml"] = eColi,
            ["bod5MgPerL"] = bod5,
            ["tssMgPerL"] = tss,
            ["turbidityNtu"] = turbidity,
            ["totalNitrogenMgPerL"] = totalNitrogen,
            [Conductivity] = conductivity,
        };
        // A class without a turbidity limit simply has no turbidity entry.
        return values.Where(kv => !double.IsNaN(kv.Value)).ToDictionary(kv => kv.Key, kv => kv.Value);
    }
}
