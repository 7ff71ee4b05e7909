using System.CommandLine;
using PlanDesk.Cli.Bench;
using PlanDesk.Core.Generation;
using Spectre.Console;

namespace PlanDesk.Cli;

/// <summary>
/// <c>plandesk bench</c>: solves generated regions of several sizes and seeds with each MIP backend and
/// reports model size, times, bounds, the saving against the rule-based baseline, the checker's verdict
/// and peak memory. A benchmark, not a test: figures depend on the machine.
/// </summary>
internal static class BenchCommand
{
    public static Command Create()
    {
        var sizes = new Option<string>("--sizes") { Description = $"Comma-separated region sizes from {RegionSize.Names}.", DefaultValueFactory = _ => "S,M" };
        var seeds = new Option<int>("--seeds") { Description = "Regions per size, seeds 1 to N.", DefaultValueFactory = _ => 1 };
        var solvers = new Option<string[]>("--solver")
        {
            Description = "MIP backend(s) to compare: HIGHS, SCIP; repeat the option or list several.",
            DefaultValueFactory = _ => ["SCIP"],
            AllowMultipleArgumentsPerToken = true,
        };
        var timeLimit = new Option<double>("--time-limit") { Description = "Time limit per solve, seconds.", DefaultValueFactory = _ => 120 };
        var gap = new Option<double>("--gap") { Description = "Relative gap at which a solve stops, percent.", DefaultValueFactory = _ => 0.5 };
        var output = new Option<string>("--out") { Description = "CSV file to write.", DefaultValueFactory = _ => "bench.csv" };
        var inProcess = new Option<bool>("--in-process") { Description = "Run every case in this process (peak memory is then the largest so far)." };
        var noFirstPlan = new Option<bool>("--skip-first-plan") { Description = "When the planner reports no early plan, do not time one with a second solve." };
        var command = new Command("bench", "Benchmark the planner on generated regions and write the figures as a table and CSV.")
        {
            sizes, seeds, solvers, timeLimit, gap, output, inProcess, noFirstPlan,
        };
        command.SetAction(parse =>
        {
            var sizeList = new List<RegionSize>();
            foreach (var name in parse.GetValue(sizes)!.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
            {
                if (RegionSize.Parse(name) is not { } size)
                {
                    Console.Error.WriteLine($"--sizes: '{name}' is not a region size; use a comma-separated list of {RegionSize.Names}");
                    return 2;
                }
                sizeList.Add(size);
            }
            var seedCount = parse.GetValue(seeds);
            var limit = parse.GetValue(timeLimit);
            var gapPercent = parse.GetValue(gap);
            if (sizeList.Count == 0 || seedCount < 1 || limit <= 0 || gapPercent < 0)
            {
                Console.Error.WriteLine("--sizes needs at least one size, --seeds at least 1, --time-limit more than 0 s and --gap 0 % or more");
                return 2;
            }
            var cases = (from size in sizeList
                         from seed in Enumerable.Range(1, seedCount)
                         from solver in parse.GetValue(solvers)!
                         select new BenchCase(size, seed, solver.ToUpperInvariant(), limit, gapPercent, !parse.GetValue(noFirstPlan))).ToList();
            return Run(cases, parse.GetValue(output)!, parse.GetValue(inProcess));
        });
        return command;
    }

    private static int Run(IReadOnlyList<BenchCase> cases, string csvPath, bool inProcess)
    {
        var machine = BenchReport.Machine();
        if (Console.IsOutputRedirected)
        {
            // Written to a file, the tables need not fit a terminal.
            AnsiConsole.Profile.Width = 200;
        }
        AnsiConsole.MarkupLine($"[bold]plandesk bench[/] on {Markup.Escape(machine)}");
        var rows = new List<BenchResult>();
        foreach (var benchCase in cases)
        {
            AnsiConsole.MarkupLine($"  {Markup.Escape(benchCase.ToString())} ...");
            var row = inProcess ? BenchRunner.Run(benchCase) : ChildProcessRunner.Run(benchCase);
            rows.Add(row);
            AnsiConsole.MarkupLine($"    {Markup.Escape(row.Status)}{(row.SolveSeconds is { } s ? $" in {s:0.0} s" : "")}" +
                $"{(row.Note.Length > 0 ? $" ({Markup.Escape(row.Note)})" : "")}");
        }
        BenchReport.Show(rows);
        try
        {
            BenchReport.WriteCsv(rows, csvPath);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            Console.Error.WriteLine($"--out: cannot write {csvPath}: {e.Message}; choose a file you can write");
            return 2;
        }
        AnsiConsole.MarkupLine($"wrote {Markup.Escape(Path.GetFullPath(csvPath))}");
        return 0;
    }
}
