using NightSim.Devices;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Devices;

public sealed class ComparatorTests
{
    private static Comparator Make(ComparatorSettings settings) =>
        new("X1", "X1", "p", "m", "o", "v", "gnd", settings);

    [Fact]
    public void PushPull_Output_Stamps_Its_Jacobian_During_A_Transition()
    {
        var h = new StampHarness("p", "m", "o", "v");
        Comparator c = Make(new ComparatorSettings(Transition: 1e-6));
        c.Setup(h);
        c.PowerUp();
        var sink = new BlockBench.Sink();
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { Time = 1.0 };
        c.OnEvent(0, ctx, sink);
        // Half-way through the ramp: level 6 V of a 12 V supply, output loaded at 3 V.
        double[] x = [5.0, 4.0, 3.0, 12.0];
        LoadContext at = h.Load(c, x, 1.0 + 0.5e-6);
        Assert.Equal((3.0 - 6.0) / 100.0, at.J[2], 9);            // Norton: (V_o − level)/R_out
        Assert.Equal(-(3.0 - 6.0) / 100.0 * 0.5, at.J[3], 9);     // half of it returns through vcc
        h.AssertJacobians(c, x, 1.0 + 0.5e-6);
        Assert.Equal(["X1 output low->high"], sink.Changes);
        Assert.Equal([1.0 + 1e-6], sink.Breakpoints);
    }

    [Fact]
    public void OpenCollector_Sinks_When_Low_And_Releases_When_High()
    {
        var h = new StampHarness("p", "m", "o", "v");
        Comparator c = Make(new ComparatorSettings(OpenCollector: true, OutputResistance: 10.0, OffResistance: 1e9));
        c.Setup(h);
        c.PowerUp();
        double[] x = [0.0, 1.0, 5.0, 12.0];
        Assert.Equal(0.5, h.Load(c, x).J[2], 12);
        h.AssertJacobians(c, x);
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { Time = 0.0 };
        c.OnEvent(0, ctx, new BlockBench.Sink());
        Assert.Equal(5e-9, h.Load(c, x, 1.0).J[2], 15);
    }

    [Fact]
    public void Event_Function_Uses_A_State_Dependent_Threshold()
    {
        var h = new StampHarness("p", "m", "o", "v");
        Comparator c = Make(new ComparatorSettings(Hysteresis: 0.2, Offset: 0.1));
        c.Setup(h);
        c.PowerUp();
        var ctx = new LoadContext(h.Unknowns, h.SlotCount);
        // d = V+ − V− − offset; low: g = d − 0.1, high: g = −(d + 0.1).
        ctx.X[0] = 5.15; ctx.X[1] = 5.0;
        Assert.Equal(-0.05, c.EventValue(0, ctx), 12);
        ctx.X[0] = 5.25;
        Assert.True(c.EventValue(0, ctx) > 0);
        c.OnEvent(0, ctx, new BlockBench.Sink());
        Assert.True(c.OutputHigh);
        Assert.True(c.EventValue(0, ctx) < 0);              // consistent again right after the flip
        ctx.X[0] = 4.95;                                    // d = −0.15 < −0.1: must flip back
        Assert.True(c.EventValue(0, ctx) > 0);
        ctx.X[0] = 5.05;                                    // inside the band: holds
        Assert.True(c.EventValue(0, ctx) < 0);
    }

    [Fact]
    public void Delay_Is_Inertial_And_Scheduled_As_A_Breakpoint()
    {
        var h = new StampHarness("p", "m", "o", "v");
        Comparator c = Make(new ComparatorSettings(Delay: 1e-3));
        c.Setup(h);
        c.PowerUp();
        Assert.Equal(2, c.EventCount);
        var sink = new BlockBench.Sink();
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { Time = 2.0 };
        Assert.Equal(-1.0, c.EventValue(1, ctx));
        c.OnEvent(0, ctx, sink);
        Assert.False(c.OutputHigh);
        Assert.Equal([2.001], sink.Breakpoints);
        Assert.Equal(2.001, c.NextBreakpoint(2.0), 12);
        ctx.Time = 2.0005;
        Assert.True(c.EventValue(1, ctx) < 0);
        ctx.Time = 2.001;
        c.OnEvent(1, ctx, sink);
        Assert.True(c.OutputHigh);
        Assert.Equal(["X1 output low->high"], sink.Changes);

        // An input that crosses back within the delay cancels the change.
        ctx.Time = 3.0;
        c.OnEvent(0, ctx, sink);
        ctx.Time = 3.0004;
        c.OnEvent(0, ctx, sink);
        Assert.Equal(-1.0, c.EventValue(1, ctx));
        Assert.True(c.OutputHigh);
    }

