using System.Globalization;
using NightSim.Analysis;
using NightSim.Reporting;
using Spectre.Console;

namespace NightSim.Cli.Rendering;

/// <summary>
/// Renders a <see cref="NightReport"/> to the terminal: a verdict line per night, the caution panel, the table of
/// nights, the targets, each relay's contacts against its lamp, findings coloured by severity, one line of solver
/// statistics.
/// </summary>
public static class TerminalReport
{
    /// <summary>Width used when output is redirected (Spectre would otherwise fix it at 80 columns).</summary>
    public const int RedirectedWidth = 160;

    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    /// <summary>When the console is not interactive (redirected), widen it to <see cref="RedirectedWidth"/> columns.</summary>
    public static void ConfigureWidth(IAnsiConsole console)
    {
        if (!console.Profile.Capabilities.Interactive && console.Profile.Width < RedirectedWidth)
            console.Profile.Width = RedirectedWidth;
    }

    /// <summary>Write the whole report to <paramref name="console"/> (calls <see cref="ConfigureWidth"/> first).</summary>
    public static void Render(NightReport report, IAnsiConsole console)
    {
        ConfigureWidth(console);
        console.Write(new Rule("[bold]" + Markup.Escape(report.CircuitName) + "[/]").LeftJustified().RuleStyle("grey"));
        console.MarkupLine("[grey]" + Markup.Escape(Summary(report)) + "[/]");
        foreach (NightSummary n in report.Nights)
        {
            bool ok = ReportText.NightOk(n);
            console.MarkupLine($"{(ok ? "[green]✓[/]" : "[red]✗[/]")} [bold]{n.Date.ToString("yyyy-MM-dd", s_inv)}[/] {(ok ? "" : "[red]")}{Markup.Escape(ReportText.Verdict(n))}{(ok ? "" : "[/]")}");
        }
        if (report.Cautions.Count > 0) console.Write(CautionPanel(report.Cautions));
        console.WriteLine();
        console.Write(NightsTable(report.Nights));
        console.WriteLine();
        WriteTargets(report, console);
        WriteContacts(report.Contacts, console);
        WriteFindings(report.Findings, console, datedFindings: report.Nights.Count > 1);
        console.WriteLine();
        console.MarkupLine("[grey]" + Markup.Escape(StatisticsLine(report.Statistics)) + "[/]");
    }

    /// <summary>"site Hollow Lane (Etc/GMT-1) · 2 nights · seed 42".</summary>
    public static string Summary(NightReport r)
    {
        var parts = new List<string>();
        if (r.SiteName is not null) parts.Add("site " + r.SiteName + (r.TimeZone is null ? "" : " (" + r.TimeZone + ")"));
        parts.Add(r.Nights.Count.ToString(s_inv) + (r.Nights.Count == 1 ? " night" : " nights"));
        parts.Add("seed " + r.Seed.ToString(s_inv));
        return string.Join(" · ", parts);
    }

    /// <summary>"solver: 1234 steps accepted, 5 rejected, 2345 Newton iterations, 12 events, 1.84 s CPU".</summary>
    public static string StatisticsLine(ReportStatistics s) =>
        string.Create(s_inv, $"solver: {s.AcceptedSteps} steps accepted, {s.RejectedSteps} rejected, {s.NewtonIterations} Newton iterations, {s.Events} events, {s.CpuSeconds:0.##} s CPU");

    private static Panel CautionPanel(IReadOnlyList<string> cautions)
    {
        var rows = new Rows(cautions.Select(c => (Spectre.Console.Rendering.IRenderable)new Markup("• " + Markup.Escape(c))));
        return new Panel(rows)
        {
            Header = new PanelHeader("[bold yellow] CAUTION: mains voltage [/]"),
            Border = BoxBorder.Heavy,
            BorderStyle = new Style(Color.Yellow),
            Expand = true,
        };
    }

