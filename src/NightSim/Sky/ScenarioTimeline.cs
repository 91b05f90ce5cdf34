namespace NightSim.Sky;

/// <summary>
/// Maps the clock times of a scenario's nights to run time. Night k (0-based) is the night of <c>Start + k</c> days and
/// runs from local noon of that date to local noon of the next; a clock time before 12:00 belongs to the next morning.
/// Run time 0 is local noon of the start date. Nights spanning a daylight-saving change last 23 h or 25 h.
/// </summary>
public sealed class ScenarioTimeline
{
    public ScenarioTimeline(Site site, DateOnly start, int nights)
    {
        ArgumentNullException.ThrowIfNull(site);
        if (nights < 1) throw new ArgumentOutOfRangeException(nameof(nights), "at least one night");
        Site = site;
        Start = start;
        Nights = nights;
        Origin = site.LocalNoon(start);
        Duration = (site.LocalNoon(start.AddDays(nights)) - Origin).TotalSeconds;
    }

    public Site Site { get; }
    public DateOnly Start { get; }
    public int Nights { get; }
    /// <summary>Local noon of the start date.</summary>
    public DateTimeOffset Origin { get; }
    /// <summary>Window length, seconds (local noon of the start date to local noon after the last night).</summary>
    public double Duration { get; }

    /// <summary>Run time of an instant, seconds.</summary>
    public double RunTime(DateTimeOffset instant) => (instant - Origin).TotalSeconds;

    /// <summary>Instant of run time <paramref name="time"/> in the site's zone.</summary>
    public DateTimeOffset Instant(double time)
        => LocalClock.ToLocal(Site.TimeZone, Origin.AddTicks((long)Math.Round(time * TimeSpan.TicksPerSecond)));

    /// <summary>Run time of clock time <paramref name="clock"/> in night <paramref name="night"/>.</summary>
    public double ClockTime(int night, TimeSpan clock)
    {
        DateOnly date = Start.AddDays(night);
        if (clock < TimeSpan.FromHours(12)) date = date.AddDays(1);
        return RunTime(Site.ToInstant(date.ToDateTime(TimeOnly.MinValue) + clock));
    }

    /// <summary>Run-time span of night <paramref name="night"/>, seconds.</summary>
    public (double Start, double End) NightSpan(int night)
        => (RunTime(Site.LocalNoon(Start.AddDays(night))), RunTime(Site.LocalNoon(Start.AddDays(night + 1))));

    /// <summary>Run-time interval of clock times <paramref name="from"/>…<paramref name="to"/> in night <paramref name="night"/> (to after from in night order).</summary>
    public (double From, double To) ClockSpan(int night, TimeSpan from, TimeSpan to)
        => (ClockTime(night, from), ClockTime(night, to));
}
