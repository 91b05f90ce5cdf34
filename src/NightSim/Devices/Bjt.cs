using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Bipolar transistor, npn or pnp, Ebers–Moll transport form with Early effect and junction charges
/// (Ebers &amp; Moll, "Large-signal behavior of junction transistors", Proc. IRE 42, 1954; Sedra &amp; Smith,
/// Microelectronic Circuits):
/// I_F = I_S(e^(V_BE/(N·V_T)) − 1), I_R = I_S(e^(V_BC/(N·V_T)) − 1), I_CT = (I_F − I_R)(1 − V_BC/V_AF),
/// I_C = I_CT − I_R/β_R, I_B = I_F/β_F + I_R/β_R. A pnp is the npn with every voltage and current reversed.
/// Charges: q_BE = depletion(V_BE) + τ_F·I_F, q_BC = depletion(V_BC) + τ_R·I_R. Pins: c, b, e.
/// </summary>
public sealed class Bjt : Device
{
    private readonly double _p;
    private readonly double _vte;
    private readonly double _vCrit;
    private int _c;
    private int _b;
    private int _e;
    // Slots [row, col] for rows/cols in order c, b, e.
    private readonly int[] _slot = new int[9];
    private double _vbeOld;
    private double _vbcOld;

    /// <param name="pnp">True for pnp polarity.</param>
    /// <param name="saturationCurrent">I_S, amperes.</param>
    /// <param name="betaF">Forward current gain β_F.</param>
    /// <param name="betaR">Reverse current gain β_R.</param>
    /// <param name="earlyVoltage">Forward Early voltage V_AF, volts (+∞ = none).</param>
    /// <param name="emission">Emission coefficient N of both junctions.</param>
    /// <param name="cje">Zero-bias base–emitter depletion capacitance, farads.</param>
    /// <param name="cjc">Zero-bias base–collector depletion capacitance, farads.</param>
    /// <param name="vje">B–E built-in potential, volts.</param>
    /// <param name="vjc">B–C built-in potential, volts.</param>
    /// <param name="mje">B–E grading coefficient.</param>
    /// <param name="mjc">B–C grading coefficient.</param>
    /// <param name="tf">Forward transit time τ_F, seconds.</param>
    /// <param name="tr">Reverse transit time τ_R, seconds.</param>
    /// <param name="temperature">Device temperature, kelvin.</param>
    public Bjt(string name, string partId, string collector, string @base, string emitter, bool pnp = false,
        double saturationCurrent = 1e-14, double betaF = 100, double betaR = 1, double earlyVoltage = double.PositiveInfinity,
        double emission = 1.0, double cje = 0, double cjc = 0, double vje = 0.75, double vjc = 0.75, double mje = 0.33, double mjc = 0.33,
        double tf = 0, double tr = 0, double temperature = 300.15)
        : base(name, partId, [collector, @base, emitter])
    {
        if (!(saturationCurrent > 0)) throw new ArgumentOutOfRangeException(nameof(saturationCurrent), "I_S must be > 0 A");
        if (!(betaF > 0) || !(betaR > 0)) throw new ArgumentOutOfRangeException(nameof(betaF), "current gains must be > 0");
        IsPnp = pnp;
        SaturationCurrent = saturationCurrent;
        BetaF = betaF;
        BetaR = betaR;
        EarlyVoltage = earlyVoltage;
        Cje = cje;
        Cjc = cjc;
        Vje = vje;
        Vjc = vjc;
        Mje = mje;
        Mjc = mjc;
        Tf = tf;
        Tr = tr;
        _p = pnp ? -1.0 : 1.0;
        _vte = emission * Junction.ThermalVoltage(temperature);
        _vCrit = Junction.CriticalVoltage(_vte, saturationCurrent);
    }

    /// <summary>Netlist kind "npn": pins c, b, e.</summary>
    public static PartKind NpnKind { get; } = MakeKind("npn", pnp: false);

    /// <summary>Netlist kind "pnp": pins c, b, e.</summary>
    public static PartKind PnpKind { get; } = MakeKind("pnp", pnp: true);

