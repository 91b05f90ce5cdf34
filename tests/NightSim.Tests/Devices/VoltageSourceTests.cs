using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class VoltageSourceTests
{
    [Fact]
    public void Branch_Equation_Forces_The_Scaled_Source_Voltage()
    {
        var h = new StampHarness("p");
        var v = new VoltageSource("V1", "V1", "p", "gnd", Waveform.Dc(12));
        v.Setup(h);
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { SourceScale = 0.5 };
        ctx.X[0] = 5.0;
        ctx.X[1] = -0.01;
        v.Load(ctx);
        Assert.Equal(-0.01, ctx.J[0], 15);      // branch current leaves p into the source
        Assert.Equal(5.0 - 6.0, ctx.J[1], 15);  // v_p − 0.5·12 V
        Assert.Equal(1.0, h.At(ctx.G, 0, 1));
        Assert.Equal(1.0, h.At(ctx.G, 1, 0));
        h.AssertJacobians(v, [5.0, -0.01]);
    }

    [Fact]
    public void Reports_The_Waveform_Corners_As_Breakpoints()
    {
        var v = new VoltageSource("V1", "V1", "p", "gnd", Waveform.PiecewiseLinear([(0, 0), (1e-3, 12), (2.0, 12)]));
        Assert.Equal(1e-3, v.NextBreakpoint(0));
        Assert.Equal(2.0, v.NextBreakpoint(1e-3));
        Assert.Equal(double.PositiveInfinity, v.NextBreakpoint(2.0));
    }
}
