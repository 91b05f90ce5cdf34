using System.Globalization;
using System.Text;
using NightSim.Reporting;
using NightSim.Units;

namespace NightSim.Studies;

/// <summary>
/// The files of a sweep: sweep.json (schema docs/sweep.schema.json) with `points[]`, sweep.csv and the page, all a
/// function of the header, the axes and the finished points.
/// </summary>
public sealed record SweepReport(StudyHeader Header, IReadOnlyList<SweepAxis> Axes, IReadOnlyList<SweepPoint> Points, bool Complete, IReadOnlyList<string> Cautions)
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    public byte[] Json() => StudyJson.Bytes(w =>
    {
        w.WriteStartObject();
        Header.WriteProperties(w);
        w.WriteBoolean("complete", Complete);
        w.WriteNumber("finished", Points.Count);
        w.WriteStartArray("axes");
        foreach (SweepAxis a in Axes)
        {
            w.WriteStartObject();
            w.WriteString("key", a.Key);
            w.WriteString("part", a.PartId);
            w.WriteString("parameter", a.Parameter);
            w.WriteString("unit", a.Unit);
            w.WriteString("spec", a.Text);
            w.WriteString("sets", a.Target switch { SweepTarget.ScenarioField => "scenario number", SweepTarget.ScenarioFile => "scenario file", _ => "part parameter" });
            w.WriteStartArray("values");
            foreach (double v in a.Values) w.WriteNumberValue(v);
            w.WriteEndArray();
            if (a.Labels is not null)
            {
                w.WriteStartArray("labels");
                foreach (string l in a.Labels) w.WriteStringValue(l);
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartObject("summary");
        w.WriteNumber("points", Points.Count);
        w.WriteNumber("passed", Points.Count(p => p.Outcome.Pass));
        w.WriteEndObject();
        w.WriteStartArray("points");
        foreach (SweepPoint p in Points) p.Write(w);
        w.WriteEndArray();
        w.WriteEndObject();
    });

    public string Csv()
    {
        var sb = new StringBuilder();
        sb.Append(StudyJson.CsvLine(["index", .. Axes.Select(a => a.Key), .. StudyOutcome.CsvHeader])).Append('\n');
        foreach (SweepPoint p in Points)
        {
            sb.Append(StudyJson.CsvLine([StudyJson.Csv(p.Index), .. p.Values.Select((v, i) => Axes[i].Labels is null ? StudyJson.Csv(v.Value) : Axes[i].Label(v.Value)), .. p.Outcome.CsvCells()])).Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>Column heads of <see cref="Rows"/>.</summary>
    public IReadOnlyList<string> Heads =>
        [.. Axes.Select(a => a.Key), "Switch-on", "vs sunset", "On-time", "False trig.", "Early offs", "Chatter", "Targets", "Result"];

    /// <summary>The outcome table, one row per point; a failing row's first cell starts with "!".</summary>
    public IEnumerable<IReadOnlyList<string>> Rows() => Points.Select(p =>
    {
        StudyOutcome o = p.Outcome;
        var cells = new List<string>();
        cells.AddRange(p.Values.Select((v, i) => Axes[i].Label(v.Value)));
        if (!o.Pass) cells[0] = "!" + cells[0];
        cells.Add(o.SwitchOn is null ? (o.Missed ? "missed" : "—") : o.SwitchOn.Substring(11, 5));
        cells.Add(o.SwitchOnMinutesAfterSunset is double m ? string.Create(s_inv, $"{m:+0;−0} min") : "—");
        cells.Add(o.OnSeconds is double s ? (o.NeverEnds ? "never ends" : ReportText.Duration(s)) : "—");
        cells.Add(StudyJson.Csv(o.FalseTriggers));
        cells.Add(StudyJson.Csv(o.EarlyOffs));
        cells.Add(StudyJson.Csv(o.ChatterBursts));
        cells.Add(o.TargetsChecked == 0 ? "—" : string.Create(s_inv, $"{o.TargetsChecked - o.TargetsFailed}/{o.TargetsChecked}"));
        cells.Add(o.Pass ? "pass" : "FAIL" + (o.FailedTargets.Length > 0 ? " (" + o.FailedTargets + ")" : o.Failure is null ? " (" + SpreadReport.Describe(o) + ")" : " (simulation failed)"));
        return (IReadOnlyList<string>)cells;
    });

    public string Summary() => string.Create(s_inv, $"{Points.Count(p => p.Outcome.Pass)} of {Points.Count} points pass")
        + (Complete ? "" : string.Create(s_inv, $" (stopped early: {Points.Count} of {Header.Total} points finished)"));

    public string Html(IReadOnlyList<HtmlFigure> figures)
    {
        var page = new StudyPage($"Sweep: {Header.Netlist}", string.Join(" × ", Axes.Select(a => $"{a.Key} = {a.Text} ({a.Values.Count} values)"))
            + (Axes.Any(a => a.Target == SweepTarget.ScenarioFile) ? "" : $" · scenario {Header.Scenario ?? "—"}"), Cautions);
        page.Section("Result").Paragraph(Summary(), "verdict");
        page.Figures(figures);
        page.Section("Points").Table(Heads, Rows());
        return page.Render($"{Header.Tool} · sweep.json and sweep.csv hold the same results in machine-readable form");
    }
}