    private static PartKind MakeKind(string name, bool pnp) => new()
    {
        Name = name,
        Description = $"{name.ToUpperInvariant()} bipolar transistor (Ebers–Moll transport model, Early effect, junction charges); pins c, b, e.",
        Pins = ["c", "b", "e"],
        UsesNodeList = false,
        Parameters =
        [
            ParameterSpec.Number("saturationCurrent", "A", "Transport saturation current I_S.") with { Default = 1e-14, Min = 1e-20, Max = 1e-6 },
            ParameterSpec.Number("forwardGain", "", "Forward current gain β_F.") with { Default = 200, Min = 1, Max = 5000 },
            ParameterSpec.Number("reverseGain", "", "Reverse current gain β_R.") with { Default = 1, Min = 0.01, Max = 100 },
            ParameterSpec.Number("earlyVoltage", "V", "Forward Early voltage (absent = none).") with { Min = 1, Max = 1e4 },
            ParameterSpec.Number("emission", "", "Emission coefficient.") with { Default = 1.0, Min = 0.5, Max = 4 },
            ParameterSpec.Number("baseEmitterCapacitance", "F", "Base–emitter zero-bias capacitance.") with { Default = 0, Min = 0, Max = 1e-6 },
            ParameterSpec.Number("baseCollectorCapacitance", "F", "Base–collector zero-bias capacitance.") with { Default = 0, Min = 0, Max = 1e-6 },
            ParameterSpec.Number("forwardTransitTime", "s", "Forward transit time.") with { Default = 0, Min = 0, Max = 1e-3 },
            ParameterSpec.Number("reverseTransitTime", "s", "Reverse transit time.") with { Default = 0, Min = 0, Max = 1e-2 },
        ],
        Create = def =>
        [
            new Bjt(def.Id, def.Id, def.Node("c"), def.Node("b"), def.Node("e"), pnp,
                def.Parameters.Number("saturationCurrent", 1e-14), def.Parameters.Number("forwardGain", 200), def.Parameters.Number("reverseGain", 1),
                def.Parameters.Number("earlyVoltage", double.PositiveInfinity), def.Parameters.Number("emission", 1.0),
                def.Parameters.Number("baseEmitterCapacitance", 0), def.Parameters.Number("baseCollectorCapacitance", 0), tf: def.Parameters.Number("forwardTransitTime", 0), tr: def.Parameters.Number("reverseTransitTime", 0)),
        ],
        ConductsDc = true,
    };

    public bool IsPnp { get; }
    public double SaturationCurrent { get; }
    public double BetaF { get; }
    public double BetaR { get; }
    public double EarlyVoltage { get; }
    public double Cje { get; }
    public double Cjc { get; }
    public double Vje { get; }
    public double Vjc { get; }
    public double Mje { get; }
    public double Mjc { get; }
    public double Tf { get; }
    public double Tr { get; }

    public override void Setup(SetupContext setup)
    {
        _c = setup.Node(Nodes[0]);
        _b = setup.Node(Nodes[1]);
        _e = setup.Node(Nodes[2]);
        int[] idx = [_c, _b, _e];
        for (int r = 0; r < 3; r++)
            for (int k = 0; k < 3; k++)
                _slot[r * 3 + k] = setup.Slot(idx[r], idx[k]);
    }

    public override void PowerUp()
    {
        _vbeOld = 0;
        _vbcOld = 0;
    }

    /// <summary>Collector and base currents (A, into the terminals, npn sense) at junction voltages V_BE, V_BC (V),
    /// without gmin; derivatives in S.</summary>
    public (double Ic, double Ib) Currents(double vbe, double vbc, out double dIcDvbe, out double dIcDvbc, out double dIbDvbe, out double dIbDvbc)
    {
        double eF = Junction.Exp(vbe / _vte, out double dF);
        double eR = Junction.Exp(vbc / _vte, out double dR);
        double iF = SaturationCurrent * (eF - 1.0), gF = SaturationCurrent * dF / _vte;
        double iR = SaturationCurrent * (eR - 1.0), gR = SaturationCurrent * dR / _vte;
        double early = double.IsPositiveInfinity(EarlyVoltage) ? 1.0 : 1.0 - vbc / EarlyVoltage;
        double dEarly = double.IsPositiveInfinity(EarlyVoltage) ? 0.0 : -1.0 / EarlyVoltage;
        double ict = (iF - iR) * early;
        double ic = ict - iR / BetaR;
        double ib = iF / BetaF + iR / BetaR;
        dIcDvbe = gF * early;
        dIcDvbc = -gR * early + (iF - iR) * dEarly - gR / BetaR;
        dIbDvbe = gF / BetaF;
        dIbDvbc = gR / BetaR;
        return (ic, ib);
    }

