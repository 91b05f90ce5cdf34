using NightSim.Devices;
using NightSim.Mna;
using NightSim.Results;
using NightSim.Supply;
using NightSim.Transient;

namespace NightSim.Tests.Supply;

/// <summary>The bleeder's discharge after unplugging against the first-order RC law V(t) = V₀·e^(−t/RC) (any circuits
/// textbook, e.g. Hambley, "Electrical Engineering: Principles and Applications", ch. 4 on first-order transients), checked by
/// a simulated discharge of the unplugged dropper.</summary>
public sealed class BleederDischargeTests
{
    [Theory]
    [InlineData(1e6, 470e-9, 325.0)]
    [InlineData(470e3, 680e-9, 310.0)]
    [InlineData(1e6, 220e-9, 170.0)]
    public void Time_To_The_Safe_Voltage_Is_Rc_Ln_Of_The_Ratio(double r, double c, double v0)
    {
        var d = new BleederDischarge(r, c, v0);
        Assert.Equal(r * c, d.TimeConstant, 1e-12);
        Assert.Equal(r * c * Math.Log(v0 / 60.0), d.SecondsToSafe, 1e-12);
        Assert.Equal(v0 * Math.Exp(-1.0 / (r * c)), d.VoltageAfterOneSecond, 1e-9);
        Assert.Equal(d.VoltageAfterOneSecond <= 34.0, d.MeetsPlugPinLimit);

        // The unplugged dropper (charged to V0, nothing but the bleeder across it), simulated: the time it falls
        // through 60 V within 0.5 % of the closed form.
        var circuit = Circuit.FromDevices("unplugged",
        [
            new Capacitor("CX", "CX", "a", "gnd", c, initialVoltage: v0),
            new Resistor("RBL", "RBL", "a", "gnd", r),
        ]);
        SimulationResult sim = TransientSolver.Run(circuit, 3 * d.SecondsToSafe);
        Assert.True(sim.Succeeded, sim.Failure?.ToString());
        Trace v = sim.Trace("a")!;
        Assert.Equal(v0, v.Values[0], 1e-6);
        int i = Enumerable.Range(0, v.Times.Count).First(k => v.Values[k] < 60.0);
        double t = v.Times[i - 1] + (60.0 - v.Values[i - 1]) * (v.Times[i] - v.Times[i - 1]) / (v.Values[i] - v.Values[i - 1]);
        Assert.InRange(t, 0.995 * d.SecondsToSafe, 1.005 * d.SecondsToSafe);

        // The largest bleeder that meets the plug-pin limit leaves exactly 34 V after one second.
        var limit = new BleederDischarge(d.LargestBleederForPlugPins, c, v0);
        Assert.Equal(34.0, limit.VoltageAfterOneSecond, 1e-9);
    }

    [Fact]
    public void Without_A_Bleeder_The_Dropper_Stays_Charged()
    {
        var d = new BleederDischarge(double.PositiveInfinity, 470e-9, 320);
        Assert.True(double.IsPositiveInfinity(d.SecondsToSafe));
        Assert.Equal(320, d.VoltageAfterOneSecond);
        Assert.False(d.MeetsPlugPinLimit);
        Assert.Equal(0, new BleederDischarge(1e6, 1e-6, 50).SecondsToSafe);
    }
}
