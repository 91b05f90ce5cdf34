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