    public override void Load(LoadContext ctx)
    {
        double p = _p;
        double vbeActual = p * (ctx.V(_b) - ctx.V(_e));
        double vbcActual = p * (ctx.V(_b) - ctx.V(_c));
        double vbe, vbc;
        if (ctx.InitJunctions)
        {
            vbe = _vCrit;
            vbc = 0;
        }
        else
        {
            vbe = Junction.Limit(vbeActual, _vbeOld, _vte, _vCrit, out bool l1);
            vbc = Junction.Limit(vbcActual, _vbcOld, _vte, _vCrit, out bool l2);
            if (l1 || l2) ctx.Limited = true;
        }
        _vbeOld = vbe;
        _vbcOld = vbc;

        var (ic, ib) = Currents(vbe, vbc, out double icBe, out double icBc, out double ibBe, out double ibBc);
        double gmin = ctx.Gmin;
        ic -= gmin * vbc;
        icBc -= gmin;
        ib += gmin * (vbe + vbc);
        ibBe += gmin;
        ibBc += gmin;
        double ie = -(ic + ib), ieBe = -(icBe + ibBe), ieBc = -(icBc + ibBc);
        double dbe = vbeActual - vbe, dbc = vbcActual - vbc;

        // Terminal currents into the device (J: leaving the node), linearised at the limited voltages.
        Stamp(ctx, 0, _c, ic + icBe * dbe + icBc * dbc, icBe, icBc, ctx.G, isCharge: false);
        Stamp(ctx, 1, _b, ib + ibBe * dbe + ibBc * dbc, ibBe, ibBc, ctx.G, isCharge: false);
        Stamp(ctx, 2, _e, ie + ieBe * dbe + ieBc * dbc, ieBe, ieBc, ctx.G, isCharge: false);

        if (Cje > 0 || Cjc > 0 || Tf > 0 || Tr > 0)
        {
            double qbe = Junction.DepletionCharge(vbe, Cje, Vje, Mje, 0.5, out double cbe);
            double qbc = Junction.DepletionCharge(vbc, Cjc, Vjc, Mjc, 0.5, out double cbc);
            if (Tf > 0)
            {
                double eF = Junction.Exp(vbe / _vte, out double dF);
                qbe += Tf * SaturationCurrent * (eF - 1.0);
                cbe += Tf * SaturationCurrent * dF / _vte;
            }
            if (Tr > 0)
            {
                double eR = Junction.Exp(vbc / _vte, out double dR);
                qbc += Tr * SaturationCurrent * (eR - 1.0);
                cbc += Tr * SaturationCurrent * dR / _vte;
            }
            qbe += cbe * dbe;
            qbc += cbc * dbc;
            // Base holds q_BE + q_BC, emitter −q_BE, collector −q_BC (npn sense).
            Stamp(ctx, 0, _c, -qbc, 0, -cbc, ctx.C, isCharge: true);
            Stamp(ctx, 1, _b, qbe + qbc, cbe, cbc, ctx.C, isCharge: true);
            Stamp(ctx, 2, _e, -qbe, -cbe, 0, ctx.C, isCharge: true);
        }
    }

    /// <summary>Add value·p on row <paramref name="node"/> and its derivatives: ∂/∂V_b = d_be + d_bc, ∂/∂V_c = −d_bc,
    /// ∂/∂V_e = −d_be (the polarity factors cancel: p² = 1).</summary>
    private void Stamp(LoadContext ctx, int row, int node, double value, double dBe, double dBc, double[] matrix, bool isCharge)
    {
        if (node < 0) return;
        if (isCharge) ctx.Q[node] += _p * value; else ctx.J[node] += _p * value;
        AddAt(matrix, _slot[row * 3 + 0], -dBc);
        AddAt(matrix, _slot[row * 3 + 1], dBe + dBc);
        AddAt(matrix, _slot[row * 3 + 2], -dBe);
    }

    private static void AddAt(double[] m, int slot, double v)
    {
        if (slot >= 0) m[slot] += v;
    }
}
