using System.Globalization;
using System.Text;
using NightSim.Reporting;

namespace NightSim.Studies;

/// <summary>One calendar month of a year study.</summary>
public sealed record YearMonth(int Year, int Month, int Nights, int Passed, int Missed, int NeverEnds, int FalseTriggers, double EnergyWh, double? MeanOnSeconds)
{
    public double PassRate => Nights == 0 ? 0 : (double)Passed / Nights;
}

/// <summary>
/// The files of a year study: year.json (schema docs/year.schema.json) with `nights[]`, the months and `energyWh`,
/// year.csv and the page.
/// </summary>
public sealed record YearReport(StudyHeader Header, IReadOnlyList<YearNight> Nights, bool Complete, IReadOnlyList<string> Cautions)
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    /// <summary>Total energy, Wh: the sum over the dates (each night's switch-ons, power-up left out).</summary>
    public double EnergyWh => Nights.Sum(n => n.Outcome.EnergyWh);

    public IReadOnlyList<YearMonth> Months() => Nights
        .GroupBy(n => (n.Date.Year, n.Date.Month))
        .OrderBy(g => g.Key)
        .Select(g => new YearMonth(g.Key.Year, g.Key.Month, g.Count(), g.Count(n => n.Outcome.Pass), g.Count(n => n.Outcome.Missed),
            g.Count(n => n.Outcome.NeverEnds), g.Sum(n => n.Outcome.FalseTriggers), g.Sum(n => n.Outcome.EnergyWh),
            g.Any(n => n.Outcome.OnSeconds is not null && !n.Outcome.NeverEnds) ? g.Where(n => n.Outcome.OnSeconds is not null && !n.Outcome.NeverEnds).Average(n => n.Outcome.OnSeconds!.Value) : null))
        .ToList();

    public byte[] Json() => StudyJson.Bytes(w =>
    {
        w.WriteStartObject();
        Header.WriteProperties(w);
        w.WriteBoolean("complete", Complete);
        w.WriteNumber("finished", Nights.Count);
        w.WriteNumber("energyWh", Math.Round(EnergyWh, 3));
        w.WriteNumber("passRate", Nights.Count == 0 ? 0 : Math.Round((double)Nights.Count(n => n.Outcome.Pass) / Nights.Count, 6));
        w.WriteNumber("missedNights", Nights.Count(n => n.Outcome.Missed));
        w.WriteNumber("falseTriggers", Nights.Sum(n => n.Outcome.FalseTriggers));
        w.WriteStartArray("months");
        foreach (YearMonth m in Months())
        {
            w.WriteStartObject();
            w.WriteString("month", string.Create(s_inv, $"{m.Year:0000}-{m.Month:00}"));
            w.WriteNumber("nights", m.Nights);
            w.WriteNumber("passRate", Math.Round(m.PassRate, 6));
            w.WriteNumber("missedNights", m.Missed);
            w.WriteNumber("neverEnds", m.NeverEnds);
            w.WriteNumber("falseTriggers", m.FalseTriggers);
            w.WriteNumber("energyWh", Math.Round(m.EnergyWh, 3));
            StudyJson.NumberOrNull(w, "meanOnSeconds", m.MeanOnSeconds is double s ? Math.Round(s, 1) : null);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("nights");
        foreach (YearNight n in Nights) n.Write(w);
        w.WriteEndArray();
        w.WriteEndObject();
    });

    public string Csv()
    {
        var sb = new StringBuilder();
        sb.Append(StudyJson.CsvLine(["index", "date", "sky", "sunset", "sunrise", .. StudyOutcome.CsvHeader])).Append('\n');
        foreach (YearNight n in Nights)
            sb.Append(StudyJson.CsvLine([StudyJson.Csv(n.Index), n.Date.ToString("yyyy-MM-dd", s_inv), n.Sky, n.Sunset ?? "", n.Sunrise ?? "", .. n.Outcome.CsvCells()])).Append('\n');
        return sb.ToString();
    }

    public IReadOnlyList<string> Lines()
    {
        int pass = Nights.Count(n => n.Outcome.Pass);
        var lines = new List<string>
        {
            string.Create(s_inv, $"{pass} of {Nights.Count} nights pass ({(Nights.Count == 0 ? 0 : 100.0 * pass / Nights.Count):0.#} %); energy {EnergyWh / 1000:0.###} kWh"),
            string.Create(s_inv, $"missed nights {Nights.Count(n => n.Outcome.Missed)}, timer never ended {Nights.Count(n => n.Outcome.NeverEnds)}, false triggers {Nights.Sum(n => n.Outcome.FalseTriggers)}, chatter bursts {Nights.Sum(n => n.Outcome.ChatterBursts)}"),
        };
        var after = Nights.Where(n => n.Outcome.SwitchOnMinutesAfterSunset is not null).Select(n => n.Outcome.SwitchOnMinutesAfterSunset!.Value).ToList();
        if (after.Count > 0) lines.Add(string.Create(s_inv, $"switch-on {after.Min():+0;−0} to {after.Max():+0;−0} min after sunset"));
        if (!Complete) lines.Add($"stopped early: {Nights.Count} of {Header.Total} dates finished; the numbers cover those only");
        return lines;
    }

    public IReadOnlyList<string> MonthHeads => ["Month", "Nights", "Pass rate", "Missed", "Never ends", "False triggers", "Mean on-time", "Energy (kWh)"];

    public IEnumerable<IReadOnlyList<string>> MonthRows() => Months().Select(m => (IReadOnlyList<string>)
    [
        (m.Passed < m.Nights ? "!" : "") + string.Create(s_inv, $"{m.Year:0000}-{m.Month:00}"), StudyJson.Csv(m.Nights),
        string.Create(s_inv, $"{m.PassRate * 100:0.#} %"), StudyJson.Csv(m.Missed), StudyJson.Csv(m.NeverEnds), StudyJson.Csv(m.FalseTriggers),
        m.MeanOnSeconds is double s ? ReportText.Duration(s) : "—", (m.EnergyWh / 1000).ToString("0.###", s_inv),
    ]);

    public string Html(IReadOnlyList<HtmlFigure> figures)
    {
        var page = new StudyPage($"Year: {Header.Netlist}", $"{Header.Setting("from")} to {Header.Setting("to")} · weather {Header.Setting("weather")} · scenario {Header.Scenario ?? "—"}", Cautions);
        page.Section("Result").Paragraph(Lines()[0], "verdict").List(Lines().Skip(1));
        page.Figures(figures);
        page.Section("Months").Table(MonthHeads, MonthRows());
        page.Section("Nights").Table(["Date", "Sky", "Sunset", "On", "Off", "On-time", "Sunrise", "Result"],
            Nights.Select(n => (IReadOnlyList<string>)
            [
                (n.Outcome.Pass ? "" : "!") + n.Date.ToString("yyyy-MM-dd", s_inv), n.Sky, Clock(n.Sunset), Clock(n.Outcome.SwitchOn), Clock(n.Outcome.SwitchOff),
                n.Outcome.OnSeconds is double s ? (n.Outcome.NeverEnds ? "never ends" : ReportText.Duration(s)) : "—", Clock(n.Sunrise),
                n.Outcome.Pass ? "pass" : "FAIL: " + SpreadReport.Describe(n.Outcome),
            ]));
        return page.Render($"{Header.Tool} · year.json and year.csv hold the same results in machine-readable form; each date is simulated from power-up at local noon and the power-up firing is left out");
    }

    private static string Clock(string? iso) => iso is null ? "—" : iso.Substring(11, 5);
}
