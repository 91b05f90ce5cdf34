using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class SwitchTests
{
    private sealed class RecordingSink : EventSink
    {
        public List<string> Changes { get; } = [];

        public override void Record(Device device, string signal, string from, string to, NightSim.Results.DeviceEventKind kind) => Changes.Add($"{device.Name} {signal} {from}->{to}");

        public override void RequestBreakpoint(double time) { }
    }

    [Fact]
    public void Stamps_The_Same_Slots_Open_And_Closed()
    {
        var h = new StampHarness("a", "b");
        var s = new Switch("S1", "S1", "a", "b", 0.1, 1e8, initiallyClosed: false, [(10.0, 1.0)]);
        s.Setup(h);
        s.PowerUp();
        Assert.Equal(4, h.SlotCount);
        LoadContext open = h.Load(s, [1.0, 0.0]);
        Assert.Equal(1e-8, open.J[0], 1e-20);
        h.AssertJacobians(s, [1.0, 0.0]);

        var sink = new RecordingSink();
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { Time = 10.0 };
        Assert.True(s.EventValue(0, ctx) >= 0);
        s.OnEvent(0, ctx, sink);
        Assert.True(s.IsClosed);
        Assert.Equal(["S1 contact open->closed"], sink.Changes);
        LoadContext closed = h.Load(s, [1.0, 0.0]);
        Assert.Equal(10.0, closed.J[0], 12);
        Assert.Equal(-1.0, s.EventValue(0, ctx));
    }

    [Fact]
    public void Schedule_Gives_Breakpoints_And_Entries_At_Zero_Apply_At_Power_Up()
    {
        var s = new Switch("S1", "S1", "a", "b", 0.1, 1e8, initiallyClosed: false, [(0.0, 1.0), (3600.0, 0.0)]);
        s.PowerUp();
        Assert.True(s.IsClosed);
        Assert.Equal(3600.0, s.NextBreakpoint(0));
        Assert.Equal(double.PositiveInfinity, s.NextBreakpoint(3600.0));
        var ctx = new LoadContext(2, 4) { Time = 100 };
        Assert.True(s.EventValue(0, ctx) < 0);
    }
}
