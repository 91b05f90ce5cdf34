namespace NightSim.Sky;

/// <summary>Conversions between local clock time in a zone and instants, with daylight-saving gaps and overlaps handled.</summary>
public static class LocalClock
{
    /// <summary>
    /// The instant of <paramref name="local"/> (kind ignored) in <paramref name="zone"/>. Skipped times move forward by
    /// the gap (02:30 on a spring-forward night becomes 03:30 summer time); repeated times take the earlier instant.
    /// </summary>
    public static DateTimeOffset ToInstant(TimeZoneInfo zone, DateTime local)
    {
        ArgumentNullException.ThrowIfNull(zone);
        var unspecified = DateTime.SpecifyKind(local, DateTimeKind.Unspecified);
        if (zone.IsInvalidTime(unspecified))
        {
            // Offset before the gap applied to the wall time lands after the gap by exactly the gap length.
            TimeSpan before = zone.GetUtcOffset(unspecified.AddHours(-6));
            var utc = DateTime.SpecifyKind(unspecified - before, DateTimeKind.Utc);
            return TimeZoneInfo.ConvertTime(new DateTimeOffset(utc), zone);
        }
        if (zone.IsAmbiguousTime(unspecified))
        {
            TimeSpan[] offsets = zone.GetAmbiguousTimeOffsets(unspecified);
            TimeSpan larger = offsets.Max();
            return new DateTimeOffset(unspecified, larger);
        }
        return new DateTimeOffset(unspecified, zone.GetUtcOffset(unspecified));
    }

    /// <summary><paramref name="instant"/> expressed in <paramref name="zone"/>'s local time with its offset.</summary>
    public static DateTimeOffset ToLocal(TimeZoneInfo zone, DateTimeOffset instant) => TimeZoneInfo.ConvertTime(instant, zone);
}
