namespace NightSim.Reporting;

/// <summary>
/// Converts run time (seconds since a run's origin) to site local clock time, so the trace, the plots and the page
/// agree on every label — across midnight and across daylight-saving changes.
/// </summary>
public static class ClockTime
{
    /// <summary>Local clock time of <paramref name="runSeconds"/> after <paramref name="origin"/>.</summary>
    /// <param name="origin">Clock time of run time 0 (site local, with offset).</param>
    /// <param name="zone">Site time zone, or null to keep the origin's fixed offset.</param>
    /// <param name="runSeconds">Run time, seconds (may be fractional; kept to 100 ns ticks).</param>
    public static DateTimeOffset At(DateTimeOffset origin, TimeZoneInfo? zone, double runSeconds)
    {
        DateTimeOffset t = origin.AddTicks((long)Math.Round(runSeconds * TimeSpan.TicksPerSecond));
        return zone is null ? t : TimeZoneInfo.ConvertTime(t, zone);
    }
}
