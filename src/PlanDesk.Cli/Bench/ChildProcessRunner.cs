using System.Diagnostics;
using System.Reflection;
using System.Text.Json;

namespace PlanDesk.Cli.Bench;

/// <summary>
/// Runs each benchmark case in a child process (<c>plandesk bench-one</c>), so its peak memory is its own
/// and a native crash in a solver loses one row, not the run. The child writes its row as JSON to a file.
/// </summary>
internal static class ChildProcessRunner
{
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    public static BenchResult Run(BenchCase benchCase)
    {
        var resultFile = Path.Combine(Path.GetTempPath(), $"plandesk-bench-{Environment.ProcessId}-{Guid.NewGuid():N}.json");
        var start = StartInfo(benchCase, resultFile);
        using var child = new Process { StartInfo = start };
        var errors = new System.Text.StringBuilder();
        // Native solver logs may go to stdout: drain both streams so the child never blocks on a full pipe.
        child.OutputDataReceived += (_, _) => { };
        child.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is not null)
            {
                lock (errors)
                {
                    errors.AppendLine(e.Data);
                }
            }
        };
        try
        {
            child.Start();
            child.BeginOutputReadLine();
            child.BeginErrorReadLine();
            // The planner may overrun its limit while stuck in a root LP (ORTOOLS-NOTES.md): allow for it, then stop the child.
            var allowed = TimeSpan.FromSeconds(benchCase.TimeLimitSeconds * (benchCase.MeasureFirstPlan ? 3 : 2) + 180);
            if (!child.WaitForExit(allowed))
            {
                child.Kill(entireProcessTree: true);
                child.WaitForExit();
                return Failed(benchCase, $"stopped after {allowed.TotalSeconds:0} s without a result");
            }
            child.WaitForExit();
            if (!File.Exists(resultFile))
            {
                var last = errors.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries).LastOrDefault()?.Trim() ?? "";
                return Failed(benchCase, $"the case process exited with code {child.ExitCode} and no result {last}".Trim());
            }
            return JsonSerializer.Deserialize<BenchResult>(File.ReadAllText(resultFile), Json)
                ?? Failed(benchCase, "the case process wrote an empty result");
        }
        finally
        {
            File.Delete(resultFile);
        }
    }

    /// <summary>Writes a row where the parent will look for it.</summary>
    public static void WriteResult(BenchResult row, string path) => File.WriteAllText(path, JsonSerializer.Serialize(row, Json));

    private static ProcessStartInfo StartInfo(BenchCase benchCase, string resultFile)
    {
        var executable = Environment.ProcessPath ?? "dotnet";
        var start = new ProcessStartInfo(executable)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        // Run as `dotnet plandesk.dll` when this process was started that way.
        if (Path.GetFileNameWithoutExtension(executable).Equals("dotnet", StringComparison.OrdinalIgnoreCase))
        {
            start.ArgumentList.Add(Assembly.GetEntryAssembly()!.Location);
        }
        foreach (var argument in BenchOneCommand.Arguments(benchCase, resultFile))
        {
            start.ArgumentList.Add(argument);
        }
        return start;
    }

    private static BenchResult Failed(BenchCase benchCase, string note) => new()
    {
        Size = benchCase.Size.Name,
        Seed = benchCase.Seed,
        Solver = benchCase.Solver,
        Status = "failed",
        Note = note,
    };
}
