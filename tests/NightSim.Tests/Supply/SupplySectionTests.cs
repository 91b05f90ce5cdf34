using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Supply;

namespace NightSim.Tests.Supply;

/// <summary>The supply's parts are recognised from the devices' roles and the wiring, however the supply is drawn (no
/// simulation): the dropper is the capacitor in series with the mains, the bleeder sits across it, the series resistor
/// is in the mains path, the rail is the timer's supply (or the Zener across the smoothing capacitor).</summary>
public sealed class SupplySectionTests
{
    private static List<Device> Bridge(string neutral, string dcMinus, bool fuse) =>
    [
        new VoltageSource("VM", "VM", "live", neutral, Waveform.Sine(0, 325, 50, 0, 0)),
        fuse ? new Resistor("RF", "RF", "live", "l1", 47) : new Resistor("RX", "RX", "live", neutral, 1e9),
        new Capacitor("CX", "CX", fuse ? "l1" : "live", "ac1", 470e-9),
        new Resistor("RBL", "RBL", fuse ? "l1" : "live", "ac1", 1e6),
        new Diode("D1", "D1", "ac1", "dcp"),
        new Diode("D2", "D2", neutral, "dcp"),
        new Diode("D3", "D3", dcMinus, "ac1"),
        new Diode("D4", "D4", dcMinus, neutral),
        new Capacitor("CS", "CS", "dcp", dcMinus, 470e-6),
        Zener.Create("DZ", "DZ", dcMinus, "dcp", 12),
        new Resistor("RL", "RL", "dcp", dcMinus, 1000),
    ];

    [Theory]
    [InlineData("gnd", "dcn", true)]
    [InlineData("neutral", "gnd", true)]
    [InlineData("neutral", "gnd", false)]
    public void Bridge_Dropper_Parts_Are_Found_However_It_Is_Drawn(string neutral, string dcMinus, bool fuse)
    {
        SupplySection s = SupplySection.Find(Bridge(neutral, dcMinus, fuse))!;
        Assert.Equal("VM", s.Source.PartId);
        Assert.Equal(["CX"], s.Droppers.Select(d => d.PartId));
        Assert.Equal(["RBL"], s.Bleeders.Select(b => b.PartId));
        // A resistor straight across the mains (RX) is not in series with it.
        Assert.Equal(fuse ? ["RF"] : [], s.SeriesResistors.Select(r => r.PartId));
        Assert.Equal(("dcp", Ground.Normalize(dcMinus)), (s.Rail!.Plus, Ground.Normalize(s.Rail.Minus)));
        Assert.Equal("DZ", s.RailZener?.PartId);
        Assert.Equal("CS", s.Reservoir?.PartId);
        Assert.Equal(470e-9, s.DropperCapacitance);
    }

    [Fact]
    public void Half_Wave_Dropper_With_A_Shunt_Zener_Has_Its_Rail_On_The_Smoothing_Capacitor()
    {
        var parts = new List<Device>
        {
            new VoltageSource("VM", "VM", "live", "gnd", Waveform.Sine(0, 325, 50, 0, 0)),
            new Capacitor("CX", "CX", "live", "a", 330e-9),
            new Resistor("RBL", "RBL", "live", "a", 1e6),
            Zener.Create("DZ", "DZ", "gnd", "a", 15),
            new Diode("D1", "D1", "a", "vcc"),
            new Capacitor("CS", "CS", "vcc", "gnd", 220e-6),
            new Resistor("RL", "RL", "vcc", "gnd", 2200),
        };
        SupplySection s = SupplySection.Find(parts)!;
        Assert.Equal(["CX"], s.Droppers.Select(d => d.PartId));
        Assert.Equal(("vcc", "gnd"), (s.Rail!.Plus, s.Rail.Minus));
        Assert.Null(s.RailZener); // the Zener clamps the AC side, not the rail
        Assert.Equal(["DZ"], s.Zeners.Select(z => z.PartId));
    }

    [Fact]
    public void The_Timer_Supply_Is_The_Rail_And_A_Node_Called_Line_Means_Nothing()
    {
        // The garden-path timer on a dropper: the timer's supply pins are the rail, whatever the nodes are called (the
        // garden path's trigger network has a node named "line"), and the timing capacitor is no dropper.
        List<Device> devices = NetlistLoader.Load(SupplyBudgets.Netlist("garden-path-dropper")).Parts
            .SelectMany(p => PartCatalog.Find(p.Kind)!.Create(p)).ToList();
        SupplySection s = SupplySection.Find(devices)!;
        Assert.Equal(["CX"], s.Droppers.Select(d => d.PartId));
        Assert.Equal(["RBL"], s.Bleeders.Select(b => b.PartId));
        Assert.Equal(["RF"], s.SeriesResistors.Select(b => b.PartId));
        Assert.Equal(("vcc", "gnd"), (s.Rail!.Plus, s.Rail.Minus));
        Assert.Contains("timer U1", s.Rail.Reason, StringComparison.Ordinal);
        Assert.Equal("DZ", s.RailZener?.PartId);
        Assert.Equal("CS", s.Reservoir?.PartId);
        Assert.Equal(["K1"], s.Relays.Select(r => r.PartId));
    }

    [Fact]
    public void An_Ideal_Rail_Has_No_Supply_Section()
    {
        List<Device> devices = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "garden-path.json")).Parts
            .SelectMany(p => PartCatalog.Find(p.Kind)!.Create(p)).ToList();
        Assert.Null(SupplySection.Find(devices));
    }
}
