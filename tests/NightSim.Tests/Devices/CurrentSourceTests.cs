using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class CurrentSourceTests
{
    [Fact]
    public void Current_Flows_Through_The_Source_From_First_To_Second_Node()
    {
        var h = new StampHarness("a", "b");
        var s = new CurrentSource("I1", "I1", "a", "b", Waveform.Dc(1e-3));
        s.Setup(h);
        LoadContext ctx = h.Load(s, [1.0, 2.0]);
        Assert.Equal(1e-3, ctx.J[0], 15);   // leaves node a (into the source)
        Assert.Equal(-1e-3, ctx.J[1], 15);  // enters node b
        Assert.Equal(0, h.SlotCount);
    }

    [Fact]
    public void Follows_A_Sine_Waveform_In_Time()
    {
        // Mains-like 50 Hz sine, 1 mA peak: quarter period 5 ms → peak.
        var h = new StampHarness("a");
        var s = new CurrentSource("I1", "I1", "a", "gnd", Waveform.Sine(0, 1e-3, 50, 0, 0));
        s.Setup(h);
        Assert.Equal(1e-3, h.Load(s, [0.0], time: 5e-3).J[0], 12);
    }
}
