using NightSim.Devices;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>
/// Skipping identical cycles of a relay chattering at dusk (docs/numerics.md §10) against the same run with every cycle
/// simulated: the reference is the full simulation itself (the skipping method tends to it as the jumps shrink), held to
/// the operation count within 5 % and the start and end of the burst within 1 s.
/// </summary>
public sealed class OscillationSkippingTests
{
    /// <summary>A dusk compressed to under a minute: the sky at the sensor falls exponentially from 1.75 lx, through
    /// the band where the self-lit demo's lamp (0.8 lx on its own sensor) makes it chatter, to below it.</summary>
    private sealed class FastDusk : ILightSignal
    {
        public const double StartLux = 1.75, Rate = 0.02; // 1/s
        public DateTimeOffset Origin => new(2026, 11, 20, 17, 0, 0, TimeSpan.FromHours(1));
        public int ChannelIndex(string name) => name == LightScenario.DefaultChannel ? 0 : -1;
        public double Lux(int channel, double time) => StartLux * Math.Exp(-Rate * time);
        public double NextBreakpoint(double time) => double.PositiveInfinity;
        public double StepLimit(double time, double change) => change / Rate;
    }

    private static (SimulationResult Result, List<DiscreteEvent> Ons, List<DiscreteEvent> Offs) Run(bool skipping)
    {
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "dusk-switch-self-lit.json"));
        List<Device> devices = NightRun.CreateDevices(net);
        var relay = (Relay)devices.Single(d => d.PartId == "K1");
        var light = new CoupledLightSignal(new FastDusk(), [(0, () => relay.LoadOn, 0.8)]);
        Circuit circuit = Circuit.FromDevices(net.Name, devices, light);
        var options = TransientOptions.Default with { OscillationSkipping = skipping };
        SimulationResult result = new TransientSolver(circuit, options, light).Run(60.0);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        return (result, [.. result.Events.Where(e => e.Kind == DeviceEventKind.LoadOn)],
            [.. result.Events.Where(e => e.Kind == DeviceEventKind.LoadOff)]);
    }

    [Fact]
    public void Skipped_Cycles_Keep_The_Operation_Count_And_The_Burst_Edges()
    {
        var (full, fullOn, fullOff) = Run(skipping: false);
        var (fast, fastOn, fastOff) = Run(skipping: true);

        // The reference chatters for real: hundreds of operations.
        Assert.True(fullOn.Count > 100, $"{fullOn.Count} switch-ons in the full run");
        Assert.True(fullOff[^1].Time < 55.0, "the burst ends within the run");
        Assert.Equal(0, full.Statistics.OscillationJumps);
        Assert.True(fast.Statistics.OscillationJumps > 0 && fast.Statistics.SkippedOscillationCycles > fullOn.Count / 3,
            $"{fast.Statistics.OscillationJumps} jumps over {fast.Statistics.SkippedOscillationCycles} cycles");
        Assert.True(fast.Statistics.AcceptedSteps < full.Statistics.AcceptedSteps / 2,
            $"{fast.Statistics.AcceptedSteps} steps against {full.Statistics.AcceptedSteps}");

        // Operation count within 5 %.
        Assert.InRange(fastOn.Count, 0.95 * fullOn.Count, 1.05 * fullOn.Count);
        // Start and end of the burst within 1 s: the first switch-on, the last switch-off.
        Assert.InRange(fastOn[0].Time - fullOn[0].Time, -1.0, 1.0);
        Assert.InRange(fastOff[^1].Time - fullOff[^1].Time, -1.0, 1.0);
        // Every skipped cycle's events are there, in time order.
        for (int i = 1; i < fast.Events.Count; i++) Assert.True(fast.Events[i].Time >= fast.Events[i - 1].Time);
    }

    [Fact]
    public void A_Night_Without_Oscillation_Never_Skips()
    {
        NightRunResult r = NightRun.Run(NightSim.Studies.BenchWorkload.Demo(RepoPaths.Netlists, "garden-path"));
        Assert.Equal(0, r.Simulation.Statistics.OscillationJumps);
    }
}
