using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Demos;

/// <summary>Examples are tests: every netlist in netlists/ loads and runs a short span from power-up.</summary>
public class ExampleNetlistsRunTests
{
    public static TheoryData<string> Examples()
    {
        var data = new TheoryData<string>();
        foreach (string f in RepoPaths.ExampleNetlists) data.Add(Path.GetFileName(f));
        return data;
    }

    [Theory]
    [MemberData(nameof(Examples))]
    public void RunsTwoSecondsFromPowerUp(string file)
    {
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, file));
        SimulationResult r = TransientSolver.Run(Circuit.Build(net), 2.0, TransientOptions.Default with { ConstantLux = 100 });
        Assert.True(r.Succeeded, r.Failure?.ToString());
        Assert.True(r.Statistics.AcceptedSteps > 2);
        // Every node voltage stays finite and within the circuit's own supply range (no runaway).
        Assert.All(r.Traces, t => Assert.All(t.Values, v => Assert.InRange(v, -1e3, 1e3)));
    }
}
