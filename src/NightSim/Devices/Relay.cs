using NightSim.Results;
using NightSim.Devices.Behavioural;
using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>Settings of a <see cref="Relay"/> (SI units, temperatures in °C).</summary>
/// <param name="CoilResistance">Coil resistance at the reference temperature (20 °C), Ω.</param>
/// <param name="CoilInductance">Coil inductance, H.</param>
/// <param name="PullIn">Pull-in coil voltage at 20 °C, V; the coil pulls in when |i| reaches PullIn / CoilResistance
/// (the ampere-turns the armature needs do not change with temperature).</param>
/// <param name="DropOut">Drop-out coil voltage at 20 °C, V; it releases when |i| falls to DropOut / CoilResistance.</param>
/// <param name="OperateTime">Armature travel time from pull-in to contacts changed over, s.</param>
/// <param name="ReleaseTime">Armature travel time from drop-out to contacts back, s.</param>
/// <param name="ContactResistance">Closed contact resistance, Ω.</param>
/// <param name="OpenResistance">Open contact resistance, Ω.</param>
/// <param name="Transition">Contact transition time, s.</param>
/// <param name="LoadName">Name of a switched load, or null.</param>
/// <param name="LoadPower">Load power when on, W.</param>
/// <param name="LoadNormallyClosed">True when the named load is on while the relay is released.</param>
/// <param name="CoilTemperature">Coil (copper) temperature, °C: the coil resistance is
/// CoilResistance·(1 + 0.00393/K·(T − 20 °C)).</param>
/// <param name="LoadKind">What the named load is, or null when not stated.</param>
/// <param name="LoadVoltage">RMS voltage the named load runs on, V.</param>
/// <param name="LoadPowerFactor">The named load's power factor when stated, or null (its kind's typical value).</param>
/// <param name="Contacts">The contacts' rating (current, voltage, electrical life, inrush), null where not stated.</param>
public sealed record RelaySettings(
    double CoilResistance = 400.0,
    double CoilInductance = 0.5,
    double PullIn = Relay.TypicalPullInFraction * Relay.DefaultRatedVoltage,
    double DropOut = Relay.TypicalDropOutFraction * Relay.DefaultRatedVoltage,
    double OperateTime = 3e-3,
    double ReleaseTime = 2e-3,
    double ContactResistance = 0.05,
    double OpenResistance = 1e12,
    double Transition = 1e-6,
    string? LoadName = null,
    double LoadPower = 0.0,
    bool LoadNormallyClosed = false,
    double CoilTemperature = Relay.ReferenceTemperature,
    LoadKind? LoadKind = null,
    double LoadVoltage = Relay.DefaultLoadVoltage,
    double? LoadPowerFactor = null,
    ContactRating? Contacts = null)
{
    /// <summary>Coil resistance at <see cref="CoilTemperature"/>, Ω.</summary>
    public double HotCoilResistance => Relay.CoilResistanceAt(CoilResistance, CoilTemperature);

    /// <summary>Coil current at which the armature pulls in, A.</summary>
    public double PullInCurrent => PullIn / CoilResistance;

    /// <summary>Coil current at which the armature drops out, A.</summary>
    public double DropOutCurrent => DropOut / CoilResistance;
}

/// <summary>One contact: a switch between two nodes, normally open or normally closed.</summary>
/// <param name="Label">Name in the event log ("no", "nc2").</param>
/// <param name="A">First node.</param>
/// <param name="B">Second node.</param>
/// <param name="NormallyClosed">True for a break contact.</param>
public sealed record RelayContact(string Label, string A, string B, bool NormallyClosed);

