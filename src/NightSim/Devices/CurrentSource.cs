using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Independent current source: I(t)·SourceScale flows from node p through the source to node n, i.e. it is drawn out
/// of the circuit at p and pushed into the circuit at n.
/// </summary>
public sealed class CurrentSource : Device
{
    private int _p;
    private int _n;

    public CurrentSource(string name, string partId, string nodeP, string nodeN, Waveform waveform)
        : base(name, partId, [nodeP, nodeN])
    {
        Waveform = waveform;
    }

    /// <summary>Netlist kind "current-source": nodes [from, to], one of constant, pulse, sine, points in amperes.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "current-source",
        Description = "Independent current source (constant, pulse, sine or points); current flows through it from nodes[0] to nodes[1].",
        Pins = ["p", "n"],
        PinsThatMustDiffer = ["p", "n"],
        UsesNodeList = true,
        Parameters = Waveform.Specs("A", 1e3),
        Check = Waveform.CheckChoice,
        Create = def => [new CurrentSource(def.Id, def.Id, def.Node("p"), def.Node("n"), Waveform.FromParameters(def.Parameters))],
        ConductsDc = false,
    };

    /// <summary>Source value against time, amperes.</summary>
    public Waveform Waveform { get; }

    public override void Setup(SetupContext setup)
    {
        _p = setup.Node(Nodes[0]);
        _n = setup.Node(Nodes[1]);
    }

    public override void Load(LoadContext ctx) => ctx.AddCurrent(_p, _n, Waveform.Value(ctx.Time) * ctx.SourceScale);

    public override double NextBreakpoint(double time) => Waveform.NextBreakpoint(time);

    public override double MaxStep => Waveform.MaxStep;
}
