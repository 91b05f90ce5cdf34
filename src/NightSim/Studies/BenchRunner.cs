using System.Diagnostics;
using NightSim.Analysis;
using NightSim.Results;
using NightSim.Runs;

namespace NightSim.Studies;

/// <summary>
/// Runs the reference workloads in this process: each untimed until warm (at least twice and <see cref="WarmUpCpu"/>
/// seconds of CPU: the runtime compiles the hot code), then timed
/// repetitions; every figure reported is the median over the repetitions. The calibration kernel is timed the same way.
/// The step counts of a deterministic run are the same in every repetition.
/// </summary>
public static class BenchRunner
{
    /// <summary>CPU seconds of untimed warm-up runs before a workload is timed (the quiet night needs 25 to 30 runs
    /// before its last methods are fully optimised).</summary>
    public const double WarmUpCpu = 5.0;

    /// <summary>Warm-up CPU with <c>--quick</c>.</summary>
    public const double WarmUpCpuQuick = 0.5;

    /// <summary>Most warm-up runs of one workload.</summary>
    public const int MaxWarmUpRuns = 40;

    /// <summary>Runs the workloads found in <paramref name="demoDir"/>; <paramref name="progress"/> hears each name
    /// before it runs.</summary>
    /// <param name="only">Run only the workloads with these names (null: all).</param>
    public static BenchReport Run(string demoDir, bool quick, Action<string>? progress = null, IReadOnlyCollection<string>? only = null)
    {
        int reps = quick ? 1 : 5;
        int warmups = 2;

        var kernel = new List<double>();
        double sink = 0;
        for (int i = 0; i < warmups + reps; i++)
        {
            long c0 = CpuTicks();
            sink += CalibrationKernel.Run();
            if (i >= warmups) kernel.Add(Seconds(CpuTicks() - c0));
        }
        double calibration = Median(kernel);
        if (!double.IsFinite(sink)) throw new InvalidOperationException("calibration kernel diverged");

        var measurements = new List<BenchMeasurement>();
        foreach (BenchWorkload w in BenchWorkload.Reference(quick))
        {
            if (only is not null && only.Count > 0 && !only.Contains(w.Name)) continue;
            progress?.Invoke(w.Name);
            if (w.SpreadRuns > 0)
            {
                measurements.Add(RunSpread(w, demoDir, calibration));
                continue;
            }
            // The year is long enough to need no warm-up of its own: the shorter workloads before it have compiled the code.
            bool year = w.Name.StartsWith("quiet-year", StringComparison.Ordinal);
            int r = year ? Math.Min(reps, 3) : reps;
            var runs = new List<(double Wall, double Cpu, NightRunResult Result)>();
            // Warm-up: at least two untimed runs, and more until they have spent WarmUpCpu seconds, so that a short
            // workload's code has been recompiled with full optimisation (the runtime promotes a method after enough
            // calls and loop iterations, on a background thread whose CPU the process figures would otherwise count).
            int warm = 0;
            double warmCpu = 0;
            while (!year && (warm < warmups || warmCpu < (quick ? WarmUpCpuQuick : WarmUpCpu)) && warm < MaxWarmUpRuns)
            {
                var request = w.Build(demoDir);
                long c0 = CpuTicks();
                NightRunResult result = NightRun.Run(request);
                warmCpu += Seconds(CpuTicks() - c0);
                if (result.Simulation.Failure is SimulationFailure f)
                    throw new InvalidOperationException($"bench workload {w.Name} failed at {f.Time} s: {f.Reason}");
                warm++;
            }
            // Give the background recompilation a moment so that the timed runs measure optimised code, not the compiler.
            if (warm > 0) Thread.Sleep(300);
            for (int i = 0; i < r; i++)
            {
                var request = w.Build(demoDir);
                GC.Collect();
                long c0 = CpuTicks();
                var sw = Stopwatch.StartNew();
                NightRunResult result = NightRun.Run(request);
                sw.Stop();
                long c1 = CpuTicks();
                if (result.Simulation.Failure is SimulationFailure f)
                    throw new InvalidOperationException($"bench workload {w.Name} failed at {f.Time} s: {f.Reason}");
                runs.Add((sw.Elapsed.TotalSeconds, Seconds(c1 - c0), result));
            }
            NightRunResult last = runs[^1].Result;
            SolverStatistics st = last.Simulation.Statistics;
            double solverCpu = Median(runs.Select(x => x.Result.Simulation.Statistics.CpuSeconds));
            measurements.Add(new BenchMeasurement(
                w.Name, w.Description, last.Facts.Duration,
                Median(runs.Select(x => x.Wall)), Median(runs.Select(x => x.Cpu)), solverCpu,
                st.AcceptedSteps, st.RejectedSteps, st.NewtonIterations, st.Factorizations, st.Events,
                Median(runs.Select(x => x.Result.Simulation.Statistics.AllocatedBytesPerStep)),
                OnTimeError(last), calibration > 0 ? solverCpu / calibration : double.NaN, r));
        }
        return new BenchReport(quick, calibration, measurements);
    }

