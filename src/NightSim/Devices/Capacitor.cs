using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// A capacitor between pins p and n with optional series resistance (ESR) and optional leakage across its dielectric.
/// </summary>
/// <remarks>
/// With ESR &gt; 0 the device reserves an internal node "&lt;id&gt;.esr" between the ESR and the ideal capacitance.
/// Leakage is either a resistance (linear) or a current. A constant leakage current is a sink that must vanish at
/// 0 V (a discharged capacitor does not keep discharging), so it is modelled smoothly as
/// i = I_leak · tanh(v / 0.05 V): within ±50 mV it behaves like a resistance of 0.05 V / I_leak, above ≈ 0.15 V it
/// is the constant I_leak, and its derivative is continuous everywhere (Newton stays well-behaved at 0 V).
/// </remarks>
public sealed class Capacitor : Device, Roles.IDcElement
{
    /// <summary>Voltage scale of the smooth constant-current leakage law, volts.</summary>
    public const double LeakageVoltageScale = 0.05;

    private int _p;
    private int _n;
    private int _inner;
    private PairSlots _capSlots;
    private PairSlots _esrSlots;

    /// <param name="capacitance">Capacitance in farads (&gt; 0).</param>
    /// <param name="esr">Series resistance in ohms (0 = none).</param>
    /// <param name="leakageResistance">Parallel leakage resistance in ohms (+∞ = none).</param>
    /// <param name="leakageCurrent">Constant leakage current in amperes (0 = none), modelled as I·tanh(v/0.05 V).</param>
    /// <param name="initialVoltage">Voltage across the capacitor at power-up in volts, or null for 0 V / solver default.</param>
    /// <param name="ratedVoltage">Rated voltage in volts, or null when not stated (for the supply budget).</param>
    public Capacitor(string name, string partId, string nodeP, string nodeN, double capacitance, double esr = 0,
        double leakageResistance = double.PositiveInfinity, double leakageCurrent = 0, double? initialVoltage = null, double? ratedVoltage = null)
        : base(name, partId, [nodeP, nodeN])
    {
        if (!(capacitance > 0)) throw new ArgumentOutOfRangeException(nameof(capacitance), capacitance, "capacitance must be > 0 F");
        if (!(esr >= 0)) throw new ArgumentOutOfRangeException(nameof(esr), esr, "ESR must be ≥ 0 Ω");
        if (!(leakageResistance > 0)) throw new ArgumentOutOfRangeException(nameof(leakageResistance), leakageResistance, "leakage resistance must be > 0 Ω");
        if (!(leakageCurrent >= 0)) throw new ArgumentOutOfRangeException(nameof(leakageCurrent), leakageCurrent, "leakage current must be ≥ 0 A");
        Capacitance = capacitance;
        Esr = esr;
        LeakageResistance = leakageResistance;
        LeakageCurrent = leakageCurrent;
        InitialVoltage = initialVoltage;
        Role = new Roles.CapacitorRole(partId, nodeP, nodeN, capacitance) { RatedVoltage = ratedVoltage, LeakageResistance = leakageResistance };
    }

