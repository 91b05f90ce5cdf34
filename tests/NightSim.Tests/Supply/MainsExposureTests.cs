using NightSim.Mna;
using NightSim.Devices;
using NightSim.Supply;

namespace NightSim.Tests.Supply;

/// <summary>
/// Which caution a design gets. The threshold is the top of extra-low voltage, 50 V AC (IEC 60449, voltage band I;
/// from memory), applied to every waveform's largest magnitude.
/// </summary>
public sealed class MainsExposureTests
{
    private static Relay LampRelay() => new("K1", "K1", "vcc", "coil", [], new RelaySettings(LoadName: "lamp", LoadPower: 12));

    [Fact]
    public void A_Mains_Sine_Makes_The_Circuit_Not_Isolated()
    {
        Device[] devices = [new VoltageSource("VM", "VM", "line", "gnd", Waveform.Sine(0, 325, 50, 0, 0)), LampRelay()];
        Assert.Equal(MainsExposureKind.NotIsolated, MainsExposure.Classify(devices));
        Assert.Contains(MainsExposure.Cautions(MainsExposureKind.NotIsolated), c => c.Contains("NOT isolated", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(49.9, MainsExposureKind.SwitchesMainsLoad)]
    [InlineData(50.0, MainsExposureKind.NotIsolated)]
    [InlineData(-60.0, MainsExposureKind.NotIsolated)]
    public void A_Constant_Or_Piecewise_Rail_Counts_From_50_V(double volts, MainsExposureKind expected)
    {
        Assert.Equal(expected, MainsExposure.Classify([new VoltageSource("V1", "V1", "vcc", "gnd", Waveform.Dc(volts)), LampRelay()]));
        Assert.Equal(expected, MainsExposure.Classify(
            [new VoltageSource("V1", "V1", "vcc", "gnd", Waveform.PiecewiseLinear([(0, 0), (1, volts)])), LampRelay()]));
    }

    [Fact]
    public void A_Low_Voltage_Circuit_Without_A_Mains_Load_Gets_No_Caution()
    {
        Device[] devices = [new VoltageSource("V1", "V1", "vcc", "gnd", Waveform.Dc(12)), new Resistor("R1", "R1", "vcc", "gnd", 1e3)];
        Assert.Equal(MainsExposureKind.None, MainsExposure.Classify(devices));
        Assert.Empty(MainsExposure.Cautions(MainsExposureKind.None));
        Assert.All(MainsExposure.Cautions(MainsExposureKind.SwitchesMainsLoad), c => Assert.DoesNotContain("NOT isolated", c, StringComparison.Ordinal));
    }
}

/// <summary>Cautions by the netlist as loaded: the sources of 50 V or more, a mains lamp behind a low-voltage relay, a
/// low-voltage lamp; and every caution defers to local codes and licensed electricians.</summary>
public sealed class MainsExposureNetlistTests
{
    private static MainsExposureKind Classify(string source, string relayExtra = "") => MainsExposure.Classify(NightSim.Netlist.NetlistLoader.LoadText($$"""
        { "name": "m", "parts": [
          { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], {{source}} },
          { "id": "R1", "kind": "resistor", "nodes": ["vcc", "gnd"], "value": "10k" },
          { "id": "V2", "kind": "voltage-source", "nodes": ["low", "gnd"], "constant": "12V" },
          { "id": "K1", "kind": "relay", "pins": { "coilA": "low", "coilB": "gnd" } {{relayExtra}} }
        ] }
        """));

    // The top of extra-low voltage, 50 V AC (IEC 60449 band I, from memory), on each waveform's largest magnitude.
    [Theory]
    [InlineData("\"sine\": { \"amplitude\": \"325V\", \"frequency\": \"50Hz\" }")]
    [InlineData("\"sine\": { \"amplitude\": \"170V\", \"frequency\": \"60Hz\" }")]
    [InlineData("\"constant\": \"60V\"")]
    [InlineData("\"constant\": \"-50V\"")]
    [InlineData("\"points\": [[0, 0], [\"1s\", \"60V\"]]")]
    [InlineData("\"pulse\": { \"peak\": \"100V\" }")]
    public void A_Source_Of_50_V_Or_More_Is_Not_Isolated_Whatever_Its_Waveform(string source)
    {
        Assert.Equal(MainsExposureKind.NotIsolated, Classify(source));
        Assert.Equal(MainsExposureKind.NotIsolated, Classify(source, """, "load": "lamp", "loadPower": "40W" """));
    }

    [Fact]
    public void A_Low_Voltage_Relay_Switching_A_Mains_Lamp_Gets_The_Contact_Cautions()
    {
        Assert.Equal(MainsExposureKind.SwitchesMainsLoad, Classify("\"constant\": \"24V\"", """, "load": "lamp", "loadPower": "40W" """));
        Assert.Equal(MainsExposureKind.SwitchesMainsLoad, Classify("\"constant\": \"24V\"", """, "load": "lamp", "loadPower": "40W", "loadVoltage": "120V" """));
    }

    [Fact]
    public void A_Low_Voltage_Lamp_Behind_A_Low_Voltage_Relay_Gets_No_Caution()
    {
        Assert.Equal(MainsExposureKind.None, Classify("\"constant\": \"24V\"", """, "load": "lamp", "loadPower": "20W", "loadVoltage": "12V" """));
        Assert.Equal(MainsExposureKind.None, Classify("\"sine\": { \"amplitude\": \"49V\", \"frequency\": \"50Hz\" }"));
    }

    [Fact]
    public void Every_Caution_List_Defers_To_Local_Codes_And_Licensed_Electricians()
    {
        foreach (MainsExposureKind kind in (MainsExposureKind[])[MainsExposureKind.NotIsolated, MainsExposureKind.SwitchesMainsLoad])
        {
            IReadOnlyList<string> cautions = MainsExposure.Cautions(kind);
            Assert.Contains(cautions, c => c.Contains("local electrical codes", StringComparison.Ordinal) && c.Contains("licensed electrician", StringComparison.Ordinal));
        }
        // The not-isolated list carries the usual dropper cautions: fuse, X2-class capacitor, bleeder, closed enclosure.
        string all = string.Join(" ", MainsExposure.Cautions(MainsExposureKind.NotIsolated));
        foreach (string word in (string[])["NOT isolated", "lethal", "fuse", "X2-class", "bleeder", "closed, insulating enclosure"])
            Assert.Contains(word, all, StringComparison.Ordinal);
        string contacts = string.Join(" ", MainsExposure.Cautions(MainsExposureKind.SwitchesMainsLoad));
        foreach (string word in (string[])["relay contacts", "lamp wiring", "inrush", "fuse the lamp circuit", "closed, insulating enclosure"])
            Assert.Contains(word, contacts, StringComparison.Ordinal);
    }
}
