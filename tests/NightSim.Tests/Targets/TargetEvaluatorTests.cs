using NightSim.Analysis;
using NightSim.Reporting;
using NightSim.Sky;
using NightSim.Targets;

namespace NightSim.Tests.Targets;

/// <summary>Target checks on hand-made nights (invented times; the margins are differences worked by hand).</summary>
public sealed class TargetEvaluatorTests
{
    private static readonly TimeSpan s_cet = TimeSpan.FromHours(1);

    private static DateTimeOffset At(int day, int h, int m) => new(2026, 11, day, h, m, 0, s_cet);

    private static NightSummary Night(DateTimeOffset on, DateTimeOffset? off, int falseTriggers = 0, double lux = 2.0) => new()
    {
        Date = new DateOnly(2026, 11, 20),
        Sunset = At(20, 16, 30),
        Sunrise = At(21, 7, 50),
        SwitchLevelLux = lux,
        LoadOn = [new LoadInterval(on, off, ((off ?? At(21, 12, 0)) - on).TotalSeconds, LoadCause.Dusk, true, "dusk", "timer ran out")],
        FalseTriggers = falseTriggers,
    };

    private static readonly DesignTargets s_targets = new()
    {
        SwitchOnLuxMin = 1, SwitchOnLuxMax = 5, SwitchOnMinutesAfterSunset = 45, OnTimeMin = 3 * 3600, OnTimeMax = 5 * 3600,
        OffBy = new TimeSpan(23, 0, 0), NoFalseTrigger = true, NoEarlyOff = true, NoChatter = true, OffAtSunrise = true,
    };

    [Fact]
    public void A_Good_Night_Passes_With_Hand_Worked_Margins()
    {
        // On 17:00 (30 min after sunset), off 21:00 (4 h): margins 15 min, 1 h, 2 h before 23:00; lux 2 in 1…5 → 1 lx.
        NightTargets t = TargetEvaluator.Evaluate(s_targets, Night(At(20, 17, 0), At(20, 21, 0)));
        Assert.True(t.Pass);
        Assert.Equal(1.0, t.Checks.Single(c => c.Target == "switch-on-lux").Margin!.Value, 9);
        Assert.Equal(15.0, t.Checks.Single(c => c.Target == "switch-on-after-sunset").Margin!.Value, 9);
        Assert.Equal(3600.0, t.Checks.Single(c => c.Target == "on-time").Margin!.Value, 9);
        Assert.Equal(120.0, t.Checks.Single(c => c.Target == "off-by").Margin!.Value, 9);
        Assert.Equal(8, t.Checks.Count);
    }

    [Fact]
    public void A_Late_Long_Night_With_A_False_Trigger_Fails_The_Right_Targets()
    {
        // On 17:45 (75 min after sunset: 30 min late), off 23:15 (5.5 h: 30 min too long; 15 min past 23:00).
        NightTargets t = TargetEvaluator.Evaluate(s_targets, Night(At(20, 17, 45), At(20, 23, 15), falseTriggers: 1));
        Assert.False(t.Pass);
        Assert.Equal(-30.0, t.Checks.Single(c => c.Target == "switch-on-after-sunset").Margin!.Value, 9);
        Assert.Equal(-1800.0, t.Checks.Single(c => c.Target == "on-time").Margin!.Value, 9);
        Assert.Equal(-15.0, t.Checks.Single(c => c.Target == "off-by").Margin!.Value, 9);
        Assert.False(t.Checks.Single(c => c.Target == "no-false-trigger").Pass);
        Assert.True(t.Checks.Single(c => c.Target == "no-chatter").Pass);
        Assert.Equal(4, t.Failed);
    }

    [Fact]
    public void A_Timer_That_Never_Ends_Fails_On_Time_Off_By_And_Sunrise()
    {
        NightSummary n = Night(At(20, 17, 0), null) with { OnAfterSunrise = true };
        NightTargets t = TargetEvaluator.Evaluate(s_targets, n);
        Assert.False(t.Checks.Single(c => c.Target == "on-time").Pass);
        Assert.False(t.Checks.Single(c => c.Target == "off-by").Pass);
        Assert.False(t.Checks.Single(c => c.Target == "off-at-sunrise").Pass);
        NightsOverview o = NightsOverview.Build([n, Night(At(20, 17, 0), At(20, 21, 0))], [t, TargetEvaluator.Evaluate(s_targets, Night(At(20, 17, 0), At(20, 21, 0)))]);
        Assert.Equal(1, o.NightsPassed);
        Assert.Equal(0.5, o.PassRate);
        Assert.Equal(n.Date, o.WorstNight);
    }
}
