using NightSim.Mna;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;

namespace NightSim.Tests.Supply;

/// <summary>
/// Envelope following (Petzold, "An efficient numerical method for highly oscillatory ordinary differential
/// equations", SIAM J. Numer. Anal. 18(3), 1981) against full mains detail over the same 30 s: a 230 V / 50 Hz bridge
/// dropper (47 Ω, 470 nF, 470 µF, 12 V Zener, 1 kΩ standby load) whose rail a 400 Ω relay coil is switched onto at
/// 15 s. Average rail within 2 %, the sag minimum after the switch within 5 %, the relay's operate time (switch to
/// pull-in) within 10 %, and the envelope run must actually skip cycles.
/// </summary>
public sealed class EnvelopeAccuracyTests
{
    private const double SwitchAt = 15.0, Stop = 30.0;

    private static Circuit Dropper() => Circuit.FromDevices("dropper-relay", RelayDropperCircuit.Devices(SwitchAt));

    private sealed record Measured(double Average, double SagMin, double OperateTime, long Skipped);

    private static Measured Run(bool envelope)
    {
        var options = TransientOptions.Default with { EnvelopeFollowing = envelope };
        var meter = SupplyMeter.Run(Dropper(), Stop, 0.0, "dcp", "gnd", options: options);
        Assert.True(meter.Result.Succeeded, meter.Result.Failure?.ToString());
        var pull = meter.Result.Events.First(e => e.PartId == "K1" && e.Signal == "coil" && e.To == "pulled in");
        var rail = meter.Result.Trace("dcp")!;
        double sag = double.PositiveInfinity;
        for (int i = 0; i < rail.Times.Count; i++)
            if (rail.Times[i] > SwitchAt) sag = Math.Min(sag, rail.Values[i]);
        return new Measured(meter.Average, sag, pull.Time - SwitchAt, meter.Result.Statistics.SkippedCycles);
    }

    [Fact]
    public void Envelope_Run_Matches_Full_Detail_On_Rail_Sag_And_Operate_Time()
    {
        Measured full = Run(envelope: false);
        Measured fast = Run(envelope: true);
        Assert.Equal(0, full.Skipped);
        Assert.True(fast.Skipped > 0, "the envelope run skipped no cycles");
        Assert.InRange(fast.Average, 0.98 * full.Average, 1.02 * full.Average);
        Assert.InRange(fast.SagMin, 0.95 * full.SagMin, 1.05 * full.SagMin);
        Assert.InRange(fast.OperateTime, 0.9 * full.OperateTime, 1.1 * full.OperateTime);
    }
}
