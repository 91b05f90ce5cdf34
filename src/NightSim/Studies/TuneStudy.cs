using System.Globalization;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Units;

namespace NightSim.Studies;

/// <summary>How a tune searched.</summary>
public enum TuneMethod
{
    /// <summary>Every combination predicted by the closed forms at every corner; the best confirmed by simulation.</summary>
    ClosedForms,
    /// <summary>No closed form bears on some varied part: every combination simulated.</summary>
    FullGrid,
}

/// <summary>
/// Finds part values that meet the scenario's targets. Every combination of the varied values (a grid over the
/// purchasable series) is first judged by the closed forms (<see cref="TunePhysics"/>) at every tolerance corner
/// (<see cref="TuneCorners"/>); the best predicted are then confirmed by night runs on the chosen nights at every
/// corner. When some varied part moves none of the closed-form quantities, every combination is simulated instead
/// (the full grid). Items of the study are the confirming runs: (candidate, night, corner), each independent, so
/// they run on workers and in shards like the other studies.
/// </summary>
public sealed class TuneStudy
{
    /// <summary>Predicted margin below which a combination is ruled out before simulation (the closed forms leave
    /// out second-order effects, so a small miss is still confirmed).</summary>
    public const double Guard = -0.2;

    /// <summary>Largest grid the closed forms judge, and the largest the full-grid fallback simulates.</summary>
    public const int MaxGrid = 20_000, MaxFullGrid = 400;

    private readonly NightRunRequest _base;
    private readonly StudyRunBuffers _buffers = new();

    public TuneStudy(NightRunRequest request, IReadOnlyList<SweepAxis> axes, string nights, bool corners, int confirm)
    {
        ArgumentNullException.ThrowIfNull(request.Scenario);
        _base = request;
        Axes = axes;
        Scenario = request.Scenario;
        Targets = Scenario.Targets is DesignTargets t && !t.IsEmpty ? t
            : throw new StudyFileException([$"{request.ScenarioPath}: error at $.targets: the scenario states no targets. hint: add \"targets\" (e.g. \"onTime\": {{ \"min\": \"3.6h\", \"max\": \"4.4h\" }}) so tune knows what to meet"]);
        NightsText = nights;
        Nights = TuneNights.Parse(nights, Scenario, out string? err) ?? throw new ArgumentException(err);
        UseCorners = corners;
        Confirm = confirm;
        GridSize = axes.Aggregate(1L, (n, a) => n * a.Values.Count);
        if (GridSize > MaxGrid) throw new ArgumentException($"--vary: {GridSize} combinations is too many; narrow the ranges below {MaxGrid}");
        Quantities = TunePhysics.Quantities(Targets, request.Netlist, Scenario);
        Corners = corners ? TuneCorners.For(request.Netlist, Scenario, Quantities) : [TuneCorner.Nominal];
        Unnarrowed = axes.Where(a => a.Values.Count > 1 && !Moves(a)).Select(a => a.Key).ToList();
        Method = Quantities.Count > 0 && Unnarrowed.Count == 0 ? TuneMethod.ClosedForms : TuneMethod.FullGrid;
        Candidates = Enumerable.Range(0, (int)GridSize).Select(Predict).ToList();
        Confirmed = Choose();
        Total = Confirmed.Count * Nights.Count * Corners.Count;
    }

    public IReadOnlyList<SweepAxis> Axes { get; }
    public LightScenario Scenario { get; }
    public DesignTargets Targets { get; }
    public string NightsText { get; }
    public IReadOnlyList<TuneNight> Nights { get; }
    public bool UseCorners { get; }
    public int Confirm { get; }
    public long GridSize { get; }
    /// <summary>The closed-form quantities the targets bear on.</summary>
    public IReadOnlyList<string> Quantities { get; }
    public IReadOnlyList<TuneCorner> Corners { get; }
    /// <summary>Varied parameters that move none of the closed-form quantities.</summary>
    public IReadOnlyList<string> Unnarrowed { get; }
    public TuneMethod Method { get; }
    /// <summary>Every combination with its predictions, in grid order.</summary>
    public IReadOnlyList<TuneCandidate> Candidates { get; }
    /// <summary>Grid indices of the candidates confirmed by simulation, best predicted first.</summary>
    public IReadOnlyList<int> Confirmed { get; }
    /// <summary>Night runs in the whole study.</summary>
    public int Total { get; }

