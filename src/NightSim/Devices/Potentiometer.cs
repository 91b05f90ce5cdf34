using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// A potentiometer (linear track): total resistance R between pins a and b, wiper at position p (0 = at a, 1 = at b):
/// R_a,wiper = p·R and R_wiper,b = (1 − p)·R, each at least <see cref="MinimumResistance"/> so the ends are fine.
/// </summary>
public sealed class Potentiometer : Device, Roles.IDcElement
{
    /// <summary>Smallest resistance of either track section, ohms.</summary>
    public const double MinimumResistance = 1e-3;

    private int _a;
    private int _w;
    private int _b;
    private PairSlots _upper;
    private PairSlots _lower;

    /// <param name="resistance">Total track resistance in ohms (&gt; 0).</param>
    /// <param name="position">Wiper position 0…1 (0 = at pin a).</param>
    public Potentiometer(string name, string partId, string nodeA, string nodeWiper, string nodeB, double resistance, double position)
        : base(name, partId, [nodeA, nodeWiper, nodeB])
    {
        if (!(resistance > 0)) throw new ArgumentOutOfRangeException(nameof(resistance), resistance, "resistance must be > 0 Ω");
        if (!(position >= 0 && position <= 1)) throw new ArgumentOutOfRangeException(nameof(position), position, "position must be within 0…1");
        Resistance = resistance;
        Position = position;
        ResistanceA = Math.Max(position * resistance, MinimumResistance);
        ResistanceB = Math.Max((1 - position) * resistance, MinimumResistance);
    }

    /// <summary>Netlist kind "potentiometer": pins { a, wiper, b }, total resistance and position 0…1.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "potentiometer",
        Description = "Potentiometer: total resistance between a and b, wiper position 0 (at a) to 1 (at b).",
        Pins = ["a", "wiper", "b"],
        UsesNodeList = false,
        Parameters =
        [
            ParameterSpec.Number("value", "Ω", "Total track resistance, e.g. \"100k\".") with { Required = true, Min = 1e-3, Max = 1e12 },
            ParameterSpec.Number("position", "", "Wiper position, 0 (at a) to 1 (at b), e.g. 0.5 or \"50%\".") with { Default = 0.5, Min = 0, Max = 1 },
            ParameterSpec.Number("tolerance", "", "Relative tolerance of the total resistance for spreads.") with { Default = 0.2, Min = 0, Max = 0.5 },
        ],
        Create = def =>
        [
            new Potentiometer(def.Id, def.Id, def.Node("a"), def.Node("wiper"), def.Node("b"), def.Parameters.Number("value"),
                def.Parameters.Number("position", 0.5)),
        ],
        ConductsDc = true,
    };

    /// <summary>Total track resistance, ohms.</summary>
    public double Resistance { get; }

    /// <summary>Wiper position 0…1.</summary>
    public double Position { get; }

    /// <summary>Resistance between a and the wiper, ohms.</summary>
    public double ResistanceA { get; }

    /// <summary>Resistance between the wiper and b, ohms.</summary>
    public double ResistanceB { get; }

    public void StampDc(Roles.DcNetwork network)
    {
        network.Conductance(Nodes[0], Nodes[1], 1.0 / ResistanceA);
        network.Conductance(Nodes[1], Nodes[2], 1.0 / ResistanceB);
    }

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _w = setup.Node(Nodes[1]);
        _b = setup.Node(Nodes[2]);
        _upper = setup.Pair(_a, _w);
        _lower = setup.Pair(_w, _b);
    }

    public override void Load(LoadContext ctx)
    {
        double ga = 1.0 / ResistanceA;
        double gb = 1.0 / ResistanceB;
        ctx.AddCurrent(_a, _w, ga * (ctx.V(_a) - ctx.V(_w)));
        ctx.AddCurrent(_w, _b, gb * (ctx.V(_w) - ctx.V(_b)));
        _upper.Add(ctx.G, ga);
        _lower.Add(ctx.G, gb);
    }
}
