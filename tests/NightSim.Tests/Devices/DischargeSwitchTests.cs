using NightSim.Devices.Behavioural;
using NightSim.Devices.Composite;

namespace NightSim.Tests.Devices;

/// <summary>The timer's discharge transistor: its on-resistance for small currents, and a current limit set by its drive,
/// i = I_max·tanh(v/(R_on·I_max)) (values chosen for the test; tanh by hand).</summary>
public sealed class DischargeSwitchTests
{
    private sealed class Fixed(double level) : ILogicLevel
    {
        public double Level(double time) => level;
    }

    [Fact]
    public void On_Switch_Limits_Its_Current_And_Stamps_Its_Jacobian()
    {
        var h = new StampHarness("d");
        var s = new DischargeSwitch("U1.discharge", "U1", "d", "gnd", new Fixed(0.0), 15.0, 10e9, 0.05);
        s.Setup(h);
        // 8 V across 15 Ω would push 533 mA; the transistor carries 50 mA·tanh(10.667) = 50.000 mA.
        Assert.Equal(0.05 * Math.Tanh(8.0 / 15.0 / 0.05), h.Load(s, [8.0]).J[0], 12);
        Assert.InRange(h.Load(s, [8.0]).J[0], 0.049999, 0.05);
        // 0.1 V: 6.667 mA by Ohm's law, 6.627 mA limited (within 1 % of the on-resistance).
        Assert.Equal(0.05 * Math.Tanh(0.1 / 15.0 / 0.05), h.Load(s, [0.1]).J[0], 12);
        Assert.Equal(0.1 / 15.0, h.Load(s, [0.1]).J[0], 1e-4);
        h.AssertJacobians(s, [0.1]);
        h.AssertJacobians(s, [3.0]);
        // Off (latch high): the leakage resistance, linear.
        var off = new DischargeSwitch("U1.discharge", "U1", "d", "gnd", new Fixed(1.0), 15.0, 10e9, 0.05);
        off.Setup(h);
        Assert.Equal(8.0 / 10e9, h.Load(off, [8.0]).J[0], 1e-18);
    }
}