/// <summary>
/// Electromechanical relay: coil R-L between coilA and coilB (a branch unknown carries the coil current), pull-in and
/// drop-out thresholds with hysteresis, operate and release travel times, and one or two changeover contact sets
/// (pins com/no/nc and com2/no2/nc2, each contact optional) plus an optional named load with a power rating.
/// </summary>
/// <remarks>
/// Thresholds act on the coil current, not the coil voltage: the armature force follows the ampere-turns, so the L/R
/// rise delays pull-in and a flyback diode that keeps current circulating delays release, both as in a real relay; the
/// rated voltages are converted with the coil resistance (steady state). Event 0: |i| − I_pull while released,
/// I_drop − |i| while pulled in (negative while consistent). Event 1: t − t_due while the armature is travelling, −1
/// otherwise. Contacts stamp the same slots in both states; their conductance blends geometrically over the transition.
/// Default values are those of a generic 12 V relay class (400 Ω, operate ≤ 10 ms, release ≤ 5 ms: common practice for
/// the class; 0.5 H from memory). Pull-in and drop-out, when not given, are fractions of <c>ratedVoltage</c>: typical
/// pull-in 70 % and drop-out 20 % (common practice, from memory: measured parts pull in at about 50–75 % and drop out
/// at 10–40 %), or with <c>thresholds</c> "worst" the limits of the class, must-operate 75 % (most) and must-release
/// 10 % (least) (common practice). Coil data are given at 20 °C (common practice); the coil is copper, whose
/// resistance rises by 0.00393 per kelvin at 20 °C (IEC 60028, International Standard of Resistance for Copper), so a
/// hot coil draws less current and needs more voltage to pull in.
/// </remarks>
public sealed class Relay : Device, IEventSource, ISwitchedLoad
{
    /// <summary>Rated coil voltage when none is given, V (the generic 12 V class).</summary>
    public const double DefaultRatedVoltage = 12.0;

    /// <summary>Voltage a named load runs on when none is given, V: the 230 V mains (IEC 60038 standard voltage).</summary>
    public const double DefaultLoadVoltage = 230.0;

    /// <summary>Typical pull-in as a fraction of the rated coil voltage (common practice, from memory).</summary>
    public const double TypicalPullInFraction = 0.70;

    /// <summary>Typical drop-out as a fraction of the rated coil voltage (common practice, from memory).</summary>
    public const double TypicalDropOutFraction = 0.20;

    /// <summary>Must-operate limit: the class is guaranteed to pull in at this fraction of rated (common practice).</summary>
    public const double MustOperateFraction = 0.75;

    /// <summary>Must-release limit: the class is guaranteed to drop out at this fraction of rated (common practice).</summary>
    public const double MustReleaseFraction = 0.10;

    /// <summary>Temperature at which coil data are given, °C (common practice).</summary>
    public const double ReferenceTemperature = 20.0;

    /// <summary>Temperature coefficient of resistance of annealed copper at 20 °C, 1/K (IEC 60028, International
    /// Standard of Resistance for Copper).</summary>
    public const double CopperCoefficient = 0.00393;

    /// <summary>Coil resistance at <paramref name="celsius"/>: R20·(1 + 0.00393/K·(T − 20 °C)), Ω.</summary>
    public static double CoilResistanceAt(double r20, double celsius) => r20 * (1.0 + CopperCoefficient * (celsius - ReferenceTemperature));