    // Slow triangle 0 → 10 V → 0 at 1 V/s on V+, V− at 5 V, hysteresis 0.2 V: the output switches exactly once each
    // way, at 5.1 V going up (t = 5.1 s) and 4.9 V going down (t = 15.1 s). Thresholds are the definition of a
    // comparator with hysteresis (common practice); ±1 mV at 1 V/s is ±1 ms, asserted here to 1 µs whatever the
    // largest step was.
    [Theory]
    [InlineData(1.0)]
    [InlineData(0.05)]
    [InlineData(3.0)]
    public void Slow_Ramp_Switches_Once_Each_Way_At_The_Thresholds(double maxStep)
    {
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            BlockBench.Pwl("VP", "p", (0, 0), (10, 10), (20, 0)),
            BlockBench.Dc("VM", "m", 5.0),
            new Comparator("X1", "X1", "p", "m", "o", "v", "gnd", new ComparatorSettings(Hysteresis: 0.2)),
            new Resistor("RL", "RL", "o", "gnd", 10e3),
        ], 20.0, TransientOptions.Default with { MaxStep = maxStep });

        List<DiscreteEvent> events = r.Events.Where(e => e.Device == "X1").ToList();
        Assert.Equal(2, events.Count);
        Assert.Equal("high", events[0].To);
        Assert.Equal(5.1, events[0].Time, 1e-6);
        Assert.Equal("low", events[1].To);
        Assert.Equal(15.1, events[1].Time, 1e-6);
        // The output level follows the supply rail: 12 V through 100 Ω into 10 kΩ.
        Assert.Equal(12.0 * 10e3 / 10.1e3, r.Trace("o")!.At(10.0), 1e-3);
    }

    [Fact]
    public void Delay_Shifts_The_Output_Change()
    {
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            BlockBench.Pwl("VP", "p", (0, 0), (10, 10)),
            BlockBench.Dc("VM", "m", 5.0),
            new Comparator("X1", "X1", "p", "m", "o", "v", "gnd", new ComparatorSettings(Hysteresis: 0.0 + 1e-3, Delay: 0.25)),
        ], 10.0);
        List<double> up = BlockBench.Times(r, "X1", "output", "high");
        Assert.Single(up);
        Assert.Equal(5.0005 + 0.25, up[0], 1e-6);
    }

    [Fact]
    public void Kind_Reads_Parameters_With_Defaults()
    {
        var pins = new Dictionary<string, string> { ["plus"] = "p", ["minus"] = "m", ["output"] = "o", ["vcc"] = "v", ["gnd"] = "gnd" };
        var c = (Comparator)Assert.Single(Comparator.Kind.Create(BlockBench.Part("X1", "comparator", pins,
            new() { ["hysteresis"] = 0.05, ["delay"] = 2e-3 }, new() { ["outputType"] = "open-collector" })));
        Assert.Equal(0.05, c.Settings.Hysteresis);
        Assert.Equal(2e-3, c.Settings.Delay);
        Assert.True(c.Settings.OpenCollector);
        Assert.Equal(1e-6, c.Settings.Transition);      // default
        Assert.Equal(100.0, c.Settings.OutputResistance);
        Assert.Equal(2, c.EventCount);
        Assert.Contains(Comparator.Kind, PartCatalog.All);
    }

    // A comparator part defaults to an open-collector output, the usual comparator part in a dusk detector (common
    // practice); push-pull only when stated. Released, the open collector leaves its output to the pull-up:
    // 12 V through 10 kΩ into the 1 GΩ off-resistance reads 12·1e9/(1e9 + 1e4) V.
    [Fact]
    public void Part_Defaults_To_Open_Collector()
    {
        var pins = new Dictionary<string, string> { ["plus"] = "p", ["minus"] = "m", ["output"] = "o", ["vcc"] = "v", ["gnd"] = "gnd" };
        var plain = (Comparator)Assert.Single(Comparator.Kind.Create(BlockBench.Part("X1", "comparator", pins)));
        Assert.True(plain.Settings.OpenCollector);
        var pushPull = (Comparator)Assert.Single(Comparator.Kind.Create(BlockBench.Part("X1", "comparator", pins, texts: new() { ["outputType"] = "push-pull" })));
        Assert.False(pushPull.Settings.OpenCollector);

        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            BlockBench.Pwl("VP", "p", (0, 0), (10, 10)),
            BlockBench.Dc("VM", "m", 5.0),
            new Resistor("RP", "RP", "v", "o", 10e3),
            plain,
        ], 10.0);
        Assert.Equal(12.0 * 100.0 / (100.0 + 10e3), r.Trace("o")!.At(2.0), 1e-4);   // sinking: 10 kΩ into its 100 Ω
        Assert.Equal(12.0 * 1e9 / (1e9 + 1e4), r.Trace("o")!.At(8.0), 1e-6);
    }
}
