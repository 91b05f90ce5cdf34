namespace NightSim.Devices.Composite;

/// <summary>A bias current from node <c>from</c> through the device into node <c>to</c> (input bias and leakage
/// currents inside composites): I·tanh(v/0.05 V) with v = V(from) − V(to), so it is the constant I once the pin sits
/// more than ≈ 0.15 V inside its supply, and it vanishes instead of pushing a high-impedance node beyond the rail (an
/// ideal constant current drove a reset pin held by 1 µF to 112 V). Scaled by the source scale like an independent
/// source.</summary>
public sealed class BiasCurrent : Device, Roles.IDcElement
{
    private readonly double _current;
    /// <summary>Voltage scale of the smooth limit, volts.</summary>
    public const double VoltageScale = 0.05;

    private int _from, _to;
    private PairSlots _slots;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Netlist part id.</param>
    /// <param name="from">Node the current leaves.</param>
    /// <param name="to">Node the current enters.</param>
    /// <param name="current">Current, A.</param>
    public BiasCurrent(string name, string partId, string from, string to, double current)
        : base(name, partId, [from, to])
    {
        _current = current;
    }

    /// <summary>Current, A.</summary>
    public double Current => _current;

    public void StampDc(Roles.DcNetwork network) => network.Current(Nodes[0], Nodes[1], _current, drain: true);

    public override void Setup(SetupContext setup)
    {
        _from = setup.Node(Nodes[0]);
        _to = setup.Node(Nodes[1]);
        _slots = setup.Pair(_from, _to);
    }

    public override void Load(LoadContext ctx)
    {
        double i0 = _current * ctx.SourceScale;
        double th = Math.Tanh((ctx.V(_from) - ctx.V(_to)) / VoltageScale);
        ctx.AddCurrent(_from, _to, i0 * th);
        _slots.Add(ctx.G, i0 * (1.0 - th * th) / VoltageScale);
    }
}
