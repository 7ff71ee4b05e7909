using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using PlanDesk.Core.Checking;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;

namespace PlanDesk.Cli;

/// <summary>
/// <c>plandesk check NETWORK PLAN</c>: the independent checker on a plan file (from the planner, the baseline or a
/// hand edit), over the horizon the plan states. Exit 0 and one line when nothing is wrong; exit 1 and a table of
/// violations otherwise; exit 2 when the files cannot be read as a network and a plan.
/// </summary>
internal static class CheckCommand
{
    public const int NoViolations = 0;
    public const int Violations = 1;
    public const int CannotCheck = 2;

    public static Command Create()
    {
        var network = new Argument<string>("NETWORK") { Description = "The network file (JSON) the plan was made for." };
        var plan = new Argument<string>("PLAN") { Description = "The plan file (JSON) to check." };
        var command = new Command("check", "Check a plan against its network: balances, limits, units, classes, permits and cost.") { network, plan };
        command.SetAction(parse => Run(parse.GetValue(network)!, parse.GetValue(plan)!, Console.Out, Console.Error));
        return command;
    }

    public static int Run(string networkPath, string planPath, TextWriter output, TextWriter errors)
    {
        var loaded = NetworkLoader.Load(networkPath);
        if (loaded.Network is not { } network)
        {
            errors.WriteLine($"{networkPath}: {loaded.Problems.Count} problem{(loaded.Problems.Count == 1 ? "" : "s")} found; nothing was checked.");
            foreach (var problem in loaded.Problems)
            {
                errors.WriteLine($"  {problem}");
            }
            return CannotCheck;
        }
        if (ReadPlan(planPath, errors) is not { } plan)
        {
            return CannotCheck;
        }
        var created = PlanningCase.Create(network, plan.StartDate, plan.Days);
        if (created.Case is not { } planningCase)
        {
            errors.WriteLine($"{planPath}: the plan's horizon ({plan.StartDate:yyyy-MM-dd}, {plan.Days} days) cannot be checked against {networkPath}:");
            foreach (var problem in created.Problems)
            {
                errors.WriteLine($"  {problem}");
            }
            return CannotCheck;
        }

        var report = PlanChecker.Check(planningCase, plan);
        if (report.Passed)
        {
            var costs = report.RecomputedCosts!;
            output.WriteLine($"{planPath}: no violations; recomputed cost {Money(costs.Total)} {network.Currency} " +
                             $"(operating {Money(costs.Operating)}, penalties {Money(costs.Penalties)}).");
            return NoViolations;
        }
        output.WriteLine($"{planPath}: {report.Violations.Count} violation{(report.Violations.Count == 1 ? "" : "s")} found" +
                         (report.RecomputedCosts is { } recomputed ? $"; recomputed cost {Money(recomputed.Total)} {network.Currency}." : "; the plan is too malformed to cost."));
        ViolationTable.Write(report.Violations, output);
        return Violations;
    }

    /// <summary>Reads a plan file; a mistake in it is said in one line naming the file, the JSON path and the line.</summary>
    public static Plan? ReadPlan(string path, TextWriter errors)
    {
        string json;
        try
        {
            json = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            errors.WriteLine($"{path}: the plan cannot be read ({e.Message}); check the path");
            return null;
        }
        try
        {
            if (PlanJson.Deserialize(json) is { } plan)
            {
                return plan;
            }
            errors.WriteLine($"{path}: the file holds no plan (it is JSON null); give a plan written by plandesk solve");
        }
        catch (JsonException e)
        {
            var line = e.LineNumber is { } n ? $" (line {n + 1})" : "";
            errors.WriteLine($"{path}: at {e.Path ?? "$"}{line}: {Reason(e)}; fix the value there or write the plan again with plandesk solve");
        }
        return null;
    }

    // System.Text.Json appends "Path: ... | LineNumber: ..." to its messages; the place is said separately.
    private static string Reason(JsonException e)
    {
        var message = e.Message;
        var cut = message.IndexOf(" Path:", StringComparison.Ordinal);
        return (cut > 0 ? message[..cut] : message).TrimEnd('.');
    }

    private static string Money(double amount) => amount.ToString("#,0.00", CultureInfo.InvariantCulture);
}