    // The defaults are written once, in RelaySettings and the constants above; the netlist parameters take theirs from there.
    private static readonly RelaySettings s_defaults = new();
    private static readonly ParameterSpec s_ratedVoltage = ParameterSpec.Number("ratedVoltage", "V", "Rated (nominal) coil voltage; pullIn and dropOut default to fractions of it") with { Default = DefaultRatedVoltage, Min = 1e-2, Max = 1e3 };
    private static readonly ParameterSpec s_thresholds = ParameterSpec.Word("thresholds",
        "Which pull-in and drop-out the rated voltage gives when they are not set: typical (pull-in 70 %, drop-out 20 % of rated; common practice, from memory) or worst (must-operate 75 %, must-release 10 %: the limits of the class; common practice)",
        "typical", "worst") with { DefaultText = "typical" };
    private static readonly ParameterSpec s_coilTemperature = ParameterSpec.Number("coilTemperature", "°C",
        "Coil temperature; the copper coil's resistance is coilResistance·(1 + 0.00393/K·(T − 20 °C)) (IEC 60028)") with { Default = ReferenceTemperature, Min = -60, Max = 200 };
    private static readonly ParameterSpec s_coilResistance = ParameterSpec.Number("coilResistance", "Ω", "Coil resistance at 20 °C") with { Default = s_defaults.CoilResistance, Min = 1e-3, Max = 1e7 };
    private static readonly ParameterSpec s_coilInductance = ParameterSpec.Number("coilInductance", "H", "Coil inductance") with { Default = s_defaults.CoilInductance, Min = 1e-9, Max = 1e3 };
    private static readonly ParameterSpec s_pullIn = ParameterSpec.Number("pullIn", "V", "Pull-in coil voltage at 20 °C (default: a fraction of ratedVoltage, see thresholds)") with { Min = 1e-3, Max = 1e4 };
    private static readonly ParameterSpec s_dropOut = ParameterSpec.Number("dropOut", "V", "Drop-out coil voltage at 20 °C, above 0 V (a relay at 0 V would never release) (default: a fraction of ratedVoltage, see thresholds)") with { Min = 1e-3, Max = 1e4 };
    private static readonly ParameterSpec s_thresholdTolerance = ParameterSpec.Number("thresholdTolerance", "", "Relative spread of pullIn and dropOut between parts, for `nightsim spread`.") with { Default = 0.1, Min = 0, Max = 0.5 };
    private static readonly ParameterSpec s_operateTime = ParameterSpec.Number("operateTime", "s", "Armature travel time after pull-in") with { Default = s_defaults.OperateTime, Min = 0, Max = 10 };
    private static readonly ParameterSpec s_releaseTime = ParameterSpec.Number("releaseTime", "s", "Armature travel time after drop-out") with { Default = s_defaults.ReleaseTime, Min = 0, Max = 10 };
    private static readonly ParameterSpec s_contactResistance = ParameterSpec.Number("contactResistance", "Ω", "Closed contact resistance") with { Default = s_defaults.ContactResistance, Min = 1e-6, Max = 1e3 };
    private static readonly ParameterSpec s_openResistance = ParameterSpec.Number("openResistance", "Ω", "Open contact resistance") with { Default = s_defaults.OpenResistance, Min = 1e3, Max = 1e18 };
    private static readonly ParameterSpec s_transition = ParameterSpec.Number("transition", "s", "Contact transition time") with { Default = s_defaults.Transition, Min = 1e-12, Max = 1.0 };
    private static readonly ParameterSpec s_load = new("load", ParameterType.Text, "", "Name of a load switched by the contacts (for energy and light reports), e.g. \"lamp\"");
    private static readonly ParameterSpec s_loadPower = ParameterSpec.Number("loadPower", "W", "Power of the named load when on") with { Min = 0, Max = 1e5 };
    private static readonly ParameterSpec s_loadContact = ParameterSpec.Word("loadContact", "Which contact switches the named load on", "no", "nc") with { DefaultText = "no" };
    private static readonly ParameterSpec s_loadKind = new("loadKind", ParameterType.Text, "",
        "What the named load is, for the current its contacts see at switch-on: " +
        string.Join("; ", LoadInrushTable.Rows.Select(r => $"{r.Word} ({r.Title}): {InrushWords(r)}")) +
        " (common practice, from memory; the report gives the numbers)") { Choices = LoadInrushTable.Words };
    private static readonly ParameterSpec s_loadVoltage = ParameterSpec.Number("loadVoltage", "V",
        "RMS voltage the named load runs on: the mains (230 V; 120 V where that is the mains) or a low-voltage lamp supply; steady current = loadPower / (loadVoltage × power factor); 50 V or more makes it a mains load for the cautions") with { Default = DefaultLoadVoltage, Min = 1, Max = 1e3 };
    private static readonly ParameterSpec s_loadPowerFactor = ParameterSpec.Number("loadPowerFactor", "",
        "Power factor of the named load when running (default: its loadKind's typical value, 1 when no kind is given)") with { Min = 0.05, Max = 1 };
    private static readonly ParameterSpec s_contactCurrent = ParameterSpec.Number("contactCurrent", "A", "Rated contact current for a resistive load, from the relay's data (the report checks the lamp's steady and switch-on current against it)") with { Min = 1e-3, Max = 1e4 };
    private static readonly ParameterSpec s_contactVoltage = ParameterSpec.Number("contactVoltage", "V", "Rated contact switching voltage, from the relay's data (checked against loadVoltage)") with { Min = 1, Max = 1e5 };
    private static readonly ParameterSpec s_contactInrush = ParameterSpec.Number("contactInrush", "A",
        $"Peak switch-on current the contacts are rated for, when the relay states one (a lamp or inrush rating); without it the report allows {ContactRating.GeneralPurposeInrushMultiple}× contactCurrent (common practice, from memory)") with { Min = 1e-3, Max = 1e5 };
    private static readonly ParameterSpec s_contactLife = ParameterSpec.Number("contactLife", "", "Electrical life of the contacts: operations (one switch-on and its switch-off) at the rated load, from the relay's data; the report counts the run's operations against it") with { Min = 1, Max = 1e12 };

