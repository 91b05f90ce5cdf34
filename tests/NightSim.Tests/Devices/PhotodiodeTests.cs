using NightSim.Devices;
using NightSim.Devices.Light;

namespace NightSim.Tests.Devices;

public sealed class PhotodiodeTests
{
    private static Photodiode Make(double lux) =>
        new("D1", "D1", "a", "k", 0.04e-6, 2e-9, 50e-12, 1e-12, 1.0, new LightInput("sensor", 1.0, lux, null));

    // I = responsivity·E + dark current, reverse-biased (photoconductive mode): 0.04 µA/lx (from memory, order of
    // magnitude for 7.5 mm²) × 100 lx + 2 nA dark (from memory) = 4.002 µA flowing cathode → anode; the junction adds
    // only −I_S.
    [Fact]
    public void Reverse_Biased_Current_Is_Photocurrent_Plus_Dark_Current()
    {
        var h = new StampHarness("a", "k");
        Photodiode d = Make(100.0);
        d.Setup(h);
        LoadContext ctx = h.Load(d, [0.0, 5.0]);
        Assert.Equal(4.002e-6 + 1e-12 + 1e-12 * 5.0, ctx.J[1], 1e-16);   // leaves at the cathode (+ gmin·5 V)
        Assert.Equal(-(4.002e-6 + 1e-12 + 1e-12 * 5.0), ctx.J[0], 1e-16);
        h.AssertJacobians(d, [0.0, 5.0]);
        h.AssertJacobians(d, [0.6, 0.0]);
        Assert.Equal(50e-12, h.At(ctx.C, 0, 0), 1e-20);
    }

    // Open circuit (no load): the photocurrent forward-biases the junction to V = n·V_T·ln(I_ph/I_S + 1)
    // (Shockley diode equation, Bell Syst. Tech. J. 28, 1949). The dark current is reverse leakage and adds nothing forward.
    [Fact]
    public void Open_Circuit_Voltage_Follows_The_Junction_Law()
    {
        var h = new StampHarness("a", "k");
        Photodiode d = Make(100.0);
        d.Setup(h);
        double vt = 1.380649e-23 * 300.15 / 1.602176634e-19;
        double voc = vt * Math.Log(4.0e-6 / 1e-12 + 1.0);
        LoadContext ctx = h.Load(d, [voc, 0.0]);
        Assert.Equal(0.0, ctx.J[0], 1e-11);
    }

    // A dark, open photodiode stays at 0 V: its leakage flows only under reverse bias (and is 2 nA there).
    [Fact]
    public void Dark_Current_Is_Reverse_Leakage_Only()
    {
        var h = new StampHarness("a", "k");
        Photodiode d = Make(0.0);
        d.Setup(h);
        Assert.Equal(0.0, h.Load(d, [0.0, 0.0]).J[0], 1e-15);
        Assert.Equal(-2e-9, h.Load(d, [-5.0, 0.0]).J[0], 1e-11); // 5 V reverse: dark current out of the anode node (plus I_S and gmin, pA)
        h.AssertJacobians(d, [-0.02, 0.0]);
    }

    [Fact]
    public void Stays_Finite_Far_Into_Forward_Bias()
    {
        var h = new StampHarness("a", "k");
        Photodiode d = Make(0.0);
        d.Setup(h);
        LoadContext ctx = h.Load(d, [5.0, 0.0]);
        Assert.True(double.IsFinite(ctx.J[0]) && ctx.J[0] > 0.1);
        h.AssertJacobians(d, [5.0, 0.0]);
    }
}
