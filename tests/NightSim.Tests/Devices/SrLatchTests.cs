using NightSim.Devices;
using NightSim.Results;

namespace NightSim.Tests.Devices;

public sealed class SrLatchTests
{
    // Set-reset latch truth table (textbook digital logic, common practice): set → q high, reset → q low, neither →
    // hold, both → the dominant input wins (reset by default).
    private static (SrLatch Latch, StampHarness H, LoadContext Ctx) Make(bool resetDominant, bool withClear = false)
    {
        var h = new StampHarness("s", "r", "c", "q", "nq", "v");
        var latch = new SrLatch("L1", "L1", "s", "r", withClear ? "c" : null, "q", "nq", "v", "gnd",
            new SrLatchSettings(ResetDominant: resetDominant, Hysteresis: 0.1));
        latch.Setup(h);
        latch.PowerUp();
        var ctx = new LoadContext(h.Unknowns, h.SlotCount);
        ctx.X[5] = 12.0;
        return (latch, h, ctx);
    }

    /// <summary>Drive input node <paramref name="node"/> to <paramref name="volts"/> and fire the input's event if it
    /// crossed, as the solver would.</summary>
    private static void Drive(SrLatch latch, LoadContext ctx, int input, int node, double volts, EventSink sink)
    {
        ctx.X[node] = volts;
        if (latch.EventValue(input, ctx) > 0) latch.OnEvent(input, ctx, sink);
    }

    [Fact]
    public void Reset_Dominant_Truth_Table()
    {
        var (latch, _, ctx) = Make(resetDominant: true);
        var sink = new BlockBench.Sink();
        Drive(latch, ctx, 0, 0, 12.0, sink);
        Assert.True(latch.IsSet);
        Drive(latch, ctx, 0, 0, 0.0, sink);
        Assert.True(latch.IsSet);                       // hold
        Drive(latch, ctx, 1, 1, 12.0, sink);
        Assert.False(latch.IsSet);                      // reset
        Drive(latch, ctx, 0, 0, 12.0, sink);
        Assert.False(latch.IsSet);                      // both: reset wins
        Drive(latch, ctx, 1, 1, 0.0, sink);
        Assert.True(latch.IsSet);                       // reset released, set still active
        Assert.Equal(["L1 q low->high", "L1 q high->low", "L1 q low->high"], sink.Changes);
    }

    [Fact]
    public void Set_Dominant_When_Asked_And_Clear_Dominates_Both()
    {
        var (latch, _, ctx) = Make(resetDominant: false, withClear: true);
        var sink = new BlockBench.Sink();
        Drive(latch, ctx, 1, 1, 12.0, sink);
        Drive(latch, ctx, 0, 0, 12.0, sink);
        Assert.True(latch.IsSet);                       // both: set wins
        Drive(latch, ctx, 2, 2, 12.0, sink);
        Assert.False(latch.IsSet);                      // clear wins over set
        Drive(latch, ctx, 2, 2, 0.0, sink);
        Assert.True(latch.IsSet);
    }

    [Fact]
    public void Inputs_Switch_At_Half_Supply_With_Hysteresis_And_Outputs_Stamp_Their_Jacobian()
    {
        var (latch, h, ctx) = Make(resetDominant: true);
        ctx.X[0] = 6.04;
        Assert.True(latch.EventValue(0, ctx) < 0);      // below 6 V + 0.05 V
        ctx.X[0] = 6.06;
        Assert.True(latch.EventValue(0, ctx) > 0);
        h.AssertJacobians(latch, [0.0, 0.0, 0.0, 4.0, 7.0, 12.0], 0.0);
        LoadContext at = h.Load(latch, [0.0, 0.0, 0.0, 4.0, 7.0, 12.0]);
        Assert.Equal(4.0 / 100.0, at.J[3], 12);          // q low: pulled to 0 V through 100 Ω
        Assert.Equal((7.0 - 12.0) / 100.0, at.J[4], 12); // not-q high: pulled to 12 V
    }

    [Fact]
    public void Transient_Set_Then_Reset_Then_Both()
    {
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            BlockBench.Pwl("VS", "s", (0, 0), (0.010, 0), (0.0101, 12), (0.020, 12), (0.0201, 0), (0.040, 0), (0.0401, 12)),
            BlockBench.Pwl("VR", "r", (0, 0), (0.030, 0), (0.0301, 12)),
            new SrLatch("L1", "L1", "s", "r", null, "q", "nq", "v", "gnd", new SrLatchSettings()),
        ], 0.05);
        List<DiscreteEvent> q = r.Events.Where(e => e.Device == "L1").ToList();
        Assert.Equal(2, q.Count);
        Assert.Equal("high", q[0].To);
        Assert.Equal(0.01005 + 0.0001 * 0.05 / 12, q[0].Time, 1e-6);   // set crosses 6.05 V on its 12 V/0.1 ms edge
        Assert.Equal("low", q[1].To);
        Assert.Equal(0.03005 + 0.0001 * 0.05 / 12, q[1].Time, 1e-6);
        Assert.Equal(0.0, r.Trace("q")!.At(0.049), 1e-6);                // both active at 40 ms: reset wins
        Assert.Equal(12.0, r.Trace("nq")!.At(0.049), 1e-6);
    }
}
