using NightSim.Results;
using NightSim.Devices.Behavioural;
using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>Settings of a <see cref="Comparator"/> (SI units).</summary>
/// <param name="Offset">Input offset, V: the output goes high when V+ − V− exceeds it.</param>
/// <param name="Hysteresis">Full hysteresis width, V (thresholds at offset ± hysteresis/2).</param>
/// <param name="OpenCollector">True: the output only sinks (to the gnd pin); false: push-pull between the supply pins.</param>
/// <param name="OutputResistance">Output resistance, Ω (push-pull both states; open collector when on).</param>
/// <param name="OffResistance">Open-collector output resistance when off, Ω.</param>
/// <param name="Delay">Response delay from the input crossing to the start of the output transition, s (inertial:
/// an input that crosses back within the delay cancels the change).</param>
/// <param name="Transition">Output transition time, s.</param>
/// <param name="InitialHigh">Output state at power-up.</param>
/// <param name="RisingMeans">What the output going high means to the analysis (inside a composite part).</param>
/// <param name="FallingMeans">What the output going low means.</param>
public sealed record ComparatorSettings(
    double Offset = 0.0,
    double Hysteresis = 1e-3,
    bool OpenCollector = false,
    double OutputResistance = 100.0,
    double OffResistance = 1e9,
    double Delay = 0.0,
    double Transition = 1e-6,
    bool InitialHigh = false,
    DeviceEventKind RisingMeans = DeviceEventKind.Other,
    DeviceEventKind FallingMeans = DeviceEventKind.Other);

/// <summary>
/// Voltage comparator with hysteresis, optional response delay and a finite output transition.
/// Pins: plus, minus, output, vcc, gnd. Output: push-pull Norton stage referenced to the supply pins
/// (<see cref="SupplyOutput"/>) or an open collector to gnd.
/// </summary>
/// <remarks>
/// Event 0 (input): with d = V+ − V− − offset, while the decided state is low g = d − hys/2, while high g = −(d + hys/2);
/// g is negative while the state agrees with the input and crosses zero upward when it must flip, so after a flip it is
/// negative again (hysteresis as a state-dependent threshold). Event 1 (only with a delay): g = t − t_due while a change
/// is pending, −1 otherwise. The output level ramps linearly over <see cref="ComparatorSettings.Transition"/> and the
/// ramp end is requested as a breakpoint.
/// </remarks>
public sealed class Comparator : Device, IEventSource, ILogicLevel
{
    private static readonly ParameterSpec s_hysteresis = ParameterSpec.Number("hysteresis", "V", "Full hysteresis width (thresholds at offset ± half of it)") with { Default = 1e-3, Min = 0, Max = 100 };
    private static readonly ParameterSpec s_offset = ParameterSpec.Number("offset", "V", "Switching point: output high when V+ − V− exceeds it") with { Default = 0.0, Min = -1000, Max = 1000 };
    private static readonly ParameterSpec s_output = ParameterSpec.Word("outputType", "Output stage", "push-pull", "open-collector") with { DefaultText = "push-pull" };
    private static readonly ParameterSpec s_outputResistance = ParameterSpec.Number("outputResistance", "Ω", "Output resistance (open collector: when on)") with { Default = 100.0, Min = 1e-3, Max = 1e9 };
    private static readonly ParameterSpec s_offResistance = ParameterSpec.Number("offResistance", "Ω", "Open-collector output resistance when off") with { Default = 1e9, Min = 1.0, Max = 1e15 };
    private static readonly ParameterSpec s_delay = ParameterSpec.Number("delay", "s", "Response delay from input crossing to output change (inertial)") with { Default = 0.0, Min = 0, Max = 1e4 };
    private static readonly ParameterSpec s_transition = ParameterSpec.Number("transition", "s", "Output transition time (linear ramp)") with { Default = 1e-6, Min = 1e-12, Max = 1.0 };
    private static readonly ParameterSpec s_initial = ParameterSpec.Word("initial", "Output state at power-up", "low", "high") with { DefaultText = "low" };

    public static PartKind Kind { get; } = new()
    {
        Name = "comparator",
        Description = "Voltage comparator with hysteresis, optional delay, push-pull or open-collector output",
        Pins = ["plus", "minus", "output", "vcc", "gnd"],
        Parameters = [s_hysteresis, s_offset, s_output, s_outputResistance, s_offResistance, s_delay, s_transition, s_initial],
        Create = part => [FromDefinition(part.Id, part)],
    };

    private readonly ComparatorSettings _settings;
    private int _plus, _minus, _out, _vcc, _gnd;
    private SupplyOutput _pushPull;
    private PairSlots _sink;

    private bool _decidedHigh;
    private bool _outputHigh;
    private bool _pending;
    private double _due;
    private LevelRamp _level;

