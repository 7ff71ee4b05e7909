using System.Globalization;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Solving;

/// <summary>
/// Creates and configures OR-Tools solvers, working around the traps measured in ORTOOLS-NOTES.md:
/// HiGHS ignores RELATIVE_MIP_GAP (its own option string is used), its best bound is the objective (a true bound
/// comes from elsewhere), hints crash it (none are given), and statuses outside the enum mean "no plan".
/// </summary>
internal static class SolverBackend
{
    public const string Highs = "HIGHS";
    public const string Scip = "SCIP";
    public static IReadOnlyList<string> Supported { get; } = [Highs, Scip];

    // HiGHS keeps one thread pool per process, sized by its first solve; a later solve asking for another size
    // returns NOT_SOLVED (measured with 1.12). So every HiGHS solve runs on one thread: its LP relaxation took the
    // same time on one thread as on two (generated M seed 2: 0.8-1.0 s against 0.8-1.1 s, measured), and grouped
    // solves already run one solve per core.
    private const int HighsThreads = 1;

    /// <summary>The MIP solver for a backend name (case-insensitive), or null for an unknown name.</summary>
    public static Solver? CreateMip(string backend) => Normalise(backend) switch
    {
        Highs => Solver.CreateSolver("HIGHS"),
        Scip => Solver.CreateSolver("SCIP"),
        _ => null,
    };

    public static string? Normalise(string backend) =>
        Supported.FirstOrDefault(s => string.Equals(s, backend, StringComparison.OrdinalIgnoreCase));

    /// <summary>Applies time limit, gap and threads; returns the parameters to pass to <c>Solve</c>.</summary>
    public static MPSolverParameters ConfigureMip(Solver solver, string backend, SolveOptions options, double timeLimitSeconds)
    {
        solver.SuppressOutput();
        solver.SetTimeLimit(Milliseconds(timeLimitSeconds));
        var parameters = new MPSolverParameters();
        var gap = Math.Max(options.GapPercent, 0) / 100.0;
        if (Normalise(backend) == Highs)
        {
            // Returns false even when applied (measured); an unknown key would make Solve return status 85.
            solver.SetSolverSpecificParametersAsString(
                $"mip_rel_gap={gap.ToString("R", CultureInfo.InvariantCulture)},threads={HighsThreads},output_flag=false");
        }
        else
        {
            // SCIP's concurrent mode (more than one thread) was much worse on plans of this kind (measured).
            solver.SetNumThreads(1);
            parameters.SetDoubleParam(MPSolverParameters.DoubleParam.RELATIVE_MIP_GAP, gap);
        }
        return parameters;
    }

    /// <summary>An LP solver for the relaxation bound: HiGHS's LP, the fastest measured.</summary>
    public static Solver CreateRelaxation(double timeLimitSeconds)
    {
        var solver = Solver.CreateSolver("HIGHS_LP");
        solver.SuppressOutput();
        solver.SetTimeLimit(Milliseconds(timeLimitSeconds));
        solver.SetSolverSpecificParametersAsString($"threads={HighsThreads},output_flag=false");
        return solver;
    }

    /// <summary>An LP solver whose duals are right (HiGHS's LP wrapper returns row activities as duals).</summary>
    public static Solver CreateDualLp(double timeLimitSeconds)
    {
        var solver = Solver.CreateSolver("GLOP");
        solver.SuppressOutput();
        solver.SetTimeLimit(Milliseconds(timeLimitSeconds));
        solver.SetSolverSpecificParametersAsString("use_dual_simplex:true");
        return solver;
    }

    /// <summary>Plan status from a solver result; anything but optimal or feasible (including the undefined
    /// codes 85 and 99) means no plan.</summary>
    public static string StatusOf(Solver.ResultStatus status) => status switch
    {
        Solver.ResultStatus.OPTIMAL => SolveStatus.Optimal,
        Solver.ResultStatus.FEASIBLE => SolveStatus.Feasible,
        _ => SolveStatus.NoPlan,
    };

    public static string Describe(Solver.ResultStatus status) =>
        Enum.IsDefined(status) ? status.ToString() : $"undefined status {(int)status}";

    private static long Milliseconds(double seconds) => (long)Math.Clamp(seconds * 1000, 1, int.MaxValue);
}
