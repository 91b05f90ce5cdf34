using System.CommandLine;
using System.Globalization;
using NightSim.Cli.Plotting;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Studies;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim spread NETLIST [--runs N] [--corners] [--seed S] [--workers N] [--shard i/n] [--out DIR]
/// [--format text|json]`: Monte Carlo over the parts as bought and the scenario's random events.</summary>
internal static class SpreadCommand
{
    public const string DefaultOut = "nightsim-spread";

    public static Command Create()
    {
        var command = new Command("spread",
            "Monte Carlo over part tolerances and the scenario's random events: percentiles of switch-on and on-time, " +
            "probabilities of a missed night, a timer that never ends, false triggers and chatter, the target pass rate with " +
            "its 95 % interval, histograms and the worst runs (each re-runnable with simulate). --corners runs each tolerance " +
            "extreme instead. Writes spread.json, spread.csv, spread.html, plots and runs/ (worst runs).");
        StudyCommon.Options o = StudyCommon.Add(command, DefaultOut);
        var runs = new Option<int>("--runs", "-n") { Description = "Number of random runs (default 200).", DefaultValueFactory = _ => 200, HelpName = "N" };
        var corners = new Option<bool>("--corners") { Description = "Run nominal, every tolerance extreme one at a time (2k+1 runs), then the combined worst cases (every band at the end that shortens or lengthens the on-time, lowers or raises the switch-on level), instead of random draws." };
        var seed = new Option<ulong>("--seed") { Description = "Study seed; run i is seeded from it and i (default 1).", DefaultValueFactory = _ => 1UL, HelpName = "S" };
        command.Options.Add(runs);
        command.Options.Add(corners);
        command.Options.Add(seed);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            try
            {
                int n = pr.GetValue(runs);
                if (n is < 1 or > 1_000_000) throw new UsageException("--runs: give 1 to 1000000 runs");
                if (pr.GetValue(o.Workers) is int w && w < 1) throw new UsageException("--workers: give at least 1");
                ShardSpec shard = StudyCommon.ParseShard(pr.GetValue(o.Shard));
                NightRunRequest request = StudyCommon.Load(pr.GetValue(o.Netlist)!.ToString(), StudyCommon.ScenarioPath(pr, o), error);
                string dir = StudyCommon.OutDir(pr.GetValue(o.Out), DefaultOut);
                var study = new SpreadStudy(request, n, pr.GetValue(corners), pr.GetValue(seed));
                StudyHeader header = study.Header(StudyCommon.Tool);
                bool progress = !pr.GetValue(o.NoProgress);
                (List<SpreadRun> done, bool complete) = StudyCommon.RunItems("spread runs", shard.Indices(study.Total), study.Run, pr.GetValue(o.Workers), progress, error);
                done = StudyCommon.Normalise(done, SpreadRun.Read);
                if (!shard.IsWhole) return StudyCommon.WriteShard(shard, dir, header, done, complete, study.Total, "runs", output, error);
                return OutputException.Guard(dir, () => Finish(header, request.Netlist, done, complete, dir, pr.GetValue(o.Format)!, output, error));
            }
            catch (UsageException u)
            {
                error.WriteLine(u.Message);
                return CliErrors.Usage;
            }
        }));
        return command;
    }

    /// <summary>Writes every file of a finished (or stopped) spread and prints the summary. Shared with merge.</summary>
    public static int Finish(StudyHeader header, NetlistDefinition net, List<SpreadRun> runs, bool complete, string dir, string format,
        TextWriter output, TextWriter error)
    {
        IReadOnlyList<Variation> variations = ToleranceModel.For(net);
        var report = new SpreadReport(header, variations, runs, complete, NightSim.Supply.MainsExposure.Cautions(net));
        var written = new List<string>();
        string? warning = null;
        var figures = new List<HtmlFigure>();
        SpreadSummary s = report.Summary;
        string rate = string.Create(CultureInfo.InvariantCulture, $"pass rate {s.Pass.Rate * 100:0.0} % (95 % interval {s.Pass.Low * 100:0.0}–{s.Pass.High * 100:0.0} %)");
        string worst = "worst seeds " + string.Join(", ", s.Worst.Select(i => runs.First(r => r.Index == i).Seed.ToString(CultureInfo.InvariantCulture)));
        LightTargets targets = LightTargets.Of(header.Scenario);

        var onHours = runs.Where(r => r.Outcome.OnSeconds is not null && !r.Outcome.NeverEnds).Select(r => r.Outcome.OnSeconds!.Value / 3600).ToList();
        int never = runs.Count(r => r.Outcome.NeverEnds);
        var onTargets = new List<(string, double)>();
        if (targets.OnMin is double a) onTargets.Add(("target min", a / 3600));
        if (targets.OnMax is double b) onTargets.Add(("target max", b / 3600));
        figures.Add(StudyCommon.Plot(StudyPlots.Histogram($"On-time over {runs.Count} runs: {rate}",
            $"{worst}{(never > 0 ? $"; {never} runs never ended (not shown)" : "")}", "on-time (h)", onHours, onTargets),
            dir, "spread-on-time", "On-time histogram with the target range", written, ref warning));
        var after = runs.Where(r => r.Outcome.SwitchOnMinutesAfterSunset is not null).Select(r => r.Outcome.SwitchOnMinutesAfterSunset!.Value).ToList();
        var afterTargets = new List<(string, double)>();
        if (targets.AfterSunset is double m) afterTargets.Add(("target latest", m));
        figures.Add(StudyCommon.Plot(StudyPlots.Histogram($"Switch-on over {runs.Count} runs", rate, "switch-on (minutes after sunset)", after, afterTargets),
            dir, "spread-switch-on", "Switch-on time histogram", written, ref warning));

        // The worst runs as files simulate takes.
        foreach (int i in s.Worst)
        {
            SpreadRun r = runs.First(x => x.Index == i);
            string target = Path.Combine(dir, SpreadReport.RunFile(i));
            written.Add(DrawnRunWriter.Write(header.Netlist, header.Scenario, target, r.Values, r.Seed, r.Sky));
        }
        string json = Path.Combine(dir, "spread.json"), csv = Path.Combine(dir, "spread.csv"), html = Path.Combine(dir, "spread.html");
        AtomicFile.Write(json, st => st.Write(report.Json()));
        AtomicFile.WriteText(csv, report.Csv());
        AtomicFile.WriteText(html, report.Html(figures));
        written.AddRange([json, csv, html]);

        if (format == "json") output.Write(System.Text.Encoding.UTF8.GetString(report.Json()));
        else
        {
            if (report.Cautions.Count > 0) output.WriteLine("CAUTION: mains voltage. " + string.Join(" ", report.Cautions));
            output.WriteLine($"spread of {header.Netlist}: {runs.Count} runs ({header.Setting("mode")}), seed {header.Seed}");
            foreach (string line in report.Lines()) output.WriteLine("  " + line);
            output.WriteLine("worst runs:");
            foreach (string line in report.WorstLines()) output.WriteLine("  " + line.Replace("nightsim simulate runs/", "nightsim simulate " + Path.Combine(dir, "runs") + "/", StringComparison.Ordinal));
            output.WriteLine($"wrote {written.Count} files to {dir}: spread.html, spread.json, spread.csv, plots, runs/");
        }
        if (warning is not null) error.WriteLine("warning: " + warning);
        if (!complete)
        {
            error.WriteLine($"stopped by Ctrl+C: {runs.Count} of {header.Total} runs finished; the files in {dir} cover those runs only");
            return StudyCommon.Interrupted;
        }
        return CliErrors.Success;
    }
}
