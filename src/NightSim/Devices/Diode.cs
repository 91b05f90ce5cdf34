using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Junction diode, anode a to cathode k: Shockley law I = I_S(e^(V/(N·V_T)) − 1) with series resistance, depletion and
/// diffusion charge, and optional reverse breakdown I_bd = −I_BV·e^(−(V + BV)/(N_bv·V_T)) (used by the Zener kind).
/// </summary>
/// <remarks>Equations from Shockley (Bell Syst. Tech. J. 28, 1949) and the textbook junction model (Sedra &amp; Smith,
/// Microelectronic Circuits). With a series
/// resistance the device reserves an internal node "&lt;name&gt;.j" between the resistance and the junction.</remarks>
public sealed class Diode : Device, Roles.ITerminalCurrent
{
    private readonly double _vt;
    private readonly double _vte;
    private readonly double _vCrit;
    private readonly double _vteBreakdown;
    private readonly double _vCritBreakdown;
    private readonly double _breakdownOffset;
    private int _a;
    private int _k;
    private int _j;
    private PairSlots _junction;
    private PairSlots _series;
    private double _vOld;

    /// <param name="saturationCurrent">I_S, amperes.</param>
    /// <param name="emission">Emission coefficient N (1…2).</param>
    /// <param name="seriesResistance">R_S, ohms (0 = none).</param>
    /// <param name="junctionCapacitance">Zero-bias depletion capacitance C_j0, farads.</param>
    /// <param name="junctionPotential">Built-in potential V_j, volts.</param>
    /// <param name="grading">Grading coefficient m.</param>
    /// <param name="transitTime">Transit time TT, seconds (diffusion charge TT·I).</param>
    /// <param name="breakdownVoltage">BV, volts (+∞ = no breakdown).</param>
    /// <param name="breakdownCurrent">I_BV, amperes: reverse current at V = −BV.</param>
    /// <param name="breakdownEmission">N_bv: the breakdown knee's slope, dynamic resistance N_bv·V_T/I at the knee.</param>
    /// <param name="temperature">Device temperature, kelvin.</param>
    public Diode(string name, string partId, string anode, string cathode, double saturationCurrent = 1e-14, double emission = 1.0,
        double seriesResistance = 0, double junctionCapacitance = 0, double junctionPotential = 0.75, double grading = 0.5,
        double transitTime = 0, double breakdownVoltage = double.PositiveInfinity, double breakdownCurrent = 1e-3,
        double breakdownEmission = 1.0, double temperature = 300.15)
        : base(name, partId, [anode, cathode])
    {
        if (!(saturationCurrent > 0)) throw new ArgumentOutOfRangeException(nameof(saturationCurrent), "I_S must be > 0 A");
        if (!(emission > 0)) throw new ArgumentOutOfRangeException(nameof(emission), "N must be > 0");
        SaturationCurrent = saturationCurrent;
        Emission = emission;
        SeriesResistance = seriesResistance;
        JunctionCapacitance = junctionCapacitance;
        JunctionPotential = junctionPotential;
        Grading = grading;
        TransitTime = transitTime;
        BreakdownVoltage = breakdownVoltage;
        BreakdownCurrent = breakdownCurrent;
        BreakdownEmission = breakdownEmission;
        _vt = Junction.ThermalVoltage(temperature);
        _vte = emission * _vt;
        _vCrit = Junction.CriticalVoltage(_vte, saturationCurrent);
        _vteBreakdown = breakdownEmission * _vt;
        _vCritBreakdown = Junction.CriticalVoltage(_vteBreakdown, breakdownCurrent);
        _breakdownOffset = double.IsPositiveInfinity(breakdownVoltage) ? 0 : Math.Exp(-breakdownVoltage / _vteBreakdown);
        Role = new Roles.JunctionRole(partId, anode, cathode, breakdownVoltage) { TestCurrent = breakdownCurrent };
    }

