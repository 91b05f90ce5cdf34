using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>A capacitor's initial voltage is v(p) − v(n) at power-up, whichever side is grounded and in whatever order the
/// parts come (definition of the capacitor voltage; Kirchhoff's voltage law along the chain).</summary>
public class CapacitorStartVoltageTests
{
    private static double StartVoltage(IEnumerable<Device> devices, string node)
    {
        SimulationResult r = TransientSolver.Run(Circuit.FromDevices("c", devices), 1e-6);
        Assert.True(r.Succeeded, r.Failure?.ToString());
        return r.Trace(node)!.Values[0];
    }

    [Fact]
    public void GroundedPositiveSideGivesANegativeNode() =>
        Assert.Equal(-5.0, StartVoltage([
            new Capacitor("C1", "C1", "gnd", "out", 1e-6, initialVoltage: 5.0),
            new Resistor("R1", "R1", "out", "gnd", 1e9)], "out"), 6);

    [Fact]
    public void ChainSettlesWhateverThePartOrder() =>
        Assert.Equal(5.0, StartVoltage([
            new Capacitor("C2", "C2", "top", "mid", 1e-6, initialVoltage: 2.0),
            new Capacitor("C1", "C1", "mid", "gnd", 1e-6, initialVoltage: 3.0),
            new Resistor("R1", "R1", "top", "gnd", 1e9)], "top"), 6);
}
