using PlanDesk.Core.Checking;

namespace PlanDesk.Core.Tests.Fixtures;

internal static class ExpectViolation
{
    /// <summary>Asserts that the report holds exactly one violation, of this kind, place and period.</summary>
    public static Violation Only(CheckReport report, string kind, string where, int period)
    {
        var found = Assert.Single(report.Violations);
        Assert.Equal((kind, where, (int?)period), (found.Kind, found.Where, found.Period));
        return found;
    }
}