    /// <summary>Netlist kind "capacitor": nodes [p, n], value in farads, optional esr, leakage and initial voltage.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "capacitor",
        Description = "Capacitor with optional ESR and leakage (as a resistance or a current).",
        Pins = ["p", "n"],
        UsesNodeList = true,
        Parameters =
        [
            ParameterSpec.Number("value", "F", "Capacitance, e.g. \"100u\" or \"3300uF\".") with { Required = true, Min = 1e-15, Max = 100 },
            ParameterSpec.Number("esr", "Ω", "Equivalent series resistance (0 = none).") with { Default = 0, Min = 0, Max = 1e6 },
            ParameterSpec.Number("leakageResistance", "Ω", "Leakage across the dielectric as a resistance.") with { Min = 1, Max = 1e18, ExclusiveGroup = "leakage" },
            ParameterSpec.Number("leakageCurrent", "A", "Leakage as a constant current at working voltage (smooth near 0 V).") with { Min = 0, Max = 1, ExclusiveGroup = "leakage" },
            ParameterSpec.Number("initialVoltage", "V", "Voltage across the capacitor at power-up (p minus n).") with { Min = -1e5, Max = 1e5 },
            ParameterSpec.Number("tolerance", "", "Relative tolerance below nominal (and above, unless toleranceAbove is given), e.g. \"20%\" or 0.2; used by `nightsim spread`. Default by construction: electrolytic 20 %, film 10 %, ceramic 10 %, not stated 20 %.") with { Min = 0, Max = 0.99 },
            ParameterSpec.Number("toleranceAbove", "", "Relative tolerance above nominal when it differs from below, e.g. 0.8 for an electrolytic of −20/+80 %.") with { Min = 0, Max = 4 },
            ParameterSpec.Word("construction", "Dielectric: an electrolytic without a stated leakage leaks a typical 2 % of its catalogue limit (IEC 60384-4: 0.01·C·V or 3 µA, whichever is larger); not stated = ideal dielectric", "electrolytic", "film", "ceramic"),
            ParameterSpec.Number("ratedVoltage", "V", "Rated voltage (needed for an electrolytic: its leakage limit depends on it). `nightsim supply` compares the peak voltage across the part against it; for a capacitor in series with the mains (a dropper, X2 class) state its AC RMS rating, e.g. \"275V\", and the RMS voltage across it is compared.") with { Min = 0.1, Max = 1e5 },
        ],
        Check = CheckDefinition,
        Create = def =>
        [
            new Capacitor(def.Id, def.Id, def.Node("p"), def.Node("n"), def.Parameters.Number("value"),
                def.Parameters.Number("esr", 0), def.Parameters.Number("leakageResistance", double.PositiveInfinity),
                EffectiveLeakageCurrent(def), def.Parameters.OptionalNumber("initialVoltage"), def.Parameters.OptionalNumber("ratedVoltage")) { CatalogueLeakageLimit = LeakageLimit(def) },
        ],
        ConductsDc = false,
    };

    /// <summary>The constant leakage current the part uses, A: the stated one, else for an electrolytic the typical
    /// value (<see cref="ElectrolyticLeakage.Typical"/>) unless a leakage resistance is given, else 0.</summary>
    public static double EffectiveLeakageCurrent(PartDefinition def)
    {
        PartParameters p = def.Parameters;
        if (p.OptionalNumber("leakageCurrent") is double given) return given;
        if (p.Has("leakageResistance") || p.Text("construction") != "electrolytic") return 0.0;
        return p.OptionalNumber("ratedVoltage") is double vr ? ElectrolyticLeakage.Typical(p.Number("value"), vr) : 0.0;
    }

    /// <summary>The catalogue leakage limit of an electrolytic with a rated voltage (IEC 60384-4), A; NaN otherwise.</summary>
    public static double LeakageLimit(PartDefinition def)
    {
        PartParameters p = def.Parameters;
        return p.Text("construction") == "electrolytic" && p.OptionalNumber("ratedVoltage") is double vr
            ? ElectrolyticLeakage.Limit(p.Number("value"), vr)
            : double.NaN;
    }

    private static IEnumerable<string> CheckDefinition(PartDefinition part)
    {
        if (part.Parameters.Text("construction") == "electrolytic" && !part.Parameters.Has("ratedVoltage"))
            yield return "an electrolytic needs its ratedVoltage (the leakage limit and the typical leakage depend on it). hint: add e.g. \"ratedVoltage\": \"16V\"";
    }

    /// <summary>Catalogue leakage limit of an electrolytic with a rated voltage (IEC 60384-4), A; NaN otherwise.</summary>
    public double CatalogueLeakageLimit { get; init; } = double.NaN;

    /// <summary>Capacitance in farads.</summary>
    public double Capacitance { get; }

    /// <summary>Series resistance in ohms (0 = none).</summary>
    public double Esr { get; }

    /// <summary>Leakage resistance in ohms (+∞ = none).</summary>
    public double LeakageResistance { get; }

    /// <summary>Constant leakage current in amperes (0 = none).</summary>
    public double LeakageCurrent { get; }

    /// <summary>Voltage across the capacitance at power-up in volts (p minus n), or null (start discharged).</summary>
    public double? InitialVoltage { get; }

    /// <summary>Unknown index of the node on the dielectric's p side (the internal node when ESR &gt; 0); valid after Setup.</summary>
    public int InnerNode => _inner;

    /// <summary>Open at DC: its capacitance, and its leakage as a drain (a resistance, or the constant current it
    /// settles to above a few tenths of a volt).</summary>
    public void StampDc(Roles.DcNetwork network)
    {
        network.Capacitance(Nodes[0], Nodes[1], Capacitance);
        if (!double.IsPositiveInfinity(LeakageResistance)) network.Conductance(Nodes[0], Nodes[1], 1.0 / LeakageResistance, drain: true);
        if (LeakageCurrent > 0) network.Current(Nodes[0], Nodes[1], LeakageCurrent, drain: true);
    }

    public override void Setup(SetupContext setup)
    {
        _p = setup.Node(Nodes[0]);
        _n = setup.Node(Nodes[1]);
        if (Esr > 0)
        {
            _inner = setup.InternalNode(Name + ".esr");
            _esrSlots = setup.Pair(_p, _inner);
        }
        else
        {
            _inner = _p;
        }
        _capSlots = setup.Pair(_inner, _n);
    }

    public override void Load(LoadContext ctx)
    {
        double v = ctx.V(_inner) - ctx.V(_n);
        ctx.AddCharge(_inner, _n, Capacitance * v);
        _capSlots.Add(ctx.C, Capacitance);

        if (Esr > 0)
        {
            double g = 1.0 / Esr;
            ctx.AddCurrent(_p, _inner, g * (ctx.V(_p) - ctx.V(_inner)));
            _esrSlots.Add(ctx.G, g);
        }

        double gLeak = 0;
        double iLeak = 0;
        if (!double.IsPositiveInfinity(LeakageResistance))
        {
            gLeak += 1.0 / LeakageResistance;
            iLeak += v / LeakageResistance;
        }
        if (LeakageCurrent > 0)
        {
            double th = Math.Tanh(v / LeakageVoltageScale);
            iLeak += LeakageCurrent * th;
            gLeak += LeakageCurrent / LeakageVoltageScale * (1.0 - th * th);
        }
        if (gLeak != 0 || iLeak != 0)
        {
            ctx.AddCurrent(_inner, _n, iLeak);
            _capSlots.Add(ctx.G, gLeak);
        }
    }
}
