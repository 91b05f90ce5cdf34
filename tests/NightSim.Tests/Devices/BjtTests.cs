using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Devices;

/// <summary>Bipolar transistor: transport-model currents, Jacobians, a common-emitter switch.</summary>
public sealed class BjtTests
{
    private static readonly double s_vt = Junction.ThermalVoltage(300.15);

    [Fact]
    public void Collector_Current_At_0_65_V_Is_0_8205_mA()
    {
        // Ebers–Moll transport equation (Ebers & Moll, Proc. IRE 42, 1954) with V_BC ≪ 0 and no Early effect:
        // I_C = I_S·e^(V_BE/V_T); I_S 1e-14 A, V_T 25.865 mV (27 °C) → I_C(0.65 V) = 0.8205 mA, computed from that formula.
        var q = new Bjt("Q1", "Q1", "c", "b", "e");
        var (ic, _) = q.Currents(0.65, -5, out _, out _, out _, out _);
        Assert.True(Math.Abs(ic - 0.8205e-3) <= 1e-3 * 0.8205e-3, $"I_C = {ic}");
    }

    [Theory]
    [InlineData(false, 0.6, 3.0, 0.0)]
    [InlineData(false, 0.72, 0.1, 0.0)]
    [InlineData(true, -0.6, -3.0, 0.0)]
    [InlineData(false, -1.0, 2.0, 0.5)]
    public void Jacobians_Match_Finite_Differences(bool pnp, double vb, double vc, double ve)
    {
        var h = new StampHarness("c", "b", "e");
        var q = new Bjt("Q1", "Q1", "c", "b", "e", pnp, betaF: 150, betaR: 2, earlyVoltage: 75, cje: 10e-12, cjc: 4e-12, tf: 0.4e-9, tr: 50e-9);
        q.Setup(h);
        double[] x = [vc, vb, ve];
        for (int i = 0; i < 100 && h.Load(q, x).Limited; i++) { }
        Assert.False(h.Load(q, x).Limited);
        h.AssertJacobians(q, x);
    }

    [Fact]
    public void Common_Emitter_Switch_Saturates_At_The_Transport_Model_Voltage()
    {
        // Common-emitter switch: V_CC 5 V, R_C 1 kΩ, base driven 0 → 5 V through R_B 10 kΩ.
        // Reference: the Ebers–Moll transport equations (Ebers & Moll 1954) solved here independently by Newton
        // on (V_BE, V_CE) with the same parameters.
        const double Vcc = 5, Rc = 1e3, Rb = 10e3, Is = 1e-14, Bf = 200, Br = 1;
        double vbe = 0.7, vce = 0.1;
        for (int it = 0; it < 200; it++)
        {
            double F(double be, double ce, out double f2)
            {
                double bc = be - ce;
                double iF = Is * (Math.Exp(be / s_vt) - 1), iR = Is * (Math.Exp(bc / s_vt) - 1);
                double ic = iF - iR - iR / Br, ib = iF / Bf + iR / Br;
                f2 = (Vcc - ce) / Rc - ic;
                return (Vcc - be) / Rb - ib;
            }
            double f1 = F(vbe, vce, out double f2);
            const double d = 1e-9;
            double a11 = (F(vbe + d, vce, out double f2a) - f1) / d, a21 = (f2a - f2) / d;
            double a12 = (F(vbe, vce + d, out double f2b) - f1) / d, a22 = (f2b - f2) / d;
            double det = a11 * a22 - a12 * a21;
            double dbe = -(f1 * a22 - a12 * f2) / det, dce = -(a11 * f2 - a21 * f1) / det;
            vbe += Math.Clamp(dbe, -0.05, 0.05);
            vce += Math.Clamp(dce, -0.05, 0.05);
        }
        Assert.InRange(vce, 0.01, 0.2); // saturated: V_CE(sat) well below 0.2 V (common practice)

        var circuit = Circuit.FromDevices("ce-switch",
        [
            new VoltageSource("VCC", "VCC", "vcc", "gnd", Waveform.Dc(Vcc)),
            new VoltageSource("VIN", "VIN", "in", "gnd", Waveform.Pulse(0, 5, 1e-3, 1e-6, 1e-6, 2e-3, double.PositiveInfinity)),
            new Resistor("RB", "RB", "in", "b", Rb),
            new Resistor("RC", "RC", "vcc", "c", Rc),
            new Bjt("Q1", "Q1", "c", "b", "gnd", betaF: Bf, betaR: Br),
        ]);
        var result = TransientSolver.Run(circuit, 5e-3, TransientOptions.Default with { Gmin = 0, MaxStep = 1e-4, SupplyRamp = 0 });
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var c = result.Trace("c")!;
        Assert.Equal(Vcc, c.At(0.9e-3), 6);                       // off: no collector current (I_S-level leakage only)
        Assert.True(Math.Abs(c.At(2.5e-3) - vce) <= 1e-4, $"V_CE(sat) {c.At(2.5e-3)} V, transport model {vce} V");
        Assert.Equal(Vcc, c.At(4.9e-3), 6);                       // off again after the pulse
        // Switching follows the input edges (no charges in this model): the output is low 10 µs after the rising edge.
        Assert.True(c.At(1.01e-3) < 0.2);
    }
}
