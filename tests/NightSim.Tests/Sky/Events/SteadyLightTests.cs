using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class SteadyLightTests
{
    [Fact]
    public void OnOffAcrossMidnight_EveryNight()
    {
        // 800 lm isotropic at 5 m: E = Φ/(4πd²) = 800/(4π·25) ≈ 2.5 lx (inverse-square law, computed by hand).
        LightScenario s = ScenarioLoader.Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-01", "nights": 3,
              "events": [ { "kind": "steady-light", "on": "19:00", "off": "06:30", "lux": 2.5 } ] }
            """, "inline.json", null, out _)!;
        var lights = s.CreateProfile().LightEvents.OfType<SteadyLight>().ToList();
        Assert.Equal(3, lights.Count);
        for (int k = 0; k < 3; k++)
        {
            Assert.Equal(k * 86400 + 7 * 3600.0, lights[k].Start, 6);
            Assert.Equal(k * 86400 + 18.5 * 3600.0, lights[k].End, 6);
            Assert.Equal(2.5, lights[k].Value(lights[k].Start + 1));
            Assert.Equal(0, lights[k].Value(lights[k].End));
        }
    }

    [Fact]
    public void OffBeforeOn_IsAnError()
    {
        ScenarioLoader.Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-01",
              "events": [ { "kind": "steady-light", "on": "06:30", "off": "19:00", "lux": 2.5 } ] }
            """, "inline.json", null, out var errors);
        Assert.Contains(errors, e => e.Path == "$.events[0].off");
    }
}
