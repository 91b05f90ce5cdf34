using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Tests.Fixtures;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Devices;

/// <summary>Diode model: Shockley law, limiting, Jacobians, diode–resistor circuit against the exact Lambert W
/// solution, half-wave rectifier ripple.</summary>
public sealed class DiodeTests
{
    private static readonly double s_vt = Junction.ThermalVoltage(300.15);

    [Fact]
    public void Critical_Voltage_Is_0_7303_V_For_1e14_A()
    {
        // Critical voltage of junction limiting (Vlach & Singhal, Computer Methods for Circuit Analysis and Design,
        // 2nd ed., 1994; docs/numerics.md §6): V_crit = V_T ln(V_T/(√2 I_S)) = 0.7303 V for I_S 1e-14 A, N 1, 27 °C,
        // computed from that formula.
        Assert.Equal(0.7303, new Diode("D1", "D1", "a", "gnd").CriticalVoltage, 4);
    }

    [Fact]
    public void Forward_Voltage_At_1_mA_Is_0_6551_V()
    {
        // Shockley diode equation (Shockley, Bell Syst. Tech. J. 28, 1949): V = N·V_T·ln(I/I_S + 1); I_S 1e-14 A, N 1,
        // 27 °C → V(1 mA) = 0.6551 V (computed from that formula), ± 0.1 mV.
        var d = new Diode("D1", "D1", "a", "gnd");
        double v = s_vt * Math.Log(1e-3 / 1e-14 + 1);
        Assert.Equal(1e-3, d.Current(v, out _), 12);
        Assert.InRange(v, 0.6550, 0.6552);
    }

    [Fact]
    public void Limiting_Never_Increases_The_Step_And_Is_Logarithmic_Above_Vcrit()
    {
        double vte = s_vt, vcrit = Junction.CriticalVoltage(vte, 1e-14);
        foreach (double vOld in new[] { -1.0, 0.0, 0.3, 0.6, 0.75 })
            foreach (double vNew in new[] { 0.8, 1.0, 3.0, 10.0 })
            {
                double v = Junction.Limit(vNew, vOld, vte, vcrit, out bool limited);
                Assert.True(Math.Abs(v - vOld) <= Math.Abs(vNew - vOld) + 1e-15, $"{vOld} → {vNew} gave {v}");
                if (limited) Assert.True(v < vNew);
            }
        // Below V_crit nothing is limited.
        Assert.Equal(0.5, Junction.Limit(0.5, -5, vte, vcrit, out bool l), 15);
        Assert.False(l);
    }

    [Theory]
    [InlineData(-3.0)]
    [InlineData(0.2)]
    [InlineData(0.65)]
    [InlineData(0.75)]
    [InlineData(-5.3)]
    public void Jacobians_Match_Finite_Differences(double v)
    {
        var h = new StampHarness("a", "k");
        var d = new Diode("D1", "D1", "a", "k", 2.5e-9, 1.75, seriesResistance: 0.6, junctionCapacitance: 4e-12, transitTime: 20e-9,
            breakdownVoltage: 5.1, breakdownCurrent: 20e-3, breakdownEmission: 7.7);
        d.Setup(h);
        double[] x = new double[h.Unknowns];
        x[0] = v + 0.01;
        x[2] = v; // internal junction node (anode side)
        // Limiting must not interfere with the finite differences: load until the previous iterate sits at x.
        for (int i = 0; i < 100 && h.Load(d, x).Limited; i++) { }
        Assert.False(h.Load(d, x).Limited);
        h.AssertJacobians(d, x);
    }

    [Fact]
    public void Diode_And_Resistor_Match_The_Lambert_W_Solution()
    {
        // Diode and resistor in series, solved exactly with the Lambert W function (Corless, Gonnet, Hare, Jeffrey &
        // Knuth, "On the Lambert W function", Adv. Comput. Math. 5, 1996): 5 V, 1 kΩ, I_S 1e-14 A, N 1 → I = 4.3071 mA,
        // V_D = 0.69289 V (computed from that closed form).
        const double V = 5, R = 1e3, Is = 1e-14;
        double n = s_vt;
        double exact = n / R * LambertW.W0(Is * R / n * Math.Exp((V + Is * R) / n)) - Is;
        Assert.Equal(4.3071e-3, exact, 7);

        var circuit = Circuit.FromDevices("d-r",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Dc(V)),
            new Resistor("R1", "R1", "in", "a", R),
            new Diode("D1", "D1", "a", "gnd", Is),
        ]);
        var options = TransientOptions.Default with { Gmin = 0 };
        Assert.True(TransientSolver.TrySolveOperatingPoint(circuit, options, out double[]? x));
        double current = (V - x![circuit.IndexOf("a")]) / R;
        Assert.True(Math.Abs(current - exact) <= 1e-6 * exact, $"operating point {current} A, exact {exact} A");

        // The same by power-up transient, settled.
        var run = TransientSolver.Run(Circuit.FromDevices("d-r", [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Dc(V)),
            new Resistor("R1", "R1", "in", "a", R),
            new Diode("D1", "D1", "a", "gnd", Is),
        ]), 0.01, TransientOptions.Verification with { Gmin = 0 });
        Assert.True(run.Succeeded, run.Failure?.ToString());
        double vd = run.Trace("a")!.Values[^1];
        Assert.True(Math.Abs((V - vd) / R - exact) <= 1e-6 * exact, $"transient {(V - vd) / R} A");
    }

    [Fact]
    public void Half_Wave_Rectifier_Ripple_Matches_The_Textbook_Approximation()
    {
        // Textbook approximation (any electronics textbook, e.g. Sedra & Smith, "The peak rectifier"):
        // ripple V_r ≈ V_p / (f·R·C) when V_r ≪ V_p, with V_p the peak capacitor voltage.
        const double Amp = 10, F = 50, R = 2e3, C = 470e-6;
        var circuit = Circuit.FromDevices("rectifier",
        [
            new VoltageSource("V1", "V1", "ac", "gnd", Waveform.Sine(0, Amp, F, 0, 0)),
            new Resistor("Rs", "Rs", "ac", "in", 1.0),
            new Diode("D1", "D1", "in", "out", 2.5e-9, 1.75, 0.6),
            new Capacitor("C1", "C1", "out", "gnd", C),
            new Resistor("RL", "RL", "out", "gnd", R),
        ]);
        var result = TransientSolver.Run(circuit, 1.0, TransientOptions.Default with { MaxStep = 1e-4, SupplyRamp = 0 });
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var trace = result.Trace("out")!;
        // Last two periods (steady state): peak and trough.
        double max = double.MinValue, min = double.MaxValue;
        for (int i = 0; i < trace.Times.Count; i++)
        {
            if (trace.Times[i] < 1.0 - 2 / F) continue;
            max = Math.Max(max, trace.Values[i]);
            min = Math.Min(min, trace.Values[i]);
        }
        double ripple = max - min;
        double expected = max / (F * R * C);
        Assert.InRange(ripple / expected, 0.85, 1.05);
        // The peak sits one diode drop below the source peak (0.6–0.8 V at ≈ 50–100 mA peak charging current).
        Assert.InRange(Amp - max, 0.5, 1.0);
    }
}
