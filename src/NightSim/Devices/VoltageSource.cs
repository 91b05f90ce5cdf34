using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Independent voltage source: v_p − v_n = V(t)·SourceScale. Branch unknown i (A) flows from p through the source to n
/// (a source delivering power has i &lt; 0).
/// </summary>
public sealed class VoltageSource : Device
{
    private int _p;
    private int _n;
    private int _k;
    private int _pk;
    private int _nk;
    private int _kp;
    private int _kn;

    public VoltageSource(string name, string partId, string nodeP, string nodeN, Waveform waveform)
        : base(name, partId, [nodeP, nodeN])
    {
        Waveform = waveform;
    }

    /// <summary>Netlist kind "voltage-source": nodes [p, n] (p is +), one of dc, pulse, sine, pwl in volts.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "voltage-source",
        Description = "Independent voltage source (dc, pulse, sine or piecewise-linear); nodes [+, −].",
        Pins = ["p", "n"],
        UsesNodeList = true,
        Parameters = Waveform.Specs("V", 1e6),
        Check = Waveform.CheckChoice,
        Create = def => [new VoltageSource(def.Id, def.Id, def.Node("p"), def.Node("n"), Waveform.FromParameters(def.Parameters))],
        ConductsDc = true,
        IsVoltageSource = true,
    };

    /// <summary>Source value against time, volts.</summary>
    public Waveform Waveform { get; }

    /// <summary>Unknown index of the branch current (A, from p through the source to n); valid after Setup.</summary>
    public int BranchIndex => _k;

    public override void Setup(SetupContext setup)
    {
        _p = setup.Node(Nodes[0]);
        _n = setup.Node(Nodes[1]);
        _k = setup.Branch(Name + ".i");
        _pk = setup.Slot(_p, _k);
        _nk = setup.Slot(_n, _k);
        _kp = setup.Slot(_k, _p);
        _kn = setup.Slot(_k, _n);
    }

    public override void Load(LoadContext ctx)
    {
        double i = ctx.X[_k];
        ctx.AddCurrent(_p, _n, i);
        ctx.J[_k] += ctx.V(_p) - ctx.V(_n) - Waveform.Value(ctx.Time) * ctx.SourceScale;
        ctx.AddG(_pk, 1.0);
        ctx.AddG(_nk, -1.0);
        ctx.AddG(_kp, 1.0);
        ctx.AddG(_kn, -1.0);
    }

    public override double NextBreakpoint(double time) => Waveform.NextBreakpoint(time);

    public override double MaxStep => Waveform.MaxStep;
}
