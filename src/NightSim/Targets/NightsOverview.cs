using NightSim.Analysis;
using NightSim.Reporting;

namespace NightSim.Targets;

/// <summary>
/// The summary across the nights of a run: how many passed every target, the earliest and latest dusk switch-on
/// (against sunset), the range of on-times, the worst night and the counts of misbehaviour.
/// </summary>
public sealed record NightsOverview
{
    public int Nights { get; init; }
    /// <summary>Nights that met every target (every night when no target is stated and nothing went wrong).</summary>
    public int NightsPassed { get; init; }
    /// <summary><see cref="NightsPassed"/> / <see cref="Nights"/>.</summary>
    public double PassRate => Nights == 0 ? 0 : (double)NightsPassed / Nights;
    public int MissedNights { get; init; }
    public int FalseTriggers { get; init; }
    public int EarlyOffs { get; init; }
    public int ChatterBursts { get; init; }
    public int NightsOnAfterSunrise { get; init; }
    /// <summary>Earliest dusk switch-on relative to sunset: (clock time, minutes after sunset), or null.</summary>
    public (DateTimeOffset At, double MinutesAfterSunset)? EarliestSwitchOn { get; init; }
    public (DateTimeOffset At, double MinutesAfterSunset)? LatestSwitchOn { get; init; }
    /// <summary>Shortest and longest dusk on-time, seconds, or null.</summary>
    public double? OnTimeMin { get; init; }
    public double? OnTimeMax { get; init; }
    /// <summary>The worst night and why, or null when there are no nights.</summary>
    public DateOnly? WorstNight { get; init; }
    public string WorstReason { get; init; } = "";
    public double EnergyWh { get; init; }

    /// <summary>Whether a night passed: every target met; without targets, nothing went wrong.</summary>
    public static bool NightPasses(NightSummary n, NightTargets? t) =>
        t is not null && t.Checks.Count > 0 ? t.Pass : Problems(n) == 0;

    /// <summary>Count of things that went wrong in a night (missed, false triggers, early offs, chatter, on at sunrise).</summary>
    public static int Problems(NightSummary n) =>
        (n.Missed ? 1 : 0) + n.FalseTriggers + n.EarlyOffs + n.ChatterBursts + (n.OnAfterSunrise ? 1 : 0);

    /// <summary>The overview of <paramref name="nights"/> with their target checks (same order, or empty).</summary>
    public static NightsOverview Build(IReadOnlyList<NightSummary> nights, IReadOnlyList<NightTargets> targets)
    {
        int passed = 0;
        (DateTimeOffset, double)? earliest = null, latest = null;
        double? onMin = null, onMax = null;
        DateOnly? worst = null;
        string reason = "";
        (int Failed, double Margin) worstScore = (-1, double.PositiveInfinity);
        for (int i = 0; i < nights.Count; i++)
        {
            NightSummary n = nights[i];
            NightTargets? t = i < targets.Count ? targets[i] : null;
            if (NightPasses(n, t)) passed++;
            LoadInterval? dusk = n.LoadOn.FirstOrDefault(l => l.Expected);
            if (dusk is not null && n.Sunset is DateTimeOffset sunset)
            {
                double after = (dusk.Start - sunset).TotalMinutes;
                if (earliest is null || after < earliest.Value.Item2) earliest = (dusk.Start, after);
                if (latest is null || after > latest.Value.Item2) latest = (dusk.Start, after);
            }
            if (dusk is not null)
            {
                onMin = onMin is null ? dusk.DurationSeconds : Math.Min(onMin.Value, dusk.DurationSeconds);
                onMax = onMax is null ? dusk.DurationSeconds : Math.Max(onMax.Value, dusk.DurationSeconds);
            }
            (int, double) score;
            string why;
            if (t is not null && t.Checks.Count > 0)
            {
                TargetCheck closest = t.Checks.MinBy(c => (c.Pass ? 1 : 0, c.RelativeMargin))!;
                score = (t.Failed, closest.RelativeMargin);
                why = t.Failed > 0
                    ? $"{t.Failed} target{(t.Failed == 1 ? "" : "s")} missed: " + string.Join("; ", t.Checks.Where(c => !c.Pass).Select(c => $"{c.Target}: {c.Detail}"))
                    : $"every target met; closest: {closest.Target}: {closest.Detail}";
            }
            else
            {
                score = (Problems(n), 0);
                why = Problems(n) == 0 ? "nothing went wrong" : Describe(n);
            }
            if (score.Item1 > worstScore.Failed || (score.Item1 == worstScore.Failed && score.Item2 < worstScore.Margin))
            {
                worstScore = score;
                worst = n.Date;
                reason = why;
            }
        }
        return new NightsOverview
        {
            Nights = nights.Count,
            NightsPassed = passed,
            MissedNights = nights.Count(n => n.Missed),
            FalseTriggers = nights.Sum(n => n.FalseTriggers),
            EarlyOffs = nights.Sum(n => n.EarlyOffs),
            ChatterBursts = nights.Sum(n => n.ChatterBursts),
            NightsOnAfterSunrise = nights.Count(n => n.OnAfterSunrise),
            EarliestSwitchOn = earliest,
            LatestSwitchOn = latest,
            OnTimeMin = onMin,
            OnTimeMax = onMax,
            WorstNight = worst,
            WorstReason = reason,
            EnergyWh = nights.Sum(n => n.LoadEnergyWh),
        };
    }

    private static string Describe(NightSummary n)
    {
        var parts = new List<string>();
        if (n.Missed) parts.Add("missed");
        if (n.FalseTriggers > 0) parts.Add($"{n.FalseTriggers} false trigger(s)");
        if (n.EarlyOffs > 0) parts.Add($"{n.EarlyOffs} early off(s)");
        if (n.ChatterBursts > 0) parts.Add($"{n.ChatterBursts} chatter burst(s)");
        if (n.OnAfterSunrise) parts.Add("on at sunrise");
        return string.Join(", ", parts);
    }
}
