using System.CommandLine;
using System.Globalization;
using NightSim.Studies;

namespace NightSim.Cli.Commands;

/// <summary>
/// <c>nightsim bench</c>: the fixed reference workloads (quiet, busy and chatter nights, a year of quiet nights, a 1000-run spread) run in
/// this process with a warm-up and timed repetitions; prints medians as a table or JSON.
/// </summary>
internal static class BenchCommand
{
    public static Command Create(TextWriter? output = null, TextWriter? error = null)
    {
        var quick = new Option<bool>("--quick") { Description = "One repetition and a month instead of a year (for CI)" };
        var format = new Option<string>("--format") { Description = "Output format", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "json");
        var demos = new Option<string?>("--demos") { Description = "Folder with the demo netlists (default: netlists/ in this folder or above)" };
        var only = new Option<string[]>("--workload") { Description = "Run only these workloads (quiet-night, busy-night, chatter-night, dropper-night, dropper-night-120, quiet-year or quiet-month, spread-1000 or spread-20)", AllowMultipleArgumentsPerToken = true };
        var cmd = new Command("bench", "Time the solver on fixed reference workloads (medians; CPU, steps, Newton iterations, allocation, on-time error)");
        cmd.Options.Add(quick);
        cmd.Options.Add(format);
        cmd.Options.Add(demos);
        cmd.Options.Add(only);
        cmd.SetAction(pr => CliErrors.Run(pr, (o, e) =>
            Run(pr.GetValue(quick), pr.GetValue(format) ?? "text", pr.GetValue(demos), output ?? o, error ?? e, pr.GetValue(only))));
        return cmd;
    }

    public static int Run(bool quick, string format, string? demos, TextWriter output, TextWriter error, string[]? only = null)
    {
        string[] known = [.. BenchWorkload.Reference(quick).Select(w => w.Name)];
        foreach (string name in only ?? [])
        {
            if (!known.Contains(name))
            {
                error.WriteLine($"--workload: no workload \"{name}\". hint: one of {string.Join(", ", known)}");
                return CliErrors.Usage;
            }
        }
        string? dir = demos ?? FindDemos(Directory.GetCurrentDirectory()) ?? FindDemos(AppContext.BaseDirectory);
        if (dir is null || !File.Exists(Path.Combine(dir, "garden-path.json")))
        {
            error.WriteLine($"{demos ?? "netlists/"}: error: the demo netlists (garden-path.json, garden-path-driveway.json, dusk-switch-self-lit.json) were not found. hint: run from the repository or give --demos DIR");
            return CliErrors.InvalidInput;
        }
        BenchReport report = BenchRunner.Run(dir, quick, name => error.WriteLine($"bench: {name} …"), only);
        if (format == "json")
        {
            output.WriteLine(BenchJson.Write(report));
            return CliErrors.Success;
        }
        var ci = CultureInfo.InvariantCulture;
        output.WriteLine(string.Create(ci, $"calibration kernel: {report.CalibrationCpuSeconds * 1e3:0.0} ms CPU (ratio = solver CPU / kernel CPU); medians of {report.Workloads.Select(w => w.Repetitions).DefaultIfEmpty(0).Max()} runs"));
        output.WriteLine();
        output.WriteLine("| workload | simulated | wall s | CPU s | solver CPU ms | ratio | accepted | rejected | Newton | factorisations | B/step | on-time error |");
        output.WriteLine("|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|");
        foreach (BenchMeasurement m in report.Workloads)
        {
            string err = m.Error is double x ? string.Create(ci, $"{x * 100:0.0000} %") : "–";
            output.WriteLine(string.Create(ci,
                $"| {m.Name} | {m.SimulatedSeconds / 3600:0} h | {m.WallSeconds:0.000} | {m.CpuSeconds:0.000} | {m.SolverCpuSeconds * 1e3:0.0} | {m.CalibrationRatio:0.00} | {m.AcceptedSteps} | {m.RejectedSteps} | {m.NewtonIterations} | {m.Factorizations} | {m.AllocatedBytesPerStep:0.#} | {err} |"));
        }
        return CliErrors.Success;
    }

    private static string? FindDemos(string start)
    {
        for (DirectoryInfo? d = new(start); d is not null; d = d.Parent)
        {
            string candidate = Path.Combine(d.FullName, "netlists");
            if (File.Exists(Path.Combine(candidate, "garden-path.json"))) return candidate;
        }
        return null;
    }
}
