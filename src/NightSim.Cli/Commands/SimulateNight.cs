using System.Globalization;
using System.Runtime.CompilerServices;
using NightSim.Cli.Plotting;
using NightSim.Cli.Rendering;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Sky;
using OxyPlot;
using Spectre.Console;

namespace NightSim.Cli.Commands;

/// <summary>The night-run half of `simulate`: a netlist through a light scenario, then report.json, trace.csv, plots
/// (SVG and PNG), report.html in the output folder and the table of nights on the terminal.</summary>
internal static class SimulateNight
{
    /// <summary>Settings of one night run from the command line.</summary>
    public sealed record Settings(
        string NetlistPath,
        string ScenarioPath,
        int? Nights,
        DirectoryInfo Out,
        string Format,
        bool NoProgress,
        string? FailOn,
        bool NoPlots,
        string Accuracy = "normal",
        string MainsDetail = "windows");

    /// <summary>The companion scenario of a demo netlist: &lt;name&gt;.scenario.json beside &lt;name&gt;.json, or null.</summary>
    public static string? CompanionScenario(string netlistPath)
    {
        string dir = Path.GetDirectoryName(netlistPath) ?? "";
        string stem = Path.GetFileNameWithoutExtension(netlistPath);
        string candidate = Path.Combine(dir, stem + ".scenario.json");
        return File.Exists(candidate) ? candidate : null;
    }

    public static int Execute(Settings s, IAnsiConsole console, TextWriter output, TextWriter error)
    {
        NetlistLoadResult loaded = NetlistLoader.Read(s.NetlistPath);
        foreach (NetlistError w in loaded.Warnings) error.WriteLine(w.ToString());
        if (!loaded.IsValid)
        {
            CliErrors.WriteProblems([.. loaded.Errors.Select(e => e.ToString())], error);
            return CliErrors.InvalidInput;
        }
        LightScenario scenario = ScenarioLoader.LoadOrThrow(s.ScenarioPath);
        // The output folder is checked before the run, not after it: a file in its place cannot take the outputs.
        string dir = s.Out.FullName;
        if (File.Exists(dir))
        {
            error.WriteLine($"--out: {s.Out}: cannot write: it is a file, not a folder. hint: give a folder name, e.g. --out out/night");
            return CliErrors.OutputFailed;
        }
        // Every output goes into a staging folder and the set goes in place whole when it is complete: a run that
        // fails, is killed or finds the disk full leaves the folder as it was (README "Troubleshooting").
        using OutputSet set = OutputException.Guard(dir, () => OutputSet.Begin(dir));
        return Run(s, loaded.Definition!, scenario, set, console, output, error);
    }

    /// <summary>Puts the run's files in place (exit 5 when that fails) and says so when the folder also holds files
    /// NightSim did not write, which are left alone (the set then goes in file by file).</summary>
    internal static void Commit(OutputSet set, TextWriter error)
    {
        OutputSet.CommitResult done = OutputException.Guard(set.Target, set.Commit);
        if (done.Warning is not null) error.WriteLine("warning: " + done.Warning);
        if (done.Mode == OutputSet.CommitMode.FileByFile && done.Foreign.Count > 0)
        {
            error.WriteLine($"note: {set.Target} also holds files NightSim did not write ({string.Join(", ", done.Foreign.Take(3))}{(done.Foreign.Count > 3 ? $" and {done.Foreign.Count - 3} more" : "")}); " +
                "they were left alone and NightSim's files were replaced one by one. hint: give --out a folder of its own to have each run's files replaced as one set");
        }
    }

