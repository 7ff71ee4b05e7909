namespace PlanDesk.Core.Generation;

/// <summary>A named size of generated region: how many plants and customers, and the default horizon.</summary>
/// <param name="Name">S, M, L or XL.</param>
/// <param name="Days">Days of the default horizon (24 h for S, 168 h for the others).</param>
public sealed record RegionSize(string Name, int Plants, int Customers, int Days)
{
    public static readonly RegionSize S = new("S", 3, 8, 1);
    public static readonly RegionSize M = new("M", 5, 20, 7);
    public static readonly RegionSize L = new("L", 10, 40, 7);
    public static readonly RegionSize XL = new("XL", 50, 200, 7);

    public static IReadOnlyList<RegionSize> All { get; } = [S, M, L, XL];

    /// <summary>The size called <paramref name="name"/> (case-insensitive), or null when there is none.</summary>
    public static RegionSize? Parse(string name) =>
        All.FirstOrDefault(s => string.Equals(s.Name, name.Trim(), StringComparison.OrdinalIgnoreCase));

    public static string Names => string.Join(", ", All.Select(s => s.Name));

    /// <summary>Hours of the default horizon (ignoring daylight-saving days).</summary>
    public int Hours => Days * 24;
}
