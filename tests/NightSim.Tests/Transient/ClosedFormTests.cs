using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>RL rise and series RLC ringing against their closed forms (circuit-theory textbooks, e.g. Nilsson &amp; Riedel, Electric
/// Circuits, chs. 7–8; docs/numerics.md §9).</summary>
public sealed class ClosedFormTests
{
    [Fact]
    public void Rl_Current_Rises_As_V_Over_R_Times_One_Minus_Exp()
    {
        // i = (V/R)(1 − e^(−Rt/L)); V 1 V, R 10 Ω, L 10 mH → τ = 1 ms.
        const double V = 1, R = 10, L = 10e-3, Tau = L / R;
        var circuit = Circuit.FromDevices("rl",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Dc(V)),
            new Resistor("R1", "R1", "in", "a", R),
            new Inductor("L1", "L1", "a", "gnd", L),
        ]);
        var result = TransientSolver.Run(circuit, 8 * Tau, TransientOptions.Default with { SupplyRamp = 0, RecordNodes = ["L1.i"] });
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var i = result.Trace("L1.i")!;
        Assert.Equal("A", i.Unit);
        double worst = 0;
        for (int k = 0; k < i.Times.Count; k++)
            worst = Math.Max(worst, Math.Abs(i.Values[k] - V / R * (1 - Math.Exp(-i.Times[k] / Tau))) / (V / R));
        Assert.True(worst <= 1e-4, $"max relative error {worst:E3}");
    }

    private static Circuit RlcDischarge(double v0, out double alpha, out double omegaD)
    {
        // Series RLC discharge: C charged to v0, then C → L → R → ground. v_C = v0·e^(−αt)(cos ω_d t + (α/ω_d) sin ω_d t),
        // α = R/2L, ω_d = √(1/LC − α²) (underdamped).
        const double R = 10, L = 10e-3, C = 1e-6;
        alpha = R / (2 * L);
        omegaD = Math.Sqrt(1 / (L * C) - alpha * alpha);
        return Circuit.FromDevices("rlc",
        [
            new Capacitor("C1", "C1", "a", "gnd", C, initialVoltage: v0),
            new Inductor("L1", "L1", "a", "b", L),
            new Resistor("R1", "R1", "b", "gnd", R),
        ]);
    }

    private static double RlcExact(double v0, double alpha, double wd, double t) =>
        v0 * Math.Exp(-alpha * t) * (Math.Cos(wd * t) + alpha / wd * Math.Sin(wd * t));

    [Fact]
    public void Series_Rlc_Rings_At_The_Damped_Frequency_And_Decays_At_Alpha()
    {
        const double V0 = 1;
        var circuit = RlcDischarge(V0, out double alpha, out double wd);
        double stop = 5e-3;
        var result = TransientSolver.Run(circuit, stop, TransientOptions.Verification with { MaxStep = 1e-5 });
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var v = result.Trace("a")!;
        double worst = 0;
        for (int k = 0; k < v.Times.Count; k++) worst = Math.Max(worst, Math.Abs(v.Values[k] - RlcExact(V0, alpha, wd, v.Times[k])));
        Assert.True(worst <= 1e-5 * V0, $"max error {worst:E3} V");

        // Frequency from the spacing of downward zero crossings (linear interpolation between points).
        var crossings = new List<double>();
        for (int k = 1; k < v.Times.Count; k++)
            if (v.Values[k - 1] > 0 && v.Values[k] <= 0)
                crossings.Add(v.Times[k - 1] + (v.Times[k] - v.Times[k - 1]) * v.Values[k - 1] / (v.Values[k - 1] - v.Values[k]));
        Assert.True(crossings.Count >= 5);
        double period = (crossings[^1] - crossings[0]) / (crossings.Count - 1);
        Assert.True(Math.Abs(2 * Math.PI / period - wd) <= 1e-4 * wd, $"ω_d {2 * Math.PI / period} rad/s, exact {wd}");

        // Decay: the envelope e^(−αt) from the ratio of the first and last positive peaks.
        var peaks = new List<(double T, double V)>();
        for (int k = 1; k + 1 < v.Times.Count; k++)
            if (v.Values[k] > v.Values[k - 1] && v.Values[k] >= v.Values[k + 1] && v.Values[k] > 0) peaks.Add((v.Times[k], v.Values[k]));
        Assert.True(peaks.Count >= 3);
        double measuredAlpha = Math.Log(peaks[0].V / peaks[^1].V) / (peaks[^1].T - peaks[0].T);
        Assert.True(Math.Abs(measuredAlpha - alpha) <= 0.01 * alpha, $"α {measuredAlpha} 1/s, exact {alpha}");
    }

    [Theory]
    [InlineData(IntegrationMethod.TrBdf2, 2.0)]
    [InlineData(IntegrationMethod.Trapezoidal, 2.0)]
    [InlineData(IntegrationMethod.BackwardEuler, 1.0)]
    public void Observed_Order_On_Rc_Matches_The_Method(IntegrationMethod method, double order)
    {
        // Fixed steps h, h/2, h/4 with control off (docs/numerics.md §9): p_obs = log2(e_h / e_{h/2}).
        const double R = 1e3, C = 1e-6, V0 = 1, T = 1e-3;
        double Error(double h)
        {
            var c = Circuit.FromDevices("rc", [new Resistor("R1", "R1", "a", "gnd", R), new Capacitor("C1", "C1", "a", "gnd", C, initialVoltage: V0)]);
            var r = TransientSolver.Run(c, T, TransientOptions.Verification with { Method = method, FixedStep = h, RelativeTolerance = 1e-12, VoltageTolerance = 1e-15 });
            Assert.True(r.Succeeded, r.Failure?.ToString());
            return Math.Abs(r.Trace("a")!.Values[^1] - V0 * Math.Exp(-T / (R * C)));
        }
        double e1 = Error(T / 20), e2 = Error(T / 40), e3 = Error(T / 80);
        Assert.InRange(Math.Log2(e1 / e2), order - 0.1, order + 0.1);
        Assert.InRange(Math.Log2(e2 / e3), order - 0.1, order + 0.1);
    }

    [Fact]
    public void Observed_Order_Of_TrBdf2_On_Rlc_Is_Two()
    {
        const double V0 = 1, T = 1e-3;
        double Error(double h)
        {
            var c = RlcDischarge(V0, out double alpha, out double wd);
            var r = TransientSolver.Run(c, T, TransientOptions.Verification with { FixedStep = h, RelativeTolerance = 1e-12, VoltageTolerance = 1e-15, CurrentTolerance = 1e-18 });
            Assert.True(r.Succeeded, r.Failure?.ToString());
            return Math.Abs(r.Trace("a")!.Values[^1] - RlcExact(V0, alpha, wd, T));
        }
        double e1 = Error(T / 100), e2 = Error(T / 200), e3 = Error(T / 400);
        Assert.InRange(Math.Log2(e1 / e2), 1.9, 2.1);
        Assert.InRange(Math.Log2(e2 / e3), 1.9, 2.1);
    }

    [Theory]
    [InlineData(IntegrationMethod.TrBdf2)]
    [InlineData(IntegrationMethod.Trapezoidal)]
    [InlineData(IntegrationMethod.BackwardEuler)]
    public void One_Step_On_An_Rc_Equals_The_Amplification_Factor(IntegrationMethod method)
    {
        // y' = λy, z = λh: BE 1/(1 − z); TR (1 + z/2)/(1 − z/2); TR-BDF2 (a(1 + dz)/(1 − dz) − b)/(1 − dz), from the
        // stage equations (Bank et al. 1985; docs/numerics.md §1).
        const double R = 1e3, C = 1e-6, h = 0.3e-3;
        double z = -h / (R * C);
        double g = 2 - Math.Sqrt(2), d = g / 2, a = 1 / (g * (2 - g)), b = (1 - g) * (1 - g) / (g * (2 - g));
        double expected = method switch
        {
            IntegrationMethod.BackwardEuler => 1 / (1 - z),
            IntegrationMethod.Trapezoidal => (1 + z / 2) / (1 - z / 2),
            _ => (a * (1 + d * z) / (1 - d * z) - b) / (1 - d * z),
        };
        var c = Circuit.FromDevices("rc", [new Resistor("R1", "R1", "a", "gnd", R), new Capacitor("C1", "C1", "a", "gnd", C, initialVoltage: 1.0)]);
        var r = TransientSolver.Run(c, h, TransientOptions.Verification with { Method = method, FixedStep = h, RelativeTolerance = 1e-14, VoltageTolerance = 1e-16 });
        Assert.True(r.Succeeded, r.Failure?.ToString());
        Assert.Equal(1, r.Statistics.AcceptedSteps);
        Assert.True(Math.Abs(r.Trace("a")!.Values[^1] - expected) <= 1e-14, $"{r.Trace("a")!.Values[^1]:R} vs {expected:R}");
    }
}
