using System.Globalization;
using PlanDesk.Core.Plans;
using Spectre.Console;

namespace PlanDesk.Cli;

/// <summary>The summary of a solve as tables: solve figures, cost by component, energy, permits, problems.</summary>
internal static class SolveSummaryView
{
    public static void Write(PlanSummary summary, Plan plan, TextWriter output)
    {
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(output),
            Ansi = output == Console.Out ? AnsiSupport.Detect : AnsiSupport.No,
        });
        console.Write(SolveTable(summary, plan));
        if (summary.Status == SolveStatus.NoPlan)
        {
            ProblemTable(console, summary);
            return;
        }
        console.Write(CostTable(summary));
        console.Write(BaselineTable(summary));
        console.Write(EnergyTable(summary));
        if (summary.Permits.Count > 0)
        {
            console.Write(PermitTable(summary));
        }
        ProblemTable(console, summary);
    }

    private static Table SolveTable(PlanSummary summary, Plan plan)
    {
        var table = new Table().Title("Solve").AddColumns("", "");
        table.ShowHeaders = false;
        table.AddRow("status", summary.Status);
        table.AddRow("solver", Markup.Escape(plan.Solve.Solver));
        table.AddRow("objective", summary.Objective is { } objective ? Amounts.Money(objective, summary.Currency) : "-");
        table.AddRow("best bound", summary.BestBound is { } bound ? Amounts.Money(bound, summary.Currency) : "unknown");
        table.AddRow("gap", summary.GapPercent is { } gap ? $"{gap.ToString("0.###", CultureInfo.InvariantCulture)} %" : "unknown");
        table.AddRow("time", $"{summary.SolveSeconds.ToString("0.0", CultureInfo.InvariantCulture)} s");
        table.AddRow("model", $"{Amounts.Format(summary.ModelSize.Variables)} variables ({Amounts.Format(summary.ModelSize.IntegerVariables)} integer), " +
                              $"{Amounts.Format(summary.ModelSize.Constraints)} constraints");
        foreach (var note in plan.Solve.Notes)
        {
            table.AddRow("note", Markup.Escape(note));
        }
        return table;
    }

    private static Table CostTable(PlanSummary summary)
    {
        var costs = summary.Costs;
        var table = new Table().Title($"Cost ({summary.Currency})").AddColumn("component").AddColumn(new TableColumn("amount").RightAligned());
        var rows = new (string Name, double Amount)[]
        {
            ("energy bought", costs.EnergyImport), ("energy sold (credit)", -costs.EnergyExportCredit), ("demand charge", costs.DemandCharge),
            ("unit starts", costs.UnitStarts), ("chemicals", costs.Chemicals), ("carbon", costs.Carbon),
            ("shortfall penalty", costs.ShortfallPenalty), ("bypass penalty", costs.BypassPenalty), ("permit penalty", costs.PermitPenalty),
            ("outfall penalty", costs.OutfallPenalty), ("tank end penalty", costs.TankEndPenalty), ("tank limit penalty", costs.TankLimitPenalty),
        };
        foreach (var (name, amount) in rows.Where(r => Math.Abs(r.Amount) >= 0.005))
        {
            table.AddRow(name, Money(amount));
        }
        table.AddRow("[bold]operating cost[/]", Money(costs.Operating));
        table.AddRow("[bold]penalties[/]", Money(costs.Penalties));
        table.AddRow("[bold]total (objective)[/]", Money(costs.Total));
        return table;
    }

    // The independent checker's verdict and the saving against what operators would do without a planner.
    private static Table BaselineTable(PlanSummary summary)
    {
        var table = new Table().Title("Check and baseline").AddColumns("", "");
        table.ShowHeaders = false;
        table.AddRow("checker", summary.CheckViolations switch
        {
            null => "not run",
            0 => "no violations",
            var n => $"{n} violation{(n == 1 ? "" : "s")}: run plandesk check for the list",
        });
        table.AddRow("rule-based plan", summary.BaselineCost is { } baseline ? Amounts.Money(baseline, summary.Currency) : "-");
        table.AddRow("saving (total)", Percent(summary.SavingPercent));
        table.AddRow("saving (operating)", Percent(summary.OperatingSavingPercent));
        return table;
    }

    private static string Percent(double? value) => value is { } p ? $"{p.ToString("0.0", CultureInfo.InvariantCulture)} %" : "-";

    private static Table EnergyTable(PlanSummary summary)
    {
        var table = new Table().Title("Energy per plant (kWh over the horizon)")
            .AddColumns("plant", "load", "engine", "import", "export", "self-sufficiency", "peak import kW");
        foreach (var plant in summary.Energy)
        {
            table.AddRow(Markup.Escape(plant.Name), Amounts.Format(plant.LoadKWh), Amounts.Format(plant.EngineKWh), Amounts.Format(plant.ImportKWh),
                Amounts.Format(plant.ExportKWh), plant.SelfSufficiencyPercent is { } share ? $"{share.ToString("0.#", CultureInfo.InvariantCulture)} %" : "-",
                Amounts.Format(plant.PeakImportKw));
        }
        return table;
    }

    private static Table PermitTable(PlanSummary summary)
    {
        var table = new Table().Title("Permit headroom (kg)").AddColumns("plant", "nutrient", "cap", "day / month", "load", "cap kg", "headroom");
        foreach (var permit in summary.Permits)
        {
            var when = permit.Period == "daily" ? permit.Day.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) : permit.Day.ToString("yyyy-MM", CultureInfo.InvariantCulture);
            var headroom = Amounts.Format(permit.HeadroomKg, 1);
            table.AddRow(permit.Plant.Value, permit.Nutrient, permit.Period, when, Amounts.Format(permit.LoadKg, 1), Amounts.Format(permit.CapKg, 1),
                permit.HeadroomKg < -1e-3 ? $"[red]{headroom}[/]" : headroom);
        }
        return table;
    }

    private static void ProblemTable(IAnsiConsole console, PlanSummary summary)
    {
        if (summary.Problems.Count == 0)
        {
            console.WriteLine("No problems: every customer served, every permit and limit kept.");
            return;
        }
        var table = new Table().Title($"Problems ({summary.Problems.Count})").AddColumns("kind", "where", "what");
        foreach (var problem in summary.Problems)
        {
            table.AddRow(problem.Kind, Markup.Escape(problem.Where), Markup.Escape(problem.Message));
        }
        console.Write(table);
    }

    private static string Money(double amount) => Amounts.Format(amount, 2);
}
