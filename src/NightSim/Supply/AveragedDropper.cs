using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;

namespace NightSim.Supply;

/// <summary>How the dropper's current is rectified.</summary>
public enum RectifierShape
{
    /// <summary>Four diodes: both half-cycles charge the smoothing capacitor.</summary>
    Bridge,

    /// <summary>One diode into the rail, a return junction (usually a shunt Zener) from the supply's minus to the AC
    /// node: only the positive half-cycle charges the smoothing capacitor.</summary>
    HalfWave,
}

/// <summary>
/// The cycle-averaged model of a capacitive-dropper supply (engine-internal; the solver adds it, no netlist names it).
/// It sits between the rectifier's DC outputs and, while the solver runs the mains in averaged mode (the mains sine held
/// at 0 V, so the dropper capacitor rests behind reverse-biased diodes), injects the charge the dropper delivers per
/// mains cycle as a steady current. In full mains detail it injects nothing.
/// </summary>
/// <remarks>
/// <para>Bridge: the dropper capacitor's voltage swings between −(V_pk − V_dc − 2V_D) and +(V_pk − V_dc − 2V_D) each
/// cycle, and the bridge passes every coulomb of that swing to the DC side, both ways: per cycle 2·C·2(V_pk − V_dc −
/// 2V_D), so I = 4·f·C·(V_pk − V_dc − 2·V_D) (common practice for capacitive droppers; from memory).</para>
/// <para>Half-wave with a return junction: the AC node is clamped at V_dc + V_D (conducting into the rail) on the
/// positive half and at −V_D (the return junction forward) on the negative half, so the capacitor swings by
/// 2V_pk − V_dc − 2V_D and that charge reaches the rail once per cycle: I = f·C·(2·V_pk − V_dc − 2·V_D) — half the
/// bridge's at the same headroom, but with half the rail voltage counted, worked out here from the same charge balance.
/// With a Zener as the return junction the AC node cannot rise above its breakdown voltage: the rail then stays at
/// V_Z − V_D and the Zener takes the rest, so the current falls to zero there.</para>
/// <para>V_D is the rectifier diode's own junction law at the average current. Left out (limits, stated in
/// docs/supply.md): the series resistor (its voltage drop shortens the swing by about ω·R·C of it: 0.7 % for 47 Ω and
/// 470 nF at 50 Hz), the bleeder's current (V_rms/R against V_rms·ωC: 0.7 % for 1 MΩ and 470 nF), and the time the
/// current takes to build up in a cycle (the model is a mean; the ripple exists only in the detail windows).</para>
/// </remarks>
public sealed class AveragedDropper : Device
{
    /// <summary>Width over which the current's max(0, headroom) is rounded, volts (keeps Newton's derivative smooth).</summary>
    private const double Rounding = 0.05;

    private readonly double _vte;
    private readonly Diode _diode;
    private int _p;
    private int _n;
    private PairSlots _slots;

    /// <param name="plus">The rectifier's DC plus (bridge cathodes, or the half-wave diode's cathode).</param>
    /// <param name="minus">The rectifier's DC minus.</param>
    /// <param name="source">The mains source the solver holds at 0 V in averaged mode.</param>
    /// <param name="shape">Bridge or half-wave.</param>
    /// <param name="capacitance">Dropper capacitance, farads.</param>
    /// <param name="diode">A rectifier diode (its junction law gives V_D).</param>
    /// <param name="clampVoltage">Half-wave with a Zener return: the rail above which the Zener takes the current
    /// (V_Z − V_D), volts; +∞ otherwise.</param>
    public AveragedDropper(string plus, string minus, VoltageSource source, RectifierShape shape, double capacitance, Diode diode, double clampVoltage)
        : base("mains.averaged", source.PartId, [plus, minus])
    {
        Source = source;
        Shape = shape;
        Capacitance = capacitance;
        Frequency = source.Waveform.SineFrequency;
        Peak = Math.Abs(source.Waveform.SineAmplitude);
        SaturationCurrent = diode.SaturationCurrent;
        SeriesResistance = diode.SeriesResistance;
        _vte = diode.Emission * Junction.ThermalVoltage(300.15);
        ClampVoltage = clampVoltage;
        _diode = diode;
    }

    /// <summary>The mains source.</summary>
    public VoltageSource Source { get; }

