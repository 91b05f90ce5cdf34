using System.Globalization;
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
        bool NoPlots);

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
        bool created = !Directory.Exists(dir);
        OutputException.Guard(dir, () => Directory.CreateDirectory(dir));
        bool done = false;
        try
        {
            int code = Run(s, loaded.Definition!, scenario, dir, console, output, error);
            done = code != CliErrors.Unexpected;
            return code;
        }
        finally
        {
            // A failed run leaves nothing behind in a folder it created itself.
            if (!done && created) TryDelete(dir);
        }
    }

    private static void TryDelete(string dir)
    {
        try
        {
            Directory.Delete(dir, recursive: true);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Best effort: the failure itself is what gets reported.
        }
    }

    private static int Run(Settings s, NetlistDefinition netlist, LightScenario scenario, string dir, IAnsiConsole console, TextWriter output, TextWriter error)
    {
        if (s.Nights is int n) scenario = scenario with { Nights = n };

        var request = new NightRunRequest
        {
            Netlist = netlist,
            NetlistPath = s.NetlistPath,
            Scenario = scenario,
            ScenarioPath = s.ScenarioPath,
            Tool = "nightsim " + typeof(SimulateNight).Assembly.GetName().Version?.ToString(3),
        };
        // Progress goes to standard error, so standard output carries only the report (redirect it to a file freely).
        var progress = new ProgressReporter(Terminal.For(error), enabled: !s.NoProgress && s.Format == "text");
        int nights = scenario.Nights;
        NightRunResult result = progress.Run(p => NightRun.Run(request, new Progress(p, nights)));

        if (result.Simulation.Failure is { } failure)
        {
            error.WriteLine($"{s.NetlistPath}: simulation failed at {ReportText.Clock(result.Facts.Clock(failure.Time))} (run time {failure.Time.ToString("0.######", CultureInfo.InvariantCulture)} s): {failure}");
            return CliErrors.Unexpected;
        }

        NightReport report = result.Report;
        OutputException.Guard(dir, () => RemoveOldPlots(dir));
        var written = new List<string>();
        string reportPath = Path.Combine(dir, "report.json");
        OutputException.Guard(reportPath, () => JsonReportWriter.Write(report, reportPath));
        written.Add(reportPath);
        string tracePath = Path.Combine(dir, "trace.csv");
        OutputException.Guard(tracePath, () => CsvTraceWriter.Write(result.Traces, tracePath));
        written.Add(tracePath);

        var figures = new List<HtmlFigure>();
        string? plotWarning = null;
        if (!s.NoPlots)
        {
            int k = 0;
            foreach (PlotData data in result.Plots)
            {
                PlotModel model = NightPlotBuilder.Build(data);
                PlotFiles files = OutputException.Guard(Path.Combine(dir, data.FileStem + ".svg"), () => PlotWriter.Write(model, dir, data.FileStem));
                written.Add(files.SvgPath);
                if (files.PngPath is not null) written.Add(files.PngPath);
                plotWarning ??= files.Warning;
                figures.Add(new HtmlFigure(data.Title, PlotWriter.ToInlineSvg(NightPlotBuilder.Build(data), $"fig{++k}-", includeTitle: false)));
            }
        }
        string htmlPath = Path.Combine(dir, "report.html");
        OutputException.Guard(htmlPath, () => HtmlReportWriter.Write(report, figures, htmlPath));
        written.Add(htmlPath);

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
            console.MarkupLine($"[grey]wrote {written.Count} files to {Markup.Escape(dir)}: report.html, report.json, trace.csv and {written.Count - 3} plot files[/]");
        }
        if (plotWarning is not null) error.WriteLine("warning: " + plotWarning);
        return FailOn(report, s.FailOn);
    }

    /// <summary>Plots of an earlier run in the same folder would sit beside the new ones and mislead: remove them.</summary>
    private static void RemoveOldPlots(string dir)
    {
        foreach (string pattern in (string[])["night-*", "zoom-*", "detail-*"])
        {
            foreach (string f in Directory.EnumerateFiles(dir, pattern))
            {
                if (f.EndsWith(".svg", StringComparison.Ordinal) || f.EndsWith(".png", StringComparison.Ordinal)) File.Delete(f);
            }
        }
    }

    /// <summary>Exit 4 when a finding is at or above --fail-on (warning or error), else 0.</summary>
    private static int FailOn(NightReport report, string? failOn)
    {
        if (failOn is null) return CliErrors.Success;
        Analysis.Severity level = failOn == "warning" ? Analysis.Severity.Warning : Analysis.Severity.Error;
        return report.Findings.Any(f => f.Severity >= level) ? CliErrors.FindingAtLevel : CliErrors.Success;
    }

    /// <summary>Maps the run's overall fraction to night-by-night progress.</summary>
    private sealed class Progress(IProgress<NightProgress> inner, int nights) : IProgress<double>
    {
        public void Report(double value)
        {
            double x = Math.Clamp(value, 0, 1) * nights;
            int night = Math.Min(nights, (int)Math.Floor(x) + 1);
            inner.Report(new NightProgress(night, nights, x - (night - 1)));
        }
    }
}