    public NetlistDefinition Netlist => _base.Netlist;

    public StudyHeader Header(string tool) => new()
    {
        Kind = "tune",
        Tool = tool,
        Netlist = _base.NetlistPath,
        Scenario = _base.ScenarioPath,
        Seed = Scenario.Seed,
        Total = Total,
        Settings =
        [
            .. Axes.Select((a, i) => new KeyValuePair<string, string>("vary" + (i + 1).ToString(CultureInfo.InvariantCulture), a.Key + "=" + a.Text)),
            new("nights", NightsText),
            new("corners", UseCorners ? "worst-case" : "nominal"),
            new("confirm", Confirm.ToString(CultureInfo.InvariantCulture)),
            new("method", Method == TuneMethod.ClosedForms ? "closed forms, then simulation" : "full grid"),
        ],
    };

    /// <summary>
    /// Parses one "--vary PART.PARAM=SERIES[:MIN..MAX]" (or a list, or a range with a count). A series without a
    /// range spans a decade either side of the part's present value.
    /// </summary>
    public static SweepAxis? Axis(NetlistDefinition net, string spec, out string? error)
    {
        int eq = spec.IndexOf('=', StringComparison.Ordinal);
        if (eq > 0 && ESeries.Decade(spec[(eq + 1)..].Trim()) is not null)
        {
            int dot = spec.LastIndexOf('.', eq);
            string id = dot > 0 ? spec[..dot] : "", name = dot > 0 ? spec[(dot + 1)..eq] : "";
            if (net.Part(id)?.Parameters.OptionalNumber(name) is double now && now > 0)
            {
                string unit = PartCatalog.Find(net.Part(id)!.Kind)?.Parameters.FirstOrDefault(p => p.Name == name)?.Unit ?? "";
                spec = spec[..(eq + 1)] + spec[(eq + 1)..].Trim() + ":" + EngineeringValue.Format(now / 10, unit, 3) + ".." + EngineeringValue.Format(now * 10, unit, 3);
            }
        }
        return SweepStudy.Axis(net, spec, out error);
    }

    /// <summary>The varied values of grid point <paramref name="index"/> (axis 0 fastest).</summary>
    public List<KeyValuePair<string, double>> ValuesOf(int index)
    {
        var list = new List<KeyValuePair<string, double>>(Axes.Count);
        int rest = index;
        foreach (SweepAxis a in Axes)
        {
            list.Add(new(a.Key, a.Values[rest % a.Values.Count]));
            rest /= a.Values.Count;
        }
        return list;
    }

    /// <summary>The closed-form predictions for a set of varied values at every corner.</summary>
    public IReadOnlyList<TunePrediction> PredictValues(IReadOnlyList<KeyValuePair<string, double>> values)
    {
        if (Method == TuneMethod.FullGrid) return [];
        NetlistDefinition net = ToleranceModel.Apply(_base.Netlist, values);
        IReadOnlyList<Variation> bands = ToleranceModel.For(net);
        var list = new List<TunePrediction>();
        foreach (string q in Quantities)
        {
            double lo = double.PositiveInfinity, hi = double.NegativeInfinity, margin = double.PositiveInfinity;
            string at = "nominal";
            foreach (TuneCorner c in Corners)
            {
                NetlistDefinition cornerNet = ToleranceModel.Apply(net, c.Values(bands));
                double? v = TunePhysics.Evaluate(cornerNet, Scenario, q);
                // No value (the threshold is never reached, the circuit never switches) is a miss by the whole target.
                double m = v is double x ? TunePhysics.Margin(q, x, Targets, cornerNet) ?? -1 : -1;
                if (v is double y)
                {
                    lo = Math.Min(lo, y);
                    hi = Math.Max(hi, y);
                }
                if (m < margin)
                {
                    margin = m;
                    at = c.Label;
                }
            }
            list.Add(new TunePrediction(q, lo, hi, Math.Round(margin, 4), at));
        }
        return list;
    }

