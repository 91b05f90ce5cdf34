using NightSim.Analysis;
using NightSim.Reporting;
using NightSim.Results;
using NightSim.Sky;

namespace NightSim.Runs;

/// <summary>Turns a run into the trace table (trace.csv) and the plot data: one plot per night and one zoom per
/// captured switching event.</summary>
public static class NightTraces
{
    /// <summary>Illuminance at the sensor including the lamp's own light, lux, at run time t.</summary>
    public static double SensorLux(RunFacts facts, double t)
    {
        double lux = facts.SensorLux?.Invoke(t) ?? 0;
        if (facts.LampCouplingLux > 0 && LoadOn(facts, t)) lux += facts.LampCouplingLux;
        return lux;
    }

    /// <summary>True when the load was on at run time t (binary search: a chattering relay has thousands of transitions
    /// and the trace table asks at every sample).</summary>
    public static bool LoadOn(RunFacts facts, double t)
    {
        IReadOnlyList<LoadTransition> x = facts.LoadTransitions;
        int lo = 0, hi = x.Count;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (x[mid].Time <= t) lo = mid + 1; else hi = mid;
        }
        return lo > 0 && x[lo - 1].On;
    }

    public static TraceTable Table(RunFacts facts, LightProfile? profile, SimulationResult sim, IReadOnlyList<string> nodes)
    {
        Trace? first = sim.Traces.FirstOrDefault();
        double[] times = first is null ? [] : [.. first.Times];
        var names = new List<string>();
        var columns = new List<double[]>();
        foreach (string node in nodes)
        {
            Trace? tr = sim.Trace(node);
            if (tr is null) continue;
            names.Add($"{node}_volts");
            columns.Add(SameTimes(tr, times) ? [.. tr.Values] : [.. times.Select(tr.At)]);
        }
        if (profile is not null)
        {
            names.Add("illuminance_lux");
            columns.Add([.. times.Select(t => SensorLux(facts, t))]);
        }
        if (facts.LoadTransitions.Count > 0)
        {
            names.Add("load_on");
            columns.Add([.. times.Select(t => LoadOn(facts, t) ? 1.0 : 0.0)]);
        }
        return new TraceTable(facts.Origin, facts.TimeZone, times, names, columns);
    }

    public static IReadOnlyList<PlotData> Plots(NightRunRequest request, RunFacts facts, AnalysisResult analysis, LightProfile? profile,
        SimulationResult sim, IReadOnlyList<(ZoomCapture Capture, string Prefix)> zooms, IReadOnlyList<string> nodes,
        IReadOnlySet<DateOnly>? plotted = null)
    {
        NodeRoles roles = NodeRoles.Of(request.Netlist);
        var plots = new List<PlotData>();
        IReadOnlyList<NightWindow> windows = facts.Nights.Count > 0
            ? facts.Nights
            : [new NightWindow(DateOnly.FromDateTime(facts.Origin.Date), 0, facts.Duration, null, null, null, null)];
        // Only the chosen nights are drawn, and only the zooms of events in them.
        bool Plotted(NightWindow n) => plotted is null || facts.Nights.Count == 0 || plotted.Contains(n.Date);
        var skipped = windows.Where(n => !Plotted(n)).Select(n => (n.From, n.To)).ToList();
        foreach (NightWindow n in windows)
        {
            if (!Plotted(n)) continue;
            double from = n.From, to = Math.Min(n.To, facts.Duration);
            if (to <= from) continue;
            var series = new List<PlotSeries>();
            var markers = new List<PlotMarker>();
            Trace? first = sim.Traces.FirstOrDefault();
            double[] times = first is null ? [] : [.. first.Times.Where(t => t >= from && t <= to)];
            NightSummary? summary = analysis.Nights.FirstOrDefault(s => s.Date == n.Date);
            AttributedInterval? dusk = analysis.Intervals.FirstOrDefault(i => i.Expected && i.Start >= from && i.Start < to);
            if (profile is not null)
            {
                PlotSeries lux = LuxSeries(facts, profile, times, from, to);
                series.Add(lux);
                // The switching level as a line on the lux panel: measured at the dusk switch-on, else the sensor's own.
                if ((summary?.SwitchLevelLux ?? facts.Sensor?.SwitchingLux) is double level && level > 0)
                    series.Add(new PlotSeries($"switching level {ReportText.Lux(level)} lx", "lx", PlotPanel.Light, [from, to], [level, level], Dashed: true));
                // On a missed night, the darkest point with its value: how far the night stayed from the level.
                if (summary is { Missed: true } && Darkest(lux, n) is (double at, double darkest))
                    markers.Add(new PlotMarker(at, $"darkest {ReportText.Lux(darkest)} lx", Emphasis: true));
            }
            foreach ((string node, string title) in Voltages(roles, facts.Supply is not null))
            {
                if (sim.Trace(node) is not Trace tr) continue;
                series.Add(Slice(tr, from, to, title));
                // The sensor node's voltage at the dusk switch-on, as a line across its trace.
                if (dusk is not null && roles.Sensor.Contains(node))
                {
                    double v = tr.At(dusk.Start);
                    series.Add(new PlotSeries($"sensor at switch-on {v:0.00} V", "V", PlotPanel.Voltages, [from, to], [v, v], Dashed: true));
                }
            }
            AddThirds(series, roles, sim, times);
            // The lamp's lane on every night, also on a night it never switched.
            if (facts.LoadTransitions.Count > 0 || facts.HasSwitchedLoad) series.Add(LoadSeries(facts, from, to));
            AddSun(markers, facts, n);
            // One marker per false trigger, the first few of each cause only: a chattering night would bury the plot.
            foreach (IGrouping<LoadCause, AttributedInterval> g in analysis.Intervals
                         .Where(i => i.Start >= from && i.Start < to && !i.Expected).GroupBy(i => i.Cause))
            {
                double last = double.NegativeInfinity;
                int count = 0;
                foreach (AttributedInterval iv in g)
                {
                    // Markers closer than 1 % of the window would print over each other.
                    if (iv.Start - last < (to - from) / 100) continue;
                    markers.Add(new PlotMarker(iv.Start, $"{ReportText.Cause(iv.Cause)} {ReportText.Clock(facts.Clock(iv.Start))}", Emphasis: true));
                    last = iv.Start;
                    if (++count == MaxMarkersPerCause) break;
                }
            }
            plots.Add(new PlotData
            {
                Title = $"{request.Netlist.Name}: night of {n.Date:yyyy-MM-dd}" + (profile is null ? "" : $" at {profile.Scenario.Site.Name}"),
                Origin = facts.Origin,
                TimeZone = facts.TimeZone,
                From = from,
                To = to,
                Series = series,
                Markers = markers,
                FileStem = $"night-{n.Date:yyyy-MM-dd}",
            });
        }

        foreach ((ZoomCapture zoom, string prefix) in zooms)
        {
            AddZooms(plots, request, facts, analysis, profile, roles, zoom, prefix, nodes, skipped);
        }
        return plots;
    }

    private static void AddZooms(List<PlotData> plots, NightRunRequest request, RunFacts facts, AnalysisResult analysis,
        LightProfile? profile, NodeRoles roles, ZoomCapture zoom, string prefix, IReadOnlyList<string> nodes, IReadOnlyList<(double From, double To)> skipped)
    {
        int k = 0;
        foreach (ZoomCapture.Window w in zoom.Windows)
        {
            k++;
            if (w.Count < 2 || skipped.Any(s => w.EventTime >= s.From && w.EventTime < s.To)) continue;
            AttributedInterval? iv = analysis.Intervals.FirstOrDefault(i => Math.Abs(i.Start - w.EventTime) < 1e-6 || (i.End is double e && Math.Abs(e - w.EventTime) < 1e-6));
            bool isOn = iv is not null && Math.Abs(iv.Start - w.EventTime) < 1e-6;
            // Each zoom sized to its event: dusk, dawn and a timer running out take minutes; a headlight, lightning
            // or a noise pulse takes seconds. The detail plots keep their own millisecond window.
            (double before, double after) = prefix == "detail" ? (zoom.Before, zoom.After)
                : SlowEvent(facts, iv, isOn, w.EventTime) ? (SlowZoomBefore, SlowZoomAfter) : (FastZoomBefore, FastZoomAfter);
            double[] times = w.Times;
            double from = Math.Max(times[0], w.EventTime - before), to = Math.Min(times[^1], w.EventTime + after);
            var series = new List<PlotSeries>();
            if (profile is not null)
            {
                PlotSeries lux = LuxSeries(facts, profile, times, from, to);
                // A millisecond detail leaves out a light panel that does not change.
                if (prefix != "detail" || Changes(lux, from, to))
                {
                    series.Add(lux);
                    NightWindow? night = facts.Nights.FirstOrDefault(n => w.EventTime >= n.From && w.EventTime < n.To);
                    NightSummary? summary = night is null ? null : analysis.Nights.FirstOrDefault(s => s.Date == night.Date);
                    if ((summary?.SwitchLevelLux ?? facts.Sensor?.SwitchingLux) is double level && level > 0)
                        series.Add(new PlotSeries($"switching level {ReportText.Lux(level)} lx", "lx", PlotPanel.Light, [from, to], [level, level], Dashed: true));
                }
            }
            AttributedInterval? duskOn = analysis.Intervals.FirstOrDefault(i => i.Expected && i.Start >= times[0] && i.Start <= times[^1]);
            var byNode = nodes.Select((name, i) => (name, i)).ToDictionary(x => x.name, x => x.i, StringComparer.Ordinal);
            foreach ((string node, string title) in Voltages(roles, facts.Supply is not null))
            {
                if (!byNode.TryGetValue(node, out int i)) continue;
                double[] values = w.Column(i);
                series.Add(new PlotSeries(title, "V", PlotPanel.Voltages, times, values));
                if (duskOn is not null && roles.Sensor.Contains(node) && prefix != "detail")
                {
                    int at = Math.Clamp(Array.BinarySearch(times, duskOn.Start) is int b && b >= 0 ? b : ~b, 0, times.Length - 1);
                    series.Add(new PlotSeries($"sensor at switch-on {values[at]:0.00} V", "V", PlotPanel.Voltages, [from, to], [values[at], values[at]], Dashed: true));
                }
            }
            if (roles.Supply is string vcc && byNode.TryGetValue(vcc, out int si) && roles.Timing is not null)
            {
                double[] supply = w.Column(si);
                series.Add(new PlotSeries("1/3 supply", "V", PlotPanel.Voltages, times, [.. supply.Select(v => v / 3)], Dashed: true));
                series.Add(new PlotSeries("2/3 supply", "V", PlotPanel.Voltages, times, [.. supply.Select(v => 2 * v / 3)], Dashed: true));
            }
            if (facts.LoadTransitions.Count > 0) series.Add(LoadSeries(facts, from, to));
            string what = iv is null ? w.Labels[0].Label
                : isOn ? $"lamp on ({ReportText.Cause(iv.Cause)})" : $"lamp off ({iv.EndedBy})";
            plots.Add(new PlotData
            {
                Title = $"{request.Netlist.Name}: {what} at {ReportText.Clock(facts.Clock(w.EventTime))}" + (prefix == "detail" ? " (detail)" : ""),
                Origin = facts.Origin,
                TimeZone = facts.TimeZone,
                From = from,
                To = to,
                Series = series,
                Markers = [.. w.Labels.Select(l => new PlotMarker(l.Time, l.Label, Emphasis: iv is { Expected: false } && iv.Cause != LoadCause.PowerUp))],
                FileStem = $"{prefix}-{k:00}-{Slug(what)}",
            });
        }
    }

    /// <summary>Seconds a zoom shows before and after a slow event (dusk, dawn, a timer running out).</summary>
    public const double SlowZoomBefore = 600, SlowZoomAfter = 120;

    /// <summary>Seconds a zoom shows before and after a fast event (a headlight, lightning, a noise pulse).</summary>
    public const double FastZoomBefore = 8, FastZoomAfter = 4;

    /// <summary>True when the switching event unfolds over minutes: a switch-on by dusk, or a switch-off by the timer
    /// or by light that changed by less than 5 % in the last <see cref="FastZoomBefore"/> seconds (dawn).</summary>
    private static bool SlowEvent(RunFacts facts, AttributedInterval? iv, bool isOn, double t)
    {
        if (iv is null) return false;
        if (isOn) return iv.Cause == LoadCause.Dusk;
        if (iv.EndedByTimer) return true;
        double now = SensorLux(facts, t - 1e-3), earlier = SensorLux(facts, t - FastZoomBefore);
        return Math.Abs(now - earlier) <= 0.05 * Math.Max(Math.Abs(now), Math.Abs(earlier));
    }

    /// <summary>True when the series moves by more than 1 % of its largest value inside the window.</summary>
    private static bool Changes(PlotSeries s, double from, double to)
    {
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        for (int i = 0; i < s.Times.Length; i++)
        {
            if (s.Times[i] < from || s.Times[i] > to) continue;
            lo = Math.Min(lo, s.Values[i]);
            hi = Math.Max(hi, s.Values[i]);
        }
        return hi > lo && hi - lo > 0.01 * Math.Max(Math.Abs(hi), Math.Abs(lo));
    }

    /// <summary>The darkest point of the night's lux series (noon to noon), first one if several.</summary>
    private static (double At, double Lux)? Darkest(PlotSeries lux, NightWindow n)
    {
        int best = -1;
        for (int i = 0; i < lux.Times.Length; i++)
        {
            if (lux.Times[i] < n.From || lux.Times[i] > n.To) continue;
            if (best < 0 || lux.Values[i] < lux.Values[best]) best = i;
        }
        return best < 0 ? null : (lux.Times[best], lux.Values[best]);
    }

    /// <param name="rail">True for a mains-fed supply: its rail is drawn too (the sag and ripple the circuit runs on).</param>
    private static IEnumerable<(string Node, string Title)> Voltages(NodeRoles roles, bool rail = false)
    {
        foreach (string s in roles.Sensor) yield return (s, $"sensor (node {s})");
        if (roles.Trigger is string t) yield return (t, $"trigger pin (node {t})");
        if (roles.Timing is string c && c != roles.Trigger) yield return (c, $"timing capacitor (node {c})");
        // Last, so it is drawn over a trigger pin pulled up to it.
        if (rail && roles.Supply is string vcc) yield return (vcc, $"supply rail (node {vcc})");
    }

    private static void AddThirds(List<PlotSeries> series, NodeRoles roles, SimulationResult sim, double[] times)
    {
        if (roles.Supply is not string vcc || roles.Timing is null || sim.Trace(vcc) is not Trace tr || times.Length == 0) return;
        double[] supply = [.. times.Select(tr.At)];
        series.Add(new PlotSeries("1/3 supply", "V", PlotPanel.Voltages, times, [.. supply.Select(v => v / 3)], Dashed: true));
        series.Add(new PlotSeries("2/3 supply", "V", PlotPanel.Voltages, times, [.. supply.Select(v => 2 * v / 3)], Dashed: true));
    }

    private static PlotSeries LuxSeries(RunFacts facts, LightProfile profile, double[] times, double from, double to)
    {
        // Sample at the trace times, on an even grid of LuxSamples points (the light itself at about a pixel column's
        // resolution, so the curve does not depend on how long the solver's steps were), and at every known light edge
        // in the window, so short events are drawn.
        var t = new SortedSet<double>(times);
        for (int k = 0; k <= LuxSamples; k++) t.Add(from + (to - from) * k / LuxSamples);
        double b = from;
        int guard = 0;
        while ((b = profile.NextBreakpoint(b)) <= to && guard++ < 20000) t.Add(b);
        foreach (LoadTransition x in facts.LoadTransitions)
        {
            if (x.Time >= from && x.Time <= to)
            {
                t.Add(x.Time);
                t.Add(Math.Min(to, x.Time + 1e-6));
            }
        }
        double[] ts = [.. t];
        (double[] tt, double[] vv) = Thin(ts, [.. ts.Select(x => SensorLux(facts, x))], from, to);
        return new PlotSeries("illuminance at sensor", "lx", PlotPanel.Light, tt, vv);
    }

    private static PlotSeries LoadSeries(RunFacts facts, double from, double to)
    {
        var ts = new List<double> { from };
        var vs = new List<double> { LoadOn(facts, from) ? 1 : 0 };
        foreach (LoadTransition x in facts.LoadTransitions)
        {
            if (x.Time <= from || x.Time >= to) continue;
            ts.Add(x.Time);
            vs.Add(x.On ? 1 : 0);
        }
        ts.Add(to);
        vs.Add(vs[^1]);
        (double[] t, double[] v) = Thin(ts, vs, from, to);
        return new PlotSeries("lamp on", "", PlotPanel.States, t, v);
    }

    /// <summary>Evenly spaced samples of the light drawn across a plot's window (about one per pixel column).</summary>
    public const int LuxSamples = 1200;

    /// <summary>False-trigger markers per cause and night plot.</summary>
    public const int MaxMarkersPerCause = 4;

    /// <summary>Points a plotted series keeps at most before it is thinned to a min/max envelope per bucket (a chattering
    /// relay gives tens of thousands of steps; a plot shows about a thousand pixels).</summary>
    public const int MaxPlotPoints = 4000;

    /// <summary>Thins a series to the first, the lowest, the highest and the last point of each of
    /// <see cref="MaxPlotPoints"/>/4 buckets (in time order), so no spike, dip or on/off burst disappears.</summary>
    public static (double[] Times, double[] Values) Thin(IReadOnlyList<double> ts, IReadOnlyList<double> vs, double from, double to)
    {
        if (ts.Count <= MaxPlotPoints || to <= from) return ([.. ts], [.. vs]);
        int buckets = MaxPlotPoints / 4;
        double width = (to - from) / buckets;
        var t = new List<double>(MaxPlotPoints);
        var v = new List<double>(MaxPlotPoints);
        int lastAdded = -1;
        int i = 0;
        for (int b = 0; b < buckets && i < ts.Count; b++)
        {
            double end = b == buckets - 1 ? double.PositiveInfinity : from + (b + 1) * width;
            int start = i, iMin = i, iMax = i;
            while (i < ts.Count && ts[i] < end)
            {
                if (vs[i] < vs[iMin]) iMin = i;
                if (vs[i] > vs[iMax]) iMax = i;
                i++;
            }
            if (i == start) continue;
            // First, the two extremes in time order, last: at most four points, no dip or spike lost.
            int last = i - 1;
            int lo = Math.Min(iMin, iMax), hi = Math.Max(iMin, iMax);
            foreach (int k in (int[])[start, lo, hi, last])
            {
                if (t.Count > 0 && k == lastAdded) continue;
                t.Add(ts[k]);
                v.Add(vs[k]);
                lastAdded = k;
            }
        }
        return ([.. t], [.. v]);
    }

    private static PlotSeries Slice(Trace tr, double from, double to, string title)
    {
        // The envelope (each bucket's minimum and maximum), so no spike between kept rows is lost in the plot.
        var ts = new List<double>();
        var vs = new List<double>();
        for (int i = 0; i < tr.EnvelopeTimes.Count; i++)
        {
            if (tr.EnvelopeTimes[i] < from || tr.EnvelopeTimes[i] > to) continue;
            ts.Add(tr.EnvelopeTimes[i]);
            vs.Add(tr.EnvelopeValues[i]);
        }
        (double[] t, double[] v) = Thin(ts, vs, from, to);
        return new PlotSeries(title, tr.Unit, PlotPanel.Voltages, t, v);
    }

    private static void AddSun(List<PlotMarker> markers, RunFacts facts, NightWindow n)
    {
        void Add(DateTimeOffset? at, string label)
        {
            if (at is DateTimeOffset a) markers.Add(new PlotMarker((a - facts.Origin).TotalSeconds, label));
        }
        Add(n.Sunset, "sunset");
        Add(n.CivilDusk, "civil dusk");
        Add(n.CivilDawn, "civil dawn");
        Add(n.Sunrise, "sunrise");
    }

    private static bool SameTimes(Trace tr, double[] times)
    {
        if (tr.Times.Count != times.Length) return false;
        for (int i = 0; i < times.Length; i++)
        {
            if (tr.Times[i] != times[i]) return false;
        }
        return true;
    }

    private static string Slug(string text)
    {
        var chars = text.ToLowerInvariant().Select(c => char.IsAsciiLetterOrDigit(c) ? c : '-').ToArray();
        string s = new string(chars);
        while (s.Contains("--", StringComparison.Ordinal)) s = s.Replace("--", "-", StringComparison.Ordinal);
        return s.Trim('-');
    }
}
