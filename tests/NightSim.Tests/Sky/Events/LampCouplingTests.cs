using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class LampCouplingTests
{
    [Fact]
    public void ParsedAsData_NotAddedToTheSky()
    {
        LightScenario s = ScenarioLoader.Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-01",
              "channels": { "wall": { "exposure": 0.1 } },
              "events": [ { "kind": "lamp-coupling", "part": "K1", "contact": "NO", "lux": "12lx", "channel": "wall" } ] }
            """, "inline.json", null, out var errors)!;
        Assert.Empty(errors);
        LightProfile p = s.CreateProfile();
        LampCoupling lamp = Assert.Single(p.LampCouplings);
        Assert.Equal(new LampCoupling("K1", "NO", 12, "wall"), lamp);
        // The lamp is off as far as the profile knows: the wall channel sees only the sky × 0.1.
        int wall = p.ChannelIndex("wall");
        Assert.Equal(1, wall);
        Assert.Equal(0.1 * p.SkyLux(43200), p.Lux(wall, 43200), 12);
    }

    [Fact]
    public void UnknownChannel_IsAnError()
    {
        ScenarioLoader.Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-01",
              "events": [ { "kind": "lamp-coupling", "part": "K1", "lux": 12, "channel": "roof" } ] }
            """, "inline.json", null, out var errors);
        Assert.Contains(errors, e => e.Path == "$.events[0].channel" && e.Message.Contains("roof", StringComparison.Ordinal));
    }
}
