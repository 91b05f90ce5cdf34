using NightSim.Results;
using NightSim.Devices.Behavioural;
using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>Settings of a <see cref="Relay"/> (SI units).</summary>
/// <param name="CoilResistance">Coil resistance, Ω.</param>
/// <param name="CoilInductance">Coil inductance, H.</param>
/// <param name="PullIn">Pull-in (must-operate) voltage, V; the coil pulls in when |i| reaches PullIn / CoilResistance.</param>
/// <param name="DropOut">Drop-out (must-release) voltage, V; it releases when |i| falls to DropOut / CoilResistance.</param>
/// <param name="OperateTime">Armature travel time from pull-in to contacts changed over, s.</param>
/// <param name="ReleaseTime">Armature travel time from drop-out to contacts back, s.</param>
/// <param name="ContactResistance">Closed contact resistance, Ω.</param>
/// <param name="OpenResistance">Open contact resistance, Ω.</param>
/// <param name="Transition">Contact transition time, s.</param>
/// <param name="LoadName">Name of a switched load, or null.</param>
/// <param name="LoadPower">Load power when on, W.</param>
/// <param name="LoadNormallyClosed">True when the named load is on while the relay is released.</param>
public sealed record RelaySettings(
    double CoilResistance = 400.0,
    double CoilInductance = 0.5,
    double PullIn = 9.0,
    double DropOut = 1.2,
    double OperateTime = 3e-3,
    double ReleaseTime = 2e-3,
    double ContactResistance = 0.05,
    double OpenResistance = 1e12,
    double Transition = 1e-6,
    string? LoadName = null,
    double LoadPower = 0.0,
    bool LoadNormallyClosed = false);

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
/// Default values are those of a generic 12 V relay class (400 Ω, pull-in 9.0 V, drop-out 1.2 V, operate ≤ 10 ms,
/// release ≤ 5 ms: common practice for the class; 0.5 H from memory).
/// </remarks>
public sealed class Relay : Device, IEventSource, ISwitchedLoad
{
    // The defaults are written once, in RelaySettings; the netlist parameters take theirs from there.
    private static readonly RelaySettings s_defaults = new();
    private static readonly ParameterSpec s_coilResistance = ParameterSpec.Number("coilResistance", "Ω", "Coil resistance") with { Default = s_defaults.CoilResistance, Min = 1e-3, Max = 1e7 };
    private static readonly ParameterSpec s_coilInductance = ParameterSpec.Number("coilInductance", "H", "Coil inductance") with { Default = s_defaults.CoilInductance, Min = 1e-9, Max = 1e3 };
    private static readonly ParameterSpec s_pullIn = ParameterSpec.Number("pullIn", "V", "Pull-in (must-operate) coil voltage") with { Default = s_defaults.PullIn, Min = 1e-3, Max = 1e4 };
    private static readonly ParameterSpec s_dropOut = ParameterSpec.Number("dropOut", "V", "Drop-out (must-release) coil voltage; above 0 V (a relay at 0 V would never release)") with { Default = s_defaults.DropOut, Min = 1e-3, Max = 1e4 };
    private static readonly ParameterSpec s_thresholdTolerance = ParameterSpec.Number("thresholdTolerance", "", "Relative spread of pullIn and dropOut between parts, for `nightsim spread`.") with { Default = 0.1, Min = 0, Max = 0.5 };
    private static readonly ParameterSpec s_operateTime = ParameterSpec.Number("operateTime", "s", "Armature travel time after pull-in") with { Default = s_defaults.OperateTime, Min = 0, Max = 10 };
    private static readonly ParameterSpec s_releaseTime = ParameterSpec.Number("releaseTime", "s", "Armature travel time after drop-out") with { Default = s_defaults.ReleaseTime, Min = 0, Max = 10 };
    private static readonly ParameterSpec s_contactResistance = ParameterSpec.Number("contactResistance", "Ω", "Closed contact resistance") with { Default = s_defaults.ContactResistance, Min = 1e-6, Max = 1e3 };
    private static readonly ParameterSpec s_openResistance = ParameterSpec.Number("openResistance", "Ω", "Open contact resistance") with { Default = s_defaults.OpenResistance, Min = 1e3, Max = 1e18 };
    private static readonly ParameterSpec s_transition = ParameterSpec.Number("transition", "s", "Contact transition time") with { Default = s_defaults.Transition, Min = 1e-12, Max = 1.0 };
    private static readonly ParameterSpec s_load = new("load", ParameterType.Text, "", "Name of a load switched by the contacts (for energy and light reports), e.g. \"lamp\"");
    private static readonly ParameterSpec s_loadPower = ParameterSpec.Number("loadPower", "W", "Power of the named load when on") with { Min = 0, Max = 1e5 };
    private static readonly ParameterSpec s_loadContact = ParameterSpec.Word("loadContact", "Which contact switches the named load on", "no", "nc") with { DefaultText = "no" };

