using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class InductorTests
{
    [Fact]
    public void Branch_Row_Is_Voltage_Minus_Ir_With_Flux_Minus_Li()
    {
        // v = L di/dt + R i (Faraday's law with winding resistance, any circuit textbook), charge-oriented form.
        var h = new StampHarness("p", "n");
        var l = new Inductor("L1", "L1", "p", "n", 0.1, seriesResistance: 2.0);
        l.Setup(h);
        Assert.Equal(3, h.Unknowns);
        LoadContext ctx = h.Load(l, [10.0, 4.0, 0.5]);
        Assert.Equal(0.5, ctx.J[0], 15);
        Assert.Equal(-0.5, ctx.J[1], 15);
        Assert.Equal(10.0 - 4.0 - 2.0 * 0.5, ctx.J[2], 15);
        Assert.Equal(-0.1 * 0.5, ctx.Q[2], 15);
        Assert.Equal(-0.1, h.At(ctx.C, 2, 2), 15);
        Assert.Equal(1.0, h.At(ctx.G, 0, 2));
        Assert.Equal(-1.0, h.At(ctx.G, 2, 1));
        h.AssertJacobians(l, [10.0, 4.0, 0.5]);
    }
}
