using NightSim.Devices;
using NightSim.Devices.Light;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Devices;

public sealed class PhotoresistorTests
{
    private static Photoresistor Make(double rise = 0, double decay = 0, double? lux = null, IReadOnlyList<(double, double)>? pwl = null, double gain = 1.0) =>
        new("LDR1", "LDR1", "a", "gnd", 15e3, 0.7, 1e13, rise, decay, new LightInput("sensor", gain, lux, pwl));

    // CdS law R(E) = R10·(E/10 lx)^(−γ), R10 15 kΩ, γ 0.7 (textbook photoconductor power law, common practice;
    // values computed from that formula, 1e-4 relative):
    // 1 lx 75.18 kΩ, 10 lx 15 kΩ, 100 lx 2.993 kΩ, 1000 lx 597 Ω.
    [Theory]
    [InlineData(1.0, 75.18e3)]
    [InlineData(10.0, 15e3)]
    [InlineData(100.0, 2.993e3)]
    [InlineData(1000.0, 597.0)]
    public void Resistance_Follows_The_Power_Law(double lux, double expected)
    {
        var h = new StampHarness("a");
        Photoresistor ldr = Make(lux: lux);
        ldr.Setup(h);
        ldr.PowerUp();
        LoadContext ctx = h.Load(ldr, [1.0]);
        double r = 1.0 / ctx.J[0];
        Assert.Equal(expected, r, expected * (expected == 597.0 ? 1e-3 : 1e-4));
        Assert.Equal(ctx.J[0], h.At(ctx.G, 0, 0), 15);
    }

    [Fact]
    public void Dark_Resistance_Is_In_Parallel()
    {
        var ldr = new Photoresistor("LDR1", "LDR1", "a", "gnd", 15e3, 0.7, 1e6, 0, 0, new LightInput("sensor", 1, 0.0, null));
        Assert.Equal(1e6, ldr.SteadyResistance(0.0), 1e-6);
        Assert.Equal(1.0 / (1.0 / 75.18e3 + 1e-6), ldr.SteadyResistance(1.0), 10.0);
    }

    [Fact]
    public void Gain_Scales_The_Channel_And_Pwl_Corners_Are_Breakpoints()
    {
        var h = new StampHarness("a");
        Photoresistor ldr = Make(pwl: [(0, 100), (10, 1), (20, 1)], gain: 0.1);
        ldr.Setup(h);
        ldr.PowerUp();
        Assert.Equal(1.0 / 15e3, h.Load(ldr, [1.0], 0.0).J[0], 12);              // 100 lx × 0.1 = 10 lx
        Assert.Equal(10.0, ldr.NextBreakpoint(0.0));
        Assert.Equal(20.0, ldr.NextBreakpoint(10.0));
        Assert.Equal(double.PositiveInfinity, ldr.NextBreakpoint(20.0));
    }

    // First-order lag on conductance (common practice): after a step
    // from 100 lx to 1 lx the conductance decays as G∞ + (G0 − G∞)·e^(−t/τ_decay), the same whatever the accepted steps.
    [Fact]
    public void Conductance_Lags_With_Decay_Time_Independently_Of_Steps()
    {
        double g0 = 1.0 / Photoresistor.LawResistance(100, 15e3, 0.7), g1 = 1.0 / Photoresistor.LawResistance(1, 15e3, 0.7);
        foreach (int steps in new[] { 1, 7, 50 })
        {
            var h = new StampHarness("a");
            Photoresistor ldr = Make(rise: 0.04, decay: 1.0, pwl: [(0, 100), (1, 100), (1 + 1e-9, 1)]);
            ldr.Setup(h);
            ldr.PowerUp();
            var ctx = new LoadContext(1, h.SlotCount) { Time = 1.0 };
            ldr.Accept(ctx);
            for (int k = 1; k <= steps; k++)
            {
                ctx.Time = 1.0 + 2.0 * k / steps;
                ldr.Accept(ctx);
            }
            double expected = g1 + (g0 - g1) * Math.Exp(-2.0 / 1.0);
            Assert.Equal(expected, ldr.Conductance(ctx), expected * 1e-6);
        }
    }

    [Fact]
    public void Rise_Is_Faster_Than_Decay()
    {
        var h = new StampHarness("a");
        Photoresistor ldr = Make(rise: 0.04, decay: 1.0, pwl: [(0, 1), (1, 1), (1 + 1e-9, 100)]);
        ldr.Setup(h);
        ldr.PowerUp();
        var ctx = new LoadContext(1, h.SlotCount) { Time = 1.0 };
        ldr.Accept(ctx);
        ctx.Time = 1.04;
        double g0 = 1.0 / Photoresistor.LawResistance(1, 15e3, 0.7), g1 = 1.0 / Photoresistor.LawResistance(100, 15e3, 0.7);
        Assert.Equal(g1 + (g0 - g1) * Math.Exp(-1.0), ldr.Conductance(ctx), g1 * 1e-6);
    }

    // Divider crossing (divider rule and the power law solved for E, by hand): LDR (R10 15 kΩ, γ 0.7) on top, 10 kΩ below, 12 V; the bottom node falls
    // through 4 V when R = 20 kΩ, i.e. at E* = 10·(15k/(10k·(12/4 − 1)))^(1/0.7) = 6.630 lx. With E = 100·e^(−t/300 s)
    // that happens at t* = 300·ln(100/6.630) = 814.1 s; a comparator at 4 V marks it.
    [Fact]
    public void Divider_Crosses_At_The_Predicted_Lux()
    {
        var pwl = new List<(double, double)>();
        for (int k = 0; k <= 200; k++) pwl.Add((k * 10.0, 100.0 * Math.Exp(-k * 10.0 / 300.0)));
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            BlockBench.Dc("VTH", "th", 4.0),
            new Photoresistor("LDR1", "LDR1", "v", "s", 15e3, 0.7, 1e13, 0, 0, new LightInput("sensor", 1, null, pwl)),
            new Resistor("RB", "RB", "s", "gnd", 10e3),
            new Comparator("X1", "X1", "th", "s", "dark", "v", "gnd", new ComparatorSettings(Hysteresis: 1e-6)),
        ], 1500.0);
        double t = Assert.Single(BlockBench.Times(r, "X1", "output", "high"));
        // At the hand-computed E* the device's law gives the 20 kΩ that puts the divider on 4 V.
        Assert.Equal(20e3, Photoresistor.LawResistance(6.630, 15e3, 0.7), 20e3 * 1e-3);
        // The piecewise-linear light between 10 s samples is slightly above the exponential (chord): allow 0.2 s.
        Assert.Equal(814.1, t, 0.2);
    }
}
