using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class NoiseInjectionTests
{
    [Fact]
    public void ExplicitAndSeededPulses_WithBreakpoints()
    {
        // IEC 61000-4-5 surge scale: a 1.2/50 µs class pulse, modelled here as 50 µs wide.
        LightScenario s = ScenarioLoader.Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-01", "seed": 3,
              "events": [ { "kind": "noise", "node": "trig", "times": ["22:15:03"], "amplitude": "5V", "width": "50u" },
                          { "kind": "noise", "node": "vcc", "perHour": 6, "from": "20:00", "to": "04:00", "amplitude": "10m", "width": "1m", "as": "current" } ] }
            """, "inline.json", null, out var errors)!;
        Assert.Empty(errors);
        LightProfile p = s.CreateProfile();
        NoiseInjection first = p.NoiseInjections.Single(n => n.Node == "trig");
        Assert.Equal((10 * 3600 + 15 * 60 + 3), first.Time, 6);
        Assert.Equal(NoiseQuantity.Voltage, first.Quantity);
        Assert.Equal(first.Time, p.NextBreakpoint(first.Time - 1e-6), 9);
        Assert.Equal(first.Time + 50e-6, p.NextBreakpoint(first.Time), 9);
        var seeded = p.NoiseInjections.Where(n => n.Node == "vcc").ToList();
        Assert.NotEmpty(seeded);
        Assert.All(seeded, n => Assert.InRange(n.Time, 8 * 3600.0, 16 * 3600.0));
        Assert.All(seeded, n => Assert.Equal(0.01, n.Amplitude, 12));
    }
}
