using System.Globalization;
using System.Text;
using NightSim.Analysis;

namespace NightSim.Reporting;

/// <summary>
/// Writes report.html: one self-contained HTML5 page (inline CSS and inline SVG plots, no scripts, no external
/// files): a one-line verdict per night first, then the cautions, the findings, the table of nights, the targets, each
/// relay's contacts against its lamp, the light and noise events (given by time, then drawn from the seed), the plots, the parts with the circuit hash and the solver
/// statistics. The markup is also well-formed XML (every element closed, attributes quoted, only XML's own
/// entities), so simple parsers and tests can read it.
/// </summary>
public static class HtmlReportWriter
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    /// <summary>Write the page for <paramref name="report"/> with <paramref name="figures"/> to <paramref name="path"/> atomically.</summary>
    public static void Write(NightReport report, IReadOnlyList<HtmlFigure> figures, string path) =>
        AtomicFile.WriteText(path, Render(report, figures));

    /// <summary>The page as a string.</summary>
    public static string Render(NightReport report, IReadOnlyList<HtmlFigure> figures)
    {
        var h = new StringBuilder(64 * 1024);
        h.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n");
        h.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n");
        h.Append("<title>").Append(Esc("NightSim report — " + report.CircuitName)).Append("</title>\n");
        h.Append("<style>").Append(Css).Append("</style>\n</head>\n<body>\n<main>\n");

        AppendHeader(h, report);
        AppendVerdict(h, report.Nights);
        if (report.Cautions.Count > 0) AppendCautions(h, report.Cautions);
        AppendFindings(h, report.Findings);
        AppendNights(h, report.Nights);
        AppendTargets(h, report);
        AppendContacts(h, report.Contacts);
        AppendEvents(h, report.Events);
        AppendFigures(h, figures);
        AppendParts(h, report);
        AppendStatistics(h, report.Statistics);

        h.Append("<footer>").Append(Esc(report.Tool)).Append(" · report.json holds the same results in machine-readable form")
         .Append("</footer>\n</main>\n</body>\n</html>\n");
        return h.ToString();
    }

    private static void AppendHeader(StringBuilder h, NightReport r)
    {
        h.Append("<header>\n<h1>").Append(Esc(r.CircuitName)).Append("</h1>\n<p class=\"summary\">");
        var parts = new List<string>();
        if (r.SiteName is not null)
            parts.Add("site " + r.SiteName + (r.TimeZone is null ? "" : " (" + r.TimeZone + ")"));
        parts.Add(r.Nights.Count.ToString(s_inv) + (r.Nights.Count == 1 ? " night" : " nights"));
        parts.Add("seed " + r.Seed.ToString(s_inv));
        h.Append(Esc(string.Join(" · ", parts))).Append("</p>\n<p class=\"files\">netlist <code>").Append(Esc(r.Netlist))
         .Append("</code>");
        if (r.Scenario is not null) h.Append(" · scenario <code>").Append(Esc(r.Scenario)).Append("</code>");
        h.Append("</p>\n</header>\n");
    }

    private static void AppendVerdict(StringBuilder h, IReadOnlyList<NightSummary> nights)
    {
        h.Append("<section id=\"verdict\">\n<ul class=\"verdict\">\n");
        if (nights.Count == 0) h.Append("<li class=\"night-verdict problem\">No night was simulated.</li>\n");
        foreach (NightSummary n in nights)
        {
            bool ok = ReportText.NightOk(n);
            h.Append("<li class=\"night-verdict ").Append(ok ? "ok" : "problem").Append("\"><span class=\"mark\">")
             .Append(ok ? "✓" : "✗").Append("</span> <strong>").Append(n.Date.ToString("yyyy-MM-dd", s_inv)).Append("</strong> ")
             .Append(Esc(ReportText.Verdict(n))).Append("</li>\n");
        }
        h.Append("</ul>\n</section>\n");
    }

    private static void AppendParts(StringBuilder h, NightReport r)
    {
        if (r.Parts.Count == 0) return;
        h.Append("<section id=\"parts\">\n<h2>Parts</h2>\n<p class=\"hash\">circuit hash <code title=\"")
         .Append(Esc(r.CircuitHash)).Append("\">").Append(Esc(r.CircuitHash.Length > 16 ? r.CircuitHash[..16] : r.CircuitHash))
         .Append("</code> (SHA-256 of every part, connection and value; compare two reports with <code>nightsim compare A/report.json B/report.json</code>)</p>\n")
         .Append("<div class=\"scroll\">\n<table class=\"parts\">\n<thead>\n<tr><th scope=\"col\">Part</th><th scope=\"col\">Kind</th>")
         .Append("<th scope=\"col\">Connections</th><th scope=\"col\">Values (defaults not listed)</th></tr>\n</thead>\n<tbody>\n");
        foreach (ReportPart p in r.Parts)
        {
            h.Append("<tr>");
            Cell(h, "", p.Id, "date");
            Cell(h, "", p.Kind);
            Cell(h, "", string.Join(", ", p.Connections.Select(c => c.Key + " " + c.Value)));
            Cell(h, "", string.Join(", ", p.Values.Select(v => v.Key + " " + v.Value)));
            h.Append("</tr>\n");
        }
        h.Append("</tbody>\n</table>\n</div>\n</section>\n");
    }

    private static void AppendCautions(StringBuilder h, IReadOnlyList<string> cautions)
    {
        h.Append("<section class=\"caution\" id=\"cautions\">\n<h2>Caution: mains voltage</h2>\n<ul>\n");
        foreach (string c in cautions) h.Append("<li>").Append(Esc(c)).Append("</li>\n");
        h.Append("</ul>\n</section>\n");
    }

    private static void AppendFindings(StringBuilder h, IReadOnlyList<Finding> findings)
    {
        h.Append("<section id=\"findings\">\n<h2>Findings</h2>\n");
        if (findings.Count == 0)
        {
            h.Append("<p class=\"none\">No findings: every night behaved as intended.</p>\n</section>\n");
            return;
        }
        // Errors first, then warnings, then information; the analysers' order within each.
        IEnumerable<Finding> ordered = findings.Select((f, i) => (f, i))
            .OrderByDescending(x => x.f.Severity).ThenBy(x => x.i).Select(x => x.f);
        h.Append("<ul class=\"findings\">\n");
        foreach (Finding f in ordered)
        {
            string sev = ReportText.Severity(f.Severity);
            h.Append("<li class=\"finding ").Append(sev).Append("\">\n<p class=\"head\"><span class=\"badge ")
             .Append(sev).Append("\">").Append(sev).Append("</span> <code>").Append(Esc(f.Code)).Append("</code>");
            if (f.At is DateTimeOffset at) h.Append(" <span class=\"meta\">at ").Append(Esc(ReportText.Iso(at).Replace('T', ' '))).Append("</span>");
            if (f.Part is not null) h.Append(" <span class=\"meta\">part <code>").Append(Esc(f.Part)).Append("</code></span>");
            h.Append("</p>\n<p class=\"message\">").Append(Esc(f.Message)).Append("</p>\n");
            if (f.Fix is not null) h.Append("<p class=\"fix\"><strong>Fix:</strong> ").Append(Esc(f.Fix)).Append("</p>\n");
            h.Append("</li>\n");
        }
        h.Append("</ul>\n</section>\n");
    }

    private static readonly string[] s_nightHeads =
    [
        "Date", "Sunset", "Switch level", "On", "Off", "Duration", "Cause", "Expected",
        "False triggers", "Early offs", "Chatter", "Relay ops", "Energy (Wh)", "Missed", "On at sunrise",
    ];

    private static void AppendNights(StringBuilder h, IReadOnlyList<NightSummary> nights)
    {
        h.Append("<section id=\"nights\">\n<h2>Nights</h2>\n<div class=\"scroll\">\n<table class=\"nights\">\n<thead>\n<tr>");
        foreach (string head in s_nightHeads) h.Append("<th scope=\"col\">").Append(Esc(head)).Append("</th>");
        h.Append("</tr>\n</thead>\n");
        foreach (NightSummary n in nights.Select(x => ReportText.Condensed(x, 3 * ReportText.TableRowsPerNight)))
        {
            int rows = Math.Max(1, n.LoadOn.Count);
            string span = rows > 1 ? " rowspan=\"" + rows.ToString(s_inv) + "\"" : "";
            string cls = n.Missed || n.FalseTriggers > 0 || n.EarlyOffs > 0 || n.ChatterBursts > 0 || n.OnAfterSunrise
                ? "night problem" : "night";
            h.Append("<tbody class=\"").Append(cls).Append("\">\n");
            for (int i = 0; i < rows; i++)
            {
                LoadInterval? on = n.LoadOn.Count > 0 ? n.LoadOn[i] : null;
                h.Append(on is not null && !on.Expected ? "<tr class=\"unexpected\">" : "<tr>");
                if (i == 0)
                {
                    Cell(h, span, n.Date.ToString("yyyy-MM-dd", s_inv), "date");
                    Cell(h, span, ReportText.Clock(n.Sunset));
                    string level = n.SwitchLevelCrossing is null ? "—" : ReportText.Clock(n.SwitchLevelCrossing);
                    if (n.SwitchLevelLux is double lux) level += " at " + ReportText.Lux(lux) + " lx";
                    Cell(h, span, level);
                }
                if (on is null)
                {
                    for (int k = 0; k < 5; k++) Cell(h, "", "—");
                }
                else
                {
                    Cell(h, "", ReportText.Clock(on.Start));
                    h.Append("<td class=\"off\">").Append(Esc(on.End is null ? "still on" : ReportText.Clock(on.End)))
                     .Append("<div class=\"note\">").Append(Esc(on.EndedBy)).Append("</div></td>");
                    Cell(h, "", ReportText.Duration(on.DurationSeconds), "num");
                    h.Append("<td class=\"cause\">").Append(Esc(on.Folded > 0 ? $"… {on.Folded} more" : ReportText.Cause(on.Cause)));
                    if (on.Explanation.Length > 0) h.Append("<div class=\"note\">").Append(Esc(on.Explanation)).Append("</div>");
                    h.Append("</td>");
                    h.Append(on.Expected ? "<td class=\"yes\">yes</td>" : "<td class=\"no\">no</td>");
                }
                if (i == 0)
                {
                    Count(h, span, n.FalseTriggers);
                    Count(h, span, n.EarlyOffs);
                    Count(h, span, n.ChatterBursts);
                    Cell(h, span, n.RelayOperations.ToString(s_inv), "num");
                    Cell(h, span, n.LoadEnergyWh.ToString("0.00", s_inv), "num");
                    Flag(h, span, n.Missed);
                    Flag(h, span, n.OnAfterSunrise);
                }
                h.Append("</tr>\n");
            }
            h.Append("</tbody>\n");
        }
        h.Append("</table>\n</div>\n</section>\n");
    }

    private static void AppendTargets(StringBuilder h, NightReport report)
    {
        bool hasTargets = report.TargetResults.Any(t => t.Checks.Count > 0);
        if (!hasTargets && report.Nights.Count < 2) return;
        h.Append("<section id=\"targets\">\n<h2>").Append(hasTargets ? "Targets" : "Summary across nights").Append("</h2>\n<ul class=\"overview\">\n");
        foreach (string line in TargetsText.OverviewLines(report.Overview, hasTargets)) h.Append("<li>").Append(Esc(line)).Append("</li>\n");
        h.Append("</ul>\n");
        if (hasTargets)
        {
            h.Append("<div class=\"scroll\">\n<table class=\"targets\">\n<thead>\n<tr><th scope=\"col\">Night</th><th scope=\"col\">Target</th>")
             .Append("<th scope=\"col\">Result</th><th scope=\"col\">Margin</th><th scope=\"col\">Detail</th></tr>\n</thead>\n<tbody>\n");
            foreach (Targets.NightTargets t in report.TargetResults)
            {
                foreach (Targets.TargetCheck c in t.Checks)
                {
                    h.Append("<tr class=\"").Append(c.Pass ? "pass" : "fail").Append("\"><td>").Append(t.Date.ToString("yyyy-MM-dd", s_inv))
                     .Append("</td><td><code>").Append(Esc(c.Target)).Append("</code></td><td>").Append(c.Pass ? "pass" : "FAIL")
                     .Append("</td><td class=\"num\">").Append(Esc(TargetsText.Margin(c))).Append("</td><td>").Append(Esc(c.Detail)).Append("</td></tr>\n");
                }
            }
            h.Append("</tbody>\n</table>\n</div>\n");
        }
        h.Append("</section>\n");
    }

    private static void AppendContacts(StringBuilder h, IReadOnlyList<ContactDuty> contacts)
    {
        if (contacts.Count == 0) return;
        h.Append("<section id=\"contacts\">\n<h2>Relay contacts against the lamp</h2>\n");
        foreach (ContactDuty d in contacts)
        {
            h.Append("<table class=\"contacts\">\n<caption>").Append(Esc(ContactText.Title(d))).Append("</caption>\n<tbody>\n");
            foreach (ContactLine line in ContactText.Lines(d))
            {
                h.Append(line.Problem ? "<tr class=\"fail\">" : "<tr>").Append("<th scope=\"row\">").Append(Esc(line.Label))
                 .Append("</th><td>").Append(Esc(line.Text)).Append("</td></tr>\n");
            }
            h.Append("</tbody>\n</table>\n");
        }
        h.Append("<p class=\"note\">Switch-on multiples and typical power factors are common practice of the trade, from memory; the lamp's and the relay's own data come first.</p>\n</section>\n");
    }

    private static void AppendEvents(StringBuilder h, IReadOnlyList<ReportEvent> events)
    {
        h.Append("<section id=\"events\">\n<h2>Light and noise events</h2>\n");
        if (events.Count == 0)
        {
            h.Append("<p class=\"none\">The scenario scheduled no light or noise events.</p>\n</section>\n");
            return;
        }
        List<ReportEvent> given = events.Where(e => !e.DrawnFromSeed).ToList();
        List<ReportEvent> drawn = events.Where(e => e.DrawnFromSeed).ToList();
        if (given.Count > 0) EventTable(h, given, " at the times the scenario gives", open: given.Count <= 12);
        if (drawn.Count > 0) EventTable(h, drawn, " drawn from the seed", open: false);
        h.Append("</section>\n");
    }

    private static void EventTable(StringBuilder h, List<ReportEvent> events, string what, bool open)
    {
        h.Append(open ? "<details open=\"open\">\n<summary>" : "<details>\n<summary>").Append(events.Count.ToString(s_inv))
         .Append(events.Count == 1 ? " event" : " events").Append(what).Append("</summary>\n")
         .Append("<div class=\"scroll\">\n<table class=\"events\">\n<thead>\n<tr><th scope=\"col\">Kind</th><th scope=\"col\">Start</th>")
         .Append("<th scope=\"col\">End</th><th scope=\"col\">Peak</th><th scope=\"col\">Description</th></tr>\n</thead>\n<tbody>\n");
        foreach (ReportEvent e in events)
        {
            h.Append("<tr>");
            Cell(h, "", e.Kind);
            Cell(h, "", ReportText.Iso(e.Start).Replace('T', ' '));
            Cell(h, "", ReportText.Iso(e.End).Replace('T', ' '));
            Cell(h, "", e.Peak.ToString("G4", s_inv), "num");
            Cell(h, "", e.Description);
            h.Append("</tr>\n");
        }
        h.Append("</tbody>\n</table>\n</div>\n</details>\n");
    }

    private static void AppendFigures(StringBuilder h, IReadOnlyList<HtmlFigure> figures)
    {
        if (figures.Count == 0) return;
        h.Append("<section id=\"plots\">\n<h2>Plots</h2>\n");
        foreach (HtmlFigure f in figures)
        {
            h.Append("<figure>\n<figcaption>").Append(Esc(f.Title)).Append("</figcaption>\n")
             .Append(StripProlog(f.Svg)).Append("\n</figure>\n");
        }
        h.Append("</section>\n");
    }

    private static void AppendStatistics(StringBuilder h, ReportStatistics s)
    {
        h.Append("<section id=\"statistics\">\n<h2>Solver statistics</h2>\n<table class=\"stats\">\n<tbody>\n");
        Stat(h, "Accepted steps", s.AcceptedSteps.ToString(s_inv));
        Stat(h, "Rejected steps", s.RejectedSteps.ToString(s_inv));
        Stat(h, "Newton iterations", s.NewtonIterations.ToString(s_inv));
        Stat(h, "Discrete events", s.Events.ToString(s_inv));
        Stat(h, "CPU time", s.CpuSeconds.ToString("0.###", s_inv) + " s");
        h.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void Stat(StringBuilder h, string name, string value) =>
        h.Append("<tr><th scope=\"row\">").Append(Esc(name)).Append("</th><td class=\"num\">").Append(Esc(value)).Append("</td></tr>\n");

    private static void Cell(StringBuilder h, string span, string text, string? cls = null)
    {
        h.Append("<td").Append(span);
        if (cls is not null) h.Append(" class=\"").Append(cls).Append('"');
        h.Append('>').Append(Esc(text)).Append("</td>");
    }

    private static void Count(StringBuilder h, string span, int n) =>
        Cell(h, span, n.ToString(s_inv), n > 0 ? "num bad" : "num");

    private static void Flag(StringBuilder h, string span, bool flag) =>
        Cell(h, span, flag ? "yes" : "no", flag ? "bad" : null);

    /// <summary>Escape text for element content and quoted attribute values (XML-safe: no named HTML entities).</summary>
    public static string Esc(string text)
    {
        if (text.AsSpan().IndexOfAny("&<>\"'") < 0 && !HasControl(text)) return text;
        var sb = new StringBuilder(text.Length + 16);
        foreach (char c in text)
        {
            switch (c)
            {
                case '&': sb.Append("&amp;"); break;
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case '"': sb.Append("&quot;"); break;
                case '\'': sb.Append("&#39;"); break;
                default:
                    // Control characters other than tab and line breaks are not allowed in HTML or XML text.
                    if (c < ' ' && c != '\t' && c != '\n' && c != '\r') sb.Append('\uFFFD'); else sb.Append(c);
                    break;
            }
        }
        return sb.ToString();
    }

    private static bool HasControl(string text)
    {
        foreach (char c in text) if (c < ' ' && c != '\t' && c != '\n' && c != '\r') return true;
        return false;
    }

    /// <summary>Drop an XML declaration and doctype before the &lt;svg&gt; element so it can sit inside the page.</summary>
    private static string StripProlog(string svg)
    {
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        return start > 0 ? svg[start..] : svg;
    }

    private const string Css = """

:root { color-scheme: light; }
body { margin: 0; background: #f4f5f7; color: #1f2933; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", "DejaVu Sans", sans-serif; }
main { max-width: 1100px; margin: 0 auto; padding: 24px 28px 40px; background: #ffffff; min-height: 100vh; box-sizing: border-box; }
h1 { font-size: 1.6em; margin: 0 0 4px; color: #17324d; }
h2 { font-size: 1.2em; margin: 28px 0 10px; padding-bottom: 4px; border-bottom: 2px solid #d8dee6; color: #17324d; }
header p { margin: 2px 0; color: #4a5866; }
code { font-family: "DejaVu Sans Mono", ui-monospace, monospace; font-size: 0.92em; background: #eef1f5; padding: 0 4px; border-radius: 3px; }
ul.verdict { list-style: none; padding: 0; margin: 14px 0 0; }
.night-verdict { font-size: 1.08em; padding: 7px 12px; margin: 4px 0; border-radius: 5px; border-left: 6px solid; }
.night-verdict.ok { background: #ecf6ee; border-left-color: #2e7d32; }
.night-verdict.problem { background: #fdf0ef; border-left-color: #b42318; }
.night-verdict .mark { font-weight: 700; }
.night-verdict.ok .mark { color: #2e7d32; }
.night-verdict.problem .mark { color: #b42318; }
p.hash { color: #4a5866; }
table.parts { width: 100%; }
.caution { margin-top: 14px; border: 2px solid #c98a00; background: #fff8e1; border-radius: 6px; padding: 4px 18px 8px; }
.caution h2 { border: none; margin: 10px 0 4px; color: #7a4d00; }
.caution li { margin: 3px 0; }
.none { color: #4a5866; font-style: italic; }
ul.findings { list-style: none; padding: 0; margin: 0; }
.finding { border: 1px solid #d8dee6; border-left-width: 6px; border-radius: 4px; padding: 6px 14px; margin: 8px 0; }
.finding.error { border-left-color: #b42318; }
.finding.warning { border-left-color: #c98a00; }
.finding.info { border-left-color: #3b6ea8; }
.finding p { margin: 4px 0; }
.finding .meta { color: #5b6875; font-size: 0.9em; }
.finding .fix { color: #24492f; }
.badge { display: inline-block; min-width: 4.6em; text-align: center; font-size: 0.78em; font-weight: 700; text-transform: uppercase; letter-spacing: 0.04em; color: #ffffff; border-radius: 10px; padding: 1px 8px; }
.badge.error { background: #b42318; }
.badge.warning { background: #b27700; }
.badge.info { background: #3b6ea8; }
.scroll { overflow-x: auto; }
table { border-collapse: collapse; font-size: 0.85em; }
table.nights, table.events { width: 100%; }
th, td { padding: 5px 5px; border-bottom: 1px solid #e1e6ec; text-align: left; vertical-align: top; }
thead th { vertical-align: bottom; background: #e8edf3; color: #1f3a56; font-weight: 600; border-bottom: 2px solid #c5cfdb; }
table.nights thead th { font-size: 0.92em; }
table.nights tbody.night:nth-of-type(even) td, table.events tbody tr:nth-child(even) td { background: #f6f8fa; }
table.nights tbody.night td { border-bottom: 1px solid #d0d7df; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
tr.fail td { background: #fdecea; }
td.date { white-space: nowrap; font-weight: 600; }
td.bad { color: #b42318; font-weight: 700; }
td.yes { color: #24492f; }
td.no { color: #b42318; font-weight: 700; }
tr.unexpected td { background: #fdf0ef; }
.note { color: #5b6875; font-size: 0.86em; }
td.cause { min-width: 9em; }

details summary { cursor: pointer; color: #17324d; font-weight: 600; margin: 4px 0 8px; }
figure { margin: 14px 0 26px; }
figcaption { font-weight: 600; color: #17324d; margin-bottom: 6px; }
figure svg { width: 100%; height: auto; display: block; border: 1px solid #e1e6ec; border-radius: 4px; background: #ffffff; }
table.stats th { font-weight: 500; color: #4a5866; padding-right: 28px; }
table.contacts { margin: 6px 0 14px; }
table.contacts caption { text-align: left; font-weight: 600; color: #17324d; padding: 2px 0 4px; }
table.contacts th { font-weight: 500; color: #4a5866; padding-right: 20px; white-space: nowrap; }
footer { margin-top: 36px; color: #7a8794; font-size: 0.85em; border-top: 1px solid #e1e6ec; padding-top: 8px; }

""";
}