    private TuneCandidate Predict(int index)
    {
        List<KeyValuePair<string, double>> values = ValuesOf(index);
        return new TuneCandidate(index, values, PredictValues(values));
    }

    /// <summary>True when some closed-form quantity differs between values of the axis (up to five, spread over it).</summary>
    private bool Moves(SweepAxis a)
    {
        int n = a.Values.Count;
        var probe = Enumerable.Range(0, Math.Min(5, n)).Select(i => a.Values[n == 1 ? 0 : i * (n - 1) / Math.Max(1, Math.Min(5, n) - 1)]).Distinct().ToList();
        foreach (string q in Quantities)
        {
            var seen = probe.Select(v => TunePhysics.Evaluate(ToleranceModel.Apply(_base.Netlist, [new(a.Key, v)]), Scenario, q)).ToList();
            var known = seen.OfType<double>().ToList();
            if (known.Count > 0 && known.Count < seen.Count) return true;
            if (known.Count > 1 && known.Max() - known.Min() > 1e-6 * known.Max(Math.Abs)) return true;
        }
        return false;
    }

    private List<int> Choose()
    {
        if (Method == TuneMethod.FullGrid)
        {
            if (GridSize > MaxFullGrid)
                throw new ArgumentException($"--vary: no closed form bears on {string.Join(", ", Unnarrowed.DefaultIfEmpty("the targets"))}, so every combination must be simulated, and {GridSize} combinations is too many for that; narrow the ranges below {MaxFullGrid}");
            return [.. Candidates.Select(c => c.Index)];
        }
        var ranked = Candidates.OrderByDescending(c => c.PredictedMargin).ThenBy(c => c.Index).ToList();
        var kept = ranked.Where(c => c.PredictedMargin >= Guard).Take(Confirm).Select(c => c.Index).ToList();
        // Nothing predicted to pass: confirm the closest anyway, so the miss is measured, not guessed.
        return kept.Count > 0 ? kept : ranked.Take(Math.Min(Confirm, 2)).Select(c => c.Index).ToList();
    }

    /// <summary>Which candidate, night and corner item <paramref name="index"/> runs.</summary>
    public (int Candidate, TuneNight Night, TuneCorner Corner) ItemOf(int index)
    {
        int k = index % Corners.Count, rest = index / Corners.Count;
        return (Confirmed[rest / Nights.Count], Nights[rest % Nights.Count], Corners[k]);
    }

    /// <summary>Runs item <paramref name="index"/>: the candidate's values, then its corner's, on its night.</summary>
    public TuneRun Run(int index)
    {
        (int candidate, TuneNight night, TuneCorner corner) = ItemOf(index);
        List<KeyValuePair<string, double>> values = ValuesOf(candidate);
        NetlistDefinition net = ToleranceModel.Apply(_base.Netlist, values);
        List<KeyValuePair<string, double>> ends = corner.Values(ToleranceModel.For(net));
        net = ToleranceModel.Apply(net, ends);
        var all = values.Where(v => !ends.Any(e => e.Key == v.Key)).Concat(ends).ToList();
        NightRunResult r = NightRun.Run(_buffers.ForThisThread(_base with { Netlist = net, Scenario = night.Apply(Scenario) }));
        var checks = TuneCheck.From(r.Report.TargetResults.SelectMany(t => t.Checks));
        return new TuneRun(index, candidate, night.Text, corner.Label, all, checks, r.Simulation.Failure?.ToString());
    }

