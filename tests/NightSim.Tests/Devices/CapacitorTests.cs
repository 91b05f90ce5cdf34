using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class CapacitorTests
{
    [Fact]
    public void Charge_Is_C_Times_V_With_No_Dc_Current()
    {
        // Q = C·V (definition of capacitance): 100 µF at 12 V holds 1.2 mC.
        var h = new StampHarness("p");
        var c = new Capacitor("C1", "C1", "p", "gnd", 100e-6);
        c.Setup(h);
        LoadContext ctx = h.Load(c, [12.0]);
        Assert.Equal(1.2e-3, ctx.Q[0], 12);
        Assert.Equal(0.0, ctx.J[0]);
        Assert.Equal(100e-6, h.At(ctx.C, 0, 0), 15);
        Assert.Equal(0.0, h.At(ctx.G, 0, 0));
    }

    [Fact]
    public void Esr_Adds_An_Internal_Node_Behind_The_Resistance()
    {
        var h = new StampHarness("p", "n");
        var c = new Capacitor("C1", "C1", "p", "n", 10e-6, esr: 2.0);
        c.Setup(h);
        Assert.Equal(3, h.Unknowns);
        Assert.Equal("C1.esr", h.Labels[2]);
        // p at 5 V, inner at 4 V, n at 0: ESR current (5 − 4)/2 = 0.5 A leaves p; charge 10 µF·4 V on inner.
        LoadContext ctx = h.Load(c, [5.0, 0.0, 4.0]);
        Assert.Equal(0.5, ctx.J[0], 15);
        Assert.Equal(-0.5, ctx.J[2], 15);
        Assert.Equal(40e-6, ctx.Q[2], 15);
        Assert.Equal(-40e-6, ctx.Q[1], 15);
        h.AssertJacobians(c, [5.0, 0.5, 4.0]);
    }

    [Fact]
    public void Leakage_Resistance_Is_A_Parallel_Conductance()
    {
        var h = new StampHarness("p");
        var c = new Capacitor("C1", "C1", "p", "gnd", 1e-3, leakageResistance: 1e6);
        c.Setup(h);
        LoadContext ctx = h.Load(c, [16.0]);
        Assert.Equal(16e-6, ctx.J[0], 15);
        h.AssertJacobians(c, [16.0]);
    }

    [Fact]
    public void Leakage_Current_Is_Constant_At_Working_Voltage_And_Vanishes_At_Zero()
    {
        // Electrolytic leakage limit 0.01·C·V for 1000 µF / 16 V = 160 µA (the catalogue
        // convention used with the IEC 60384-4 leakage test; common practice).
        double iLeak = 0.01 * 1000 * 16 * 1e-6;
        var h = new StampHarness("p");
        var c = new Capacitor("C1", "C1", "p", "gnd", 1000e-6, leakageCurrent: iLeak);
        c.Setup(h);
        Assert.Equal(160e-6, h.Load(c, [16.0]).J[0], 12);
        Assert.Equal(160e-6 * Math.Tanh(1.0), h.Load(c, [0.05]).J[0], 12);
        Assert.Equal(0.0, h.Load(c, [0.0]).J[0]);
        Assert.Equal(-160e-6, h.Load(c, [-16.0]).J[0], 12);
        h.AssertJacobians(c, [0.0]);
        h.AssertJacobians(c, [0.03]);
        h.AssertJacobians(c, [12.0]);
    }
}
