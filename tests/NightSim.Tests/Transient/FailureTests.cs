using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>Runs that cannot go on stop with a <see cref="NightSim.Results.SimulationFailure"/> saying when, where and what to try.</summary>
public sealed class FailureTests
{
    /// <summary>Two flip-flops that each switch when the other did (a ring without delay): from t = 0.5 s every firing
    /// makes the other function change sign again, an endless logic loop.</summary>
    private sealed class Ring : Device, IEventSource
    {
        private bool _a;
        private bool _b;
        public Ring() : base("T1", "T1", ["a"]) { }
        public int EventCount => 2;
        public override void Setup(SetupContext setup) { }
        public override void Load(LoadContext ctx) { }
        public double EventValue(int index, LoadContext ctx) =>
            ctx.Time < 0.5 ? -1 : index == 0 ? (_a == _b ? 1 : -1) : (_a != _b ? 1 : -1);
        public void OnEvent(int index, LoadContext ctx, EventSink events)
        {
            if (index == 0) _a = !_a; else _b = !_b;
            events.Record(this, index == 0 ? "a" : "b", "low", "high");
        }
    }

    [Fact]
    public void An_Endless_Switching_Loop_Fails_With_Time_Device_And_Hint()
    {
        var circuit = Circuit.FromDevices("zeno",
        [
            new Resistor("R1", "R1", "a", "gnd", 1e3),
            new Capacitor("C1", "C1", "a", "gnd", 1e-6, initialVoltage: 1),
            new Ring(),
        ]);
        var result = TransientSolver.Run(circuit, 1.0);
        Assert.False(result.Succeeded);
        Assert.Contains("endless switching loop", result.Failure!.Reason, StringComparison.Ordinal);
        Assert.Contains("T1", result.Failure.WorstNodes);
        Assert.InRange(result.Failure.Time, 0.5 - 1e-6, 0.5 + 1e-6);
        Assert.False(string.IsNullOrWhiteSpace(result.Failure.Hint));
        Assert.Equal(result.Failure.Time, result.StopTime);
    }
}