    /// <summary>Bridge or half-wave.</summary>
    public RectifierShape Shape { get; }

    /// <summary>Dropper capacitance, farads.</summary>
    public double Capacitance { get; }

    /// <summary>Mains frequency, hertz.</summary>
    public double Frequency { get; }

    /// <summary>Mains peak voltage, volts.</summary>
    public double Peak { get; }

    /// <summary>The rectifier diode's saturation current, amperes.</summary>
    public double SaturationCurrent { get; }

    /// <summary>The rectifier diode's series resistance, ohms.</summary>
    public double SeriesResistance { get; }

    /// <summary>Rail above which a half-wave supply's Zener return takes the current, volts; +∞ without one.</summary>
    public double ClampVoltage { get; }

    /// <summary>True while the solver runs the mains cycle-averaged (set by the solver only).</summary>
    public bool Active { get; internal set; }

    /// <summary>The dropper's pin on the rectifier's side (the solver sets its voltage when it enters full detail), or
    /// null when the dropper's place in the loop is not known (then detail starts only at a rising zero crossing).</summary>
    public string? LiftNode { get; init; }

    /// <summary>The dropper's pin on the source's side.</summary>
    public string? LiftReference { get; init; }

    /// <summary>The nodes on the mains side of the rectifier (the source's, the dropper's, the series resistors' and the
    /// rectifier's AC terminals): they swing with the mains, so the solver holds their error to its tolerance of the mains
    /// peak (the charge they move is C·V_pk-sized), not of their instantaneous value.</summary>
    public IReadOnlyList<string> MainsNodes { get; init; } = [];

    /// <summary>With the dropper in the plus leg: the source's plus and the nodes between it and the dropper (through
    /// series resistors), which the solver sets to the source's value above its minus when it enters full detail, so
    /// the whole loop meets the returning source consistently; empty otherwise.</summary>
    public IReadOnlyList<string> SourceSide { get; init; } = [];

    /// <summary>+1 when the dropper is in the source's plus leg, −1 in its minus leg.</summary>
    public double LiftSign { get; init; } = 1.0;

    /// <summary>
    /// The dropper's voltage at <paramref name="time"/> on the periodic steady state with the DC side at
    /// <paramref name="vdc"/>, along the loop from the source's plus to its minus. The rectifier clamps its AC
    /// terminals between V_lo and V_hi (bridge ±(V_dc + 2V_D); half-wave −V_D and V_dc + V_D); the dropper follows the
    /// source while they conduct and holds its voltage from each peak until the source has swung across the clamp
    /// window: rising, v_c = max(v_s − V_hi, −V_pk − V_lo); falling, v_c = min(v_s − V_lo, V_pk − V_hi).
    /// </summary>
    public double SteadyDropperVoltage(double time, double vdc)
    {
        Waveform w = Source.Waveform;
        double theta = 2.0 * Math.PI * Frequency * Math.Max(0.0, time - w.SineStart) + w.SinePhase;
        double amplitude = w.SineAmplitude;
        double vs = amplitude * Math.Sin(theta);
        bool rising = amplitude * Math.Cos(theta) >= 0;
        double vd = DiodeDrop(Current(vdc, out _));
        double lo, hi;
        if (Shape == RectifierShape.Bridge)
        {
            hi = vdc + 2.0 * vd;
            lo = -hi;
        }
        else
        {
            hi = Math.Min(vdc + vd, ClampVoltage + vd);
            lo = -vd;
        }
        return rising ? Math.Max(vs - hi, -Peak - lo) : Math.Min(vs - lo, Peak - hi);
    }

    /// <summary>Forward voltage of one rectifier diode at <paramref name="current"/> amperes (its junction law plus its
    /// series resistance), volts.</summary>
    public double DiodeDrop(double current)
    {
        double i = Math.Max(current, 1e-9);
        return _vte * Math.Log(i / SaturationCurrent + 1.0) + i * SeriesResistance;
    }

