using System.CommandLine;
using System.Globalization;
using NodaTime;
using NodaTime.Text;
using PlanDesk.Core.Baseline;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Planning;
using Spectre.Console;

namespace PlanDesk.Cli;

/// <summary><c>plandesk solve NETWORK</c>: plans the horizon as one MILP (or by the operators' rules with <c>--method rules</c>),
/// writes the plan, the per-plant day targets and a summary with the checker's verdict and the saving against the rules.</summary>
internal static class SolveCommand
{
    public const int PlanWritten = 0;
    public const int BadInput = 1;
    public const int NoPlan = 2;

    public static Command Create()
    {
        var network = new Argument<string>("NETWORK") { Description = "The network file (JSON); CSV paths in it are relative to it." };
        var start = new Option<string?>("--start") { Description = "First local day of the plan, YYYY-MM-DD (default: the file's horizon)." };
        var days = new Option<int?>("--days") { Description = "Days to plan, 1 to 7 (default: the file's horizon, else 1)." };
        var timeLimit = new Option<double>("--time-limit") { Description = "Seconds the solver may run.", DefaultValueFactory = _ => 60 };
        var gap = new Option<double>("--gap") { Description = "Relative gap at which the search stops, percent.", DefaultValueFactory = _ => 0.5 };
        var solver = new Option<string>("--solver") { Description = "MIP backend: SCIP or HIGHS.", DefaultValueFactory = _ => "SCIP" };
        var output = new Option<string>("--out") { Description = "Where to write the plan (JSON).", DefaultValueFactory = _ => "plan.json" };
        var targets = new Option<string>("--targets") { Description = "Folder for the per-plant day targets (JSON, CSV, text).", DefaultValueFactory = _ => "targets" };
        var summaryJson = new Option<string?>("--summary-json") { Description = "Also write the summary as JSON to this file." };
        var method = new Option<string>("--method")
        {
            Description = "milp: the least-cost plan (default); rules: what operators do without a planner (the baseline every saving is measured against).",
            DefaultValueFactory = _ => MilpMethod,
        };
        var command = new Command("solve", "Plan a horizon at least cost and write the plan, the plant targets and a summary.")
        {
            network, start, days, timeLimit, gap, solver, output, targets, summaryJson, method,
        };
        command.SetAction(parse => Run(new SolveRequest(
            parse.GetValue(network)!,
            parse.GetValue(start),
            parse.GetValue(days),
            new SolveOptions
            {
                TimeLimitSeconds = parse.GetValue(timeLimit),
                GapPercent = parse.GetValue(gap),
                Solver = parse.GetValue(solver)!,
            },
            parse.GetValue(output)!,
            parse.GetValue(targets)!,
            parse.GetValue(summaryJson),
            parse.GetValue(method)!)));
        return command;
    }

    public const string MilpMethod = "milp";

    public sealed record SolveRequest(string NetworkPath, string? Start, int? Days, SolveOptions Options, string PlanPath, string TargetsFolder,
        string? SummaryJsonPath, string Method = MilpMethod);

    /// <summary>Runs one solve; returns 0 with a plan, 1 for bad input (said on stderr), 2 when the solver found no plan.</summary>
    public static int Run(SolveRequest request, TextWriter? output = null, TextWriter? errors = null)
    {
        output ??= Console.Out;
        errors ??= Console.Error;
        var planningCase = LoadCase(request, errors);
        if (planningCase is null)
        {
            return BadInput;
        }
        if (InvalidOptions(request) is { } optionProblem)
        {
            errors.WriteLine(optionProblem);
            return BadInput;
        }

        var rules = request.Method == RuleBasedBaseline.Method;
        var plan = rules ? RuleBasedBaseline.Build(planningCase) : SolveWithProgress(planningCase, request.Options, errors);
        File.WriteAllText(request.PlanPath, PlanJson.Serialize(plan));
        var targetFiles = TargetWriters.WriteAll(PlantDayTargetsBuilder.Build(planningCase, plan), request.TargetsFolder);
        // Every summary carries the independent checker's verdict and the saving against the rule-based baseline.
        var summary = BaselineComparison.Of(planningCase, plan, rules ? plan : null).AddTo(PlanSummary.From(planningCase, plan));
        if (request.SummaryJsonPath is { } summaryPath)
        {
            File.WriteAllText(summaryPath, summary.ToJson());
        }

        SolveSummaryView.Write(summary, plan, output);
        output.WriteLine();
        output.WriteLine($"Plan written to {request.PlanPath}; {targetFiles.Count} target files in {request.TargetsFolder}" +
                         (request.SummaryJsonPath is null ? "" : $"; summary in {request.SummaryJsonPath}") + ".");
        output.WriteLine("Caution: " + Cautions.TargetSheet);
        return plan.Solve.Status == SolveStatus.NoPlan ? NoPlan : PlanWritten;
    }