    private static Table NightsTable(IReadOnlyList<NightSummary> nights)
    {
        var table = new Table().Border(TableBorder.Rounded).BorderColor(Color.Grey).Title("[bold]Nights[/]");
        table.AddColumn("Date");
        table.AddColumn("Sunset");
        table.AddColumn("On at");
        table.AddColumn("Off at");
        table.AddColumn(new TableColumn("Duration").RightAligned());
        table.AddColumn("Cause");
        table.AddColumn(new TableColumn("False trig.").RightAligned());
        table.AddColumn(new TableColumn("Early offs").RightAligned());
        table.AddColumn(new TableColumn("Relay ops").RightAligned());
        table.AddColumn(new TableColumn("Energy Wh").RightAligned());
        if (nights.Count == 0)
        {
            table.AddRow("[grey]no nights[/]", "", "", "", "", "", "", "", "", "");
            return table;
        }
        foreach (NightSummary n in nights.Select(x => ReportText.Condensed(x, ReportText.TableRowsPerNight)))
        {
            int rows = Math.Max(1, n.LoadOn.Count);
            for (int i = 0; i < rows; i++)
            {
                bool first = i == 0;
                LoadInterval? on = n.LoadOn.Count > 0 ? n.LoadOn[i] : null;
                string date = first ? n.Date.ToString("yyyy-MM-dd", s_inv) : "";
                string sunset = first ? ReportText.Clock(n.Sunset) : "";
                string onAt = on is null ? (n.Missed ? "[red]missed[/]" : "—") : ReportText.Clock(on.Start);
                string offAt = on is null ? "—" : on.End is null ? "[yellow]still on[/]" : ReportText.Clock(on.End);
                string duration = on is null ? "—" : (on.Folded > 0 ? "total " : "") + ReportText.Duration(on.DurationSeconds);
                string cause = on is null ? "" : on.Folded > 0
                    ? $"[grey]… {on.Folded} more, mostly {Markup.Escape(ReportText.Cause(on.Cause))}[/]"
                    : on.Expected
                    ? Markup.Escape(ReportText.Cause(on.Cause))
                    : "[red]" + Markup.Escape(ReportText.Cause(on.Cause)) + "[/]";
                table.AddRow(
                    date, sunset, onAt, offAt, duration, cause,
                    first ? Count(n.FalseTriggers) : "",
                    first ? Count(n.EarlyOffs) : "",
                    first ? n.RelayOperations.ToString(s_inv) : "",
                    first ? n.LoadEnergyWh.ToString("0.00", s_inv) : "");
            }
        }
        return table;
    }

    private static string Count(int n) => n > 0 ? "[red]" + n.ToString(s_inv) + "[/]" : "0";

    /// <summary>Per-night target checks (single night: every check; several: failures only) and the summary across nights.</summary>
    private static void WriteTargets(NightReport report, IAnsiConsole console)
    {
        bool hasTargets = report.TargetResults.Any(t => t.Checks.Count > 0);
        if (hasTargets)
        {
            console.MarkupLine("[bold]Targets[/]");
            bool all = report.TargetResults.Count == 1;
            foreach (Targets.NightTargets t in report.TargetResults)
            {
                string verdict = t.Pass ? "[green]pass[/]" : $"[red]FAIL[/] ({t.Failed} of {t.Checks.Count})";
                console.MarkupLine($"  {t.Date:yyyy-MM-dd} {verdict}");
                foreach (Targets.TargetCheck c in t.Checks.Where(c => all || !c.Pass))
                {
                    string mark = c.Pass ? "[green]pass[/]" : "[red]FAIL[/]";
                    console.MarkupLine($"    {mark} [grey]{Markup.Escape(c.Target),-24}[/] margin {Markup.Escape(TargetsText.Margin(c)),-12} {Markup.Escape(c.Detail)}");
                }
            }
            console.WriteLine();
        }
        if (report.Nights.Count > 1 || hasTargets)
        {
            console.MarkupLine(report.Nights.Count > 1 ? $"[bold]Summary across {report.Nights.Count} nights[/]" : "[bold]Summary[/]");
            foreach (string line in TargetsText.OverviewLines(report.Overview, hasTargets)) console.MarkupLine("  " + Markup.Escape(line));
            console.WriteLine();
        }
    }

    /// <summary>Each relay's contacts against its lamp: load, steady and switch-on current, rating, operations, life.</summary>
    private static void WriteContacts(IReadOnlyList<ContactDuty> contacts, IAnsiConsole console)
    {
        if (contacts.Count == 0) return;
        console.MarkupLine("[bold]Relay contacts[/] [grey](switch-on multiples: common practice, from memory)[/]");
        foreach (ContactDuty d in contacts)
        {
            console.MarkupLine("  " + Markup.Escape(ContactText.Title(d)));
            foreach (ContactLine line in ContactText.Lines(d))
            {
                string text = Markup.Escape(line.Text);
                console.MarkupLine($"    [grey]{Markup.Escape(line.Label),-16}[/] {(line.Problem ? "[yellow]" + text + "[/]" : text)}");
            }
        }
        console.WriteLine();
    }

    private static void WriteFindings(IReadOnlyList<Finding> findings, IAnsiConsole console, bool datedFindings = false)
    {
        console.MarkupLine("[bold]Findings[/]");
        if (findings.Count == 0)
        {
            console.MarkupLine("  [green]none: every night behaved as intended[/]");
            return;
        }
        foreach (Finding f in findings.Select((f, i) => (f, i)).OrderByDescending(x => x.f.Severity).ThenBy(x => x.i).Select(x => x.f))
        {
            string colour = f.Severity switch { Severity.Error => "red", Severity.Warning => "yellow", _ => "blue" };
            string sev = ReportText.Severity(f.Severity);
            string where = (f.At is DateTimeOffset at ? " at " + (datedFindings ? at.ToString("yyyy-MM-dd HH:mm:ss", s_inv) : ReportText.Clock(at)) : "") + (f.Part is null ? "" : " (" + f.Part + ")");
            console.MarkupLine($"  [bold {colour}]{sev,-7}[/] [grey]{Markup.Escape(f.Code)}{Markup.Escape(where)}[/]: {Markup.Escape(f.Message)}");
            if (f.Fix is not null) console.MarkupLine("          [green]fix:[/] " + Markup.Escape(f.Fix));
        }
    }
}
