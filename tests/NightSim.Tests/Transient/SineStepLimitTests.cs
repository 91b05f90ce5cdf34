using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>A sine has no corners and a node held by a source carries no error estimate: the step must still follow it.
/// A 50 Hz sine of 5 V crosses +4.5 V twice per period (sin θ = 0.9 twice per cycle, elementary trigonometry), so a
/// comparator on it switches 100 times up and 100 times down in one second.</summary>
public class SineStepLimitTests
{
    [Fact]
    public void ComparatorOnASineSwitchesEveryPeriod()
    {
        const string json = """
        { "name": "sine-comparator", "parts": [
          { "id": "V1", "kind": "voltage-source", "nodes": ["a", "gnd"], "sine": { "amplitude": "5", "frequency": "50" } },
          { "id": "VCC", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": "12" },
          { "id": "R1", "kind": "resistor", "nodes": ["a", "gnd"], "value": "10k" },
          { "id": "U1", "kind": "comparator", "pins": { "plus": "a", "minus": "gnd", "output": "out", "vcc": "vcc", "gnd": "gnd" }, "offset": "4.5" },
          { "id": "RL", "kind": "resistor", "nodes": ["out", "gnd"], "value": "10k" } ] }
        """;
        SimulationResult r = TransientSolver.Run(Circuit.Build(NetlistLoader.LoadText(json)), 1.0);
        Assert.True(r.Succeeded, r.Failure?.ToString());
        int switches = r.Events.Count(e => e.Device == "U1");
        Assert.InRange(switches, 99, 100); // the last fall may land after t = 1 s
        Assert.True(r.Statistics.MaxStep <= 1.0 / (20 * 50) * 1.0001);
    }
}
