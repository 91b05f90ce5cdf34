using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Runs;

namespace NightSim.Tests.Runs;

public class TimerFactsExtractorTests
{
    private static PartDefinition Two(string id, string kind, string a, string b, params (string Name, double Value)[] p) =>
        new(id, kind, new Dictionary<string, string> { [PartCatalog.Find(kind)!.Pins[0]] = a, [PartCatalog.Find(kind)!.Pins[1]] = b },
            new PartParameters(p.ToDictionary(x => x.Name, x => x.Value)));

    // Worked case: 1 MΩ from 12 V, 100 µF with 1 µA leakage → 129.93 s (computed from textbook
    // RC charging with a constant drain).
    [Fact]
    public void ReadsTheTimingNetworkAndLeakage()
    {
        var timer = new PartDefinition("U1", "timer-555",
            new Dictionary<string, string> { ["vcc"] = "vcc", ["gnd"] = "gnd", ["threshold"] = "tc", ["discharge"] = "tc", ["trigger"] = "trig", ["output"] = "out", ["reset"] = "vcc" },
            PartParameters.Empty);
        var net = new NetlistDefinition("t", null,
        [
            Two("V1", "voltage-source", "vcc", "gnd", ("constant", 12.0)),
            Two("RT", "resistor", "vcc", "tc", ("value", 1e6)),
            Two("CT", "capacitor", "tc", "gnd", ("value", 100e-6), ("leakageCurrent", 1e-6)),
            timer,
        ]);
        TimerFacts f = Assert.Single(TimerFactsExtractor.Extract(net, n => TimerFactsExtractor.DcSupply(net, n)));
        Assert.Equal(1e6, f.Resistance, 6);
        Assert.Equal(100e-6, f.Capacitance, 12);
        Assert.Equal(12.0, f.SupplyVoltage);
        Assert.Equal(129.93, f.ClosedFormWidth, 2);
    }
}
