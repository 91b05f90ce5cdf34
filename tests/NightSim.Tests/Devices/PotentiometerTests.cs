using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class PotentiometerTests
{
    [Fact]
    public void Wiper_Divides_The_Track_In_Proportion_To_Position()
    {
        // Unloaded divider: v_w = V·(1 − p) with pin a at V, b at 0 (voltage divider rule, any circuit textbook).
        var h = new StampHarness("a", "w");
        var pot = new Potentiometer("P1", "P1", "a", "w", "gnd", 100e3, 0.25);
        pot.Setup(h);
        Assert.Equal(25e3, pot.ResistanceA, 9);
        Assert.Equal(75e3, pot.ResistanceB, 9);
        // At the divider's own solution the wiper row balances: 10 V · 0.75 = 7.5 V.
        LoadContext ctx = h.Load(pot, [10.0, 7.5]);
        Assert.Equal(0.0, ctx.J[1], 15);
        Assert.Equal(1e-4, ctx.J[0], 15);
        h.AssertJacobians(pot, [10.0, 3.0]);
    }

    [Fact]
    public void Ends_Of_Travel_Keep_A_Tiny_Resistance()
    {
        var pot = new Potentiometer("P1", "P1", "a", "w", "b", 10e3, 0.0);
        Assert.Equal(Potentiometer.MinimumResistance, pot.ResistanceA);
        Assert.Equal(10e3, pot.ResistanceB, 9);
    }
}
