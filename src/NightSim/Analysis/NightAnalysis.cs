using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>The result of analysing a run: one summary per night and the findings.</summary>
public sealed record AnalysisResult(IReadOnlyList<NightSummary> Nights, IReadOnlyList<Finding> Findings, IReadOnlyList<AttributedInterval> Intervals);

/// <summary>Summarises a run night by night and runs every registered analyser.</summary>
public static class NightAnalysis
{
    /// <summary>Relay operations within this window, seconds, that count as one chatter burst.</summary>
    public const double ChatterWindow = 60.0;

    /// <summary>Operations within <see cref="ChatterWindow"/> that make a burst (common practice: a relay that closes
    /// and opens three times within a minute is chattering, not switching).</summary>
    public const int ChatterOperations = 6;

    public static AnalysisResult Analyze(RunFacts facts)
    {
        using InvariantCultureScope invariant = InvariantCultureScope.Enter();
        IReadOnlyList<AttributedInterval> intervals = LoadTimeline.Build(facts);
        var nights = new List<NightSummary>();
        IEnumerable<NightWindow> windows = facts.Nights.Count > 0
            ? facts.Nights
            : [new NightWindow(DateOnly.FromDateTime(facts.Clock(0).DateTime), 0, facts.Duration, null, null, null, null)];
        foreach (NightWindow n in windows)
        {
            nights.Add(Summarize(facts, n, intervals));
        }
        var findings = new List<Finding>();
        foreach (IResultAnalyzer a in AnalyzerCatalog.All)
        {
            findings.AddRange(a.Analyze(facts, intervals, nights));
        }
        findings.Sort((x, y) => y.Severity.CompareTo(x.Severity) != 0
            ? y.Severity.CompareTo(x.Severity)
            : Nullable.Compare(x.At, y.At));
        return new AnalysisResult(nights, findings, intervals);
    }

    /// <summary>Start times (run seconds) of chatter bursts among relay transitions in [from, to).</summary>
    public static List<(double Start, double End, int Operations)> ChatterBursts(RunFacts facts, double from, double to)
    {
        double[] times = facts.LoadTransitions.Where(t => t.Time >= from && t.Time < to).Select(t => t.Time).Order().ToArray();
        return ChatterBursts(times);
    }

    /// <summary>Chatter bursts among switching times (run seconds, ascending): start, end and number of operations.</summary>
    public static List<(double Start, double End, int Operations)> ChatterBursts(IReadOnlyList<double> times)
    {
        var bursts = new List<(double, double, int)>();
        int i = 0;
        while (i < times.Count)
        {
            int j = i;
            while (j + 1 < times.Count && times[j + 1] - times[i] <= ChatterWindow) j++;
            // Extend the burst while operations keep coming within the window of the previous one.
            while (j + 1 < times.Count && times[j + 1] - times[j] <= ChatterWindow / ChatterOperations) j++;
            int count = j - i + 1;
            if (count >= ChatterOperations)
            {
                bursts.Add((times[i], times[j], count));
                i = j + 1;
            }
            else
            {
                i++;
            }
        }
        return bursts;
    }

    private static NightSummary Summarize(RunFacts facts, NightWindow n, IReadOnlyList<AttributedInterval> all)
    {
        var mine = all.Where(iv => iv.Start >= n.From && iv.Start < n.To).ToList();
        double energy = 0;
        foreach (AttributedInterval iv in all)
        {
            double s = Math.Max(iv.Start, n.From), e = Math.Min(iv.End ?? facts.Duration, n.To);
            if (e > s) energy += iv.PowerWatts * (e - s) / 3600.0;
        }
        AttributedInterval? dusk = mine.FirstOrDefault(iv => iv.Expected);
        double? level = dusk is not null && facts.SensorLux is not null ? facts.SensorLux(dusk.Start - 1e-3) : null;
        DateTimeOffset? crossing = dusk is not null && level is double lv && facts.SkyLux is not null
            ? CrossingTime(facts, n.From, dusk.Start, lv)
            : null;

        double? sunriseRun = n.Sunrise is null ? null : (n.Sunrise.Value - facts.Origin).TotalSeconds;
        bool afterSunrise = sunriseRun is double sr && sr <= facts.Duration &&
            mine.Any(iv => iv.Start < sr && (iv.End ?? double.PositiveInfinity) > sr);
        int operations = facts.LoadTransitions.Count(t => t.Time >= n.From && t.Time < n.To);
        bool dark = n.CivilDusk is not null || n.Sunset is not null;

        return new NightSummary
        {
            Date = n.Date,
            Sunset = n.Sunset,
            CivilDusk = n.CivilDusk,
            CivilDawn = n.CivilDawn,
            Sunrise = n.Sunrise,
            SwitchLevelCrossing = crossing,
            SwitchLevelLux = level,
            LoadOn = mine.Select(iv => new LoadInterval(
                facts.Clock(iv.Start),
                iv.End is double e ? facts.Clock(e) : null,
                (iv.End ?? facts.Duration) - iv.Start,
                iv.Cause, iv.Expected, iv.Explanation, iv.EndedBy)).ToList(),
            FalseTriggers = mine.Count(iv => !iv.Expected && iv.Cause != LoadCause.PowerUp),
            EarlyOffs = mine.Count(iv => IsEarlyOff(facts, iv)),
            ChatterBursts = ChatterBursts(facts, n.From, n.To).Count,
            RelayOperations = operations,
            Missed = facts.HasSwitchedLoad && dark && mine.Count == 0 && n.To <= facts.Duration + 1,
            OnAfterSunrise = afterSunrise,
            LoadEnergyWh = energy,
        };
    }

    /// <summary>An on-time cut short: ended by something other than the timer, before the timer's closed form.</summary>
    public static bool IsEarlyOff(RunFacts facts, AttributedInterval iv)
    {
        if (iv.End is null || iv.EndedByTimer || !iv.Expected) return false;
        double width = facts.Timers.Count > 0 ? facts.Timers[0].ClosedFormWidth : double.NaN;
        double duration = iv.End.Value - iv.Start;
        return !double.IsNaN(width) && !double.IsInfinity(width) && duration < 0.95 * width;
    }

    /// <summary>When the sky alone fell through <paramref name="level"/> lux before <paramref name="before"/>
    /// (bisection on the last falling crossing; the sky is monotone around dusk).</summary>
    private static DateTimeOffset? CrossingTime(RunFacts facts, double from, double before, double level)
    {
        Func<double, double> sky = facts.SkyLux!;
        if (sky(before) > level) return null;
        // Walk back in 60 s steps to the last time the sky was above the level.
        double hi = before, lo = before;
        while (lo > from)
        {
            lo = Math.Max(from, lo - 60);
            if (sky(lo) > level) break;
            hi = lo;
        }
        if (sky(lo) <= level) return null;
        for (int k = 0; k < 40 && hi - lo > 0.01; k++)
        {
            double mid = 0.5 * (lo + hi);
            if (sky(mid) > level) lo = mid; else hi = mid;
        }
        return facts.Clock(hi);
    }
}