    public static PartKind Kind { get; } = new()
    {
        Name = "relay",
        Description = "Relay: R-L coil, pull-in/drop-out hysteresis, operate/release times, changeover contacts, named load",
        Pins = ["coilA", "coilB", "com", "no", "nc", "com2", "no2", "nc2"],
        OptionalPins = ["com", "no", "nc", "com2", "no2", "nc2"],
        PinsThatMustDiffer = ["coilA", "coilB"],
        Parameters = [s_coilResistance, s_coilInductance, s_pullIn, s_dropOut, s_operateTime, s_releaseTime, s_contactResistance, s_openResistance, s_transition, s_load, s_loadPower, s_loadContact, s_thresholdTolerance],
        Check = CheckDefinition,
        FacesMains = part => part.Parameters.Has(s_load.Name),
        Create = part => [FromDefinition(part)],
    };

    private readonly RelaySettings _settings;
    private readonly RelayContact[] _contacts;
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
        _contacts = [.. contacts];
        _contactA = new int[_contacts.Length];
        _contactB = new int[_contacts.Length];
        _contactSlots = new PairSlots[_contacts.Length];
        Role = new Roles.RelayCoilRole(partId, coilA, coilB, settings.PullIn, settings.DropOut, settings.CoilResistance, CoilCurrentLabel(name));
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
            PullIn: p.NumberOrDefault(s_pullIn),
            DropOut: p.NumberOrDefault(s_dropOut),
            OperateTime: p.NumberOrDefault(s_operateTime),
            ReleaseTime: p.NumberOrDefault(s_releaseTime),
            ContactResistance: p.NumberOrDefault(s_contactResistance),
            OpenResistance: p.NumberOrDefault(s_openResistance),
            Transition: p.NumberOrDefault(s_transition),
            LoadName: load.Length > 0 ? load : null,
            LoadPower: p.Number(s_loadPower.Name, 0.0),
            LoadNormallyClosed: p.TextOrDefault(s_loadContact) == "nc");
        return new Relay(part.Id, part.Id, part.Node("coilA"), part.Node("coilB"), contacts, settings);
    }

    private static IEnumerable<string> CheckDefinition(PartDefinition part)
    {
        PartParameters p = part.Parameters;
        if (p.NumberOrDefault(s_dropOut) >= p.NumberOrDefault(s_pullIn))
            yield return "dropOut must be below pullIn (a relay releases at a lower coil voltage than it operates); typical 12 V relay: pullIn 9 V, dropOut 1.2 V";
        foreach (string suffix in (string[])["", "2"])
        {
            bool hasCom = part.ConnectedPin("com" + suffix) is not null;
            bool hasSide = part.ConnectedPin("no" + suffix) is not null || part.ConnectedPin("nc" + suffix) is not null;
            if (hasCom != hasSide)
                yield return $"contact set 'com{suffix}' needs its common pin and at least one of 'no{suffix}', 'nc{suffix}'";
        }
        if (p.Text(s_load.Name).Length > 0 && !p.Has(s_loadPower.Name))
            yield return "a named load needs 'loadPower' (W), e.g. \"loadPower\": \"60W\"";
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
        double r = _settings.CoilResistance;
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
            double r = _settings.CoilResistance;
            return _energised ? _settings.DropOut / r - i : i - _settings.PullIn / r;
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
            events.Record(this, "contact " + _contacts[k].Label, closed ? "open" : "closed", closed ? "closed" : "open",
                _operated ? DeviceEventKind.RelayOperated : DeviceEventKind.RelayReleased);
        }
        if (_settings.LoadName is not null && wasLoadOn != LoadOn)
            events.Record(this, "load " + _settings.LoadName, wasLoadOn ? "on" : "off", LoadOn ? "on" : "off",
                LoadOn ? DeviceEventKind.LoadOn : DeviceEventKind.LoadOff);
        events.RequestBreakpoint(_armature.End);
    }
}
