using System.CommandLine;
using System.Globalization;
using NightSim.Cli.Plotting;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Studies;
using Spectre.Console;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim sweep NETLIST --vary PART.PARAM=VALUES [--vary ...] [--scenario FILE] [--workers N]
/// [--shard i/n] [--out DIR] [--format text|json]`: a night run at every point of a grid of part values.</summary>
internal static class SweepCommand
{
    public const string DefaultOut = "nightsim-sweep";

    public static Command Create()
    {
        var command = new Command("sweep",
            "Run the scenario at every value (or pair of values) of one or two part parameters: an outcome table, " +
            "sweep.json (points[]), sweep.csv, sweep.html and a line plot (one parameter) or heat map (two) with the target boundary.");
        StudyCommon.Options o = StudyCommon.Add(command, DefaultOut, severalScenarios: true);
        var vary = new Option<string[]>("--vary")
        {
            Description = "PART.PARAM=VALUES: a list (10n,22n,47n), a range with a count (1n..100n/7, log-spaced over a decade or more) or a series (E12:1n..100n). " +
                "scenario.PATH=VALUES sets a number in the scenario instead (scenario.events[0].peakLux=1k..20k/5). Repeat for a second parameter.",
            HelpName = "PART.PARAM=VALUES",
            Required = true,
            AllowMultipleArgumentsPerToken = false,
        };
        command.Options.Add(vary);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            try
            {
                if (pr.GetValue(o.Workers) is int w && w < 1) throw new UsageException("--workers: give at least 1");
                ShardSpec shard = StudyCommon.ParseShard(pr.GetValue(o.Shard));
                FileInfo[] scenarioFiles = pr.GetValue(o.Scenario) ?? [];
                NightRunRequest request = StudyCommon.Load(pr.GetValue(o.Netlist)!.ToString(), scenarioFiles.Length > 0 ? scenarioFiles[0].ToString() : null, error);
                var specs = pr.GetValue(vary)!.ToList();
                if (specs.Any(v => v.StartsWith(SweepAxis.ScenarioPrefix + "=", StringComparison.Ordinal)))
                {
                    throw new UsageException("--vary scenario=…: give several scenarios as --scenario FILE --scenario FILE");
                }
                if (scenarioFiles.Length > 1) specs.Add(SweepAxis.ScenarioPrefix + "=" + string.Join(",", scenarioFiles.Select(f => f.ToString())));
                ScenarioVariants? variants = Variants(specs, request.ScenarioPath!);
                List<SweepAxis> axes = Axes(request.Netlist, specs, variants);
                var study = new SweepStudy(request, axes, variants);
                if (study.Total > 100_000) throw new UsageException($"--vary: {study.Total} points is too many; keep it under 100000");
                string dir = StudyCommon.OutDir(pr.GetValue(o.Out), DefaultOut);
                StudyHeader header = study.Header(StudyCommon.Tool);
                (List<SweepPoint> done, bool complete) = StudyCommon.RunItems("sweep points", shard.Indices(study.Total), study.Run, pr.GetValue(o.Workers), !pr.GetValue(o.NoProgress), error);
                done = StudyCommon.Normalise(done, SweepPoint.Read);
                if (!shard.IsWhole) return StudyCommon.WriteShard(shard, dir, header, done, complete, study.Total, "points", output, error);
                return OutputException.Guard(dir, () => Finish(header, request.Netlist, axes, done, complete, dir, pr.GetValue(o.Format)!, output, error));
            }
            catch (UsageException u)
            {
                error.WriteLine(u.Message);
                return CliErrors.Usage;
            }
        }));
        return command;
    }

    /// <summary>The scenario files the axes need (several files, or one whose numbers are swept), read once; null when
    /// every axis is a part parameter. A file that cannot be read is an input error (exit 2).</summary>
    public static ScenarioVariants? Variants(IReadOnlyList<string> specs, string scenarioPath)
    {
        string? files = specs.FirstOrDefault(v => v.StartsWith(SweepAxis.ScenarioPrefix + "=", StringComparison.Ordinal));
        if (files is not null) return ScenarioVariants.Read([.. files[(SweepAxis.ScenarioPrefix.Length + 1)..].Split(',')]);
        return specs.Any(v => v.StartsWith(SweepAxis.ScenarioPrefix + ".", StringComparison.Ordinal)) ? ScenarioVariants.Read([scenarioPath]) : null;
    }

    /// <summary>The axes of the --vary options (a mistake is a usage error naming the part or the scenario file).</summary>
    public static List<SweepAxis> Axes(NetlistDefinition net, IEnumerable<string> specs, ScenarioVariants? scenarios = null)
    {
        var axes = new List<SweepAxis>();
        foreach (string spec in specs)
        {
            SweepAxis axis = SweepStudy.Axis(net, spec, out string? err, scenarios) ?? throw new UsageException(err!);
            if (axes.Any(a => a.Key == axis.Key)) throw new UsageException($"--vary: {axis.Key} is given twice");
            axes.Add(axis);
        }
        if (axes.Count == 0) throw new UsageException("--vary: give at least one PART.PARAM=VALUES");
        return axes;
    }

    public static int Finish(StudyHeader header, NetlistDefinition net, IReadOnlyList<SweepAxis> axes, List<SweepPoint> points, bool complete, string dir,
        string format, TextWriter output, TextWriter error)
    {
        var report = new SweepReport(header, axes, points, complete, NightSim.Supply.MainsExposure.Cautions(net));
        var written = new List<string>();
        string? warning = null;
        var figures = new List<HtmlFigure>();
        LightTargets targets = LightTargets.Of(header.Scenario);
        if (axes.Count == 1 && points.Count > 0)
        {
            SweepAxis a = axes[0];
            var on = points.Select(p => (p.Values[0].Value, p.Outcome.OnSeconds is double s && !p.Outcome.NeverEnds ? s / 3600 : (double?)null, p.Outcome.Pass)).ToList();
            var lines = new List<(string, double)>();
            if (targets.OnMin is double lo) lines.Add(("target min", lo / 3600));
            if (targets.OnMax is double hi) lines.Add(("target max", hi / 3600));
            figures.Add(StudyCommon.Plot(StudyPlots.Line($"On-time against {a.Key}", report.Summary() + "; crosses: points that miss a target (false trigger, missed night, …)",
                a.Key, a.Unit, a.LogScale, "on-time of the dusk switch-on (h)", on, lines), dir, "sweep-on-time", $"On-time against {a.Key} with the target range", written, ref warning));
            var ft = points.Select(p => (p.Values[0].Value, (double?)(p.Outcome.FalseTriggers + (p.Outcome.Missed ? 0 : 0)), p.Outcome.Pass)).ToList();
            figures.Add(StudyCommon.Plot(StudyPlots.Line($"False triggers against {a.Key}", "switch-ons not caused by dusk; the target is none", a.Key, a.Unit, a.LogScale,
                "false triggers", ft, [("target: none", 0)]), dir, "sweep-false-triggers", $"False triggers against {a.Key}", written, ref warning));
        }
        else if (axes.Count >= 2 && points.Count > 0)
        {
            SweepAxis ax = axes[0], ay = axes[1];
            var byCell = points.Where(p => axes.Count == 2).ToDictionary(p => (Array.IndexOf([.. ax.Values], p.Values[0].Value), Array.IndexOf([.. ay.Values], p.Values[1].Value)));
            figures.Add(StudyCommon.Plot(StudyPlots.HeatMap($"Targets over {ax.Key} × {ay.Key}", report.Summary() + "; green passes, red fails, black line: the target boundary; cells: on-time / problems",
                ax.Key, [.. ax.Values.Select(ax.Label)], ay.Key, [.. ay.Values.Select(ay.Label)],
                (i, j) => byCell.TryGetValue((i, j), out SweepPoint? p) ? (p.Outcome.Pass, CellText(p.Outcome)) : (false, "not run")),
                dir, "sweep-map", $"Pass/fail map over {ax.Key} × {ay.Key}", written, ref warning));
        }
        string json = Path.Combine(dir, "sweep.json"), csv = Path.Combine(dir, "sweep.csv"), html = Path.Combine(dir, "sweep.html");
        AtomicFile.Write(json, st => st.Write(report.Json()));
        AtomicFile.WriteText(csv, report.Csv());
        AtomicFile.WriteText(html, report.Html(figures));
        written.AddRange([json, csv, html]);
        if (format == "json") output.Write(System.Text.Encoding.UTF8.GetString(report.Json()));
        else
        {
            IAnsiConsole console = Rendering.Terminal.For(output);
            Rendering.TerminalReport.ConfigureWidth(console);
            if (report.Cautions.Count > 0) console.MarkupLine("[yellow]CAUTION: mains voltage.[/] " + Markup.Escape(string.Join(" ", report.Cautions)));
            var table = new Table { Border = TableBorder.Rounded, Title = new TableTitle($"Sweep of {Markup.Escape(header.Netlist)}") };
            foreach (string h in report.Heads) table.AddColumn(Markup.Escape(h));
            foreach (IReadOnlyList<string> row in report.Rows())
            {
                bool bad = row[0].StartsWith('!');
                table.AddRow(row.Select((c, i) => (i == 0 && bad ? "[red]" + Markup.Escape(c[1..]) + "[/]" : Markup.Escape(c))).ToArray());
            }
            console.Write(table);
            console.MarkupLine(Markup.Escape(report.Summary()));
            console.MarkupLine($"[grey]wrote {written.Count} files to {Markup.Escape(dir)}: sweep.html, sweep.json, sweep.csv and plots[/]");
        }
        if (warning is not null) error.WriteLine("warning: " + warning);
        if (!complete)
        {
            error.WriteLine($"stopped by Ctrl+C: {points.Count} of {header.Total} points finished; the files in {dir} cover those points only");
            return StudyCommon.Interrupted;
        }
        return CliErrors.Success;
    }

    private static string CellText(StudyOutcome o)
    {
        string on = o.OnSeconds is double s ? (o.NeverEnds ? "never ends" : (s / 3600).ToString("0.0", CultureInfo.InvariantCulture) + " h") : o.Missed ? "missed" : "—";
        var issues = new List<string>();
        if (o.FalseTriggers > 0) issues.Add(o.FalseTriggers.ToString(CultureInfo.InvariantCulture) + " false");
        if (o.ChatterBursts > 0) issues.Add("chatter");
        if (o.EarlyOffs > 0) issues.Add("early off");
        if (!o.Pass && issues.Count == 0 && o.FailedTargets.Length > 0) issues.Add("target: " + o.FailedTargets);
        return issues.Count == 0 ? on : on + "\n" + string.Join(", ", issues);
    }
}
