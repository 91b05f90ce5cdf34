using System.Globalization;
using System.Text;
using System.Text.Json;
using NightSim.Reporting;

namespace NightSim.Studies;

/// <summary>
/// The files of a spread: spread.json (schema docs/spread.schema.json), spread.csv (one row per run) and the page.
/// Everything is a function of the header, the variations and the finished runs, so a joined set of shards writes the
/// same bytes as the run that did everything at once.
/// </summary>
public sealed record SpreadReport(StudyHeader Header, IReadOnlyList<Variation> Variations, IReadOnlyList<SpreadRun> Runs, bool Complete, IReadOnlyList<string> Cautions)
{
    public SpreadSummary Summary { get; } = SpreadSummary.Of(Runs);

    /// <summary>Relative path of the drawn netlist of a run, for re-running it alone.</summary>
    public static string RunFile(int index) => string.Create(CultureInfo.InvariantCulture, $"runs/run-{index:0000}.json");

    public byte[] Json() => StudyJson.Bytes(w =>
    {
        w.WriteStartObject();
        Header.WriteProperties(w);
        w.WriteBoolean("complete", Complete);
        w.WriteNumber("finished", Runs.Count);
        w.WriteStartArray("variations");
        foreach (Variation v in Variations)
        {
            w.WriteStartObject();
            w.WriteString("key", v.Key);
            w.WriteString("part", v.PartId);
            w.WriteString("parameter", v.Parameter);
            w.WriteNumber("nominal", v.Nominal);
            w.WriteNumber("low", v.Low);
            w.WriteNumber("high", v.High);
            StudyJson.NumberOrNull(w, "drawHigh", v.DrawHigh);
            w.WriteString("distribution", v.LogScale ? "log-uniform" : "uniform");
            w.WriteString("source", v.Source);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        SpreadSummary s = Summary;
        w.WriteStartObject("summary");
        w.WriteNumber("runs", s.Runs);
        w.WriteNumber("simulationFailures", s.SimulationFailures);
        w.WriteNumber("passRate", Math.Round(s.Pass.Rate, 6));
        w.WriteStartObject("passRateInterval");
        w.WriteNumber("low", Math.Round(s.Pass.Low, 6));
        w.WriteNumber("high", Math.Round(s.Pass.High, 6));
        w.WriteString("method", "Wilson score, 95 %");
        w.WriteEndObject();
        WriteDistribution(w, "onTimeSeconds", s.OnTimeSeconds);
        WriteDistribution(w, "switchOnMinutesAfterSunset", s.SwitchOnMinutesAfterSunset);
        w.WriteStartObject("probabilities");
        WriteProportion(w, "missed", s.Missed);
        WriteProportion(w, "neverEnds", s.NeverEnds);
        WriteProportion(w, "falseTrigger", s.FalseTrigger);
        WriteProportion(w, "chatter", s.Chatter);
        WriteProportion(w, "earlyOff", s.EarlyOff);
        w.WriteEndObject();
        w.WriteStartArray("worst");
        foreach (int i in s.Worst)
        {
            SpreadRun r = Runs.First(x => x.Index == i);
            w.WriteStartObject();
            w.WriteNumber("index", r.Index);
            w.WriteNumber("seed", r.Seed);
            w.WriteString("label", r.Label);
            w.WriteString("rerun", RunFile(r.Index));
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
        w.WriteStartArray("runs");
        foreach (SpreadRun r in Runs) r.Write(w);
        w.WriteEndArray();
        w.WriteEndObject();
    });

    public string Csv()
    {
        var sb = new StringBuilder();
        sb.Append(StudyJson.CsvLine(["index", "seed", "label", "sky", .. Variations.Select(v => v.Key), .. StudyOutcome.CsvHeader])).Append('\n');
        foreach (SpreadRun r in Runs)
        {
            var cells = new List<string> { StudyJson.Csv(r.Index), r.Seed.ToString(CultureInfo.InvariantCulture), r.Label, r.Sky ?? "" };
            cells.AddRange(Variations.Select(v => StudyJson.Csv(r.Values.FirstOrDefault(x => x.Key == v.Key).Value)));
            cells.AddRange(r.Outcome.CsvCells());
            sb.Append(StudyJson.CsvLine(cells)).Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>The headline lines (terminal and page).</summary>
    public IReadOnlyList<string> Lines()
    {
        SpreadSummary s = Summary;
        var inv = CultureInfo.InvariantCulture;
        var lines = new List<string>
        {
            string.Create(inv, $"pass rate {s.Pass.Rate * 100:0.0} % ({s.Pass.Count} of {s.Runs} runs), 95 % interval {s.Pass.Low * 100:0.0}–{s.Pass.High * 100:0.0} % (Wilson score)"),
        };
        if (s.OnTimeSeconds is { } on)
            lines.Add($"on-time p5 {ReportText.Duration(on.P5)}, median {ReportText.Duration(on.P50)}, p95 {ReportText.Duration(on.P95)} (min {ReportText.Duration(on.Min)}, max {ReportText.Duration(on.Max)}, {on.N} runs that ended)");
        if (s.SwitchOnMinutesAfterSunset is { } sw)
            lines.Add(string.Create(inv, $"switch-on p5 {sw.P5:+0;−0} min, median {sw.P50:+0;−0} min, p95 {sw.P95:+0;−0} min after sunset"));
        lines.Add(string.Create(inv, $"missed a night {P(s.Missed)}, never ends {P(s.NeverEnds)}, false trigger {P(s.FalseTrigger)}, chatter {P(s.Chatter)}, early off {P(s.EarlyOff)}"));
        if (s.SimulationFailures > 0) lines.Add($"{s.SimulationFailures} runs failed to simulate (counted as not passing)");
        if (!Complete) lines.Add($"stopped early: {Runs.Count} of {Header.Total} runs finished; the numbers cover those only");
        return lines;
    }

    /// <summary>One line per worst run: index, seed, what went wrong, the drawn values furthest from nominal.</summary>
    public IReadOnlyList<string> WorstLines()
    {
        var lines = new List<string>();
        foreach (int i in Summary.Worst)
        {
            SpreadRun r = Runs.First(x => x.Index == i);
            lines.Add(string.Create(CultureInfo.InvariantCulture, $"run {r.Index} seed {r.Seed}{(r.Label == "random" ? "" : " (" + r.Label + ")")}: {Describe(r.Outcome)}; {Furthest(r)} — nightsim simulate {RunFile(r.Index)}"));
        }
        return lines;
    }

    public string Html(IReadOnlyList<HtmlFigure> figures)
    {
        var page = new StudyPage($"Spread: {Header.Netlist}", $"{Header.Total} {(Header.Setting("mode") == "corners" ? "corner" : "random")} runs · seed {Header.Seed} · scenario {Header.Scenario ?? "—"}", Cautions);
        page.Section("Result").Paragraph(Lines()[0], "verdict").List(Lines().Skip(1));
        page.Figures(figures);
        page.Section("Worst runs").Paragraph("Each is re-run alone with the command shown (the drawn netlist and its scenario are written beside this page).").List(WorstLines());
        page.Section("Parts as bought").Table(["Parameter", "Nominal", "Low", "High", "Draw", "Band"],
            Variations.Select(v => (IReadOnlyList<string>)[v.Key, StudyPage.N(v.Nominal, 12), StudyPage.N(v.Low, 12), StudyPage.N(v.High, 12), v.LogScale ? "log-uniform" : "uniform", v.Source]));
        page.Section("Runs").Table(["Run", "Seed", "Label", "Switch-on", "After sunset (min)", "On-time", "Pass", "Problems"],
            Runs.Select(r => (IReadOnlyList<string>)[(r.Outcome.Pass ? "" : "!") + r.Index.ToString(CultureInfo.InvariantCulture), r.Seed.ToString(CultureInfo.InvariantCulture), r.Label,
                r.Outcome.SwitchOn?.Replace('T', ' ') ?? "—", StudyPage.N(r.Outcome.SwitchOnMinutesAfterSunset, 1),
                r.Outcome.OnSeconds is double s ? ReportText.Duration(s) + (r.Outcome.NeverEnds ? " (never ends)" : "") : "—", r.Outcome.Pass ? "pass" : "FAIL", Describe(r.Outcome)]));
        return page.Render($"{Header.Tool} · spread.json and spread.csv hold the same results in machine-readable form");
    }

    /// <summary>What went wrong in plain words ("ok" when nothing).</summary>
    public static string Describe(StudyOutcome o)
    {
        var parts = new List<string>();
        if (o.Failure is not null) parts.Add("simulation failed");
        if (o.Missed) parts.Add("missed the night");
        if (o.NeverEnds) parts.Add("timer never ends");
        if (o.FalseTriggers > 0) parts.Add($"{o.FalseTriggers} false trigger(s)");
        if (o.EarlyOffs > 0) parts.Add($"{o.EarlyOffs} early off(s)");
        if (o.ChatterBursts > 0) parts.Add($"{o.ChatterBursts} chatter burst(s)");
        if (o.TargetsFailed > 0) parts.Add($"missed target{(o.FailedTargets.Contains(',', StringComparison.Ordinal) ? "s" : "")} {o.FailedTargets}");
        return parts.Count == 0 ? "ok" : string.Join(", ", parts);
    }

    private string Furthest(SpreadRun r)
    {
        var far = r.Values
            .Select(kv => (kv.Key, kv.Value, V: Variations.FirstOrDefault(v => v.Key == kv.Key)))
            .Where(x => x.V is not null && x.V.High > x.V.Low)
            .Select(x => (x.Key, x.Value, x.V!.Unit, Pos: (x.Value - x.V!.Nominal) / Math.Max(x.V.High - x.V.Nominal, x.V.Nominal - x.V.Low)))
            .Where(x => Math.Abs(x.Pos) > 1e-9)
            .OrderByDescending(x => Math.Abs(x.Pos)).Take(3)
            .Select(x => string.Create(CultureInfo.InvariantCulture, $"{x.Key} {Units.EngineeringValue.Format(x.Value, x.Unit, 3)} ({x.Pos * 100:+0;−0} % of band)"));
        string s = string.Join(", ", far);
        return s.Length == 0 ? "nominal values" : s;
    }

    private static string P(Proportion p) => string.Create(CultureInfo.InvariantCulture, $"{p.Rate * 100:0.#} % ({p.Count})");

    private static void WriteDistribution(Utf8JsonWriter w, string name, Distribution? d)
    {
        if (d is null)
        {
            w.WriteNull(name);
            return;
        }
        w.WriteStartObject(name);
        w.WriteNumber("n", d.N);
        w.WriteNumber("p5", Math.Round(d.P5, 4));
        w.WriteNumber("p50", Math.Round(d.P50, 4));
        w.WriteNumber("p95", Math.Round(d.P95, 4));
        w.WriteNumber("mean", Math.Round(d.Mean, 4));
        w.WriteNumber("min", Math.Round(d.Min, 4));
        w.WriteNumber("max", Math.Round(d.Max, 4));
        w.WriteNumber("standardDeviation", Math.Round(d.StandardDeviation, 4));
        w.WriteEndObject();
    }

    private static void WriteProportion(Utf8JsonWriter w, string name, Proportion p)
    {
        w.WriteStartObject(name);
        w.WriteNumber("count", p.Count);
        w.WriteNumber("rate", Math.Round(p.Rate, 6));
        w.WriteNumber("low", Math.Round(p.Low, 6));
        w.WriteNumber("high", Math.Round(p.High, 6));
        w.WriteEndObject();
    }
}
