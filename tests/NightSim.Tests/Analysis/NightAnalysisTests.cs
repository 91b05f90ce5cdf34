using NightSim.Analysis;
using NightSim.Reporting;
using NightSim.Results;

namespace NightSim.Tests.Analysis;

/// <summary>Attribution and night summaries on hand-made runs (invented demo data: times and levels are ours).</summary>
public class NightAnalysisTests
{
    private static readonly DateTimeOffset s_origin = new(2026, 11, 20, 12, 0, 0, TimeSpan.FromHours(1));

    private static RunFacts Facts(IReadOnlyList<LoadTransition> transitions, IReadOnlyList<EventFact>? events = null,
        IReadOnlyList<DiscreteEvent>? deviceEvents = null, double lampLux = 0, IReadOnlyList<TimerFacts>? timers = null) => new()
    {
        Origin = s_origin,
        TimeZone = TimeZoneInfo.CreateCustomTimeZone("plus1", TimeSpan.FromHours(1), "plus1", "plus1"),
        Duration = 86400,
        Nights = [new NightWindow(new DateOnly(2026, 11, 20), 0, 86400,
            s_origin.AddHours(4.5), s_origin.AddHours(5.1), s_origin.AddHours(18.9), s_origin.AddHours(19.5))],
        LoadTransitions = transitions,
        Events = events ?? [],
        DeviceEvents = deviceEvents ?? [],
        LampCouplingLux = lampLux,
        Timers = timers ?? [],
        SkyLux = t => t < 5 * 3600 ? 1000 * Math.Exp(-(t - 4 * 3600) / 900.0) : 1e-3,
        SensorLux = t => t < 5 * 3600 ? 1000 * Math.Exp(-(t - 4 * 3600) / 900.0) : 1e-3,
    };

    private static LoadTransition On(double t) => new(t, true, "lamp", 60, "K1");
    private static LoadTransition Off(double t) => new(t, false, "lamp", 60, "K1");

    [Fact]
    public void CleanNightHasOneExpectedDuskInterval()
    {
        double on = 4.8 * 3600, off = on + 4 * 3600;
        AnalysisResult r = NightAnalysis.Analyze(Facts([On(on), Off(off)],
            deviceEvents:
            [
                new DiscreteEvent(off - 0.001, "U1.a", "U1", "output", "low", "high", DeviceEventKind.ThresholdReached),
                new DiscreteEvent(off - 0.0009, "U1.b", "U1", "q", "high", "low", DeviceEventKind.TimerOutputLow),
            ]));
        NightSummary n = Assert.Single(r.Nights);
        LoadInterval iv = Assert.Single(n.LoadOn);
        Assert.Equal(LoadCause.Dusk, iv.Cause);
        Assert.True(iv.Expected);
        Assert.Equal("timer ran out", iv.EndedBy);
        Assert.Equal(0, n.FalseTriggers);
        Assert.Equal(2, n.RelayOperations);
        Assert.Equal(240.0, n.LoadEnergyWh, 6); // 60 W × 4 h
        // The sky model above falls through the switch-on level exactly at the switch-on.
        Assert.NotNull(n.SwitchLevelCrossing);
        Assert.InRange(Math.Abs((n.SwitchLevelCrossing!.Value - s_origin.AddSeconds(on)).TotalSeconds), 0, 1);
    }

    [Fact]
    public void HeadlightAfterTimeoutIsAFalseTrigger()
    {
        double on = 4.8 * 3600, off = on + 4 * 3600, car = off + 1800;
        var headlight = new EventFact(LoadCause.Headlight, "headlights", car, car + 4, 40, "headlight, 40 lx for 4 s");
        AnalysisResult r = NightAnalysis.Analyze(Facts([On(on), Off(off), On(car + 4.5), Off(car + 4.5 + 3600)], [headlight]));
        NightSummary n = Assert.Single(r.Nights);
        Assert.Equal(2, n.LoadOn.Count);
        Assert.Equal(LoadCause.Headlight, n.LoadOn[1].Cause);
        Assert.False(n.LoadOn[1].Expected);
        Assert.Equal(1, n.FalseTriggers);
        Assert.Contains(r.Findings, f => f.Code == "false-trigger-headlight" && f.Severity == Severity.Warning);
    }

    [Fact]
    public void SelfIlluminationLoopIsChatter()
    {
        var t = new List<LoadTransition>();
        double s = 4.8 * 3600;
        for (int k = 0; k < 8; k++)
        {
            t.Add(On(s + 6 * k));
            t.Add(Off(s + 6 * k + 3));
        }
        AnalysisResult r = NightAnalysis.Analyze(Facts(t, lampLux: 12));
        NightSummary n = Assert.Single(r.Nights);
        Assert.Equal(1, n.ChatterBursts);
        Assert.Equal(16, n.RelayOperations);
        Assert.Contains(r.Findings, f => f.Code == "relay-chatter" && f.Message.Contains("16 operations", StringComparison.Ordinal));
        Assert.All(n.LoadOn.Skip(1), iv => Assert.Equal(LoadCause.SelfIllumination, iv.Cause));
    }

    [Fact]
    public void NeverEndingTimerIsAnError()
    {
        double on = 4.8 * 3600;
        AnalysisResult r = NightAnalysis.Analyze(Facts([On(on)], timers: [new TimerFacts("U1", 1e6, 1000e-6, 12, 16e-6, double.PositiveInfinity)]));
        Assert.Contains(r.Findings, f => f.Code == "timer-never-ends" && f.Severity == Severity.Error);
        Assert.Contains(r.Findings, f => f.Code == "still-on-at-end");
        Assert.True(r.Nights[0].OnAfterSunrise);
    }