    private static PlanningCase? LoadCase(SolveRequest request, TextWriter errors)
    {
        var loaded = NetworkLoader.Load(request.NetworkPath);
        if (loaded.Network is not { } network)
        {
            errors.WriteLine($"{request.NetworkPath}: {loaded.Problems.Count} problem{(loaded.Problems.Count == 1 ? "" : "s")} found; nothing was solved.");
            foreach (var problem in loaded.Problems)
            {
                errors.WriteLine($"  {problem}");
            }
            return null;
        }
        LocalDate startDate;
        if (request.Start is { } text)
        {
            var parsed = LocalDatePattern.Iso.Parse(text);
            if (!parsed.Success)
            {
                errors.WriteLine($"--start: '{text}' is not a date; write it as YYYY-MM-DD, e.g. 2027-03-26");
                return null;
            }
            startDate = parsed.Value;
        }
        else if (network.DefaultStartDate is { } fileStart)
        {
            startDate = fileStart;
        }
        else
        {
            errors.WriteLine($"{request.NetworkPath} names no horizon: give the first day with --start YYYY-MM-DD");
            return null;
        }
        var days = request.Days ?? (request.Start is null ? network.DefaultDays : 1);
        if (days < 1 || days > Horizon.MaxDays)
        {
            errors.WriteLine($"--days: {days} is outside 1 to {Horizon.MaxDays}; plan one to seven days");
            return null;
        }
        var created = PlanningCase.Create(network, startDate, days);
        foreach (var problem in created.Problems)
        {
            errors.WriteLine($"{request.NetworkPath}: {problem}");
        }
        return created.Case;
    }

    private static string? InvalidOptions(SolveRequest request)
    {
        var options = request.Options;
        if (request.Method != MilpMethod && request.Method != RuleBasedBaseline.Method)
        {
            return $"--method: '{request.Method}' is not offered; choose {MilpMethod} (the default) or {RuleBasedBaseline.Method}";
        }
        if (!(options.TimeLimitSeconds > 0))
        {
            return $"--time-limit: {options.TimeLimitSeconds.ToString(CultureInfo.InvariantCulture)} s; give a positive number of seconds";
        }
        if (!(options.GapPercent >= 0 && options.GapPercent < 100))
        {
            return $"--gap: {options.GapPercent.ToString(CultureInfo.InvariantCulture)} %; give a percentage from 0 to below 100, e.g. 0.5";
        }
        if (!string.Equals(options.Solver, "HIGHS", StringComparison.OrdinalIgnoreCase) && !string.Equals(options.Solver, "SCIP", StringComparison.OrdinalIgnoreCase))
        {
            return $"--solver: '{options.Solver}' is not offered; choose SCIP (the default) or HIGHS";
        }
        return null;
    }

    // Progress goes to stderr so stdout carries only the summary; a terminal sees a live status line.
    private static Plan SolveWithProgress(PlanningCase planningCase, SolveOptions options, TextWriter errors)
    {
        var console = AnsiConsole.Create(new AnsiConsoleSettings { Out = new AnsiConsoleOutput(errors) });
        if (!console.Profile.Capabilities.Interactive)
        {
            // Without a terminal: a line per phase and one every 5 s while solving, for logs.
            var (lastPhase, lastSeconds) = ("", 0.0);
            return Planner.Solve(planningCase, options, new InlineProgress(p =>
            {
                if (p.Phase != lastPhase || p.ElapsedSeconds - lastSeconds >= 5)
                {
                    (lastPhase, lastSeconds) = (p.Phase, p.ElapsedSeconds);
                    errors.WriteLine(ProgressText(p));
                }
            }));
        }
        Plan? plan = null;
        console.Status().Start("building the model", context =>
        {
            plan = Planner.Solve(planningCase, options, new InlineProgress(p => context.Status(Markup.Escape(ProgressText(p)))));
        });
        return plan!;
    }

    private static string ProgressText(SolveProgress progress)
    {
        var text = $"{progress.Phase}: {progress.ElapsedSeconds:0.0} s of {progress.TimeLimitSeconds:0.#} s";
        if (progress.Incumbent is { } incumbent)
        {
            text += $", best plan {Amounts.Format(incumbent, 2)}";
        }
        if (progress.BestBound is { } bound)
        {
            text += $", bound {Amounts.Format(bound, 2)}";
        }
        return progress.GapPercent is { } gap ? text + $", gap {gap:0.##} %" : text;
    }

    private sealed class InlineProgress(Action<SolveProgress> report) : IProgress<SolveProgress>
    {
        public void Report(SolveProgress value) => report(value);
    }
}
