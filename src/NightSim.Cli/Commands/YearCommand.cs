using System.CommandLine;
using System.Globalization;
using NightSim.Cli.Plotting;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Studies;
using Spectre.Console;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim year NETLIST [--from DATE --to DATE] [--step DAYS] [--workers N] [--shard i/n] [--out DIR]
/// [--format text|json]`: every night of a year at the scenario's site.</summary>
internal static class YearCommand
{
    public const string DefaultOut = "nightsim-year";

    public static Command Create()
    {
        var command = new Command("year",
            "Every night of a year (or a date range) at the scenario's site, the sky drawn per night from the scenario's " +
            "monthly weather mix: switch-on and off against sunset and sunrise, missed nights, false triggers, energy and " +
            "target pass rate per month. Writes year.json (nights[]), year.csv, year.html and the year plot.");
        StudyCommon.Options o = StudyCommon.Add(command, DefaultOut);
        var from = new Option<string?>("--from") { Description = "First evening, YYYY-MM-DD (default: 1 January of the scenario's year).", HelpName = "DATE" };
        var to = new Option<string?>("--to") { Description = "Last evening, YYYY-MM-DD (default: 31 December of that year).", HelpName = "DATE" };
        var step = new Option<int>("--step") { Description = "Every N-th date only (default 1: every night).", DefaultValueFactory = _ => 1, HelpName = "DAYS" };
        command.Options.Add(from);
        command.Options.Add(to);
        command.Options.Add(step);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            try
            {
                if (pr.GetValue(o.Workers) is int w && w < 1) throw new UsageException("--workers: give at least 1");
                if (pr.GetValue(step) is < 1 or > 366) throw new UsageException("--step: give 1 to 366 days");
                ShardSpec shard = StudyCommon.ParseShard(pr.GetValue(o.Shard));
                NightRunRequest request = StudyCommon.Load(pr.GetValue(o.Netlist)!.ToString(), StudyCommon.ScenarioPath(pr, o), error);
                int year = request.Scenario!.Start.Year;
                DateOnly first = Date(pr.GetValue(from), "--from") ?? new DateOnly(year, 1, 1);
                DateOnly last = Date(pr.GetValue(to), "--to") ?? new DateOnly(first.Year, 12, 31);
                if (last < first) throw new UsageException("--to: the last date is before the first");
                if (last.DayNumber - first.DayNumber > 3660) throw new UsageException("--from/--to: at most ten years");
                var study = new YearStudy(request, first, last, pr.GetValue(step));
                string dir = StudyCommon.OutDir(pr.GetValue(o.Out), DefaultOut);
                StudyHeader header = study.Header(StudyCommon.Tool);
                (List<YearNight> done, bool complete) = StudyCommon.RunItems("year nights", shard.Indices(study.Total), study.Run, pr.GetValue(o.Workers), !pr.GetValue(o.NoProgress), error);
                done = StudyCommon.Normalise(done, YearNight.Read);
                if (!shard.IsWhole) return StudyCommon.WriteShard(shard, dir, header, done, complete, study.Total, "nights", output, error);
                return OutputException.Guard(dir, () => Finish(header, request.Netlist, done, complete, dir, pr.GetValue(o.Format)!, output, error, request));
            }
            catch (UsageException u)
            {
                error.WriteLine(u.Message);
                return CliErrors.Usage;
            }
        }));
        return command;
    }

    /// <summary>
    /// The night plots of the interesting dates (<see cref="PlottedNights"/>): each such date is run once more, with its
    /// plot data, and its night plot, zooms and details are written with the date in their names
    /// (<c>night-DATE</c>, <c>DATE-zoom-NN-…</c>, <c>DATE-detail-NN-…</c>). The run is the study's own, so the same
    /// inputs give the same files whether the study ran at once or in shards.
    /// </summary>
    private static IReadOnlyList<DateOnly> PlotNights(StudyHeader header, List<YearNight> nights, NightRunRequest? request, string dir,
        List<HtmlFigure> figures, List<string> written, ref string? warning)
    {
        if (nights.Count == 0) return [];
        request ??= StudyCommon.Load(header.Netlist, header.Scenario, TextWriter.Null);
        DateOnly Setting(string name) => DateOnly.ParseExact(header.Setting(name)!, "yyyy-MM-dd", CultureInfo.InvariantCulture);
        var study = new YearStudy(request, Setting("from"), Setting("to"), int.Parse(header.Setting("step") ?? "1", CultureInfo.InvariantCulture));
        IReadOnlyList<DateOnly> dates = YearStudy.PlottedDates(nights);
        var runs = new NightRunResult[dates.Count];
        Parallel.For(0, dates.Count, i => runs[i] = study.RunWithPlots(dates[i]));
        var plots = new List<PlotData>();
        for (int i = 0; i < dates.Count; i++)
        {
            string prefix = dates[i].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + "-";
            plots.AddRange(runs[i].Plots.Select(p => p.FileStem.StartsWith("night-", StringComparison.Ordinal) ? p : p with { FileStem = prefix + p.FileStem }));
        }
        PlotSetResult set = PlotSetWriter.WriteAll(plots, dir, (svg, write) => OutputException.Guard(svg, write));
        foreach (PlotFiles f in set.Files)
        {
            written.Add(f.SvgPath);
            if (f.PngPath is not null) written.Add(f.PngPath);
        }
        warning ??= set.Warnings.FirstOrDefault();
        // The page shows each night's plot; its zooms and details are in the folder.
        figures.AddRange(set.Figures.Where((_, i) => plots[i].FileStem.StartsWith("night-", StringComparison.Ordinal)));
        return dates;
    }

    private static DateOnly? Date(string? text, string option)
    {
        if (text is null) return null;
        return DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out DateOnly d)
            ? d : throw new UsageException($"{option}: '{text}' is not a date; write YYYY-MM-DD");
    }

    /// <param name="request">The study's request; null (merge) to load the netlist and scenario the header names.</param>
    public static int Finish(StudyHeader header, NetlistDefinition net, List<YearNight> nights, bool complete, string dir, string format, TextWriter output, TextWriter error,
        NightRunRequest? request = null)
    {
        var report = new YearReport(header, nights, complete, NightSim.Supply.MainsExposure.Cautions(net));
        var written = new List<string>();
        string? warning = null;
        var figures = new List<HtmlFigure>
        {
            StudyCommon.Plot(YearPlot.Build($"Switch-on and off through the year: {header.Netlist}", report.Lines()[0], nights), dir, "year", "Switch-on and switch-off against sunset and sunrise", written, ref warning),
            StudyCommon.Plot(YearPlot.Energy("Energy and pass rate per month", report.Months()), dir, "year-months", "Energy and target pass rate per month", written, ref warning),
        };
        IReadOnlyList<DateOnly> plotted = PlotNights(header, nights, request, dir, figures, written, ref warning);
        string json = Path.Combine(dir, "year.json"), csv = Path.Combine(dir, "year.csv"), html = Path.Combine(dir, "year.html");
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
            var table = new Table { Border = TableBorder.Rounded, Title = new TableTitle($"Year of {Markup.Escape(header.Netlist)}") };
            foreach (string h in report.MonthHeads) table.AddColumn(Markup.Escape(h));
            foreach (IReadOnlyList<string> row in report.MonthRows())
            {
                bool bad = row[0].StartsWith('!');
                table.AddRow(row.Select((c, i) => i == 0 && bad ? "[red]" + Markup.Escape(c[1..]) + "[/]" : Markup.Escape(c)).ToArray());
            }
            console.Write(table);
            foreach (string line in report.Lines()) console.MarkupLine(Markup.Escape(line));
            console.MarkupLine($"[grey]wrote {written.Count} files to {Markup.Escape(dir)}: year.html, year.json, year.csv and plots[/]");
            if (plotted.Count > 0)
            {
                console.MarkupLine($"[grey]night plots for {(plotted.Count == nights.Count ? "every date" : plotted.Count == 1 && nights.All(n => n.Outcome.Pass) ? "the first date, as an example (no date went wrong)" : $"the {plotted.Count} most interesting dates")}: {string.Join(", ", plotted.Select(d => d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)))}[/]");
            }
        }
        if (warning is not null) error.WriteLine("warning: " + warning);
        if (!complete)
        {
            error.WriteLine($"stopped by Ctrl+C: {nights.Count} of {header.Total} dates finished; the files in {dir} cover those dates only");
            return StudyCommon.Interrupted;
        }
        return CliErrors.Success;
    }
}
