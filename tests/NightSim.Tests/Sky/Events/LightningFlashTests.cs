using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class LightningFlashTests
{
    [Fact]
    public void Strokes_RiseLinearly_DecayExponentially_AndAdd()
    {
        // check-values §5 (CIGRE TB 549, Krider & Guo 1983): strokes ≈ 60 ms apart, 20 µs rise, 300 µs decay.
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
