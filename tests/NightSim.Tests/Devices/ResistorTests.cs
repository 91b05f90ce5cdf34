using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class ResistorTests
{
    [Fact]
    public void Current_Follows_Ohms_Law_And_Leaves_The_Higher_Node()
    {
        // Ohm's law, i = V/R (any physics handbook): 12 V across 4.7 kΩ → 2.553 mA out of node a into node b.
        var h = new StampHarness("a", "b");
        var r = new Resistor("R1", "R1", "a", "b", 4700);
        r.Setup(h);
        LoadContext ctx = h.Load(r, [12.0, 0.0]);
        Assert.Equal(12.0 / 4700, ctx.J[0], 15);
        Assert.Equal(-12.0 / 4700, ctx.J[1], 15);
        Assert.Equal(1.0 / 4700, h.At(ctx.G, 0, 0), 15);
        Assert.Equal(-1.0 / 4700, h.At(ctx.G, 0, 1), 15);
        h.AssertJacobians(r, [3.0, -2.0]);
    }

    [Fact]
    public void Grounded_Resistor_Stamps_Only_Its_Node()
    {
        var h = new StampHarness("a");
        var r = new Resistor("R1", "R1", "a", "gnd", 1000);
        r.Setup(h);
        Assert.Equal(1, h.SlotCount);
        LoadContext ctx = h.Load(r, [5.0]);
        Assert.Equal(5e-3, ctx.J[0], 15);
    }

    [Fact]
    public void Rejects_Zero_Resistance() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new Resistor("R1", "R1", "a", "b", 0));
}
