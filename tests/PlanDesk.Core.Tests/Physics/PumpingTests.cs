using PlanDesk.Core.Physics;

namespace PlanDesk.Core.Tests.Physics;

/// <summary>E = rho g H V / eta against worked values. Source for every check here:
/// [pub, general physics; the arithmetic is checkable by hand] (REFERENCES.md, Energy, Pumping).</summary>
public class PumpingTests
{
    [Fact]
    public void LiftingOneCubicMetreFiftyMetresAtSeventyFivePercentTakes0Point1817KWh()
    {
        // [pub, general physics]: 1 m3 lifted 50 m at eta 0.75, g 9.81 -> 654 kJ = 0.1817 kWh/m3
        Assert.Equal(0.1817, Pumping.EnergyKWhPerM3(50, 0.75), 4);
    }

    [Fact]
    public void FiftyLitresPerSecondLiftedTwentyMetresAtSeventyFivePercentNeeds13080Watts()
    {
        // [pub, general physics]: Q 0.05 m3/s, H 20 m, eta 0.75 -> 13 080 W
        Assert.Equal(13_080, Pumping.ShaftPowerW(0.05, 20, 0.75), 0);
    }

    [Fact]
    public void OneHundredThirtyCubicMetresPerHourAtEightyFiveMetresNeeds30Point1KWHydraulicAnd50Point2KWShaft()
    {
        // [pub, general physics]: 130 m3/h, H 85 m, eta 0.60 -> 30.1 kW hydraulic, 50.2 kW shaft
        const double flowM3PerSecond = 130.0 / 3600.0;

        Assert.Equal(30.1, Pumping.HydraulicPowerW(flowM3PerSecond, 85) / 1000, 1);
        Assert.Equal(50.2, Pumping.ShaftPowerW(flowM3PerSecond, 85, 0.60) / 1000, 1);
    }
}