    /// <summary>
    /// Cycle-average current into the DC side at DC voltage <paramref name="v"/> (bridge 4fC·(V_pk − v − 2V_D),
    /// half-wave fC·(2V_pk − v − 2V_D)), with V_D at that current, and its derivative with respect to v.
    /// </summary>
    public double Current(double v, out double derivative)
    {
        double k = Shape == RectifierShape.Bridge ? 4.0 : 1.0;       // coulombs per volt of headroom, in units of f·C
        double reach = Shape == RectifierShape.Bridge ? Peak : 2.0 * Peak;
        double fc = k * Frequency * Capacitance;
        // V_D at the current the headroom gives with a first guess of 0.6 V per diode (one correction: V_D moves by
        // V_T·ln of the ratio, a few millivolts).
        double vd = DiodeDrop(fc * Math.Max(reach - v - 1.2, 0.0));
        double headroom = reach - v - 2.0 * vd;
        double s = headroom / Rounding;
        // Rounded max(0, headroom): Rounding·ln(1 + e^s), computed without overflow.
        double soft = s > 0 ? headroom + Rounding * Math.Log(1.0 + Math.Exp(-s)) : Rounding * Math.Log(1.0 + Math.Exp(s));
        double slope = 1.0 / (1.0 + Math.Exp(-s));
        double i = fc * soft;
        derivative = -fc * slope;
        if (double.IsFinite(ClampVoltage))
        {
            // The Zener return takes the current once the rail reaches V_Z − V_D.
            double z = (v - ClampVoltage) / Rounding;
            double pass = 1.0 / (1.0 + Math.Exp(Math.Clamp(z, -60.0, 60.0)));
            derivative = derivative * pass - i * pass * (1.0 - pass) / Rounding;
            i *= pass;
        }
        return i;
    }

    public override void Setup(SetupContext setup)
    {
        _p = setup.Node(Nodes[0]);
        _n = setup.Node(Nodes[1]);
        _slots = setup.Pair(_p, _n);
    }

    public override void Load(LoadContext ctx)
    {
        if (!Active) return;
        double v = ctx.V(_p) - ctx.V(_n);
        double i = Current(v, out double g) * ctx.SourceScale;
        ctx.AddCurrent(_n, _p, i); // into the DC plus, out of the DC minus
        _slots.Add(ctx.G, -g * ctx.SourceScale);
    }

    /// <summary>
    /// The averaged model of the supply among <paramref name="devices"/>, found from the parts' roles (the sine source,
    /// the dropper in series with it, the rectifier diodes between its AC node and the rail): null when there is no
    /// dropper or no rectifier of a known shape (then the run stays in full mains detail).
    /// </summary>
    public static AveragedDropper? For(IReadOnlyList<Device> devices)
    {
        SupplySection? section = SupplySection.Find(devices);
        if (section is null || section.Droppers.Count == 0 || section.Rail is null) return null;
        VoltageSource? source = devices.OfType<VoltageSource>().FirstOrDefault(d => ReferenceEquals(d.Role, section.Source));
        if (source is null || source.Waveform.SineOffset != 0) return null;
        var rectifiers = devices.OfType<Diode>().Where(d => d.Role is JunctionRole { IsZener: false }).ToList();
        static string N(string node) => Ground.Normalize(node);
        static JunctionRole J(Diode d) => (JunctionRole)d.Role!;

        // Bridge: two diodes with one cathode (the DC plus) whose anodes are the cathodes of two diodes with one anode
        // (the DC minus).
        foreach (Diode a in rectifiers)
            foreach (Diode b in rectifiers)
            {
                if (ReferenceEquals(a, b) || N(J(a).Cathode) != N(J(b).Cathode) || N(J(a).Anode) == N(J(b).Anode)) continue;
                string ac1 = N(J(a).Anode), ac2 = N(J(b).Anode);
                Diode? c = rectifiers.FirstOrDefault(d => N(J(d).Cathode) == ac1);
                if (c is null) continue;
                Diode? e = rectifiers.FirstOrDefault(d => N(J(d).Cathode) == ac2 && N(J(d).Anode) == N(J(c).Anode));
                if (e is null || N(J(c).Anode) == N(J(a).Cathode)) continue;
                return WithLift(new AveragedDropper(J(a).Cathode, J(c).Anode, source, RectifierShape.Bridge, section.DropperCapacitance, a, double.PositiveInfinity)
                { MainsNodes = MainsSide(section, ac1, ac2) }, section);
            }

        // Half-wave: a diode from an AC node (a dropper's or a series resistor's pin) into the rail's plus, with a
        // return junction from the rail's minus to that AC node.
        var acNodes = section.Droppers.SelectMany(d => new[] { N(d.P), N(d.N) })
            .Concat(section.SeriesResistors.SelectMany(r => new[] { N(r.A), N(r.B) })).ToHashSet(StringComparer.Ordinal);
        string plus = N(section.Rail.Plus), minus = N(section.Rail.Minus);
        foreach (Diode d in rectifiers)
        {
            string anode = N(J(d).Anode);
            if (!acNodes.Contains(anode) || N(J(d).Cathode) != plus) continue;
            Device? ret = devices.FirstOrDefault(x => x.Role is JunctionRole r && N(r.Cathode) == anode && N(r.Anode) == minus);
            if (ret?.Role is not JunctionRole back) continue;
            double clamp = back.IsZener ? back.BreakdownVoltage : double.PositiveInfinity;
            var model = new AveragedDropper(J(d).Cathode, section.Rail.Minus, source, RectifierShape.HalfWave, section.DropperCapacitance, d, double.PositiveInfinity)
            { MainsNodes = MainsSide(section, anode) };
            if (!double.IsFinite(clamp)) return WithLift(model, section);
            // The Zener clamps the AC node at V_Z: the rail tops out one diode drop below it.
            double vd = model.DiodeDrop(model.Current(clamp, out _) + 1e-3);
            return WithLift(new AveragedDropper(J(d).Cathode, section.Rail.Minus, source, RectifierShape.HalfWave, section.DropperCapacitance, d, clamp - vd)
            { MainsNodes = model.MainsNodes }, section);
        }
        return null;
    }

