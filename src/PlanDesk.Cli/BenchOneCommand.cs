using System.CommandLine;
using System.Globalization;
using PlanDesk.Cli.Bench;
using PlanDesk.Core.Generation;

namespace PlanDesk.Cli;

/// <summary><c>plandesk bench-one</c>: one benchmark case, run by <c>plandesk bench</c> in a child process; not for people.</summary>
internal static class BenchOneCommand
{
    public static Command Create()
    {
        var size = new Option<string>("--size") { Required = true };
        var seed = new Option<int>("--seed") { Required = true };
        var solver = new Option<string>("--solver") { Required = true };
        var timeLimit = new Option<double>("--time-limit") { Required = true };
        var gap = new Option<double>("--gap") { Required = true };
        var firstPlan = new Option<bool>("--first-plan");
        var result = new Option<string>("--result") { Required = true };
        var command = new Command("bench-one", "Run one benchmark case and write its figures as JSON (used by bench).")
        {
            size, seed, solver, timeLimit, gap, firstPlan, result,
        };
        command.Hidden = true;
        command.SetAction(parse =>
        {
            var regionSize = RegionSize.Parse(parse.GetValue(size)!);
            if (regionSize is null)
            {
                Console.Error.WriteLine($"--size: use one of {RegionSize.Names}");
                return 2;
            }
            var benchCase = new BenchCase(regionSize, parse.GetValue(seed), parse.GetValue(solver)!, parse.GetValue(timeLimit),
                parse.GetValue(gap), parse.GetValue(firstPlan));
            ChildProcessRunner.WriteResult(BenchRunner.Run(benchCase), parse.GetValue(result)!);
            return 0;
        });
        return command;
    }

    /// <summary>The command line that runs <paramref name="benchCase"/> and writes its row to <paramref name="resultFile"/>.</summary>
    public static IEnumerable<string> Arguments(BenchCase benchCase, string resultFile)
    {
        yield return "bench-one";
        yield return "--size";
        yield return benchCase.Size.Name;
        yield return "--seed";
        yield return benchCase.Seed.ToString(CultureInfo.InvariantCulture);
        yield return "--solver";
        yield return benchCase.Solver;
        yield return "--time-limit";
        yield return benchCase.TimeLimitSeconds.ToString("R", CultureInfo.InvariantCulture);
        yield return "--gap";
        yield return benchCase.GapPercent.ToString("R", CultureInfo.InvariantCulture);
        if (benchCase.MeasureFirstPlan)
        {
            yield return "--first-plan";
        }
        yield return "--result";
        yield return resultFile;
    }
}
