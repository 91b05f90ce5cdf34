using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class LightningFlashTests
{
    [Fact]
    public void Strokes_RiseLinearly_DecayExponentially_AndAdd()
    {
        // Strokes ≈ 60 ms apart (CIGRE Technical Brochure 549, Lightning parameters for engineering applications, 2013);
        // 20 µs rise and 300 µs decay of a stroke's light from memory. Expected values: linear rise and e^(−t/τ) by hand.
        var f = new LightningFlash([new LightningStroke(10.0, 500), new LightningStroke(10.060, 200)], "sensor");
        Assert.Equal(250, f.Value(10.0 + 10e-6), 6);
        Assert.Equal(500, f.Value(10.0 + 20e-6), 6);
        Assert.Equal(500 * Math.Exp(-1), f.Value(10.0 + 20e-6 + 300e-6), 6);
        Assert.Equal(0, f.Value(10.030));
        Assert.Equal(200, f.Value(10.060 + 20e-6), 6);
        Assert.Equal(500, f.PeakLux);
        Assert.Equal(10.0, f.Start);
        var bp = new List<double>();
        f.AddBreakpoints(bp);
        Assert.Contains(10.0, bp);
        Assert.Contains(10.0 + 20e-6, bp);
        Assert.Contains(10.060, bp);
    }
}
