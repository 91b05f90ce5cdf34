using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Devices;

/// <summary>Zener diode: breakdown point and line regulation of a shunt regulator.</summary>
public sealed class ZenerTests
{
    [Fact]
    public void Breakdown_Current_At_Vz_Is_Izt_With_Dynamic_Resistance_Zzt()
    {
        var z = Zener.Create("Z1", "Z1", "a", "k", vz: 5.1, izt: 20e-3, zzt: 10);
        double i = z.Current(-5.1, out double g);
        Assert.Equal(-20e-3, i, 9);
        Assert.Equal(1.0 / 10, g, 6);
    }

    [Fact]
    public void Line_Regulation_Matches_The_Small_Signal_Divider()
    {
        // Shunt regulator (textbook small-signal model, e.g. Sedra & Smith "Zener shunt regulator"):
        // ΔV_out/ΔV_in = (r_z ∥ R_L)/(R_s + r_z ∥ R_L), with r_z the Zener's dynamic resistance at its current.
        const double Rs = 220, RL = 1e3;
        double Vout(double vin, out double iz)
        {
            var c = Circuit.FromDevices("zener-reg",
            [
                new VoltageSource("V1", "V1", "in", "gnd", Waveform.Dc(vin)),
                new Resistor("Rs", "Rs", "in", "out", Rs),
                Zener.Create("Z1", "Z1", "gnd", "out", vz: 5.1, izt: 20e-3, zzt: 10),
                new Resistor("RL", "RL", "out", "gnd", RL),
            ]);
            Assert.True(TransientSolver.TrySolveOperatingPoint(c, TransientOptions.Verification, out double[]? x));
            double v = x![c.IndexOf("out")];
            iz = (vin - v) / Rs - v / RL;
            return v;
        }
        double v1 = Vout(12.0, out double i1), v2 = Vout(12.1, out double i2);
        Assert.InRange(v1, 4.9, 5.2);
        double measured = (v2 - v1) / 0.1;
        // The model's dynamic resistance at current I is Z_ZT·I_ZT/I; use the mean current of the two points.
        double rz = 10 * 20e-3 / (0.5 * (i1 + i2));
        double par = rz * RL / (rz + RL);
        double expected = par / (Rs + par);
        Assert.True(Math.Abs(measured - expected) <= 0.01 * expected, $"line regulation {measured:E4}, small-signal {expected:E4}");
    }
}