    /// <summary>
    /// The advice for a combination that misses: for every varied part at an end of its range, the closed-form margin
    /// one series step beyond that end, when it is better than at the end; and when the corners alone spread a
    /// quantity wider than its target allows, that. Plain sentences.
    /// </summary>
    public List<string> Advice(int candidate)
    {
        var advice = new List<string>();
        List<KeyValuePair<string, double>> values = ValuesOf(candidate);
        double here = PredictValues(values).Select(p => p.Margin).DefaultIfEmpty(double.NaN).Min();
        for (int i = 0; i < Axes.Count; i++)
        {
            SweepAxis a = Axes[i];
            double v = values[i].Value;
            foreach (bool up in (bool[])[false, true])
            {
                if (v != (up ? a.Values[^1] : a.Values[0])) continue;
                if (Beyond(a, up) is not double next) continue;
                var moved = values.Select(x => x.Key == a.Key ? new KeyValuePair<string, double>(x.Key, next) : x).ToList();
                double there = PredictValues(moved).Select(p => p.Margin).DefaultIfEmpty(double.NaN).Min();
                if (double.IsNaN(here))
                {
                    advice.Add($"{a.Key} is at the {(up ? "top" : "bottom")} of its range ({EngineeringValue.Format(v, a.Unit, 3)}); try widening it {(up ? "upward" : "downward")}, e.g. to {EngineeringValue.Format(next, a.Unit, 3)}.");
                }
                else if (there > here + 1e-6)
                {
                    advice.Add($"widen the range of {a.Key} {(up ? "upward" : "downward")}: at {EngineeringValue.Format(next, a.Unit, 3)} the closed forms predict a margin of {TuneReport.Percent(there)} (here {TuneReport.Percent(here)}).");
                }
            }
        }
        foreach (TunePrediction p in PredictValues(values))
        {
            (double? lo, double? hi, string unit, double scale) = p.Quantity switch
            {
                TunePhysics.OnTime => (Targets.OnTimeMin, Targets.OnTimeMax, "s", 1.0),
                TunePhysics.SwitchLux => (Targets.SwitchOnLuxMin, Targets.SwitchOnLuxMax, "lx", 1.0),
                _ => ((double?)null, (double?)null, "", 1.0),
            };
            if (lo is double a && hi is double b && p.High - p.Low > (b - a) * scale)
            {
                string Fmt(double x) => unit == "s" ? ReportingDuration(x) : x.ToString("0.###", CultureInfo.InvariantCulture) + " " + unit;
                var bands = Corners.Where(c => c.Label.StartsWith(p.Quantity, StringComparison.Ordinal)).SelectMany(c => c.Ends.Select(e => e.Key)).Distinct().ToList();
                advice.Add($"the tolerances alone spread the {p.Quantity} from {Fmt(p.Low)} to {Fmt(p.High)} across the corners, wider than the target's {Fmt(a)} to {Fmt(b)}: no value of the varied parts meets it at every corner. Choose closer-tolerance parts for the bands that move it ({string.Join(", ", bands.Take(8))}), adjust a trimmer on the built circuit, or widen the target.");
            }
        }
        if (advice.Count == 0) advice.Add("no varied part is at the end of its range; vary another part, or relax the target it misses.");
        return advice;
    }

    private static string ReportingDuration(double seconds) => Reporting.ReportText.Duration(Math.Round(seconds));

    /// <summary>The next value past one end of an axis: the next series value, or one more step of a list or range; null
    /// when that leaves the parameter's physical range.</summary>
    private double? Beyond(SweepAxis a, bool up)
    {
        double edge = up ? a.Values[^1] : a.Values[0];
        double? next = null;
        int colon = a.Text.IndexOf(':', StringComparison.Ordinal);
        if (colon > 0 && ESeries.Decade(a.Text[..colon]) is IReadOnlyList<double> decade)
        {
            List<double> around = ESeries.Between(decade, edge / 2, edge * 2);
            int at = around.FindIndex(x => Math.Abs(x - edge) <= 1e-9 * edge);
            if (at >= 0 && at + (up ? 1 : -1) is int j && j >= 0 && j < around.Count) next = around[j];
        }
        else if (a.Values.Count >= 2)
        {
            double inner = up ? a.Values[^2] : a.Values[1];
            next = a.LogScale && inner > 0 ? edge * edge / inner : 2 * edge - inner;
        }
        if (next is not double n) return null;
        PartDefinition? part = _base.Netlist.Part(a.PartId);
        ParameterSpec? spec = part is null ? null : PartCatalog.Find(part.Kind)?.Parameters.FirstOrDefault(p => p.Name == a.Parameter);
        if (spec is not null && (n < spec.Min || n > spec.Max)) return null;
        return n;
    }
}
