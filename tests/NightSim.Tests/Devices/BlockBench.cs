using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Devices;

/// <summary>Helpers for the behavioural-block tests: a recording event sink and transient runs on device lists.</summary>
internal static class BlockBench
{
    /// <summary>Collects recorded changes and requested breakpoints.</summary>
    internal sealed class Sink : EventSink
    {
        public List<string> Changes { get; } = [];

        public List<double> Breakpoints { get; } = [];

        public override void Record(Device device, string signal, string from, string to, NightSim.Results.DeviceEventKind kind) => Changes.Add($"{device.Name} {signal} {from}->{to}");

        public override void RequestBreakpoint(double time) => Breakpoints.Add(time);
    }

    /// <summary>Run the devices from power-up to <paramref name="stop"/> seconds; asserts success.</summary>
    public static SimulationResult Run(IEnumerable<Device> devices, double stop, TransientOptions? options = null)
    {
        Circuit circuit = Circuit.FromDevices("test", devices);
        SimulationResult result = TransientSolver.Run(circuit, stop, options);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        return result;
    }

    /// <summary>Times of the events of <paramref name="device"/> on <paramref name="signal"/> that went to <paramref name="to"/>.</summary>
    public static List<double> Times(SimulationResult result, string device, string signal, string to) =>
        result.Events.Where(e => e.Device == device && e.Signal == signal && e.To == to).Select(e => e.Time).ToList();

    /// <summary>A part definition built in code (no loader), with numbers and words.</summary>
    public static PartDefinition Part(string id, string kind, Dictionary<string, string> pins,
        Dictionary<string, double>? numbers = null, Dictionary<string, string>? texts = null,
        Dictionary<string, IReadOnlyList<(double X, double Y)>>? points = null) =>
        new(id, kind, pins, new PartParameters(numbers, texts, points: points));

    /// <summary>Ideal voltage source (DC) between node and ground.</summary>
    public static VoltageSource Dc(string name, string node, double volts) => new(name, name, node, "gnd", Waveform.Dc(volts));

    /// <summary>Piecewise-linear voltage source between node and ground.</summary>
    public static VoltageSource Pwl(string name, string node, params (double T, double V)[] points) =>
        new(name, name, node, "gnd", Waveform.PiecewiseLinear(points.Select(p => (p.T, p.V)).ToList()));
}
