using System.Globalization;
using System.Text.Json;
using NightSim.Units;

namespace NightSim.Studies;

/// <summary>One target as a candidate met it across all its runs: the least margin and the night and corner that gave it.</summary>
public sealed record TuneBound(string Target, bool Pass, double? Margin, double RelativeMargin, string Unit, string Detail, string Night, string Corner);

/// <summary>A confirmed candidate's outcome over every night and corner.</summary>
/// <param name="Candidate">Grid index.</param>
/// <param name="Values">The varied values.</param>
/// <param name="Bounds">Per target, the bounding run.</param>
/// <param name="Runs">Runs finished for it.</param>
/// <param name="Expected">Runs it should have.</param>
/// <param name="Failure">A simulation failure in one of its runs, or null.</param>
/// <param name="PredictedMargin">The closed forms' least margin, or null.</param>
public sealed record TuneResult(int Candidate, IReadOnlyList<KeyValuePair<string, double>> Values, IReadOnlyList<TuneBound> Bounds, int Runs, int Expected,
    string? Failure, double? PredictedMargin)
{
    public bool Complete => Runs == Expected;
    public bool Pass => Complete && Failure is null && Bounds.Count > 0 && Bounds.All(b => b.Pass);
    /// <summary>Least relative margin over the targets (−∞ after a failure).</summary>
    public double WorstMargin => Failure is not null || Bounds.Count == 0 ? double.NegativeInfinity : Bounds.Min(b => b.RelativeMargin);
    public TuneBound? Weakest => Bounds.Count == 0 ? null : Bounds.MinBy(b => b.RelativeMargin);
}

/// <summary>
/// The outcome of a tune: every candidate with its closed-form predictions, the confirmed ones with their margins per
/// target and the night and corner that bound each, ranked (passing first, then by least margin, then by the
/// predicted margin when the least margins agree within 0.1 %); the best, or the closest miss with advice. Writes tune.json (docs/tune.schema.json) and the page.
/// </summary>
public sealed class TuneReport
{
    public TuneReport(StudyHeader header, TuneStudy study, IReadOnlyList<TuneRun> runs, bool complete, IReadOnlyList<string> cautions)
    {
        Header = header;
        Study = study;
        Runs = runs;
        IsComplete = complete;
        Cautions = cautions;
        int perCandidate = study.Nights.Count * study.Corners.Count;
        var byCandidate = study.Candidates.ToDictionary(c => c.Index);
        Results = study.Confirmed.Select(ci =>
        {
            var mine = runs.Where(r => r.Candidate == ci).OrderBy(r => r.Index).ToList();
            var bounds = mine.SelectMany(r => r.Checks.Select(c => (Run: r, Check: c)))
                .GroupBy(x => x.Check.Target)
                .Select(g =>
                {
                    (TuneRun run, TuneCheck c) = g.MinBy(x => x.Check.RelativeMargin);
                    return new TuneBound(g.Key, g.All(x => x.Check.Pass), c.Margin, c.RelativeMargin, c.Unit, c.Detail, run.Night, run.Corner);
                }).ToList();
            return new TuneResult(ci, byCandidate[ci].Values, bounds, mine.Count, perCandidate, mine.FirstOrDefault(r => r.Failure is not null)?.Failure, byCandidate[ci].PredictedMargin);
        }).Where(r => r.Runs > 0)
          .OrderByDescending(r => r.Pass).ThenByDescending(r => Math.Round(r.WorstMargin, 3)).ThenByDescending(r => r.PredictedMargin ?? double.NegativeInfinity).ThenBy(r => r.Candidate)
          .ToList();
        Advice = Best is TuneResult b && !b.Pass ? study.Advice(b.Candidate) : [];
    }

