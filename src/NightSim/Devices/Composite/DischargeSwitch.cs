using NightSim.Devices.Behavioural;

namespace NightSim.Devices.Composite;

/// <summary>
/// The timer's discharge transistor as a switch from the discharge pin to gnd that follows its latch: on while q is
/// low, off while q is high, blended geometrically in conductance over the latch's output transition (no event of its
/// own, so it switches exactly with the latch). Same matrix slots in both states.
/// </summary>
public sealed class DischargeSwitch : Device, Roles.IDcElement
{
    private readonly ILogicLevel _latch;
    private readonly double _gOn;
    private readonly double _gOff;
    private int _a, _b;
    private PairSlots _slots;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Netlist part id.</param>
    /// <param name="discharge">Discharge pin node.</param>
    /// <param name="gnd">Ground pin node.</param>
    /// <param name="latch">The latch it follows.</param>
    /// <param name="onResistance">On resistance, Ω.</param>
    /// <param name="offResistance">Off resistance (leakage), Ω.</param>
    public DischargeSwitch(string name, string partId, string discharge, string gnd, ILogicLevel latch, double onResistance, double offResistance)
        : base(name, partId, [discharge, gnd])
    {
        _latch = latch;
        _gOn = 1.0 / onResistance;
        _gOff = 1.0 / offResistance;
    }

    /// <summary>Conductance at run time <paramref name="time"/>, S.</summary>
    /// <summary>While the one-shot times, the switch is off: its off-resistance is a drain at the discharge pin.</summary>
    public void StampDc(Roles.DcNetwork network) => network.Conductance(Nodes[0], Nodes[1], _gOff, drain: true);

    public double Conductance(double time) => _gOff * Math.Pow(_gOn / _gOff, 1.0 - _latch.Level(time));

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _b = setup.Node(Nodes[1]);
        _slots = setup.Pair(_a, _b);
    }

    public override void Load(LoadContext ctx)
    {
        double g = Conductance(ctx.Time);
        ctx.AddCurrent(_a, _b, g * (ctx.V(_a) - ctx.V(_b)));
        _slots.Add(ctx.G, g);
    }
}