    private static int Run(Settings s, NetlistDefinition netlist, LightScenario scenario, OutputSet set, IAnsiConsole console, TextWriter output, TextWriter error)
    {
        // Files are written into the staging folder; messages name the output folder.
        string dir = set.Staging;
        // Ctrl+C and SIGTERM stop the run at its next step; what finished is kept as a partial report. Before the first
        // step there is nothing to keep, and the signal ends the process at once as usual (leaving no staging folder).
        using var interrupt = new CancellationTokenSource();
        var stepping = new StrongBox<bool>();
        void OnSignal(System.Runtime.InteropServices.PosixSignalContext ctx)
        {
            if (!Volatile.Read(ref stepping.Value))
            {
                // The process ends as usual: take the (still empty) staging folder with it.
                set.Dispose();
                return;
            }
            ctx.Cancel = true;
            interrupt.Cancel();
        }
        using var sigterm = System.Runtime.InteropServices.PosixSignalRegistration.Create(System.Runtime.InteropServices.PosixSignal.SIGTERM, OnSignal);
        using var sigint = System.Runtime.InteropServices.PosixSignalRegistration.Create(System.Runtime.InteropServices.PosixSignal.SIGINT, OnSignal);
        if (s.Nights is int n) scenario = scenario with { Nights = n };

        var request = new NightRunRequest
        {
            Netlist = netlist,
            NetlistPath = s.NetlistPath,
            Scenario = scenario,
            ScenarioPath = s.ScenarioPath,
            Tool = "nightsim " + typeof(SimulateNight).Assembly.GetName().Version?.ToString(3),
            Options = (Transient.TransientOptions.ForAccuracy(s.Accuracy) ?? Transient.TransientOptions.Default) with { MainsAveraging = s.MainsDetail != "full" },
            Cancellation = interrupt.Token,
        };
        // Progress goes to standard error, so standard output carries only the report (redirect it to a file freely).
        var progress = new ProgressReporter(Terminal.For(error), enabled: !s.NoProgress && s.Format == "text");
        int nights = scenario.Nights;
        // The plot font and renderer load on a spare core while the circuit is solved.
        if (!s.NoPlots) PlotWarmUp.Start();
        NightRunResult result = progress.Run(p => NightRun.Run(request, new Progress(p, nights, stepping)));

        if (result.Simulation.Failure is { } failure)
        {
            string clock = ReportText.Clock(result.Facts.Clock(failure.Time));
            error.WriteLine($"{s.NetlistPath}: simulation failed at {clock} (run time {failure.Time.ToString("0.######", CultureInfo.InvariantCulture)} s): {failure}");
            WritePartial(s, result, failure, failure.Time, TotalSeconds(scenario), clock, set, error);
            return CliErrors.Unexpected;
        }
        if (result.Simulation.Interrupted)
        {
            double reached = result.Simulation.StopTime;
            string clock = ReportText.Clock(result.Facts.Clock(reached));
            double done = 100.0 * reached / Math.Max(reached, TotalSeconds(scenario));
            error.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{s.NetlistPath}: interrupted at {clock} (run time {reached:0.###} s, {done:0.#} % of the run)"));
            WritePartial(s, result, null, reached, TotalSeconds(scenario), clock, set, error);
            return CliErrors.Interrupted;
        }

        NightReport report = result.Report;
        var written = new List<string>();
        string reportPath = Path.Combine(dir, "report.json");
        // A failure names the file as the user will find it, not its place in the staging folder.
        string At(string file) => Path.Combine(set.Target, Path.GetFileName(file));
        OutputException.Guard(At(reportPath), () => JsonReportWriter.Write(report, reportPath));
        written.Add(reportPath);
        string tracePath = Path.Combine(dir, "trace.csv");
        OutputException.Guard(At(tracePath), () => CsvTraceWriter.Write(result.Traces, tracePath));
        written.Add(tracePath);

        IReadOnlyList<HtmlFigure> figures = [];
        IReadOnlyList<DateOnly> plotted = [];
        string? plotWarning = null;
        if (!s.NoPlots)
        {
            // A run of several nights opens with the overview of every night; a long run plots its interesting nights only.
            plotted = PlottedNights.Select(report.Nights, report.TargetResults);
            List<(PlotModel, string, string)> overview = report.Nights.Count > 1
                ? [(NightsOverviewPlot.Build(report, plotted.ToHashSet()), NightsOverviewPlot.FileStem, $"Every night: when the lamp was on ({report.Nights.Count} nights)")]
                : [];
            PlotSetResult plots = PlotSetWriter.WriteAll(result.Plots, dir, (svg, write) => OutputException.Guard(At(svg), write), overview);
            foreach (PlotFiles files in plots.Files)
            {
                written.Add(files.SvgPath);
                if (files.PngPath is not null) written.Add(files.PngPath);
            }
            plotWarning = plots.Warnings.FirstOrDefault();
            figures = plots.Figures;
        }
        string htmlPath = Path.Combine(dir, "report.html");
        OutputException.Guard(At(htmlPath), () => HtmlReportWriter.Write(report, figures, htmlPath));
        written.Add(htmlPath);
        Commit(set, error);

        if (s.Format == "json")
        {
            using var stdout = new MemoryStream();
            JsonReportWriter.Write(report, stdout);
            output.WriteLine(System.Text.Encoding.UTF8.GetString(stdout.ToArray()));
        }
        else
        {
            TerminalReport.Render(report, console);
            console.WriteLine();
            console.MarkupLine($"[grey]wrote {written.Count} files to {Markup.Escape(set.Target)}: report.html, report.json, trace.csv and {written.Count - 3} plot files[/]");
            if (plotted.Count > 0 && plotted.Count < report.Nights.Count)
            {
                console.MarkupLine($"[grey]plotted {plotted.Count} of {report.Nights.Count} nights, the most interesting ({string.Join(", ", plotted.Select(d => d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)))}); {NightsOverviewPlot.FileStem}.png shows every night[/]");
            }
        }
        if (plotWarning is not null) error.WriteLine("warning: " + plotWarning);
        return FailOn(report, s.FailOn, error);
    }

    /// <summary>
    /// What a failed run computed, named as partial so it is never taken for a finished run: report-partial.json (the
    /// failure: time, worst nodes with values, parts, hint), trace-partial.csv up to the failure and a plot of the last
    /// stretch before it (last-seconds-partial.svg/png). They go in as one set with the complete outputs of the run
    /// before, which stay as they were (partial outputs of an earlier failure are replaced).
    /// </summary>
    private static void WritePartial(Settings s, NightRunResult result, Results.SimulationFailure? failure, double reached, double planned, string clock, OutputSet set, TextWriter error)
    {
        string dir = set.Staging;
        var written = new List<string>();
        string reportPath = Path.Combine(dir, "report-partial.json");
        OutputException.Guard(Path.Combine(set.Target, "report-partial.json"), () => PartialReportWriter.Write(new PartialReportWriter.Content(s.NetlistPath, s.ScenarioPath, Math.Max(planned, reached), reached, clock,
            failure, result.Simulation.Statistics), reportPath));
        written.Add(reportPath);
        string tracePath = Path.Combine(dir, "trace-partial.csv");
        OutputException.Guard(Path.Combine(set.Target, "trace-partial.csv"), () => CsvTraceWriter.Write(result.Traces, tracePath));
        written.Add(tracePath);
        if (!s.NoPlots && LastStretch(result, reached, failure?.Reason ?? "interrupted") is { } data)
        {
            PlotFiles files = OutputException.Guard(Path.Combine(set.Target, data.FileStem + ".svg"), () => PlotWriter.Write(NightPlotBuilder.Build(data), dir, data.FileStem));
            written.Add(files.SvgPath);
            if (files.PngPath is not null) written.Add(files.PngPath);
        }
        OutputException.Guard(set.Target, () => set.CarryOver(name => !IsPartial(name)));
        Commit(set, error);
        error.WriteLine($"kept what was computed up to {clock}: {string.Join(", ", written.Select(Path.GetFileName))} in {set.Target}");
    }

    /// <summary>An output of a run that stopped early ("report-partial.json", "last-seconds-partial.png", …).</summary>
    private static bool IsPartial(string name) => Path.GetFileName(name).Contains("-partial.", StringComparison.Ordinal);

    /// <summary>The recorded node voltages over the last stretch before the failure (the last 200 recorded points).</summary>
    private static PlotData? LastStretch(NightRunResult result, double reached, string reason)
    {
        var series = new List<PlotSeries>();
        double from = reached;
        foreach (Results.Trace t in result.Simulation.Traces)
        {
            if (t.Unit != "V" || t.Times.Count == 0) continue;
            int start = Math.Max(0, t.Times.Count - 200);
            from = Math.Min(from, t.Times[start]);
            series.Add(new PlotSeries($"node {t.Name}", "V", PlotPanel.Voltages, [.. t.Times.Skip(start)], [.. t.Values.Skip(start)]));
        }
        if (series.Count == 0 || !(reached > from)) return null;
        return new PlotData
        {
            Title = $"Last stretch before the run stopped (partial): {reason}",
            Origin = result.Simulation.Origin ?? DateTimeOffset.UnixEpoch,
            From = from,
            To = reached,
            Series = series,
            Markers = [new PlotMarker(reached, "stopped", Emphasis: true)],
            FileStem = "last-seconds-partial",
        };
    }

    /// <summary>Run seconds of the whole scenario window, nights × 24 h from local noon (a night across a daylight-saving
    /// change is an hour shorter or longer: the fraction done is approximate there).</summary>
    private static double TotalSeconds(LightScenario scenario) => scenario.Nights * 86400.0;

    /// <summary>Exit 4 when a finding is at or above --fail-on (warning or error), else 0.</summary>
    private static int FailOn(NightReport report, string? failOn, TextWriter error)
    {
        if (failOn is null) return CliErrors.Success;
        Analysis.Severity level = failOn == "warning" ? Analysis.Severity.Warning : Analysis.Severity.Error;
        List<Analysis.Finding> tripped = report.Findings.Where(f => f.Severity >= level).ToList();
        if (tripped.Count == 0) return CliErrors.Success;
        // Say which findings tripped it, so a script's log shows why the exit code is not 0.
        error.WriteLine($"--fail-on {failOn}: {tripped.Count} finding{(tripped.Count == 1 ? "" : "s")} at or above {failOn}: " +
            string.Join(", ", tripped.Select(f => ReportText.Severity(f.Severity) + " " + f.Code + (f.At is DateTimeOffset at ? " at " + ReportText.Clock(at) : ""))));
        return CliErrors.FindingAtLevel;
    }

    /// <summary>Maps the run's overall fraction to night-by-night progress.</summary>
    private sealed class Progress(IProgress<NightProgress> inner, int nights, StrongBox<bool> stepping) : IProgress<double>
    {
        public void Report(double value)
        {
            Volatile.Write(ref stepping.Value, true);
            double x = Math.Clamp(value, 0, 1) * nights;
            int night = Math.Min(nights, (int)Math.Floor(x) + 1);
            inner.Report(new NightProgress(night, nights, x - (night - 1)));
        }
    }
}