    public StudyHeader Header { get; }
    public TuneStudy Study { get; }
    public IReadOnlyList<TuneRun> Runs { get; }
    public bool IsComplete { get; }
    public IReadOnlyList<string> Cautions { get; }
    /// <summary>Confirmed candidates, best first.</summary>
    public IReadOnlyList<TuneResult> Results { get; }
    /// <summary>The best confirmed candidate (passing or the closest miss), or null when nothing ran.</summary>
    public TuneResult? Best => Results.Count > 0 ? Results[0] : null;
    public bool Met => Best?.Pass == true;
    /// <summary>Advice when the best misses.</summary>
    public IReadOnlyList<string> Advice { get; }

    /// <summary>A value with its unit and an engineering prefix ("2.2 MΩ").</summary>
    public string Value(string key, double v) => EngineeringValue.Format(v, Study.Axes.FirstOrDefault(a => a.Key == key)?.Unit ?? "", 3);

    public string Values(IReadOnlyList<KeyValuePair<string, double>> values) => string.Join(", ", values.Select(v => v.Key + " = " + Value(v.Key, v.Value)));

    /// <summary>Per axis: the full range and the range the closed forms left.</summary>
    public IEnumerable<(SweepAxis Axis, double? Low, double? High)> Narrowed()
    {
        var kept = Study.Candidates.Where(c => c.PredictedMargin >= TuneStudy.Guard).ToList();
        for (int i = 0; i < Study.Axes.Count; i++)
        {
            SweepAxis a = Study.Axes[i];
            if (Study.Method != TuneMethod.ClosedForms || kept.Count == 0) yield return (a, null, null);
            else yield return (a, kept.Min(c => c.Values[i].Value), kept.Max(c => c.Values[i].Value));
        }
    }

    public static string Percent(double relative) => double.IsNegativeInfinity(relative) ? "failed" : (relative * 100).ToString("+0.0;−0.0;0.0", CultureInfo.InvariantCulture) + " %";

    public static string MarginText(TuneBound b) => b.Margin is double m
        ? b.Unit switch
        {
            "s" => (m < 0 ? "−" : "+") + Reporting.ReportText.Duration(Math.Round(Math.Abs(m))),
            "count" => b.Pass ? "none" : m.ToString("0", CultureInfo.InvariantCulture),
            _ => m.ToString("+0.###;−0.###;0", CultureInfo.InvariantCulture) + " " + b.Unit,
        }
        : "not measured";

    /// <summary>The method in one sentence.</summary>
    public string MethodText() => Study.Method == TuneMethod.ClosedForms
        ? $"closed forms first ({string.Join(", ", Study.Quantities)}) over all {Study.GridSize} combinations at {Study.Corners.Count} corner(s); the best {Study.Confirmed.Count} confirmed by simulation"
        : $"full grid: no closed form bears on {string.Join(", ", Study.Unnarrowed.DefaultIfEmpty("the targets"))}; all {Study.GridSize} combinations simulated";

    /// <summary>Terminal lines (without the table of results).</summary>
    public IEnumerable<string> Lines()
    {
        yield return "method: " + MethodText();
        yield return "nights: " + string.Join("; ", Study.Nights.Select(n => n.Text));
        yield return "corners: " + string.Join("; ", Study.Corners.Select(c => c.Label));
        foreach ((SweepAxis a, double? lo, double? hi) in Narrowed())
        {
            string full = EngineeringValue.Format(a.Values[0], a.Unit, 3) + " … " + EngineeringValue.Format(a.Values[^1], a.Unit, 3);
            yield return lo is double l && hi is double h
                ? $"{a.Key}: {a.Values.Count} values {full}; the closed forms leave {EngineeringValue.Format(l, a.Unit, 3)} … {EngineeringValue.Format(h, a.Unit, 3)}"
                : $"{a.Key}: {a.Values.Count} values {full}";
        }
    }

