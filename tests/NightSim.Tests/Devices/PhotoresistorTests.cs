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
            ctx.Time = 1.0 + 1e-9; // the solver lands on the light's corner
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
        ctx.Time = 1.0 + 1e-9;
        ldr.Accept(ctx);
        ctx.Time = 1.04 + 1e-9;
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

    // First-order lag y' = (u − y)/τ driven by a linear ramp u = u0 + m·t from steady state y(0) = u0: closed form
    // y(t) = u(t) − m·τ·(1 − e^(−t/τ)) (linear ODE with constant coefficients, common practice). With γ = 1 the target
    // conductance is linear in lux, so a lux ramp is a conductance ramp, and the lag must match the closed form whatever
    // the accepted steps: 1 ms to 600 s.
    [Theory]
    [InlineData(1e-3)]
    [InlineData(0.1)]
    [InlineData(7.0)]
    [InlineData(60.0)]
    [InlineData(600.0)]
    public void Lag_Matches_The_Ramp_Closed_Form_At_Any_Step(double step)
    {
        const double r10 = 15e3, tau = 20.0;
        int n = (int)Math.Round(1200.0 / step);
        double stop = n * step;
        foreach (bool falling in new[] { true, false })
        {
            IReadOnlyList<(double, double)> pwl = falling ? [(0, 100), (2000, 0)] : [(0, 0), (2000, 100)];
            var h = new StampHarness("a");
            var ldr = new Photoresistor("LDR1", "LDR1", "a", "gnd", r10, 1.0, 1e13, falling ? 1e-3 : tau, falling ? tau : 1e-3,
                new LightInput("sensor", 1.0, null, pwl));
            ldr.Setup(h);
            ldr.PowerUp();
            var ctx = new LoadContext(1, h.SlotCount) { Time = 0.0 };
            ldr.Accept(ctx);
            for (int k = 1; k <= n; k++)
            {
                ctx.Time = k * step;
                ldr.Accept(ctx);
            }
            double u0 = (falling ? 100.0 : 0.0) / 10.0 / r10 + 1e-13;
            double m = (falling ? -100.0 : 100.0) / 2000.0 / 10.0 / r10;
            double expected = u0 + m * stop - m * tau * (1.0 - Math.Exp(-stop / tau));
            Assert.Equal(expected, ldr.Conductance(ctx), Math.Abs(expected) * 1e-9);
            // Between accepted points (inside a step, as Newton sees it) the same closed form holds.
            ctx.Time = stop + 0.37 * step;
            double t = ctx.Time;
            double inside = u0 + m * t - m * tau * (1.0 - Math.Exp(-t / tau));
            Assert.Equal(inside, ldr.Conductance(ctx), Math.Abs(inside) * 1e-9);
        }
    }

    // Light-level-dependent speed τ(E) = τ10·(10 lx/E)^k (from memory; power law common practice). After a step to a
    // constant 1 lx the decay runs with τ = τ10·10^k: k = 1, τ10 = 1 s → 10 s; k = 0 keeps 1 s.
    [Theory]
    [InlineData(0.0, 1.0)]
    [InlineData(1.0, 10.0)]
    [InlineData(0.5, 3.16227766)]
    public void Decay_Slows_Down_In_Dim_Light(double exponent, double tauAtOneLux)
    {
        var h = new StampHarness("a");
        var ldr = new Photoresistor("LDR1", "LDR1", "a", "gnd", 15e3, 0.7, 1e13, 0.04, 1.0,
            new LightInput("sensor", 1.0, null, [(0, 100), (1, 100), (1 + 1e-9, 1)]), exponent);
        ldr.Setup(h);
        ldr.PowerUp();
        var ctx = new LoadContext(1, h.SlotCount) { Time = 1.0 };
        ldr.Accept(ctx);
        ctx.Time = 1.0 + 1e-9;
        ldr.Accept(ctx);
        for (int k = 1; k <= 13; k++)
        {
            ctx.Time = 1.0 + 1e-9 + 5.0 * k / 13;
            ldr.Accept(ctx);
        }
        double g0 = 1.0 / Photoresistor.LawResistance(100, 15e3, 0.7), g1 = 1.0 / Photoresistor.LawResistance(1, 15e3, 0.7);
        double expected = g1 + (g0 - g1) * Math.Exp(-5.0 / tauAtOneLux);
        Assert.Equal(expected, ldr.Conductance(ctx), expected * 1e-6);
        Assert.Equal(tauAtOneLux, Photoresistor.TimeConstant(1.0, 1.0, exponent), 1e-6);
    }

    // The divider of Divider_Crosses_At_The_Predicted_Lux under a falling lux ramp with a 20 s decay lag: the crossing
    // time must not depend on how small the solver's steps are. Reference: the lag ODE integrated by classical
    // Runge–Kutta at 10 ms (own integration of the documented law), crossing where the conductance reaches 1/20 kΩ.
    [Fact]
    public void Lagged_Divider_Crossing_Does_Not_Depend_On_The_Step()
    {
        const double tau = 20.0, r10 = 15e3, gamma = 0.7;
        static double Lux(double t) => Math.Max(0.0, 20.0 - 0.01 * t);
        double Target(double t) => Math.Pow(Lux(t) / 10.0, gamma) / r10 + 1e-13;
        double g = Target(0), tRef = double.NaN;
        const double dt = 0.01;
        for (double t = 0; t < 1900; t += dt)
        {
            double k1 = (Target(t) - g) / tau, k2 = (Target(t + dt / 2) - (g + dt / 2 * k1)) / tau;
            double k3 = (Target(t + dt / 2) - (g + dt / 2 * k2)) / tau, k4 = (Target(t + dt) - (g + dt * k3)) / tau;
            double next = g + dt / 6 * (k1 + 2 * k2 + 2 * k3 + k4);
            if (next < 1.0 / 20e3 && g >= 1.0 / 20e3) { tRef = t + dt * (g - 1.0 / 20e3) / (g - next); break; }
            g = next;
        }
        Assert.False(double.IsNaN(tRef));
        Assert.True(tRef > 1337.0 + 10.0); // the lag delays the crossing well beyond the no-lag 1337 s

        foreach (double maxStep in new[] { 60.0, 0.5 })
        {
            SimulationResult r = BlockBench.Run(
            [
                BlockBench.Dc("VCC", "v", 12.0),
                BlockBench.Dc("VTH", "th", 4.0),
                new Photoresistor("LDR1", "LDR1", "v", "s", r10, gamma, 1e13, 0.04, tau, new LightInput("sensor", 1, null, [(0, 20), (2000, 0)])),
                new Resistor("RB", "RB", "s", "gnd", 10e3),
                new Comparator("X1", "X1", "th", "s", "dark", "v", "gnd", new ComparatorSettings(Hysteresis: 1e-6)),
            ], 1900.0, TransientOptions.Default with { MaxStep = maxStep });
            double t = Assert.Single(BlockBench.Times(r, "X1", "output", "high"));
            Assert.Equal(tRef, t, 0.5);
        }
    }
}