    public static PartKind Kind { get; } = new()
    {
        Name = "relay",
        Description = "Relay: R-L coil, pull-in/drop-out hysteresis, operate/release times, changeover contacts, named load",
        Pins = ["coilA", "coilB", "com", "no", "nc", "com2", "no2", "nc2"],
        OptionalPins = ["com", "no", "nc", "com2", "no2", "nc2"],
        PinsThatMustDiffer = ["coilA", "coilB"],
        Parameters = [s_coilResistance, s_coilInductance, s_ratedVoltage, s_thresholds, s_pullIn, s_dropOut, s_coilTemperature, s_operateTime, s_releaseTime, s_contactResistance, s_openResistance, s_transition, s_load, s_loadPower, s_loadContact, s_thresholdTolerance, s_loadKind, s_loadVoltage, s_loadPowerFactor, s_contactCurrent, s_contactVoltage, s_contactInrush, s_contactLife],
        Check = CheckDefinition,
        Notes = ContactNotes,
        FacesMains = part => part.Parameters.Has(s_load.Name) && part.Parameters.NumberOrDefault(s_loadVoltage) >= PartKind.MainsVoltage,
        Create = part => [FromDefinition(part)],
    };

    /// <summary>What the report does with the load and contact parameters, and the contact caution, for the part-kind
    /// reference.</summary>
    private static string ContactNotes =>
        "**Contacts against the lamp.** For a relay with a named `load`, every night report gives the steady load current " +
        "`loadPower` / (`loadVoltage` × power factor) and, when `loadKind` is stated, the kind's typical switch-on peak " +
        "(common practice, from memory: " +
        string.Join("; ", LoadInrushTable.Rows.Select(r => $"`{r.Word}` {InrushWords(r)}, power factor {r.PowerFactor.ToString("0.##", System.Globalization.CultureInfo.InvariantCulture)}")) +
        ") against `contactCurrent`, `contactVoltage` and the switch-on peak the contacts take (`contactInrush`, else " +
        $"{ContactRating.GeneralPurposeInrushMultiple}× `contactCurrent`), with a warning when the contacts may weld; it counts the switch-ons, chatter " +
        "included, against `contactLife`. A load on 50 V or more is a mains load: a low-voltage design that switches one " +
        "gets the contact and wiring caution (contacts rated for the mains and the lamp's inrush, the mains wiring kept apart " +
        "from the low-voltage side, a fused lamp circuit, a closed enclosure; local electrical codes and a licensed " +
        "electrician).";

    private readonly RelaySettings _settings;
    private readonly double _hotResistance, _pullInCurrent, _dropOutCurrent;
    private readonly RelayContact[] _contacts;
    // Event signal names, made once so that switching allocates nothing.
    private readonly string[] _contactSignals;
    private readonly string? _loadSignal;
    private readonly int[] _contactA;
    private readonly int[] _contactB;
    private readonly PairSlots[] _contactSlots;
    private BranchSlots _coil;
    private int _sBrBr; // (br, br)

    private bool _energised;
    private bool _operated;
    private bool _travelling;
    private double _due;
    private LevelRamp _armature;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Netlist part id.</param>
    /// <param name="coilA">Coil node A (coil current flows A → B inside the coil).</param>
    /// <param name="coilB">Coil node B.</param>
    /// <param name="contacts">Contacts.</param>
    /// <param name="settings">Settings.</param>
    public Relay(string name, string partId, string coilA, string coilB, IReadOnlyList<RelayContact> contacts, RelaySettings settings)
        : base(name, partId, BuildNodes(coilA, coilB, contacts))
    {
        _settings = settings;
        _hotResistance = settings.HotCoilResistance;
        _pullInCurrent = settings.PullInCurrent;
        _dropOutCurrent = settings.DropOutCurrent;
        _contacts = [.. contacts];
        _contactSignals = [.. _contacts.Select(c => "contact " + c.Label)];
        _loadSignal = settings.LoadName is null ? null : "load " + settings.LoadName;
        _contactA = new int[_contacts.Length];
        _contactB = new int[_contacts.Length];
        _contactSlots = new PairSlots[_contacts.Length];
        // The analysis compares coil voltages: at the coil's temperature the same currents need R(T)/R20 more volts.
        double hot = settings.HotCoilResistance;
        Role = new Roles.RelayCoilRole(partId, coilA, coilB, settings.PullInCurrent * hot, settings.DropOutCurrent * hot, hot, CoilCurrentLabel(name));
        PowerUp();
    }

    /// <summary>Label of the coil-current unknown of a relay device named <paramref name="name"/>.</summary>
    public static string CoilCurrentLabel(string name) => name + ".i";

    private static List<string> BuildNodes(string a, string b, IReadOnlyList<RelayContact> contacts)
    {
        var nodes = new List<string> { a, b };
        foreach (RelayContact c in contacts)
        {
            nodes.Add(c.A);
            nodes.Add(c.B);
        }
        return nodes;
    }

    /// <summary>Builds a relay from a part definition.</summary>
    public static Relay FromDefinition(PartDefinition part)
    {
        PartParameters p = part.Parameters;
        var contacts = new List<RelayContact>();
        foreach (string suffix in (string[])["", "2"])
        {
            if (part.ConnectedPin("com" + suffix) is not string com) continue;
            if (part.ConnectedPin("no" + suffix) is string no) contacts.Add(new RelayContact("no" + suffix, com, no, false));
            if (part.ConnectedPin("nc" + suffix) is string nc) contacts.Add(new RelayContact("nc" + suffix, com, nc, true));
        }
        string load = p.Text(s_load.Name);
        var settings = new RelaySettings(
            CoilResistance: p.NumberOrDefault(s_coilResistance),
            CoilInductance: p.NumberOrDefault(s_coilInductance),
            PullIn: PullInOf(p),
            DropOut: DropOutOf(p),
            OperateTime: p.NumberOrDefault(s_operateTime),
            ReleaseTime: p.NumberOrDefault(s_releaseTime),
            ContactResistance: p.NumberOrDefault(s_contactResistance),
            OpenResistance: p.NumberOrDefault(s_openResistance),
            Transition: p.NumberOrDefault(s_transition),
            LoadName: load.Length > 0 ? load : null,
            LoadPower: p.Number(s_loadPower.Name, 0.0),
            LoadNormallyClosed: p.TextOrDefault(s_loadContact) == "nc",
            CoilTemperature: p.NumberOrDefault(s_coilTemperature),
            LoadKind: LoadInrushTable.ForWord(p.Text(s_loadKind.Name))?.Kind,
            LoadVoltage: p.NumberOrDefault(s_loadVoltage),
            LoadPowerFactor: p.OptionalNumber(s_loadPowerFactor.Name),
            Contacts: new ContactRating(p.OptionalNumber(s_contactCurrent.Name), p.OptionalNumber(s_contactVoltage.Name),
                p.OptionalNumber(s_contactLife.Name), p.OptionalNumber(s_contactInrush.Name)));
        return new Relay(part.Id, part.Id, part.Node("coilA"), part.Node("coilB"), contacts, settings);
    }

    private static string InrushWords(LoadInrush r) => r.MultipleHigh <= 1
        ? "no inrush"
        : string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{r.MultipleLow:0.#}–{r.MultipleHigh:0.#}× at switch-on");

    private static bool Worst(PartParameters p) => p.TextOrDefault(s_thresholds) == "worst";

    /// <summary>The pull-in ("pullIn") or drop-out ("dropOut") voltage at 20 °C a relay part uses: given, or the
    /// fraction of its rated voltage its <c>thresholds</c> choose, V. For studies that vary them.</summary>
    /// <exception cref="KeyNotFoundException">Neither name.</exception>
    public static double EffectiveThreshold(PartDefinition part, string name) => name switch
    {
        "pullIn" => PullInOf(part.Parameters),
        "dropOut" => DropOutOf(part.Parameters),
        _ => throw new KeyNotFoundException($"relay has no threshold '{name}'"),
    };

    /// <summary>Pull-in voltage at 20 °C: given, or the typical or must-operate fraction of the rated voltage, V.</summary>
    private static double PullInOf(PartParameters p) =>
        p.OptionalNumber(s_pullIn.Name) ?? (Worst(p) ? MustOperateFraction : TypicalPullInFraction) * p.NumberOrDefault(s_ratedVoltage);

    /// <summary>Drop-out voltage at 20 °C: given, or the typical or must-release fraction of the rated voltage, V.</summary>
    private static double DropOutOf(PartParameters p) =>
        p.OptionalNumber(s_dropOut.Name) ?? (Worst(p) ? MustReleaseFraction : TypicalDropOutFraction) * p.NumberOrDefault(s_ratedVoltage);

    private static IEnumerable<string> CheckDefinition(PartDefinition part)
    {
        PartParameters p = part.Parameters;
        if (DropOutOf(p) >= PullInOf(p))
            yield return $"dropOut ({DropOutOf(p):0.###} V) must be below pullIn ({PullInOf(p):0.###} V) (a relay releases at a lower coil voltage than it operates); typical 12 V relay: pullIn 8.4 V, dropOut 2.4 V";
        foreach (string suffix in (string[])["", "2"])
        {
            bool hasCom = part.ConnectedPin("com" + suffix) is not null;
            bool hasSide = part.ConnectedPin("no" + suffix) is not null || part.ConnectedPin("nc" + suffix) is not null;
            if (hasCom != hasSide)
                yield return $"contact set 'com{suffix}' needs its common pin and at least one of 'no{suffix}', 'nc{suffix}'";
        }
        if (p.Text(s_load.Name).Length > 0 && !p.Has(s_loadPower.Name))
            yield return "a named load needs 'loadPower' (W), e.g. \"loadPower\": \"60W\"";
        if (p.Text(s_load.Name).Length == 0)
        {
            foreach (ParameterSpec about in (ParameterSpec[])[s_loadKind, s_loadPowerFactor]) // loadVoltage has a default, so it is always there
            {
                if (p.Has(about.Name))
                    yield return $"'{about.Name}' describes the named load, but the relay names none. hint: add \"load\": \"lamp\" and its \"loadPower\", or remove '{about.Name}'";
            }
        }
        if (p.OptionalNumber(s_contactInrush.Name) is double inrush && p.OptionalNumber(s_contactCurrent.Name) is double rated && inrush < rated)
            yield return $"contactInrush ({inrush:0.###} A) is below contactCurrent ({rated:0.###} A); a switch-on rating is a peak, at least the steady rating. hint: take both from the relay's data";
    }

    public RelaySettings Settings => _settings;

    /// <summary>Coil above pull-in (and not yet below drop-out): the magnetic state, before the armature travel.</summary>
    public bool IsEnergised => _energised;

    /// <summary>Armature operated: normally-open contacts closed, normally-closed contacts open.</summary>
    public bool IsOperated => _operated;

    /// <summary>The contacts, in the order of <see cref="IsContactClosed"/>.</summary>
    public IReadOnlyList<RelayContact> Contacts => _contacts;

    /// <summary>True while contact <paramref name="index"/> is closed (after its transition started).</summary>
    public bool IsContactClosed(int index) => _contacts[index].NormallyClosed != _operated;

    public string? LoadName => _settings.LoadName;

    public double LoadPower => _settings.LoadName is null ? 0.0 : _settings.LoadPower;

    public bool LoadOn => _settings.LoadName is not null && _settings.LoadNormallyClosed != _operated;

    public LoadKind? LoadKind => _settings.LoadKind;

    public double LoadVoltage => _settings.LoadVoltage;

    public double? LoadPowerFactor => _settings.LoadPowerFactor;

    public ContactRating ContactRating => _settings.Contacts ?? ContactRating.Unknown;

    /// <summary>Unknown index of the coil current (A → B), valid after Setup.</summary>
    public int CoilCurrentIndex => _coil.K;

    public int EventCount => 2;

    public override void Setup(SetupContext setup)
    {
        _coil = setup.BranchBetween(setup.Node(Nodes[0]), setup.Node(Nodes[1]), CoilCurrentLabel(Name));
        _sBrBr = setup.Slot(_coil.K, _coil.K);
        for (int k = 0; k < _contacts.Length; k++)
        {
            _contactA[k] = setup.Node(_contacts[k].A);
            _contactB[k] = setup.Node(_contacts[k].B);
            _contactSlots[k] = setup.Pair(_contactA[k], _contactB[k]);
        }
    }

    public override void PowerUp()
    {
        _energised = false;
        _operated = false;
        _travelling = false;
        _due = double.PositiveInfinity;
        _armature = new LevelRamp(0.0, _settings.Transition);
    }

    public override void Load(LoadContext ctx)
    {
        // Coil: F_br = d/dt(−L·i) + (V_a − V_b − R·i) = 0; the coil current leaves node a and enters node b.
        double i = ctx.X[_coil.K];
        double r = _hotResistance;
        _coil.Load(ctx);
        ctx.J[_coil.K] -= r * i;
        ctx.Q[_coil.K] -= _settings.CoilInductance * i;
        ctx.AddG(_sBrBr, -r);
        ctx.AddC(_sBrBr, -_settings.CoilInductance);

        if (_contacts.Length == 0) return;
        double operated = _armature.At(ctx.Time);
        double gOpen = 1.0 / _settings.OpenResistance;
        double ratio = _settings.OpenResistance / _settings.ContactResistance;
        for (int k = 0; k < _contacts.Length; k++)
        {
            double closed = _contacts[k].NormallyClosed ? 1.0 - operated : operated;
            double g = gOpen * Math.Pow(ratio, closed);
            ctx.AddCurrent(_contactA[k], _contactB[k], g * (ctx.V(_contactA[k]) - ctx.V(_contactB[k])));
            _contactSlots[k].Add(ctx.G, g);
        }
    }

    public double EventValue(int index, LoadContext ctx)
    {
        if (index == 0)
        {
            double i = Math.Abs(ctx.X[_coil.K]);
            return _energised ? _dropOutCurrent - i : i - _pullInCurrent;
        }
        return _travelling ? ctx.Time - _due : -1.0;
    }

    public void OnEvent(int index, LoadContext ctx, EventSink events)
    {
        if (index == 0)
        {
            bool old = _energised;
            _energised = !_energised;
            events.Record(this, "coil", old ? "pulled in" : "released", _energised ? "pulled in" : "released",
                _energised ? DeviceEventKind.CoilPulledIn : DeviceEventKind.CoilReleased);
            if (_energised == _operated)
            {
                _travelling = false; // dropped back before the armature moved: nothing changes
                _due = double.PositiveInfinity;
                return;
            }
            double travel = _energised ? _settings.OperateTime : _settings.ReleaseTime;
            if (travel <= 0.0)
            {
                MoveArmature(ctx.Time, events);
                return;
            }
            _travelling = true;
            _due = ctx.Time + travel;
            events.RequestBreakpoint(_due);
            return;
        }

        if (!_travelling) return;
        _travelling = false;
        _due = double.PositiveInfinity;
        if (_energised != _operated) MoveArmature(ctx.Time, events);
    }

    public override double NextBreakpoint(double time)
    {
        double next = _armature.NextEdge(time);
        if (_travelling && _due > time && _due < next) next = _due;
        return next;
    }

    private void MoveArmature(double time, EventSink events)
    {
        bool wasLoadOn = LoadOn;
        _operated = _energised;
        _armature.Begin(time, _operated ? 1.0 : 0.0);
        for (int k = 0; k < _contacts.Length; k++)
        {
            bool closed = IsContactClosed(k);
            events.Record(this, _contactSignals[k], closed ? "open" : "closed", closed ? "closed" : "open",
                _operated ? DeviceEventKind.RelayOperated : DeviceEventKind.RelayReleased);
        }
        if (_loadSignal is not null && wasLoadOn != LoadOn)
            events.Record(this, _loadSignal, wasLoadOn ? "on" : "off", LoadOn ? "on" : "off",
                LoadOn ? DeviceEventKind.LoadOn : DeviceEventKind.LoadOff);
        events.RequestBreakpoint(_armature.End);
    }
}
