using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Independent voltage source: v_p − v_n = V(t)·SourceScale. Branch unknown i (A) flows from p through the source to n
/// (a source delivering power has i &lt; 0).
/// </summary>
public sealed class VoltageSource : Device
{
    private BranchSlots _branch;

    public VoltageSource(string name, string partId, string nodeP, string nodeN, Waveform waveform)
        : base(name, partId, [nodeP, nodeN])
    {
        Waveform = waveform;
        if (waveform.Shape == WaveformShape.Dc && Netlist.Ground.Is(nodeN)) Role = new Roles.FixedSupplyRole(partId, nodeP, waveform.Value(0.0));
        else if (waveform.Shape == WaveformShape.Sine && waveform.SineFrequency > 0)
            Role = new Roles.SineSourceRole(partId, nodeP, nodeN, waveform.SineAmplitude, waveform.SineFrequency, name + ".i") { Offset = waveform.SineOffset, Start = waveform.SineStart };
    }

    /// <summary>Netlist kind "voltage-source": nodes [p, n] (p is +), one of constant, pulse, sine, points in volts.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "voltage-source",
        Description = "Independent voltage source (constant, pulse, sine or points); nodes [+, −].",
        Pins = ["p", "n"],
        UsesNodeList = true,
        Parameters = Waveform.Specs("V", 1e6, " CAUTION: a mains sine (50 V or more) makes the design non-isolated, with a lethal voltage on every node; NightSim then prints the mains cautions."),
        Notes = MainsNote,
        Check = Waveform.CheckChoice,
        Create = def => [new VoltageSource(def.Id, def.Id, def.Node("p"), def.Node("n"), Waveform.FromParameters(def.Parameters))],
        ConductsDc = true,
        IsVoltageSource = true,
        FacesMains = def => Waveform.FromParameters(def.Parameters).PeakMagnitude >= PartKind.MainsVoltage,
    };

    /// <summary>The mains caution beside the sine source in the part-kind reference. The run prints the full cautions
    /// (Supply.MainsExposure) for every netlist with a source of 50 V or more.</summary>
    private const string MainsNote =
        "**Caution: mains.** A voltage source of 50 V or more — a mains `sine` (230 V: amplitude 325 V; 120 V: 170 V), " +
        "or a `constant`, `pulse` or `points` level that reaches 50 V — stands for a circuit that is NOT isolated from " +
        "the mains: every node, the light sensor included, can carry a lethal voltage while it is plugged in. `check`, " +
        "`simulate`, report.json and report.html then print the mains cautions: fit a fuse in the live feed, use an " +
        "X2-class dropper capacitor rated for the mains with a bleeder resistor across it, build it into a closed " +
        "insulating enclosure, and never touch or adjust it while connected. NightSim is not a safety assessment: follow " +
        "your local electrical codes, and have mains wiring done or checked by a licensed electrician.";

    /// <summary>Source value against time, volts.</summary>
    public Waveform Waveform { get; }

    /// <summary>Unknown index of the branch current (A, from p through the source to n); valid after Setup.</summary>
    public int BranchIndex => _branch.K;

    public override void Setup(SetupContext setup)
    {
        _branch = setup.BranchBetween(setup.Node(Nodes[0]), setup.Node(Nodes[1]), Name + ".i");
    }

    /// <summary>True while the solver holds the source at 0 V (a mains source while its supply runs cycle-averaged).</summary>
    internal bool Held { get; set; }

    public override void Load(LoadContext ctx)
    {
        _branch.Load(ctx);
        if (!Held) ctx.J[_branch.K] -= Waveform.Value(ctx.Time) * ctx.SourceScale;
    }

    public override double NextBreakpoint(double time) => Waveform.NextBreakpoint(time);

    public override double MaxStep => Waveform.MaxStep;
}
