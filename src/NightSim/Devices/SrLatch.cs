using NightSim.Results;
using NightSim.Devices.Behavioural;
using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>Settings of an <see cref="SrLatch"/> (SI units).</summary>
/// <param name="ResetDominant">True: set and reset both active → q low; false: → q high.</param>
/// <param name="Hysteresis">Input hysteresis around half the supply, V.</param>
/// <param name="OutputResistance">Output resistance of q and not-q, Ω.</param>
/// <param name="Transition">Output transition time, s.</param>
/// <param name="ClearActiveAtPowerUp">True when the clear input is taken as active at power-up (it follows a rising
/// supply, e.g. a reset comparator that powers up active).</param>
/// <param name="RisingMeans">What q going high means to the analysis (inside a composite part).</param>
/// <param name="FallingMeans">What q going low means.</param>
public sealed record SrLatchSettings(
    bool ResetDominant = true,
    double Hysteresis = 0.1,
    double OutputResistance = 100.0,
    double Transition = 1e-6,
    bool ClearActiveAtPowerUp = false,
    DeviceEventKind RisingMeans = DeviceEventKind.Other,
    DeviceEventKind FallingMeans = DeviceEventKind.Other);

/// <summary>
/// Set-reset latch with logic inputs read against half the supply (with hysteresis), outputs q and not-q as push-pull
/// Norton stages referenced to the supply pins, a finite output transition, and an optional clear input that dominates
/// both (used by the timer's reset pin). Powers up with q low.
/// </summary>
/// <remarks>
/// One event function per input: with d = V_in − (V_vcc + V_gnd)/2, g = d − hys/2 while the input is read low and
/// −(d + hys/2) while read high (negative while consistent). On any input change the next q follows from the input
/// levels: clear → low; set and reset → by priority; set → high; reset → low; neither → hold.
/// </remarks>
public sealed class SrLatch : Device, IEventSource, ILogicLevel
{
    private static readonly ParameterSpec s_priority = ParameterSpec.Word("priority", "Which input wins when set and reset are both active", "reset", "set") with { DefaultText = "reset" };
    private static readonly ParameterSpec s_hysteresis = ParameterSpec.Number("hysteresis", "V", "Input hysteresis around half the supply") with { Default = 0.1, Min = 0, Max = 100 };
    private static readonly ParameterSpec s_outputResistance = ParameterSpec.Number("outputResistance", "Ω", "Output resistance of q and not-q") with { Default = 100.0, Min = 1e-3, Max = 1e9 };
    private static readonly ParameterSpec s_transition = ParameterSpec.Number("transition", "s", "Output transition time (linear ramp)") with { Default = 1e-6, Min = 1e-12, Max = 1.0 };

    public static PartKind Kind { get; } = new()
    {
        Name = "sr-latch",
        Description = "Set-reset latch, reset-dominant by default, levels from its supply pins",
        Pins = ["set", "reset", "q", "notQ", "vcc", "gnd"],
        OptionalPins = ["notQ"],
        Parameters = [s_priority, s_hysteresis, s_outputResistance, s_transition],
        Create = part =>
        [
            new SrLatch(part.Id, part.Id, part.Node("set"), part.Node("reset"), null, part.Node("q"),
                part.ConnectedPin("notQ"), part.Node("vcc"), part.Node("gnd"),
                new SrLatchSettings(
                    ResetDominant: part.Parameters.TextOrDefault(s_priority) != "set",
                    Hysteresis: part.Parameters.NumberOrDefault(s_hysteresis),
                    OutputResistance: part.Parameters.NumberOrDefault(s_outputResistance),
                    Transition: part.Parameters.NumberOrDefault(s_transition))),
        ],
    };

    private const int SetInput = 0;
    private const int ResetInput = 1;
    private const int ClearInput = 2;

