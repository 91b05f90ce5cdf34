using NightSim.Devices;

namespace NightSim.Tests.Devices;

public class NoiseInjectorTests
{
    private static NoiseInjector Make(bool asCurrent) =>
        new("noise1", "trig", [1.0, 2.0], [1e-6, 2e-6], [-5.0, 3.0], asCurrent);

    [Fact]
    public void TrapezoidPulseValues()
    {
        NoiseInjector n = Make(false);
        Assert.Equal(0.0, n.Value(0.5));
        Assert.Equal(-2.5, n.Value(1.0 + 0.05e-6), 1e-6); // half-way up the 10 % edge (t − start loses digits near t = 1 s)
        Assert.Equal(-5.0, n.Value(1.0 + 0.5e-6), 12);
        Assert.Equal(0.0, n.Value(1.0 + 1.5e-6));
        Assert.Equal(3.0, n.Value(2.0 + 1e-6), 12);
    }

    [Fact]
    public void BreakpointsLandOnEveryCorner()
    {
        NoiseInjector n = Make(false);
        var corners = new List<double>();
        double t = 0;
        while ((t = n.NextBreakpoint(t)) < double.PositiveInfinity) corners.Add(t);
        Assert.Equal(8, corners.Count);
        Assert.Equal(1.0, corners[0]);
        Assert.Equal(1.0 + 0.1e-6, corners[1], 15);
        Assert.Equal(2.0 + 2e-6, corners[^1], 15);
    }

    // Capacitive coupling: Q = C_c·(v_src − v_node); the source branch enforces v_src = pulse (circuit theory).
    [Fact]
    public void VoltageModeStampsMatchFiniteDifferences()
    {
        var h = new StampHarness("trig");
        NoiseInjector n = Make(false);
        n.Setup(h);
        double[] x = [7.0, 1.0, 1e-3];
        h.AssertJacobians(n, x, 1.0 + 0.5e-6);
        LoadContext ctx = h.Load(n, x, 1.0 + 0.5e-6);
        Assert.Equal(1.0 - (-5.0), ctx.J[2], 12);                 // v_src − V(t)
        Assert.Equal(NoiseInjector.DefaultCoupling * (1.0 - 7.0), ctx.Q[1], 1e-22);
    }

    [Fact]
    public void CurrentModeInjectsIntoTheNode()
    {
        var h = new StampHarness("trig");
        NoiseInjector n = Make(true);
        n.Setup(h);
        LoadContext ctx = h.Load(n, [0.0], 2.0 + 1e-6);
        Assert.Equal(-3.0, ctx.J[0], 12); // 3 A into the node = −3 A leaving it
    }
}
