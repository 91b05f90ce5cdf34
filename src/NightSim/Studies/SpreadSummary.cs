namespace NightSim.Studies;

/// <summary>A probability with its count and 95 % Wilson score interval.</summary>
public sealed record Proportion(int Count, int Of, double Low, double High)
{
    public double Rate => Of == 0 ? 0 : (double)Count / Of;

    public static Proportion From(int count, int of)
    {
        (double lo, double hi) = Wilson.Interval(count, of);
        return new Proportion(count, of, lo, hi);
    }
}

/// <summary>Percentiles and range of one outcome over the runs that have it.</summary>
public sealed record Distribution(int N, double P5, double P50, double P95, double Mean, double Min, double Max, double StandardDeviation)
{
    public static Distribution? Of(IEnumerable<double> values)
    {
        var sorted = values.Where(double.IsFinite).Order().ToList();
        if (sorted.Count == 0) return null;
        double mean = sorted.Average();
        double sd = sorted.Count > 1 ? Math.Sqrt(sorted.Sum(v => (v - mean) * (v - mean)) / (sorted.Count - 1)) : 0;
        return new Distribution(sorted.Count, Percentile.Of(sorted, 5), Percentile.Of(sorted, 50), Percentile.Of(sorted, 95),
            mean, sorted[0], sorted[^1], sd);
    }
}

/// <summary>What a spread found across its runs.</summary>
public sealed record SpreadSummary(
    int Runs,
    int SimulationFailures,
    Proportion Pass,
    Distribution? OnTimeSeconds,
    Distribution? SwitchOnMinutesAfterSunset,
    Proportion Missed,
    Proportion NeverEnds,
    Proportion FalseTrigger,
    Proportion Chatter,
    Proportion EarlyOff,
    IReadOnlyList<int> Worst)
{
    /// <summary>How many of the worst runs are listed.</summary>
    public const int WorstCount = 5;

    public static SpreadSummary Of(IReadOnlyList<SpreadRun> runs)
    {
        int n = runs.Count;
        var worst = runs
            .OrderBy(r => r.Outcome.Pass ? 1 : 0)
            .ThenByDescending(r => r.Outcome.Failure is null ? 0 : 1)
            .ThenByDescending(r => r.Outcome.TargetsFailed)
            .ThenBy(r => r.Outcome.WorstMargin ?? 0)
            .ThenByDescending(r => (r.Outcome.Missed ? 1 : 0) + (r.Outcome.NeverEnds ? 1 : 0) + r.Outcome.FalseTriggers + r.Outcome.ChatterBursts + r.Outcome.EarlyOffs)
            .ThenBy(r => r.Index)
            .Take(WorstCount).Select(r => r.Index).ToList();
        return new SpreadSummary(
            n,
            runs.Count(r => r.Outcome.Failure is not null),
            Proportion.From(runs.Count(r => r.Outcome.Pass), n),
            Distribution.Of(runs.Where(r => !r.Outcome.NeverEnds && r.Outcome.OnSeconds is not null).Select(r => r.Outcome.OnSeconds!.Value)),
            Distribution.Of(runs.Where(r => r.Outcome.SwitchOnMinutesAfterSunset is not null).Select(r => r.Outcome.SwitchOnMinutesAfterSunset!.Value)),
            Proportion.From(runs.Count(r => r.Outcome.Missed), n),
            Proportion.From(runs.Count(r => r.Outcome.NeverEnds), n),
            Proportion.From(runs.Count(r => r.Outcome.FalseTriggers > 0), n),
            Proportion.From(runs.Count(r => r.Outcome.ChatterBursts > 0), n),
            Proportion.From(runs.Count(r => r.Outcome.EarlyOffs > 0), n),
            worst);
    }
}