    private readonly SrLatchSettings _settings;
    private readonly bool _hasClear;
    private readonly bool _hasNotQ;
    private readonly int[] _inputs;
    private readonly bool[] _inputHigh;
    private int _q, _nq, _vcc, _gnd;
    private SupplyOutput _qOut, _nqOut;
    private bool _stateHigh;
    private LevelRamp _level;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Netlist part id.</param>
    /// <param name="set">Set input node.</param>
    /// <param name="reset">Reset input node.</param>
    /// <param name="clear">Optional clear input node (dominates set and reset), or null.</param>
    /// <param name="q">Output node.</param>
    /// <param name="notQ">Optional inverted output node, or null.</param>
    /// <param name="vcc">Upper supply node.</param>
    /// <param name="gnd">Lower supply node.</param>
    /// <param name="settings">Settings.</param>
    public SrLatch(string name, string partId, string set, string reset, string? clear, string q, string? notQ, string vcc, string gnd, SrLatchSettings settings)
        : base(name, partId, BuildNodes(set, reset, clear, q, notQ, vcc, gnd))
    {
        _settings = settings;
        _hasClear = clear is not null;
        _hasNotQ = notQ is not null;
        _inputs = new int[_hasClear ? 3 : 2];
        _inputHigh = new bool[_inputs.Length];
        PowerUp();
    }

    private static List<string> BuildNodes(string set, string reset, string? clear, string q, string? notQ, string vcc, string gnd)
    {
        var nodes = new List<string> { set, reset, q, vcc, gnd };
        if (clear is not null) nodes.Add(clear);
        if (notQ is not null) nodes.Add(notQ);
        return nodes;
    }

    /// <summary>Latch state, true = q high.</summary>
    public bool IsSet => _stateHigh;

    public int EventCount => _inputs.Length;

    public override void Setup(SetupContext setup)
    {
        // Node order: set, reset, q, vcc, gnd, [clear], [notQ].
        _inputs[SetInput] = setup.Node(Nodes[0]);
        _inputs[ResetInput] = setup.Node(Nodes[1]);
        _q = setup.Node(Nodes[2]);
        _vcc = setup.Node(Nodes[3]);
        _gnd = setup.Node(Nodes[4]);
        if (_hasClear) _inputs[ClearInput] = setup.Node(Nodes[5]);
        _qOut = SupplyOutput.Reserve(setup, _q, _vcc, _gnd);
        if (_hasNotQ)
        {
            _nq = setup.Node(Nodes[^1]);
            _nqOut = SupplyOutput.Reserve(setup, _nq, _vcc, _gnd);
        }
    }

    public override void PowerUp()
    {
        Array.Clear(_inputHigh);
        if (_hasClear) _inputHigh[ClearInput] = _settings.ClearActiveAtPowerUp;
        _stateHigh = false;
        _level = new LevelRamp(0.0, _settings.Transition);
    }

    public double Level(double time) => _level.At(time);

    public override void Load(LoadContext ctx)
    {
        double f = _level.At(ctx.Time);
        double g = 1.0 / _settings.OutputResistance;
        _qOut.Load(ctx, f, g, g, 0.0, 0.0);
        if (_hasNotQ) _nqOut.Load(ctx, 1.0 - f, g, g, 0.0, 0.0);
    }

    public double EventValue(int index, LoadContext ctx)
    {
        double vg = ctx.V(_gnd);
        double d = ctx.V(_inputs[index]) - vg - 0.5 * (ctx.V(_vcc) - vg);
        double half = 0.5 * _settings.Hysteresis;
        return _inputHigh[index] ? -(d + half) : d - half;
    }

    public void OnEvent(int index, LoadContext ctx, EventSink events)
    {
        _inputHigh[index] = !_inputHigh[index];
        bool next = NextState();
        if (next == _stateHigh) return;
        bool old = _stateHigh;
        _stateHigh = next;
        _level.Begin(ctx.Time, next ? 1.0 : 0.0);
        events.Record(this, "q", old ? "high" : "low", next ? "high" : "low", next ? _settings.RisingMeans : _settings.FallingMeans);
        events.RequestBreakpoint(_level.End);
    }

    public override double NextBreakpoint(double time) => _level.NextEdge(time);

    private bool NextState()
    {
        if (_hasClear && _inputHigh[ClearInput]) return false;
        bool set = _inputHigh[SetInput];
        bool reset = _inputHigh[ResetInput];
        if (set && reset) return !_settings.ResetDominant;
        if (set) return true;
        if (reset) return false;
        return _stateHigh;
    }
}
