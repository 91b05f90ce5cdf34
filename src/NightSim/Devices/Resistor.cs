using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>A linear resistor between pins a and b: i = (v_a − v_b) / R.</summary>
public sealed class Resistor : Device, Roles.IDcElement, Roles.ITerminalCurrent
{
    private int _a;
    private int _b;
    private PairSlots _slots;

    /// <param name="resistance">Resistance in ohms (&gt; 0).</param>
    /// <param name="powerRating">Rated dissipation in watts, or null when not stated.</param>
    /// <param name="voltageRating">Rated voltage across the part in volts, or null when not stated.</param>
    public Resistor(string name, string partId, string nodeA, string nodeB, double resistance, double? powerRating = null, double? voltageRating = null)
        : base(name, partId, [nodeA, nodeB])
    {
        if (!(resistance > 0)) throw new ArgumentOutOfRangeException(nameof(resistance), resistance, "resistance must be > 0 Ω");
        Resistance = resistance;
        Role = new Roles.ResistorRole(partId, nodeA, nodeB, resistance) { PowerRating = powerRating, VoltageRating = voltageRating };
    }

    /// <summary>Netlist kind "resistor": nodes [a, b], value in ohms, optional tolerance (fraction, for spreads) and
    /// ratings (for `nightsim supply`).</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "resistor",
        Description = "Linear resistor between two nodes.",
        Pins = ["a", "b"],
        UsesNodeList = true,
        Parameters =
        [
            ParameterSpec.Number("value", "Ω", "Resistance, e.g. \"4k7\".") with { Required = true, Min = 1e-6, Max = 1e15 },
            ParameterSpec.Number("tolerance", "", "Relative tolerance, e.g. \"5%\" or 0.05: used by `nightsim spread`; a single run uses the nominal value.") with { Default = 0.05, Min = 0, Max = 0.5 },
            ParameterSpec.Number("powerRating", "W", "Rated dissipation, e.g. \"0.25W\" or \"1W\": `nightsim supply` compares the dissipation against it (absent = not judged).") with { Min = 1e-4, Max = 1e4 },
            ParameterSpec.Number("voltageRating", "V", "Rated voltage across the part (its limiting element voltage), e.g. \"250V\": `nightsim supply` compares the peak voltage against it (absent = not judged).") with { Min = 0.1, Max = 1e5 },
        ],
        Create = def => [new Resistor(def.Id, def.Id, def.Node("a"), def.Node("b"), def.Parameters.Number("value"),
            def.Parameters.OptionalNumber("powerRating"), def.Parameters.OptionalNumber("voltageRating"))],
        ConductsDc = true,
    };

    /// <summary>Resistance in ohms.</summary>
    public double Resistance { get; }

    public void StampDc(Roles.DcNetwork network) => network.Conductance(Nodes[0], Nodes[1], 1.0 / Resistance);

    /// <summary>(v_a − v_b)/R, A.</summary>
    public double TerminalCurrent(ReadOnlySpan<double> x) => ((_a >= 0 ? x[_a] : 0.0) - (_b >= 0 ? x[_b] : 0.0)) / Resistance;

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _b = setup.Node(Nodes[1]);
        _slots = setup.Pair(_a, _b);
    }

    public override void Load(LoadContext ctx)
    {
        double g = 1.0 / Resistance;
        ctx.AddCurrent(_a, _b, g * (ctx.V(_a) - ctx.V(_b)));
        _slots.Add(ctx.G, g);
    }
}
