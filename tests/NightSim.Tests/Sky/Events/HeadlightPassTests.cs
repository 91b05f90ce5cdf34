using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class HeadlightPassTests
{
    [Fact]
    public void Trapezoid_RiseHoldFall()
    {
        // Duration 3.3 s: a car at 30 km/h passing 10 m from the sensor with a beam 20° off its axis lights it for
        // t = y/(v·tan θ) = 10 m/(8.33 m/s · tan 20°) = 3.30 s (plane geometry, computed by hand). Peak 40 lx, rise 0.5 s and
        // fall 0.8 s are chosen inputs; the expected values are the trapezoid's linear interpolation, computed by hand.
        var h = new HeadlightPass(100, 3.3, 0.5, 0.8, 40, "sensor");
        Assert.Equal(0, h.Value(100));
        Assert.Equal(20, h.Value(100.25), 9);
        Assert.Equal(40, h.Value(101));
        Assert.Equal(20, h.Value(103.3 - 0.4), 9);
        Assert.Equal(0, h.Value(103.3));
        var bp = new List<double>();
        h.AddBreakpoints(bp);
        Assert.Equal(new[] { 100, 100.5, 103.3 - 0.8, 103.3 }, bp.ToArray(), new ToleranceComparer(1e-9));
        Assert.Throws<ArgumentException>(() => new HeadlightPass(0, 1, 0.6, 0.6, 1, "sensor"));
    }

    [Fact]
    public void SeededRate_MeanCountOverManyNights()
    {
        // Poisson arrivals: 3 per hour for 5 h → mean 15 per night; 200 nights → mean within ±0.8 (≈ 3σ of 0.27).
        LightScenario s = ScenarioLoader.Parse("""
            { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-01", "nights": 200, "seed": 9,
              "events": [ { "kind": "headlights", "perHour": 3, "from": "18:00", "to": "23:00", "peakLux": 5 } ] }
            """, "inline.json", null, out _)!;
        LightProfile p = s.CreateProfile();
        var passes = p.LightEvents.OfType<HeadlightPass>().ToList();
        Assert.InRange(passes.Count / 200.0, 15 - 0.8, 15 + 0.8);
        Assert.All(passes, e =>
        {
            double clock = ((e.Start % 86400) + 86400) % 86400 / 3600.0 + 12; // hours after midnight, origin is noon (UTC)
            Assert.InRange(clock % 24, 18, 23);
        });
    }

    private sealed class ToleranceComparer(double tol) : IEqualityComparer<double>
    {
        public bool Equals(double x, double y) => Math.Abs(x - y) <= tol;
        public int GetHashCode(double obj) => 0;
    }
}