    public Comparator(string name, string partId, string plus, string minus, string output, string vcc, string gnd, ComparatorSettings settings)
        : base(name, partId, [plus, minus, output, vcc, gnd])
    {
        _settings = settings;
        PowerUp();
    }

    /// <summary>Builds a comparator named <paramref name="name"/> from a part definition's pins and parameters.</summary>
    public static Comparator FromDefinition(string name, PartDefinition part)
    {
        PartParameters p = part.Parameters;
        var settings = new ComparatorSettings(
            Offset: p.NumberOrDefault(s_offset),
            Hysteresis: p.NumberOrDefault(s_hysteresis),
            OpenCollector: p.TextOrDefault(s_output) == "open-collector",
            OutputResistance: p.NumberOrDefault(s_outputResistance),
            OffResistance: p.NumberOrDefault(s_offResistance),
            Delay: p.NumberOrDefault(s_delay),
            Transition: p.NumberOrDefault(s_transition),
            InitialHigh: p.TextOrDefault(s_initial) == "high");
        return new Comparator(name, part.Id, part.Node("plus"), part.Node("minus"), part.Node("output"), part.Node("vcc"), part.Node("gnd"), settings);
    }

    public ComparatorSettings Settings => _settings;

    /// <summary>Output state (after any delay), true = high (open collector: released).</summary>
    public bool OutputHigh => _outputHigh;

    public int EventCount => _settings.Delay > 0.0 ? 2 : 1;

    public override void Setup(SetupContext setup)
    {
        _plus = setup.Node(Nodes[0]);
        _minus = setup.Node(Nodes[1]);
        _out = setup.Node(Nodes[2]);
        _vcc = setup.Node(Nodes[3]);
        _gnd = setup.Node(Nodes[4]);
        if (_settings.OpenCollector) _sink = setup.Pair(_out, _gnd);
        else _pushPull = SupplyOutput.Reserve(setup, _out, _vcc, _gnd);
    }

    public override void PowerUp()
    {
        _decidedHigh = _settings.InitialHigh;
        _outputHigh = _settings.InitialHigh;
        _pending = false;
        _due = double.PositiveInfinity;
        _level = new LevelRamp(_outputHigh ? 1.0 : 0.0, _settings.Transition);
    }

    public double Level(double time) => _level.At(time);

    public override void Load(LoadContext ctx)
    {
        double f = _level.At(ctx.Time);
        double gOn = 1.0 / _settings.OutputResistance;
        if (_settings.OpenCollector)
        {
            // Geometric blend between off and on conductance: smooth in log(g) over the transition.
            double gOff = 1.0 / _settings.OffResistance;
            double g = gOff * Math.Pow(gOn / gOff, 1.0 - f);
            double v = ctx.V(_out) - ctx.V(_gnd);
            ctx.AddCurrent(_out, _gnd, g * v);
            _sink.Add(ctx.G, g);
        }
        else
        {
            _pushPull.Load(ctx, f, gOn, gOn, 0.0, 0.0);
        }
    }

    public double EventValue(int index, LoadContext ctx)
    {
        if (index == 0)
        {
            double d = ctx.V(_plus) - ctx.V(_minus) - _settings.Offset;
            double half = 0.5 * _settings.Hysteresis;
            return _decidedHigh ? -(d + half) : d - half;
        }
        return _pending ? ctx.Time - _due : -1.0;
    }

    public void OnEvent(int index, LoadContext ctx, EventSink events)
    {
        if (index == 0)
        {
            _decidedHigh = !_decidedHigh;
            if (_settings.Delay <= 0.0)
            {
                SwitchOutput(ctx.Time, events);
                return;
            }
            if (_decidedHigh != _outputHigh)
            {
                _pending = true;
                _due = ctx.Time + _settings.Delay;
                events.RequestBreakpoint(_due);
            }
            else
            {
                _pending = false;
                _due = double.PositiveInfinity;
            }
            return;
        }

        if (!_pending) return;
        _pending = false;
        _due = double.PositiveInfinity;
        if (_decidedHigh != _outputHigh) SwitchOutput(ctx.Time, events);
    }

    public override double NextBreakpoint(double time)
    {
        double next = _level.NextEdge(time);
        if (_pending && _due > time && _due < next) next = _due;
        return next;
    }

    private void SwitchOutput(double time, EventSink events)
    {
        bool old = _outputHigh;
        _outputHigh = _decidedHigh;
        _level.Begin(time, _outputHigh ? 1.0 : 0.0);
        events.Record(this, "output", StateWord(old), StateWord(_outputHigh), _outputHigh ? _settings.RisingMeans : _settings.FallingMeans);
        events.RequestBreakpoint(_level.End);
    }

    private static string StateWord(bool high) => high ? "high" : "low";
}