    /// <summary>The verdict and, for a miss, the closest combination, its missed target and the advice.</summary>
    public IEnumerable<string> Verdict()
    {
        if (Best is not TuneResult b)
        {
            yield return "no candidate was simulated.";
            yield break;
        }
        if (b.Pass)
        {
            yield return $"best: {Values(b.Values)}: meets every target on every night{(Study.UseCorners ? " at every corner" : "")}, least margin {Percent(b.WorstMargin)} ({b.Weakest!.Target}, {b.Weakest.Night}, {b.Weakest.Corner})";
            yield break;
        }
        yield return $"nothing tried meets every target. Closest: {Values(b.Values)}";
        if (b.Failure is not null) yield return "  a run failed: " + b.Failure;
        foreach (TuneBound m in b.Bounds.Where(x => !x.Pass))
            yield return $"  misses {m.Target} by {MarginText(m).TrimStart('−', '+')} ({Percent(m.RelativeMargin)} of the target): {m.Detail}; {m.Night}, corner {m.Corner}";
        foreach (string a in Advice) yield return "  advice: " + a;
    }

    /// <summary>Table heads and rows of the confirmed candidates (best first): values, margin per target with its bound.</summary>
    public IReadOnlyList<string> Heads => ["#", .. Study.Axes.Select(a => a.Key), "pass", "least margin", .. TargetNames.Select(t => t + " (night, corner)"), "predicted"];

    public IReadOnlyList<string> TargetNames => Results.SelectMany(r => r.Bounds.Select(b => b.Target)).Distinct().ToList();

    public IEnumerable<IReadOnlyList<string>> Rows(int max = int.MaxValue) => Results.Take(max).Select((r, i) =>
    {
        var row = new List<string> { (r.Pass ? "" : "!") + (i + 1).ToString(CultureInfo.InvariantCulture) };
        row.AddRange(r.Values.Select(v => Value(v.Key, v.Value)));
        row.Add(r.Pass ? "yes" : r.Complete ? "no" : "incomplete");
        row.Add(Percent(r.WorstMargin));
        foreach (string t in TargetNames)
        {
            TuneBound? b = r.Bounds.FirstOrDefault(x => x.Target == t);
            row.Add(b is null ? "—" : $"{MarginText(b)} ({b.Night}, {b.Corner})");
        }
        row.Add(r.PredictedMargin is double p ? Percent(p) : "—");
        return (IReadOnlyList<string>)row;
    });

