using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky;

public sealed class LightProfileTests
{
    private static LightScenario Parse(string json)
    {
        LightScenario? s = ScenarioLoader.Parse(json, "inline.json", SkyTestFiles.Scenario(""), out var errors);
        Assert.True(s is not null, string.Join("\n", errors));
        return s!;
    }

    private const string Garden = """
        { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-11-20", "seed": 42,
          "sensor": { "exposure": 0.3 },
          "events": [
            { "kind": "headlights", "times": ["21:40", "01:10"], "peakLux": 40, "seconds": 4, "riseSeconds": 0.5 },
            { "kind": "headlights", "perHour": 3, "from": "18:00", "to": "23:00", "peakLux": 30 },
            { "kind": "lightning", "storms": [{ "from": "22:00", "minutes": 20, "flashesPerMinute": 2 }], "peakLux": 500 },
            { "kind": "steady-light", "on": "19:00", "off": "23:30", "lux": 2.5 },
            { "kind": "lamp-coupling", "part": "K1", "lux": 12 },
            { "kind": "noise", "node": "trig", "perHour": 1, "from": "20:00", "to": "06:00", "amplitude": "5V", "width": "2u" } ] }
        """;

    [Fact]
    public void FullSyntheticNight_SensorFollowsTheSky()
    {
        // A plain clear night: sensor lux = exposure × (USNO model + 0.0005 lx floor) (USNO Circular No. 171).
        LightScenario s = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-11-20", "sensor": { "exposure": 0.3 } }""");
        LightProfile p = s.CreateProfile();
        int ch = p.ChannelIndex("sensor");
        Assert.Equal(0, ch);
        Assert.Equal(-1, p.ChannelIndex("nope"));
        Assert.Equal(new DateTimeOffset(2026, 11, 20, 12, 0, 0, TimeSpan.FromHours(1)), p.Origin);
        Assert.Equal(24 * 3600.0, p.Duration, 6);
        SolarEvents night = Assert.Single(p.SolarEvents);
        double sunset = (night.Sunset!.Value - p.Origin).TotalSeconds;
        double civilDusk = (night.CivilDusk!.Value - p.Origin).TotalSeconds;
        double sunrise = (night.Sunrise!.Value - p.Origin).TotalSeconds;
        Assert.True(p.Lux(ch, 0) > 1000 * 0.3);                       // winter noon at 52 N: ≈ 15° elevation, > 10 klx open sky
        Assert.InRange(p.Lux(ch, civilDusk), 2.0 * 0.3, 3.5 * 0.3);   // AMS Glossary: end of civil twilight 2–3.5 lx
        Assert.Equal(0.0005 * 0.3, p.Lux(ch, 12 * 3600), 9);          // midnight: only the model's night floor
        Assert.True(p.Lux(ch, sunset - 600) > p.Lux(ch, sunset + 600));
        Assert.True(p.Lux(ch, sunrise + 600) > p.Lux(ch, sunrise - 600));
        // The sky is continuous: without light events there is no breakpoint near sunset.
        Assert.True(double.IsPositiveInfinity(p.NextBreakpoint(sunset - 120)));
        Assert.True(double.IsPositiveInfinity(p.NextBreakpoint(p.Duration + 10)));
    }

    [Fact]
    public void SunGrid_MatchesDirectEvaluation()
    {
        LightScenario s = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-11-20" }""");
        LightProfile p = s.CreateProfile();
        double jd0 = SunPosition.JulianDay(p.Origin);
        for (double t = 17; t < p.Duration; t += 3607.3)
        {
            double direct = SunPosition.Elevation(jd0 + t / 86400.0, 52.1, 8.6);
            Assert.InRange(p.SunElevation(t), direct - 1e-4, direct + 1e-4);
        }
    }

    [Fact]
    public void SameSeed_SameEventList_DifferentSeed_Different()
    {
        LightProfile a = Parse(Garden).CreateProfile();
        LightProfile b = Parse(Garden).CreateProfile();
        Assert.Equal(a.ScheduledEvents, b.ScheduledEvents);
        Assert.Equal(a.Breakpoints, b.Breakpoints);
        LightProfile c = Parse(Garden.Replace("\"seed\": 42", "\"seed\": 43", StringComparison.Ordinal)).CreateProfile();
        Assert.NotEqual(a.ScheduledEvents.Select(e => e.StartSeconds), c.ScheduledEvents.Select(e => e.StartSeconds));
    }

    [Fact]
    public void AddingAnotherKind_DoesNotShiftHeadlightDraws()
    {
        LightProfile a = Parse(Garden).CreateProfile();
        const string extra = """ { "kind": "lightning", "storms": [{ "from": "19:00", "minutes": 30, "flashesPerMinute": 3 }], "peakLux": 50 },""";
        string more = Garden.Replace("\"events\": [", "\"events\": [" + extra, StringComparison.Ordinal);
        LightProfile b = Parse(more).CreateProfile();
        double[] Heads(LightProfile p) => [.. p.ScheduledEvents.Where(e => e.Kind == "headlights").Select(e => e.StartSeconds)];
        Assert.Equal(Heads(a), Heads(b));
        double[] Noise(LightProfile p) => [.. p.NoiseInjections.Select(e => e.Time)];
        Assert.Equal(Noise(a), Noise(b));
        Assert.True(b.ScheduledEvents.Count(e => e.Kind == "lightning") > a.ScheduledEvents.Count(e => e.Kind == "lightning"));
    }

    [Fact]
    public void Headlights_ExplicitTimes_TrapezoidOnTopOfNight()
    {
        LightProfile p = Parse(Garden).CreateProfile();
        // 21:40 local on 2026-11-20 (UTC+1) is 9 h 40 min after noon.
        double t = (9 * 60 + 40) * 60.0;
        HeadlightPass h = Assert.IsType<HeadlightPass>(p.LightEvents.First(e => e.Kind == "headlights" && Math.Abs(e.Start - t) < 1e-6));
        Assert.Equal(t + 4, h.End, 9);
        double dark = p.Lux(0, t - 1);
        Assert.Equal(dark + 20, p.Lux(0, t + 0.25), 6); // half-way up the 0.5 s rise
        Assert.Equal(dark + 40, p.Lux(0, t + 2), 6);
        Assert.Equal(t, p.NextBreakpoint(t - 0.001), 9);
        Assert.Equal(t + 0.5, p.NextBreakpoint(t), 9);
        // 01:10 belongs to the next morning: 13 h 10 min after noon.
        Assert.Contains(p.LightEvents, e => e.Kind == "headlights" && Math.Abs(e.Start - (13 * 60 + 10) * 60.0) < 1e-6);
    }

    [Fact]
    public void Lightning_StrokesHaveBreakpointsAtStartAndPeak()
    {
        LightProfile p = Parse(Garden).CreateProfile();
        var flashes = p.LightEvents.OfType<LightningFlash>().ToList();
        Assert.NotEmpty(flashes);
        foreach (LightningFlash f in flashes)
        {
            Assert.InRange(f.Strokes.Count, 3, 5); // 3–5 strokes typical: CIGRE Technical Brochure 549 (2013)
            foreach (LightningStroke s in f.Strokes)
            {
                Assert.Equal(s.Start, p.NextBreakpoint(s.Start - 1e-7), 9);
                Assert.Equal(s.Start + LightningFlash.DefaultRiseSeconds, p.NextBreakpoint(s.Start + 1e-7), 9);
                double peak = p.Lux(0, s.Start + LightningFlash.DefaultRiseSeconds) - p.Lux(0, s.Start - 1e-3);
                Assert.InRange(peak, 0.3 * 500 - 1e-6, 500 + 1e-6);
                // After one decay constant the stroke has fallen to 1/e.
                double later = p.Lux(0, s.Start + LightningFlash.DefaultRiseSeconds + LightningFlash.DefaultDecaySeconds) - p.Lux(0, s.Start - 1e-3);
                Assert.InRange(later / peak, Math.Exp(-1) - 1e-3, Math.Exp(-1) + 1e-3);
            }
        }
    }

    [Fact]
    public void SteadyLight_StepOnAndOff()
    {
        LightProfile p = Parse(Garden).CreateProfile();
        double on = 7 * 3600.0, off = (11 * 60 + 30) * 60.0; // 19:00 and 23:30 after noon
        Assert.Equal(on, p.NextBreakpoint(on - 1e-3), 9);
        Assert.Equal(off, p.NextBreakpoint(off - 1e-3), 9);
        // Away from other events: 2.5 lx more inside than just outside.
        double inside = p.Lux(0, off - 1e-3), outside = p.Lux(0, off + 1e-3);
        var busy = p.LightEvents.Where(e => e.Kind != "steady-light" && e.Start <= off + 1 && e.End >= off - 1);
        if (!busy.Any()) Assert.Equal(2.5, inside - outside, 6);
    }

    [Fact]
    public void LampCouplingAndNoise_ExposedForTheCircuitRun()
    {
        LightProfile p = Parse(Garden).CreateProfile();
        LampCoupling lamp = Assert.Single(p.LampCouplings);
        Assert.Equal(("K1", 12.0, "sensor"), (lamp.Part, lamp.Lux, lamp.Channel));
        Assert.All(p.NoiseInjections, n =>
        {
            Assert.Equal("trig", n.Node);
            Assert.InRange(n.Time, 8 * 3600.0, 18 * 3600.0);
            Assert.Equal(5.0, n.Amplitude);
            Assert.Equal(p.Origin.AddSeconds(n.Time).UtcDateTime, n.Instant.UtcDateTime, TimeSpan.FromMilliseconds(1));
        });
        Assert.Equal(p.NoiseInjections.Count, p.ScheduledEvents.Count(e => e.Kind == "noise"));
    }

    [Fact]
    public void SpringForwardNight_23Hours_ClockTimesAfterTheChange()
    {
        // EU rule: 2026-03-29 02:00 CET → 03:00 CEST. 05:00 CEST is 16 h after noon (CET), not 17 h.
        LightScenario s = Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-03-28",
              "events": [ { "kind": "headlights", "times": ["05:00", "02:30"], "peakLux": 10 } ] }
            """);
        LightProfile p = s.CreateProfile();
        Assert.Equal(23 * 3600.0, p.Duration, 6);
        var starts = p.LightEvents.Select(e => e.Start).ToArray();
        Assert.Contains(16 * 3600.0, starts);
        // 02:30 does not exist that night; it is moved forward by the gap to 03:30 CEST = 01:30 UTC = 14.5 h after noon.
        Assert.Contains(14.5 * 3600.0, starts);
        Assert.Equal(TimeSpan.FromHours(2), p.Timeline.Instant(16 * 3600.0).Offset);
    }

    [Fact]
    public void FallBackNight_25Hours()
    {
        LightScenario s = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-10-24", "nights": 2 }""");
        LightProfile p = s.CreateProfile();
        Assert.Equal((25 + 24) * 3600.0, p.Duration, 6);
        Assert.Equal(2, p.SolarEvents.Count);
    }

    [Fact]
    public void RecordedLog_ReplacesSkyInsideItsSpan()
    {
        LightScenario? s = ScenarioLoader.Load(SkyTestFiles.Scenario("good-log.scenario.json"), out var errors);
        Assert.True(s is not null, string.Join("\n", errors));
        Assert.Single(s!.Warnings); // the 15:20–15:40 gap
        LightProfile p = s.CreateProfile();
        // 15:10 UTC = 16:10 CET = 4 h 10 min after noon; value 200 − 3·10 = 170 lx open sky × exposure 0.5.
        double t = (4 * 60 + 10) * 60.0;
        Assert.Equal(85.0, p.Lux(0, t), 9);
        Assert.Equal(0.5 * (200 - 3 * 10.5), p.Lux(0, t + 30), 9); // linear between samples
        Assert.Equal(t, p.NextBreakpoint(t - 1), 9);
        // Outside the log: synthetic sky again.
        Assert.Equal(0.5 * p.SkyLux(12 * 3600), p.Lux(0, 12 * 3600), 12);
    }

    [Fact]
    public void OvercastAndClouds_ScaleTheSky()
    {
        LightScenario clear = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-06-01" }""");
        LightScenario dark = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-06-01", "weather": { "sky": "overcast", "floorLux": 0.3 } }""");
        LightProfile a = clear.CreateProfile(), b = dark.CreateProfile();
        // USNO Circular 171: dark stratus divides by 10; the light floor adds at the sensor.
        Assert.Equal(a.Lux(0, 3600) / 10 + 0.3, b.Lux(0, 3600), 6);
        LightScenario cloudy = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-06-01", "seed": 5, "weather": { "clouds": { "perHour": 2, "depth": 0.8, "minutes": 10 } } }""");
        LightProfile c = cloudy.CreateProfile();
        CloudPass cloud = Assert.IsType<CloudPass>(c.LightEvents.First(e => e.Kind == "clouds"));
        double mid = 0.5 * (cloud.Start + cloud.End);
        Assert.True(c.Lux(0, mid) < a.Lux(0, mid));
        Assert.InRange(c.Lux(0, mid) / a.Lux(0, mid), 1 - 0.8, 1 - 0.8 * 0.5 + 1e-9);
    }

    [Fact]
    public void Lux_DoesNotAllocate()
    {
        LightProfile p = Parse(Garden).CreateProfile();
        double sum = p.Lux(0, 1.0) + p.NextBreakpoint(1.0);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 10_000; i++)
        {
            double t = i * 8.64;
            sum += p.Lux(0, t) + p.NextBreakpoint(t);
        }
        long after = GC.GetAllocatedBytesForCurrentThread();
        Assert.True(sum > 0);
        Assert.Equal(0, after - before);
    }

    [Fact]
    public void SkyInterpolation_MatchesModel_AndKeepsTheStep()
    {
        LightScenario s = Parse("""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-11-20" }""");
        LightProfile p = s.CreateProfile();
        for (double t = 3.3; t < p.Duration; t += 97.1)
        {
            double exact = IlluminanceModel.SkyLux(p.SunElevation(t));
            Assert.InRange(p.SkyLux(t), exact * (1 - 1e-3), exact * (1 + 1e-3));
        }
        // Around sunset (the joint of the USNO Circular No. 171 model's two branches at −5/6°) the profile follows the
        // joined model closely at every second: no step, no interpolation error from the curved joint.
        double sunset = (p.SolarEvents[0].Sunset!.Value - p.Origin).TotalSeconds;
        for (double t = sunset - 300; t < sunset + 300; t += 1.0)
        {
            double exact = IlluminanceModel.SkyLux(p.SunElevation(t));
            Assert.InRange(p.SkyLux(t), exact * (1 - 1e-3), exact * (1 + 1e-3));
            Assert.InRange(p.SkyLux(t + 1.0) / p.SkyLux(t), 0.99, 1.0);
        }
    }
}
