using NightSim.Devices;
using NightSim.Devices.Composite;

namespace NightSim.Tests.Devices;

public class BiasCurrentTests
{
    // A pin bias current is the constant I inside the rails and fades to zero as the pin reaches the rail it flows
    // from (a real input stage cannot push its pin past the supply; common practice).
    [Fact]
    public void ConstantInsideTheRailsAndZeroAtTheRail()
    {
        var h = new StampHarness("vcc", "rst");
        var bias = new BiasCurrent("U1.reset-current", "U1", "vcc", "rst", 1e-4);
        bias.Setup(h);
        Assert.Equal(1e-4, h.Load(bias, [12.0, 6.0]).J[0], 12);          // 6 V inside: the full current leaves vcc
        Assert.Equal(-1e-4, h.Load(bias, [12.0, 6.0]).J[1], 12);         // and enters the pin node
        Assert.Equal(0.0, h.Load(bias, [12.0, 12.0]).J[1], 15);          // at the rail: nothing
        Assert.True(h.Load(bias, [12.0, 12.2]).J[1] > 0);                 // beyond it, it pulls back
        h.AssertJacobians(bias, [12.0, 11.97]);
    }
}
