namespace NightSim.Devices.Composite;

/// <summary>A constant current from node <c>from</c> through the device into node <c>to</c> (input bias and leakage
/// currents inside composites). Scaled by the source scale like an independent source.</summary>
public sealed class BiasCurrent : Device
{
    private readonly double _current;
    private int _from, _to;

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

    public override void Setup(SetupContext setup)
    {
        _from = setup.Node(Nodes[0]);
        _to = setup.Node(Nodes[1]);
    }

    public override void Load(LoadContext ctx) => ctx.AddCurrent(_from, _to, _current * ctx.SourceScale);
}
