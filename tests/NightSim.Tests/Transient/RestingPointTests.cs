using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>The circuit at rest with its discrete states settled, against the plain operating point that keeps the
/// power-up states.</summary>
public sealed class RestingPointTests
{
    // 12 V across 40 kΩ over 80 kΩ puts 8 V on the comparator's plus input against 6 V from two equal resistors on its
    // minus input (voltage dividers, by hand): at rest the comparator's output is high.
    private const string Net = """
        {
          "name": "resting",
          "parts": [
            { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": "12V" },
            { "id": "R1", "kind": "resistor", "nodes": ["vcc", "in"], "value": "40k" },
            { "id": "R2", "kind": "resistor", "nodes": ["in", "gnd"], "value": "80k" },
            { "id": "R3", "kind": "resistor", "nodes": ["vcc", "ref"], "value": "10k" },
            { "id": "R4", "kind": "resistor", "nodes": ["ref", "gnd"], "value": "10k" },
            { "id": "U1", "kind": "comparator", "pins": { "plus": "in", "minus": "ref", "output": "o", "vcc": "vcc", "gnd": "gnd" }, "hysteresis": "0.1V" },
            { "id": "RL", "kind": "resistor", "nodes": ["o", "gnd"], "value": "100k" }
          ]
        }
        """;

    private static Circuit Build() => Circuit.FromDevices("resting", NightRun.CreateDevices(NetlistLoader.LoadText(Net, "resting.json")));

    [Fact]
    public void Comparator_Settles_To_The_Side_Its_Inputs_Say()
    {
        Circuit plain = Build();
        Assert.True(TransientSolver.TrySolveOperatingPoint(plain, TransientOptions.Default, out double[]? x0));
        Assert.True(x0![plain.IndexOf("o")] < 1.0); // the power-up state (low) is kept

        Circuit rest = Build();
        Assert.True(TransientSolver.TrySolveRestingPoint(rest, TransientOptions.Default, out double[]? x1));
        Assert.Equal(8.0, x1![rest.IndexOf("in")], 6);
        Assert.True(x1[rest.IndexOf("o")] > 11.0, $"output {x1[rest.IndexOf("o")]} V");
    }
}