    /// <summary>Netlist kind "diode": nodes [anode, cathode].</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "diode",
        Description = "Junction diode (Shockley law, series resistance, junction and diffusion charge, optional breakdown); nodes [anode, cathode].",
        Pins = ["anode", "cathode"],
        UsesNodeList = true,
        Parameters =
        [
            ParameterSpec.Number("saturationCurrent", "A", "Saturation current I_S.") with { Default = 1e-14, Min = 1e-20, Max = 1e-3 },
            ParameterSpec.Number("emission", "", "Emission coefficient.") with { Default = 1.0, Min = 0.5, Max = 4 },
            ParameterSpec.Number("seriesResistance", "Ω", "Series resistance.") with { Default = 0, Min = 0, Max = 1e4 },
            ParameterSpec.Number("junctionCapacitance", "F", "Zero-bias junction capacitance.") with { Default = 0, Min = 0, Max = 1e-6 },
            ParameterSpec.Number("junctionPotential", "V", "Junction built-in potential.") with { Default = 0.75, Min = 0.1, Max = 2 },
            ParameterSpec.Number("junctionGrading", "", "Junction grading coefficient.") with { Default = 0.5, Min = 0.05, Max = 0.95 },
            ParameterSpec.Number("transitTime", "s", "Transit time (diffusion charge).") with { Default = 0, Min = 0, Max = 1e-3 },
            ParameterSpec.Number("breakdownVoltage", "V", "Reverse breakdown voltage (absent = no breakdown).") with { Min = 0.5, Max = 1e4 },
            ParameterSpec.Number("breakdownCurrent", "A", "Reverse current at the breakdown voltage.") with { Default = 1e-3, Min = 1e-12, Max = 10 },
        ],
        Create = def =>
        [
            new Diode(def.Id, def.Id, def.Node("anode"), def.Node("cathode"), def.Parameters.Number("saturationCurrent", 1e-14), def.Parameters.Number("emission", 1.0),
                def.Parameters.Number("seriesResistance", 0), def.Parameters.Number("junctionCapacitance", 0), def.Parameters.Number("junctionPotential", 0.75), def.Parameters.Number("junctionGrading", 0.5),
                def.Parameters.Number("transitTime", 0), def.Parameters.Number("breakdownVoltage", double.PositiveInfinity), def.Parameters.Number("breakdownCurrent", 1e-3)),
        ],
        ConductsDc = true,
    };

    public double SaturationCurrent { get; }
    public double Emission { get; }
    public double SeriesResistance { get; }
    public double JunctionCapacitance { get; }
    public double JunctionPotential { get; }
    public double Grading { get; }
    public double TransitTime { get; }
    public double BreakdownVoltage { get; }
    public double BreakdownCurrent { get; }
    public double BreakdownEmission { get; }

    /// <summary>Critical voltage used by junction limiting, volts.</summary>
    public double CriticalVoltage => _vCrit;

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _k = setup.Node(Nodes[1]);
        if (SeriesResistance > 0)
        {
            _j = setup.InternalNode(Name + ".j");
            _series = setup.Pair(_a, _j);
        }
        else
        {
            _j = _a;
        }
        _junction = setup.Pair(_j, _k);
    }

    public override void PowerUp() => _vOld = 0;

    /// <summary>Junction current anode → cathode at the solution, A (the Shockley and breakdown law at the junction's
    /// own voltage; charge currents and gmin left out).</summary>
    public double TerminalCurrent(ReadOnlySpan<double> x) => Current((_j >= 0 ? x[_j] : 0.0) - (_k >= 0 ? x[_k] : 0.0), out _);

    /// <summary>Junction current (A) and its derivative (S) at junction voltage v (V), without gmin.</summary>
    public double Current(double v, out double conductance)
    {
        double ef = Junction.Exp(v / _vte, out double def);
        double i = SaturationCurrent * (ef - 1.0);
        double g = SaturationCurrent * def / _vte;
        if (!double.IsPositiveInfinity(BreakdownVoltage))
        {
            double eb = Junction.Exp(-(v + BreakdownVoltage) / _vteBreakdown, out double deb);
            i -= BreakdownCurrent * (eb - _breakdownOffset);
            g += BreakdownCurrent * deb / _vteBreakdown;
        }
        conductance = g;
        return i;
    }

    public override void Load(LoadContext ctx)
    {
        double vActual = ctx.V(_j) - ctx.V(_k);
        double v;
        if (ctx.InitJunctions)
        {
            v = _vCrit;
        }
        else
        {
            bool limited;
            if (vActual >= -3.0 * _vte || double.IsPositiveInfinity(BreakdownVoltage))
            {
                v = Junction.Limit(vActual, _vOld, _vte, _vCrit, out limited);
            }
            else
            {
                // Breakdown branch: limit v_z = −v − BV with the breakdown slope.
                double vz = Junction.Limit(-vActual - BreakdownVoltage, -_vOld - BreakdownVoltage, _vteBreakdown, _vCritBreakdown, out limited);
                v = -vz - BreakdownVoltage;
            }
            if (limited) ctx.Limited = true;
        }
        _vOld = v;

        double i = Current(v, out double g);
        i += ctx.Gmin * v;
        g += ctx.Gmin;
        // Newton companion at the (possibly limited) voltage: i(v) + g·(v_actual − v).
        ctx.AddCurrent(_j, _k, i + g * (vActual - v));
        _junction.Add(ctx.G, g);

        double q = Junction.DepletionCharge(v, JunctionCapacitance, JunctionPotential, Grading, 0.5, out double c);
        if (TransitTime > 0)
        {
            double iF = SaturationCurrent * (Junction.Exp(v / _vte, out double dF) - 1.0);
            q += TransitTime * iF;
            c += TransitTime * SaturationCurrent * dF / _vte;
        }
        if (c != 0 || q != 0)
        {
            ctx.AddCharge(_j, _k, q + c * (vActual - v));
            _junction.Add(ctx.C, c);
        }

        if (SeriesResistance > 0)
        {
            double gs = 1.0 / SeriesResistance;
            ctx.AddCurrent(_a, _j, gs * (ctx.V(_a) - ctx.V(_j)));
            _series.Add(ctx.G, gs);
        }
    }
}