    public byte[] Json() => StudyJson.Bytes(w =>
    {
        w.WriteStartObject();
        Header.WriteProperties(w);
        w.WriteBoolean("complete", IsComplete);
        w.WriteString("method", Study.Method == TuneMethod.ClosedForms ? "closed-forms" : "full-grid");
        w.WriteString("methodText", MethodText());
        w.WriteStartArray("quantities");
        foreach (string q in Study.Quantities) w.WriteStringValue(q);
        w.WriteEndArray();
        w.WriteStartArray("nights");
        foreach (TuneNight n in Study.Nights)
        {
            w.WriteStartObject();
            w.WriteString("label", n.Label);
            w.WriteString("date", n.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
            w.WriteNumber("nights", n.Nights);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("corners");
        foreach (TuneCorner c in Study.Corners)
        {
            w.WriteStartObject();
            w.WriteString("label", c.Label);
            w.WriteStartObject("ends");
            foreach ((string k, int e) in c.Ends) w.WriteString(k, e < 0 ? "low" : "high");
            w.WriteEndObject();
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("parameters");
        foreach ((SweepAxis a, double? lo, double? hi) in Narrowed())
        {
            w.WriteStartObject();
            w.WriteString("parameter", a.Key);
            w.WriteString("values", a.Text);
            w.WriteNumber("count", a.Values.Count);
            StudyJson.NumberOrNull(w, "narrowedLow", lo);
            StudyJson.NumberOrNull(w, "narrowedHigh", hi);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        var confirmed = Study.Confirmed.ToHashSet();
        var results = Results.ToDictionary(r => r.Candidate);
        w.WriteStartArray("candidates");
        foreach (TuneCandidate c in Study.Candidates)
        {
            w.WriteStartObject();
            w.WriteNumber("index", c.Index);
            w.WriteStartObject("values");
            foreach ((string k, double v) in c.Values) w.WriteNumber(k, v);
            w.WriteEndObject();
            w.WriteStartArray("predicted");
            foreach (TunePrediction p in c.Predictions)
            {
                w.WriteStartObject();
                w.WriteString("quantity", p.Quantity);
                StudyJson.NumberOrNull(w, "low", p.Low);
                StudyJson.NumberOrNull(w, "high", p.High);
                w.WriteNumber("margin", p.Margin);
                w.WriteString("corner", p.Corner);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            StudyJson.NumberOrNull(w, "predictedMargin", c.PredictedMargin);
            w.WriteString("status", confirmed.Contains(c.Index) ? "simulated"
                : c.PredictedMargin < TuneStudy.Guard ? "ruled out by the closed forms" : "not simulated (lower predicted margin)");
            if (results.TryGetValue(c.Index, out TuneResult? r)) WriteResult(w, "result", r);
            else w.WriteNull("result");
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("ranking");
        foreach (TuneResult r in Results) w.WriteNumberValue(r.Candidate);
        w.WriteEndArray();
        w.WriteBoolean("met", Met);
        if (Best is TuneResult b) WriteResult(w, "best", b); else w.WriteNull("best");
        w.WriteStartArray("advice");
        foreach (string a in Advice) w.WriteStringValue(a);
        w.WriteEndArray();
        w.WriteStartArray("runs");
        foreach (TuneRun run in Runs) run.Write(w);
        w.WriteEndArray();
        w.WriteStartArray("cautions");
        foreach (string c in Cautions) w.WriteStringValue(c);
        w.WriteEndArray();
        w.WriteEndObject();
    });

    private static void WriteResult(Utf8JsonWriter w, string name, TuneResult r)
    {
        w.WriteStartObject(name);
        w.WriteNumber("candidate", r.Candidate);
        w.WriteStartObject("values");
        foreach ((string k, double v) in r.Values) w.WriteNumber(k, v);
        w.WriteEndObject();
        w.WriteBoolean("pass", r.Pass);
        w.WriteBoolean("complete", r.Complete);
        StudyJson.NumberOrNull(w, "leastMargin", r.WorstMargin);
        StudyJson.StringOrNull(w, "failure", r.Failure);
        w.WriteStartArray("targets");
        foreach (TuneBound b in r.Bounds)
        {
            w.WriteStartObject();
            w.WriteString("target", b.Target);
            w.WriteBoolean("pass", b.Pass);
            StudyJson.NumberOrNull(w, "margin", b.Margin);
            w.WriteNumber("relativeMargin", b.RelativeMargin);
            w.WriteString("unit", b.Unit);
            w.WriteString("night", b.Night);
            w.WriteString("corner", b.Corner);
            w.WriteString("detail", b.Detail);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
    }

    /// <summary>The HTML page: verdict, method, the margin plot, the ranked table and the advice.</summary>
    public string Html(IReadOnlyList<Reporting.HtmlFigure> figures, string? winner)
    {
        var page = new StudyPage($"Tune of {Header.Netlist}", MethodText(), Cautions);
        page.Section("Verdict");
        foreach (string line in Verdict()) page.Paragraph(line.Trim(), line.StartsWith("  ", StringComparison.Ordinal) ? null : "verdict");
        if (winner is not null) page.Paragraph($"Winning netlist written to {winner}; re-check it with `nightsim simulate` and `nightsim spread --corners`.");
        page.Section("Search").List(Lines());
        page.Section("Margins").Figures(figures);
        page.Section("Confirmed candidates (best first)").Table(Heads, Rows());
        if (!IsComplete) page.Paragraph("Stopped before every run finished: the table covers the finished runs only.", "verdict");
        return page.Render($"{Header.Tool}; {Study.Candidates.Count} combinations judged, {Runs.Count} night runs; tune.json holds every candidate and run.");
    }
}