    [Fact]
    public void NoiseAndPowerUpAreAttributed()
    {
        double noise = 10 * 3600;
        var pulse = new EventFact(LoadCause.Noise, "noise", noise, noise + 2e-6, 5, "5 V noise pulse on trig");
        AnalysisResult r = NightAnalysis.Analyze(Facts([On(0.002), Off(3600), On(4.8 * 3600), Off(4.9 * 3600), On(noise + 1e-5), Off(noise + 100)], [pulse]));
        IReadOnlyList<LoadInterval> ivs = r.Nights[0].LoadOn;
        Assert.Equal(LoadCause.PowerUp, ivs[0].Cause);
        Assert.Equal(LoadCause.Dusk, ivs[1].Cause);
        Assert.Equal(LoadCause.Noise, ivs[2].Cause);
        Assert.Equal(1, r.Nights[0].FalseTriggers);
    }

    [Fact]
    public void DarkNightWithoutSwitchOnIsMissed()
    {
        AnalysisResult r = NightAnalysis.Analyze(Facts([]));
        Assert.True(r.Nights[0].Missed);
        Assert.Contains(r.Findings, f => f.Code == "missed-night");
    }

    // The trigger held low past the timing period: the output followed the trigger, and the on-period ended when it
    // was released, not when the timer ran out (555 logic: a trigger below 1/3 holds the output high whatever the
    // threshold does; common practice).
    [Fact]
    public void TriggerHeldPastThePeriodIsNamed()
    {
        double on = 4.8 * 3600, released = on + 3 * 3600;
        var events = new List<DiscreteEvent>
        {
            new(on - 0.01, "x", "U1", "output", "low", "high", DeviceEventKind.TriggerFired),
            new(on - 0.005, "y", "U1", "q", "low", "high", DeviceEventKind.TimerOutputHigh),
            new(on + 110, "z", "U1", "output", "low", "high", DeviceEventKind.ThresholdReached),
            new(released, "x", "U1", "output", "high", "low", DeviceEventKind.TriggerReleased),
            new(released + 1e-6, "y", "U1", "q", "high", "low", DeviceEventKind.TimerOutputLow),
        };
        AnalysisResult r = NightAnalysis.Analyze(Facts([On(on), Off(released + 0.01)], deviceEvents: events,
            timers: [new TimerFacts("U1", 1e6, 100e-6, 12, 0, double.PositiveInfinity)]));
        Assert.Equal("timer U1's trigger input was released", r.Nights[0].LoadOn[0].EndedBy);
        Finding f = Assert.Single(r.Findings, f => f.Code == "trigger-held");
        // Held 3 h against ln 3 · 1 MΩ · 100 µF = 1 min 50 s.
        Assert.Contains("for 3 h from", f.Message, StringComparison.Ordinal);
        Assert.Contains("timing period of 1 min 50 s", f.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("U1.", f.Message, StringComparison.Ordinal);
        Assert.Equal("U1", f.Part);
    }

    // The timer output went high, the coil stayed at 8.7 V against its 9 V pull-in: the relay stage failed.
    [Fact]
    public void CoilBelowPullInIsTheRelayStage()
    {
        double on = 4.8 * 3600, off = on + 3600;
        var events = new List<DiscreteEvent>
        {
            new(on, "x", "U1", "output", "low", "high", DeviceEventKind.TriggerFired),
            new(on + 1e-6, "y", "U1", "q", "low", "high", DeviceEventKind.TimerOutputHigh),
            new(on + 0.01, "x", "U1", "output", "high", "low", DeviceEventKind.TriggerReleased),
            new(off, "z", "U1", "output", "low", "high", DeviceEventKind.ThresholdReached),
            new(off + 1e-6, "y", "U1", "q", "high", "low", DeviceEventKind.TimerOutputLow),
        };
        RunFacts facts = Facts([], deviceEvents: events) with
        {
            Relays = [new RelayFacts("K1", 9.0, 1.2, (from, to) => from <= on + 1 && to >= on ? 8.7 : 0.0)],
        };
        AnalysisResult r = NightAnalysis.Analyze(facts);
        Finding f = Assert.Single(r.Findings, f => f.Code == "relay-not-pulling-in");
        Assert.Contains("8.7 V against its 9.0 V pull-in", f.Message, StringComparison.Ordinal);
        Assert.Equal("K1", f.Part);
        Assert.DoesNotContain(r.Findings, f => f.Code == "missed-night");
    }

    // A night never darker than the switching level is not a failure of any stage: it says how dark it got.
    [Fact]
    public void BrightNightNamesTheDarkestLight()
    {
        RunFacts facts = Facts([]) with
        {
            Sensor = new SensorFacts("LDR1", 2.0),
            SensorLux = t => 4.0 + Math.Abs(t - 13 * 3600) / 3600.0,
        };
        AnalysisResult r = NightAnalysis.Analyze(facts);
        Finding f = Assert.Single(r.Findings, f => f.Code == "never-dark-enough");
        Assert.Contains("never fell below 4 lx (darkest at 01:00:00) against the circuit's switching level of 2 lx", f.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(r.Findings, f => f.Code == "missed-night");
    }
}
