namespace PlanDesk.Core.Physics;

/// <summary>Pumping energy from static head: E = ρ g H V / η.</summary>
public static class Pumping
{
    /// <summary>Density of water, kg/m3 (fresh water near 10 °C, rounded as in common practice).</summary>
    public const double WaterDensityKgPerM3 = 1000.0;

    /// <summary>Standard gravity, m/s2.</summary>
    public const double GravityMPerS2 = 9.81;

    private const double JoulesPerKWh = 3.6e6;

    /// <summary>Electrical energy to lift one m3 by <paramref name="headM"/> metres at pump-and-motor efficiency <paramref name="efficiency"/>, kWh/m3.</summary>
    public static double EnergyKWhPerM3(double headM, double efficiency) =>
        WaterDensityKgPerM3 * GravityMPerS2 * headM / efficiency / JoulesPerKWh;

    /// <summary>Hydraulic power of a flow <paramref name="flowM3PerSecond"/> lifted <paramref name="headM"/> metres, W.</summary>
    public static double HydraulicPowerW(double flowM3PerSecond, double headM) =>
        WaterDensityKgPerM3 * GravityMPerS2 * headM * flowM3PerSecond;

    /// <summary>Shaft (input) power for the same lift at efficiency <paramref name="efficiency"/>, W.</summary>
    public static double ShaftPowerW(double flowM3PerSecond, double headM, double efficiency) =>
        HydraulicPowerW(flowM3PerSecond, headM) / efficiency;
}
