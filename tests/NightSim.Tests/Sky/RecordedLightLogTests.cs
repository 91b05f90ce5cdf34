using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class RecordedLightLogTests
{
    private static readonly TimeZoneInfo s_berlin = TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin");

    [Fact]
    public void MalformedRows_ReportedWithLineNumbers()
    {
        const string csv = "time,lux\n2026-11-20T16:00:00,5\n\n2026-11-20T16:01:00;7;8\n2026-11-20 16:02,1,5\n2026-11-20T16:03:00,NaN\n2026-11-20T16:04:00,2\n";
        RecordedLightLog? log = RecordedLightLog.Parse(csv, "x.csv", s_berlin, utc: false, out var errors);
        Assert.Null(log);
        Assert.Equal(new[] { 4, 5, 6 }, errors.Select(e => e.Line).ToArray());
        Assert.All(errors, e => Assert.Equal("x.csv", e.File));
    }

    [Fact]
    public void UnsortedTimes_NameThePreviousLine()
    {
        const string csv = "2026-11-20T16:00:00,5\n2026-11-20T16:05:00,4\n2026-11-20T16:03:00,3\n";
        RecordedLightLog.Parse(csv, "u.csv", s_berlin, false, out var errors);
        ScenarioError e = Assert.Single(errors);
        Assert.Equal(3, e.Line);
        Assert.Contains("line 2", e.Message);
    }

    [Fact]
    public void Gaps_AreWarningsWithLineNumbers()
    {
        var rows = new List<string>();
        for (int m = 0; m < 10; m++) rows.Add($"2026-11-20T16:{m:00}:00,{10 - m}");
        rows.Add("2026-11-20T16:45:00,0.5");
        RecordedLightLog? log = RecordedLightLog.Parse(string.Join("\n", rows), "g.csv", s_berlin, false, out var errors);
        Assert.Empty(errors);
        ScenarioError w = Assert.Single(log!.Warnings);
        Assert.Equal(11, w.Line);
        Assert.Contains("gap", w.Message);
    }

    [Fact]
    public void LocalAndUtcStamps()
    {
        // 2026-11-20 is winter time in Berlin: UTC+1 (EU rule, Directive 2000/84/EC).
        const string csv = "2026-11-20T16:00:00,5\n2026-11-20T16:01:00Z,4\n2026-11-20T17:05:00+01:00,3\n";
        RecordedLightLog local = RecordedLightLog.Parse(csv, "l.csv", s_berlin, false, out _)!;
        Assert.Equal(new DateTimeOffset(2026, 11, 20, 15, 0, 0, TimeSpan.Zero), local.Times[0]);
        Assert.Equal(new DateTimeOffset(2026, 11, 20, 16, 1, 0, TimeSpan.Zero), local.Times[1]);
        RecordedLightLog utc = RecordedLightLog.Parse(csv, "l.csv", s_berlin, true, out _)!;
        Assert.Equal(new DateTimeOffset(2026, 11, 20, 16, 0, 0, TimeSpan.Zero), utc.Times[0]);
    }
}
