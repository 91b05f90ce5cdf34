using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// An inductor between pins p and n with optional series resistance. Branch unknown i (A) flows from p through the
/// inductor to n; branch row: v_p − v_n − R·i − L·di/dt = 0, written as J_k = v_p − v_n − R·i, Q_k = −L·i.
/// </summary>
public sealed class Inductor : Device
{
    private BranchSlots _branch;
    private int _kk;

    /// <param name="inductance">Inductance in henries (&gt; 0).</param>
    /// <param name="seriesResistance">Winding resistance in ohms (≥ 0).</param>
    public Inductor(string name, string partId, string nodeP, string nodeN, double inductance, double seriesResistance = 0)
        : base(name, partId, [nodeP, nodeN])
    {
        if (!(inductance > 0)) throw new ArgumentOutOfRangeException(nameof(inductance), inductance, "inductance must be > 0 H");
        if (!(seriesResistance >= 0)) throw new ArgumentOutOfRangeException(nameof(seriesResistance), seriesResistance, "series resistance must be ≥ 0 Ω");
        Inductance = inductance;
        SeriesResistance = seriesResistance;
    }

    /// <summary>Netlist kind "inductor": nodes [p, n], value in henries, optional seriesResistance.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "inductor",
        Description = "Inductor with optional series (winding) resistance.",
        Pins = ["p", "n"],
        UsesNodeList = true,
        Parameters =
        [
            ParameterSpec.Number("value", "H", "Inductance, e.g. \"10m\" or \"2.2H\".") with { Required = true, Min = 1e-12, Max = 1e4 },
            ParameterSpec.Number("seriesResistance", "Ω", "Winding resistance in series.") with { Default = 0, Min = 0, Max = 1e9 },
        ],
        Create = def =>
        [
            new Inductor(def.Id, def.Id, def.Node("p"), def.Node("n"), def.Parameters.Number("value"),
                def.Parameters.Number("seriesResistance", 0)),
        ],
        ConductsDc = true,
    };

    /// <summary>Inductance in henries.</summary>
    public double Inductance { get; }

    /// <summary>Series resistance in ohms.</summary>
    public double SeriesResistance { get; }

    /// <summary>Unknown index of the branch current (A, from p through the inductor to n); valid after Setup.</summary>
    public int BranchIndex => _branch.K;

    public override void Setup(SetupContext setup)
    {
        _branch = setup.BranchBetween(setup.Node(Nodes[0]), setup.Node(Nodes[1]), Name + ".i");
        _kk = setup.Slot(_branch.K, _branch.K);
    }

    public override void Load(LoadContext ctx)
    {
        // Branch row: V(p) − V(n) − R·i − d(L·i)/dt = 0.
        double i = ctx.X[_branch.K];
        _branch.Load(ctx);
        ctx.J[_branch.K] -= SeriesResistance * i;
        ctx.Q[_branch.K] -= Inductance * i;
        ctx.AddG(_kk, -SeriesResistance);
        ctx.AddC(_kk, -Inductance);
    }
}
