using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using NightSim.Cli.Plotting;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Studies;
using Spectre.Console;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim tune NETLIST --vary PART.PARAM=SERIES[:MIN..MAX] [...] [--scenario FILE] [--nights worst|year|DATES]
/// [--corners] [--confirm N] [--workers N] [--shard i/n] [--out DIR] [--format text|json]`: finds part values that meet
/// the scenario's targets across tolerance corners and nights.</summary>
internal static class TuneCommand
{
    public const string DefaultOut = "nightsim-tune";

    public static Command Create()
    {
        var command = new Command("tune",
            "Find values of the parts you may change that meet the scenario's targets on the chosen nights (and, with --corners, " +
            "with every part at its tolerance corners). The closed forms (on-time ln 3·R·C with leakage, switching level, the " +
            "trigger pin's RC against a pulse) judge every combination first; the best are confirmed by night runs. Writes " +
            "tune.json (every candidate), tune.html with the margin plot, and the winning netlist as <name>-tuned.json.");
        StudyCommon.Options o = StudyCommon.Add(command, DefaultOut);
        var vary = new Option<string[]>("--vary")
        {
            Description = "PART.PARAM=SERIES[:MIN..MAX]: an IEC 60063 series (E6, E12, E24; without a range a decade either side of the present value), " +
                "a list (10n,22n,47n) or a range with a count (trimmer positions: 0.05..0.95/19). Repeat for each part.",
            HelpName = "PART.PARAM=VALUES",
            Required = true,
        };
        var nights = new Option<string>("--nights") { Description = "worst (longest and shortest nights plus the scenario's own), year (the 21st of each month) or dates (2026-06-21,2026-12-21).", DefaultValueFactory = _ => "worst", HelpName = "worst|year|DATES" };
        var corners = new Option<bool>("--corners") { Description = "Check every candidate with its parts at the tolerance corners that push each predicted quantity low and high, besides nominal." };
        var confirm = new Option<int>("--confirm") { Description = "How many of the best predicted combinations to confirm by simulation (default 4).", DefaultValueFactory = _ => 4, HelpName = "N" };
        command.Options.Add(vary);
        command.Options.Add(nights);
        command.Options.Add(corners);
        command.Options.Add(confirm);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            try
            {
                if (pr.GetValue(o.Workers) is int w && w < 1) throw new UsageException("--workers: give at least 1");
                int n = pr.GetValue(confirm);
                if (n is < 1 or > 1000) throw new UsageException("--confirm: give 1 to 1000");
                ShardSpec shard = StudyCommon.ParseShard(pr.GetValue(o.Shard));
                NightRunRequest request = StudyCommon.Load(pr.GetValue(o.Netlist)!.ToString(), StudyCommon.ScenarioPath(pr, o), error);
                TuneStudy study = Build(request, pr.GetValue(vary)!, pr.GetValue(nights)!, pr.GetValue(corners), n);
                string format = pr.GetValue(o.Format)!;
                TextWriter plan = format == "json" ? error : output;
                if (study.Method == TuneMethod.FullGrid)
                    plan.WriteLine($"full grid: no closed form bears on {string.Join(", ", study.Unnarrowed.DefaultIfEmpty("the targets"))}; simulating all {study.GridSize} combinations × {study.Nights.Count} nights × {study.Corners.Count} corners = {study.Total} night runs");
                else
                    plan.WriteLine($"closed forms judged {study.GridSize} combinations at {study.Corners.Count} corner(s); confirming the best {study.Confirmed.Count} × {study.Nights.Count} nights × {study.Corners.Count} corners = {study.Total} night runs");
                string dir = StudyCommon.OutDir(pr.GetValue(o.Out), DefaultOut);
                StudyHeader header = study.Header(StudyCommon.Tool);
                (List<TuneRun> done, bool complete) = StudyCommon.RunItems("tune runs", shard.Indices(study.Total), study.Run, pr.GetValue(o.Workers), !pr.GetValue(o.NoProgress), error);
                done = StudyCommon.Normalise(done, TuneRun.Read);
                if (!shard.IsWhole) return StudyCommon.WriteShard(shard, dir, header, done, complete, study.Total, "runs", output, error);
                return Finish(header, study, done, complete, dir, format, output, error);
            }
            catch (UsageException u)
            {
                error.WriteLine(u.Message);
                return CliErrors.Usage;
            }
        }));
        return command;
    }

    /// <summary>The study for the given options; a mistake in them is a usage error.</summary>
    public static TuneStudy Build(NightRunRequest request, IEnumerable<string> specs, string nights, bool corners, int confirm)
    {
        var axes = new List<SweepAxis>();
        foreach (string spec in specs)
        {
            SweepAxis axis = TuneStudy.Axis(request.Netlist, spec, out string? err) ?? throw new UsageException(err!);
            if (axes.Any(a => a.Key == axis.Key)) throw new UsageException($"--vary: {axis.Key} is given twice");
            axes.Add(axis);
        }
        if (axes.Count == 0) throw new UsageException("--vary: give at least one PART.PARAM=SERIES");
        try
        {
            return new TuneStudy(request, axes, nights, corners, confirm);
        }
        catch (ArgumentException e)
        {
            throw new UsageException(e.Message);
        }
    }

    /// <summary>Joins the shards of a tune (called by merge): the study is rebuilt from the header's inputs and settings.</summary>
    public static int Merge(StudyHeader header, List<JsonElement> items, string dir, string format, TextWriter output, TextWriter error)
    {
        NightRunRequest request = StudyCommon.Load(header.Netlist, header.Scenario, error);
        var specs = header.Settings.Where(k => k.Key.StartsWith("vary", StringComparison.Ordinal)).Select(k => k.Value);
        TuneStudy study = Build(request, specs, header.Setting("nights") ?? "worst", header.Setting("corners") == "worst-case",
            int.Parse(header.Setting("confirm") ?? "4", CultureInfo.InvariantCulture));
        StudyHeader again = study.Header(header.Tool);
        if (again.Identity() != header.Identity())
            throw new StudyFileException([$"{header.Netlist}: error: the netlist or scenario changed since the shards were run (the tune plans different runs now). hint: run the shards again"]);
        return Finish(header, study, items.Select(TuneRun.Read).ToList(), true, dir, format, output, error);
    }

    /// <summary>Writes tune.json, tune.html, the plots and the winning netlist, and prints the result.</summary>
    public static int Finish(StudyHeader header, TuneStudy study, List<TuneRun> runs, bool complete, string dir, string format,
        TextWriter output, TextWriter error)
    {
        var report = new TuneReport(header, study, runs, complete, NightSim.Supply.MainsExposure.Cautions(study.Netlist));
        var written = new List<string>();
        string? warning = null;
        var figures = new List<HtmlFigure>();
        Figures(report, dir, figures, written, ref warning);

        string? winner = null;
        if (report.Best is TuneResult best && best.Pass)
        {
            string name = Path.GetFileNameWithoutExtension(header.Netlist) + "-tuned.json";
            string target = Path.Combine(dir, name);
            if (Path.GetFullPath(target) == Path.GetFullPath(header.Netlist)) target = Path.Combine(dir, Path.GetFileNameWithoutExtension(header.Netlist) + "-tuned-1.json");
            winner = DrawnRunWriter.Write(header.Netlist, header.Scenario, target, best.Values, null, null);
            written.Add(winner);
        }
        string json = Path.Combine(dir, "tune.json"), html = Path.Combine(dir, "tune.html");
        AtomicFile.Write(json, st => st.Write(report.Json()));
        AtomicFile.WriteText(html, report.Html(figures, winner));
        written.AddRange([json, html]);

        if (format == "json") output.Write(System.Text.Encoding.UTF8.GetString(report.Json()));
        else
        {
            IAnsiConsole console = Rendering.Terminal.For(output);
            Rendering.TerminalReport.ConfigureWidth(console);
            if (report.Cautions.Count > 0) console.MarkupLine("[yellow]CAUTION: mains voltage.[/] " + Markup.Escape(string.Join(" ", report.Cautions)));
            console.MarkupLine(Markup.Escape($"tune of {header.Netlist} against {header.Scenario}"));
            foreach (string line in report.Lines()) console.MarkupLine("  " + Markup.Escape(line));
            var table = new Table { Border = TableBorder.Rounded, Title = new TableTitle("Best combinations (least margin per target, and the night and corner that bound it)") };
            foreach (string h in report.Heads) table.AddColumn(Markup.Escape(h));
            foreach (IReadOnlyList<string> row in report.Rows(5))
            {
                bool bad = row[0].StartsWith('!');
                table.AddRow(row.Select((c, i) => i == 0 && bad ? "[red]" + Markup.Escape(c[1..]) + "[/]" : Markup.Escape(c)).ToArray());
            }
            console.Write(table);
            foreach (string line in report.Verdict()) console.MarkupLine((report.Met ? "[green]" : "[red]") + Markup.Escape(line) + "[/]");
            if (winner is not null)
                console.MarkupLine(Markup.Escape($"winning netlist: {winner}; re-check with: nightsim simulate {winner}  and  nightsim spread {winner} --corners"));
            console.MarkupLine($"[grey]wrote {written.Count} files to {Markup.Escape(dir)}: tune.html, tune.json, plots{(winner is null ? "" : ", " + Markup.Escape(Path.GetFileName(winner)))}[/]");
        }
        if (warning is not null) error.WriteLine("warning: " + warning);
        if (!complete)
        {
            error.WriteLine($"stopped by Ctrl+C: {runs.Count} of {header.Total} runs finished; the files in {dir} cover those runs only");
            return StudyCommon.Interrupted;
        }
        return CliErrors.Success;
    }

    /// <summary>The margin plots: predicted least margin of every combination (a line over one parameter, a map over two)
    /// and the simulated least margin of the confirmed ones.</summary>
    private static void Figures(TuneReport report, string dir, List<HtmlFigure> figures, List<string> written, ref string? warning)
    {
        TuneStudy s = report.Study;
        SweepAxis a = s.Axes[0];
        var simulated = report.Results.ToDictionary(r => r.Candidate);
        if (s.Method == TuneMethod.ClosedForms && s.Axes.Count == 1)
        {
            var pts = s.Candidates.Select(c => (c.Values[0].Value, (double?)(c.PredictedMargin * 100), c.PredictedMargin >= 0)).ToList();
            figures.Add(StudyCommon.Plot(StudyPlots.Line($"Predicted least margin against {a.Key}",
                "closed forms at every corner; crosses: predicted to miss a target", a.Key, a.Unit, a.LogScale, "least margin (% of the target)", pts, [("target met above 0", 0)]),
                dir, "tune-predicted", $"Closed-form least margin of every value of {a.Key}", written, ref warning));
        }
        else if (s.Method == TuneMethod.ClosedForms && s.Axes.Count == 2)
        {
            SweepAxis b = s.Axes[1];
            var byCell = s.Candidates.ToDictionary(c => (Array.IndexOf([.. a.Values], c.Values[0].Value), Array.IndexOf([.. b.Values], c.Values[1].Value)));
            figures.Add(StudyCommon.Plot(StudyPlots.HeatMap($"Predicted least margin over {a.Key} × {b.Key}",
                "closed forms at every corner; green: predicted to meet every target; cells: predicted / simulated margin",
                a.Key, [.. a.Values.Select(a.Label)], b.Key, [.. b.Values.Select(b.Label)],
                (i, j) => byCell.TryGetValue((i, j), out TuneCandidate? c)
                    ? (c.PredictedMargin >= 0, TuneReport.Percent(c.PredictedMargin ?? double.NaN) + (simulated.TryGetValue(c.Index, out TuneResult? r) ? "\nsim " + TuneReport.Percent(r.WorstMargin) : ""))
                    : (false, "")),
                dir, "tune-predicted", $"Closed-form least margin over {a.Key} × {b.Key}", written, ref warning));
        }
        if (report.Results.Count > 0)
        {
            var pts = report.Results.OrderBy(r => r.Values[0].Value).Select(r => (r.Values[0].Value, double.IsFinite(r.WorstMargin) ? r.WorstMargin * 100 : (double?)null, r.Pass)).ToList();
            figures.Add(StudyCommon.Plot(StudyPlots.Line($"Simulated least margin of the confirmed combinations",
                $"every night and corner; {(report.Met ? "best: " + report.Values(report.Best!.Values) : "none meets every target")}", a.Key, a.Unit, a.LogScale,
                "least margin (% of the target)", pts, [("target met above 0", 0)]),
                dir, "tune-simulated", "Simulated least margin of each confirmed combination (the other varied values are in the table)", written, ref warning));
        }
    }
}
