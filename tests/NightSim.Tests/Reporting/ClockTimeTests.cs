using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>Run seconds → local clock time, across midnight and across the end of summer time.</summary>
public sealed class ClockTimeTests
{
    [Fact]
    public void FixedOffsetCrossesMidnight()
    {
        var origin = new DateTimeOffset(2026, 11, 20, 12, 0, 0, TimeSpan.FromHours(1));
        Assert.Equal(new DateTimeOffset(2026, 11, 21, 0, 30, 0, TimeSpan.FromHours(1)), ClockTime.At(origin, null, 12.5 * 3600));
    }

    [Fact]
    public void ZoneFollowsEndOfSummerTime()
    {
        // EU summer-time rule (Directive 2000/84/EC): summer time ends on the last Sunday of October at 01:00 UTC.
        // A central-European zone built from that rule: UTC+1, +1 h in summer.
        var rule = TimeZoneInfo.AdjustmentRule.CreateAdjustmentRule(
            DateTime.MinValue.Date, DateTime.MaxValue.Date, TimeSpan.FromHours(1),
            TimeZoneInfo.TransitionTime.CreateFloatingDateRule(new DateTime(1, 1, 1, 2, 0, 0), 3, 5, DayOfWeek.Sunday),
            TimeZoneInfo.TransitionTime.CreateFloatingDateRule(new DateTime(1, 1, 1, 3, 0, 0), 10, 5, DayOfWeek.Sunday));
        TimeZoneInfo zone = TimeZoneInfo.CreateCustomTimeZone("Test/Central", TimeSpan.FromHours(1), "Test/Central", "CET", "CEST", [rule]);

        var origin = new DateTimeOffset(2026, 10, 24, 12, 0, 0, TimeSpan.FromHours(2)); // 10:00 UTC, summer time
        // 2026-10-25 01:00 UTC is 15 h after the origin.
        DateTimeOffset before = ClockTime.At(origin, zone, 15 * 3600 - 1);
        DateTimeOffset after = ClockTime.At(origin, zone, 15 * 3600);
        Assert.Equal("2026-10-25T02:59:59+02:00", ReportText.Iso(before));
        Assert.Equal("2026-10-25T02:00:00+01:00", ReportText.Iso(after));
    }
}