    /// <summary>The source's, droppers', bleeders' and series resistors' nodes and the rectifier's AC terminals, ground
    /// left out.</summary>
    private static List<string> MainsSide(SupplySection section, params string[] acTerminals)
    {
        var nodes = new List<string> { section.Source.Plus, section.Source.Minus };
        foreach (CapacitorRole c in section.Droppers) nodes.AddRange([c.P, c.N]);
        foreach (ResistorRole r in section.Bleeders.Concat(section.SeriesResistors)) nodes.AddRange([r.A, r.B]);
        nodes.AddRange(acTerminals);
        return nodes.Where(n => !Ground.Is(n)).Select(n => n).Distinct(StringComparer.Ordinal).ToList();
    }

    /// <summary>The model with the dropper's place in the loop: which of its pins faces the source (reached from the
    /// source's plus, or its minus, through series resistors only).</summary>
    private static AveragedDropper WithLift(AveragedDropper model, SupplySection section)
    {
        static string N(string node) => Ground.Normalize(node);
        HashSet<string> Reach(string from)
        {
            var set = new HashSet<string>(StringComparer.Ordinal) { N(from) };
            for (bool grew = true; grew;)
            {
                grew = false;
                foreach (ResistorRole r in section.SeriesResistors)
                {
                    if (set.Contains(N(r.A)) && set.Add(N(r.B))) grew = true;
                    if (set.Contains(N(r.B)) && set.Add(N(r.A))) grew = true;
                }
            }
            return set;
        }
        CapacitorRole dropper = section.Droppers[0];
        HashSet<string> plus = Reach(section.Source.Plus), minus = Reach(section.Source.Minus);
        foreach (var (source, sign) in new[] { (plus, 1.0), (minus, -1.0) })
        {
            List<string> side = sign > 0 ? [.. source.Where(n => !Ground.Is(n))] : [];
            if (source.Contains(N(dropper.P)) && !source.Contains(N(dropper.N)))
                return new AveragedDropper(model, dropper.N, dropper.P, sign) { SourceSide = side };
            if (source.Contains(N(dropper.N)) && !source.Contains(N(dropper.P)))
                return new AveragedDropper(model, dropper.P, dropper.N, sign) { SourceSide = side };
        }
        return model;
    }

    private AveragedDropper(AveragedDropper model, string liftNode, string liftReference, double sign)
        : this(model.Nodes[0], model.Nodes[1], model.Source, model.Shape, model.Capacitance, model._diode, model.ClampVoltage)
    {
        LiftNode = liftNode;
        LiftReference = liftReference;
        LiftSign = sign;
        MainsNodes = model.MainsNodes;
    }
}
