using NightSim.Devices;

namespace NightSim.Tests.Fixtures;

/// <summary>
/// Test-only event source: watches v(sense) against a threshold and, once it rises above, connects a load resistance
/// between nodes a and b (a discrete state change). Optionally follows another switch instead (fires when that one has
/// switched), to exercise logic passes at one event time.
/// </summary>
internal sealed class ThresholdSwitch : Device, IEventSource
{
    private readonly double _threshold;
    private readonly double _load;
    private readonly ThresholdSwitch? _follow;
    private int _sense;
    private int _a;
    private int _b;
    private PairSlots _slots;

    public ThresholdSwitch(string name, string sense, string a, string b, double threshold, double load, ThresholdSwitch? follow = null)
        : base(name, name, [sense, a, b])
    {
        _threshold = threshold;
        _load = load;
        _follow = follow;
    }

    public bool IsOn { get; private set; }

    public int EventCount => 1;

    public override void Setup(SetupContext setup)
    {
        _sense = setup.Node(Nodes[0]);
        _a = setup.Node(Nodes[1]);
        _b = setup.Node(Nodes[2]);
        _slots = setup.Pair(_a, _b);
    }

    public override void PowerUp() => IsOn = false;

    public override void Load(LoadContext ctx)
    {
        double g = IsOn ? 1.0 / _load : 1e-12;
        ctx.AddCurrent(_a, _b, g * (ctx.V(_a) - ctx.V(_b)));
        _slots.Add(ctx.G, g);
    }

    public double EventValue(int index, LoadContext ctx)
    {
        if (IsOn) return 1.0; // latched on
        if (_follow is not null) return _follow.IsOn ? 1.0 : -1.0;
        return ctx.V(_sense) - _threshold;
    }

    public void OnEvent(int index, LoadContext ctx, EventSink events)
    {
        if (IsOn) return;
        IsOn = true;
        events.Record(this, "output", "off", "on");
    }
}
