using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Devices.Composite;
using NightSim.Netlist;
using NightSim.Runs;

namespace NightSim.Tests.Runs;

/// <summary>The charging network a one-shot's timing node sees, reduced from the devices themselves, checked against
/// the 555 one-shot width t = ln 3 · R·C ≈ 1.1·R·C (common practice: the standard monostable relation, from 0 V to
/// 2/3 of the supply through R) worked by hand for series, parallel and trimmer timing resistors.</summary>
public class TimingNetworkTests
{
    private const double Supply = 12.0, C = 100e-6;

    private static List<Device> Circuit(params Device[] timing)
    {
        var timer = new PartDefinition("U1", "timer-555",
            new Dictionary<string, string> { ["vcc"] = "vcc", ["gnd"] = Ground.Node, ["threshold"] = "tc", ["discharge"] = "tc", ["trigger"] = "trig", ["output"] = "out", ["reset"] = "vcc" },
            new PartParameters(texts: new Dictionary<string, string> { ["variant"] = "cmos" }));
        var list = new List<Device> { new VoltageSource("V1", "V1", "vcc", Ground.Node, Waveform.Dc(Supply)) };
        list.AddRange(timing);
        list.AddRange(Timer555.Expand(timer));
        return list;
    }

    private static TimerFacts Facts(List<Device> devices) =>
        Assert.Single(TimingNetwork.Extract(devices, n => TimingNetwork.FixedVoltage(devices, n)));

    [Fact]
    public void SeriesTimingResistorsAddUp()
    {
        // 470 kΩ + 530 kΩ in series = 1 MΩ; ln 3 · 1 MΩ · 100 µF = 109.861 s (by hand).
        TimerFacts f = Facts(Circuit(
            new Resistor("RA", "RA", "vcc", "mid", 470e3), new Resistor("RB", "RB", "mid", "tc", 530e3),
            new Capacitor("CT", "CT", "tc", Ground.Node, C)));
        Assert.Equal(1e6, f.Resistance, 1);
        Assert.Equal(Supply, f.ChargeVoltage, 9);
        Assert.Equal(109.861, f.IdealWidth, 3);
        Assert.True(f.IsCmos);
    }

    [Fact]
    public void ParallelTimingResistorsCombine()
    {
        // 2 MΩ ∥ 2 MΩ = 1 MΩ; 100 µF as 47 µF + 53 µF in parallel: ln 3 · 1 MΩ · 100 µF = 109.861 s (by hand).
        TimerFacts f = Facts(Circuit(
            new Resistor("RA", "RA", "vcc", "tc", 2e6), new Resistor("RB", "RB", "vcc", "tc", 2e6),
            new Capacitor("CA", "CA", "tc", Ground.Node, 47e-6), new Capacitor("CB", "CB", "tc", Ground.Node, 53e-6)));
        Assert.Equal(1e6, f.Resistance, 1);
        Assert.Equal(100e-6, f.Capacitance, 12);
        Assert.Equal(109.861, f.IdealWidth, 3);
    }

    [Fact]
    public void TrimmerInSeriesCountsItsSetting()
    {
        // 680 kΩ, then a 1 MΩ trimmer wired as a variable resistor (wiper and far end joined) at 32 %: 680k + 320k =
        // 1 MΩ; ln 3 · 1 MΩ · 100 µF = 109.861 s (by hand).
        TimerFacts f = Facts(Circuit(
            new Resistor("RA", "RA", "vcc", "a", 680e3), new Potentiometer("P1", "P1", "a", "tc", "tc", 1e6, 0.32),
            new Capacitor("CT", "CT", "tc", Ground.Node, C)));
        Assert.Equal(1e6, f.Resistance, 0);
        Assert.Equal(109.861, f.IdealWidth, 2);
    }

    [Fact]
    public void ResistorToGroundMakesATheveninSource()
    {
        // 1 MΩ from 12 V and 4 MΩ to ground: V₀ = 12·4/5 = 9.6 V behind 800 kΩ; from 0 to 8 V:
        // t = 0.8 MΩ · 100 µF · ln(9.6/(9.6 − 8)) = 80 s · ln 6 = 143.34 s (textbook RC charging, by hand).
        TimerFacts f = Facts(Circuit(
            new Resistor("RA", "RA", "vcc", "tc", 1e6), new Resistor("RG", "RG", "tc", Ground.Node, 4e6),
            new Capacitor("CT", "CT", "tc", Ground.Node, C)));
        Assert.Equal(9.6, f.ChargeVoltage, 9);
        Assert.Equal(800e3, f.Resistance, 1);
        Assert.Equal(80 * Math.Log(6), f.IdealWidth, 3);
    }

    [Fact]
    public void CapacitorLeakageIsADrain()
    {
        // 1 MΩ from 12 V, 100 µF with 1 µA leakage: V∞ = 12 − 1 µA · 1 MΩ = 11 V, t = 100 s · ln(11/3) = 129.93 s
        // (textbook RC charging with a constant drain, by hand); the CMOS timer's pA input and 10 GΩ discharge
        // leakage move it by less than 0.1 s.
        TimerFacts f = Facts(Circuit(
            new Resistor("RT", "RT", "vcc", "tc", 1e6), new Capacitor("CT", "CT", "tc", Ground.Node, C, leakageCurrent: 1e-6)));
        Assert.Equal(1e-6, f.DrainCurrent, 8);
        Assert.Equal(129.93, f.ClosedFormWidth, 1);
        Assert.Equal(109.861, f.IdealWidth, 3);
    }

    [Fact]
    public void NoFactsWhenTheTimingNodeMeetsATransistor()
    {
        var devices = Circuit(new Resistor("RT", "RT", "vcc", "tc", 1e6), new Capacitor("CT", "CT", "tc", Ground.Node, C),
            new Bjt("Q1", "Q1", "tc", "b", Ground.Node));
        Assert.Empty(TimingNetwork.Extract(devices, n => TimingNetwork.FixedVoltage(devices, n)));
    }
}