    /// <summary>
    /// A spread as <c>nightsim spread</c> runs it (drawn part values, seeded per run, every core, each run reduced to its
    /// outcome), timed once as a whole: wall and process CPU of the study, steps and iterations summed over the runs,
    /// bytes allocated per step over the whole study. Per-run solver CPU is not separable while runs share the cores, so
    /// the solver CPU reported is the study's process CPU.
    /// </summary>
    private static BenchMeasurement RunSpread(BenchWorkload w, string demoDir, double calibration)
    {
        NightRunRequest request = w.Build(demoDir);
        var study = new SpreadStudy(request, w.SpreadRuns, corners: false, seed: 1);
        var buffers = new StudyRunBuffers();
        int[] indices = [.. Enumerable.Range(0, study.Total)];
        GC.Collect();
        long bytes0 = GC.GetTotalAllocatedBytes(precise: true);
        long c0 = CpuTicks();
        var sw = Stopwatch.StartNew();
        SolverStatistics?[] stats = StudyRunner.Run(indices, i =>
        {
            NightRunResult r = NightRun.Run(buffers.ForThisThread(study.Request(i)));
            if (r.Simulation.Failure is SimulationFailure f)
                throw new InvalidOperationException($"bench workload {w.Name} run {i} failed at {f.Time} s: {f.Reason}");
            _ = StudyOutcome.From(r);
            return r.Simulation.Statistics;
        }, Environment.ProcessorCount, CancellationToken.None);
        sw.Stop();
        double cpu = Seconds(CpuTicks() - c0);
        long bytes = GC.GetTotalAllocatedBytes(precise: true) - bytes0;
        SolverStatistics[] all = [.. stats.OfType<SolverStatistics>()];
        long steps = all.Sum(s => s.AcceptedSteps);
        return new BenchMeasurement(w.Name, w.Description, w.SpreadRuns * NightRun.DefaultDuration,
            sw.Elapsed.TotalSeconds, cpu, cpu, steps, all.Sum(s => s.RejectedSteps), all.Sum(s => s.NewtonIterations),
            all.Sum(s => s.Factorizations), all.Sum(s => s.Events), steps > 0 ? bytes / (double)steps : 0.0, null,
            calibration > 0 ? cpu / calibration : double.NaN, 1);
    }

    /// <summary>Largest |actual − closed form| / closed form over the on-intervals the timer ended, or null.</summary>
    public static double? OnTimeError(NightRunResult result)
    {
        if (result.Facts.Timers.Count == 0) return null;
        double expected = result.Facts.Timers[0].ClosedFormWidth;
        if (!double.IsFinite(expected)) return null;
        double? worst = null;
        foreach (AttributedInterval iv in result.Analysis.Intervals)
        {
            if (!iv.EndedByTimer || iv.End is not double end) continue;
            double dev = Math.Abs((end - iv.Start - expected) / expected);
            if (worst is null || dev > worst) worst = dev;
        }
        return worst;
    }

    private static long CpuTicks() => Environment.CpuUsage.TotalTime.Ticks;

    private static double Seconds(long ticks) => ticks / (double)TimeSpan.TicksPerSecond;

    private static double Median(IEnumerable<double> values)
    {
        double[] v = [.. values.Order()];
        if (v.Length == 0) return double.NaN;
        return v.Length % 2 == 1 ? v[v.Length / 2] : 0.5 * (v[v.Length / 2 - 1] + v[v.Length / 2]);
    }
}
