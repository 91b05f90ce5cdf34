namespace NightSim.Devices.Composite;

/// <summary>A linear conductance between two nodes, for the inside of composites (divider legs, supply current).</summary>
public sealed class FixedConductance : Device
{
    private readonly double _conductance;
    private int _a, _b;
    private PairSlots _slots;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Netlist part id.</param>
    /// <param name="a">First node.</param>
    /// <param name="b">Second node.</param>
    /// <param name="conductance">Conductance, S.</param>
    public FixedConductance(string name, string partId, string a, string b, double conductance)
        : base(name, partId, [a, b])
    {
        _conductance = conductance;
    }

    /// <summary>Conductance, S.</summary>
    public double Conductance => _conductance;

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _b = setup.Node(Nodes[1]);
        _slots = setup.Pair(_a, _b);
    }

    public override void Load(LoadContext ctx)
    {
        ctx.AddCurrent(_a, _b, _conductance * (ctx.V(_a) - ctx.V(_b)));
        _slots.Add(ctx.G, _conductance);
    }
}
