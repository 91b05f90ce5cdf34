using NightSim.Analysis;
using NightSim.Targets;

namespace NightSim.Runs;

/// <summary>
/// Which nights of a run get their own plots. A run of up to <see cref="AllUpTo"/> nights plots every night. A longer
/// run (a month, a year) plots the interesting nights only, at most <see cref="MostInteresting"/>, worst first: a night
/// is interesting when the lamp missed it or still burned at sunrise, it failed a target, the relay chattered, a false
/// trigger switched the lamp on, or the lamp went off early. The worst are the ones with the gravest trouble (in that
/// order), then with more kinds of trouble, then the smallest target margin, then the most events; ties go to the
/// earlier night. When no night is interesting, the first night is plotted as an example. The nights' overview plot
/// shows every night either way.
/// </summary>
public static class PlottedNights
{
    /// <summary>Runs of at most this many nights plot every night.</summary>
    public const int AllUpTo = 7;

    /// <summary>Longer runs plot at most this many nights.</summary>
    public const int MostInteresting = 5;

    /// <summary>The dates to plot, in date order.</summary>
    /// <param name="nights">Every night of the run.</param>
    /// <param name="targets">Each night's target checks (empty without targets).</param>
    public static IReadOnlyList<DateOnly> Select(IReadOnlyList<NightSummary> nights, IReadOnlyList<NightTargets> targets)
    {
        var byDate = new Dictionary<DateOnly, NightTargets>();
        foreach (NightTargets t in targets) byDate[t.Date] = t;
        return Select([.. nights.Select(n => (n.Date, TroubleOf(n, byDate.GetValueOrDefault(n.Date))))]);
    }

    /// <summary>The dates to plot, in date order, from what went wrong on each date (in date order).</summary>
    public static IReadOnlyList<DateOnly> Select(IReadOnlyList<(DateOnly Date, Trouble Trouble)> nights)
    {
        if (nights.Count <= AllUpTo) return [.. nights.Select(n => n.Date)];
        var ranked = nights.Where(n => n.Trouble.Gravest < Grave.None).ToList();
        if (ranked.Count == 0) return [nights[0].Date];
        return [.. ranked
            .OrderBy(r => r.Trouble.Gravest)
            .ThenByDescending(r => r.Trouble.Kinds)
            .ThenBy(r => r.Trouble.WorstMargin)
            .ThenByDescending(r => r.Trouble.Events)
            .ThenBy(r => r.Date)
            .Take(MostInteresting)
            .Select(r => r.Date)
            .Order()];
    }

    /// <summary>Kinds of trouble, gravest first.</summary>
    public enum Grave
    {
        /// <summary>The lamp never came on although it got dark, or it still burned at sunrise.</summary>
        LampWrongAllNight,
        /// <summary>A design target was missed.</summary>
        FailedTarget,
        /// <summary>The relay chattered.</summary>
        Chatter,
        /// <summary>Something other than dusk switched the lamp on.</summary>
        FalseTrigger,
        /// <summary>The on-time was cut short.</summary>
        EarlyOff,
        /// <summary>Nothing went wrong.</summary>
        None,
    }

    /// <summary>What went wrong in one night.</summary>
    /// <param name="Gravest">The gravest kind present.</param>
    /// <param name="Kinds">How many kinds are present.</param>
    /// <param name="WorstMargin">Smallest relative target margin (0 without targets).</param>
    /// <param name="Events">Chatter bursts, false triggers and early offs, counted together.</param>
    public readonly record struct Trouble(Grave Gravest, int Kinds, double WorstMargin, int Events);

    /// <summary>The trouble of one night.</summary>
    public static Trouble TroubleOf(NightSummary n, NightTargets? targets) =>
        TroubleOf(n.Missed || n.OnAfterSunrise, targets is { Pass: false }, n.ChatterBursts, n.FalseTriggers, n.EarlyOffs,
            targets is null || targets.Checks.Count == 0 ? 0 : targets.Checks.Min(c => c.RelativeMargin));

    /// <summary>The trouble of one night from its counts.</summary>
    /// <param name="lampWrongAllNight">The lamp never came on although it got dark, or still burned at sunrise.</param>
    /// <param name="failedTarget">A design target was missed.</param>
    /// <param name="chatterBursts">Chatter bursts.</param>
    /// <param name="falseTriggers">Switch-ons not caused by dusk.</param>
    /// <param name="earlyOffs">On-times cut short.</param>
    /// <param name="worstMargin">Smallest relative target margin (0 without targets).</param>
    public static Trouble TroubleOf(bool lampWrongAllNight, bool failedTarget, int chatterBursts, int falseTriggers, int earlyOffs, double worstMargin)
    {
        var kinds = new List<Grave>();
        if (lampWrongAllNight) kinds.Add(Grave.LampWrongAllNight);
        if (failedTarget) kinds.Add(Grave.FailedTarget);
        if (chatterBursts > 0) kinds.Add(Grave.Chatter);
        if (falseTriggers > 0) kinds.Add(Grave.FalseTrigger);
        if (earlyOffs > 0) kinds.Add(Grave.EarlyOff);
        return new Trouble(kinds.Count == 0 ? Grave.None : kinds.Min(), kinds.Count, worstMargin, chatterBursts + falseTriggers + earlyOffs);
    }
}
