using System.Globalization;
using NightSim.Netlist;
using NightSim.Units;

namespace NightSim.Devices;

/// <summary>
/// A switch between pins a and b: a resistance that is <see cref="OnResistance"/> when closed and
/// <see cref="OffResistance"/> when open. Both states stamp the same four slots. The state follows a time schedule of
/// [time, state] entries (1 = closed, 0 = open): an entry at t ≤ 0 applies at power-up, later ones are events at their
/// exact time (reported as breakpoints so the solver lands on them, then fired as event function t − t_next).
/// </summary>
public sealed class Switch : Device, IEventSource
{
    private readonly double[] _times;
    private readonly bool[] _states;
    private int _a;
    private int _b;
    private PairSlots _slots;
    private int _next;

    /// <param name="onResistance">Resistance when closed, ohms (&gt; 0).</param>
    /// <param name="offResistance">Resistance when open, ohms (&gt; onResistance).</param>
    /// <param name="initiallyClosed">State at power-up before any schedule entry.</param>
    /// <param name="schedule">(time s, state) pairs, times strictly increasing; state ≥ 0.5 = closed.</param>
    public Switch(string name, string partId, string nodeA, string nodeB, double onResistance, double offResistance,
        bool initiallyClosed, IReadOnlyList<(double X, double Y)>? schedule = null)
        : base(name, partId, [nodeA, nodeB])
    {
        if (!(onResistance > 0)) throw new ArgumentOutOfRangeException(nameof(onResistance), onResistance, "on resistance must be > 0 Ω");
        if (!(offResistance > onResistance)) throw new ArgumentOutOfRangeException(nameof(offResistance), offResistance, "off resistance must exceed the on resistance");
        OnResistance = onResistance;
        OffResistance = offResistance;
        InitiallyClosed = initiallyClosed;
        schedule ??= [];
        _times = new double[schedule.Count];
        _states = new bool[schedule.Count];
        for (int i = 0; i < schedule.Count; i++)
        {
            _times[i] = schedule[i].X;
            _states[i] = schedule[i].Y >= 0.5;
            if (i > 0 && !(_times[i] > _times[i - 1])) throw new ArgumentException("schedule times must increase strictly", nameof(schedule));
        }
        PowerUp();
    }

    /// <summary>Netlist kind "switch": nodes [a, b], on/off resistance, initial state, optional time schedule.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "switch",
        Description = "Switch with on and off resistance, an initial state and an optional time schedule.",
        Pins = ["a", "b"],
        UsesNodeList = true,
        Parameters =
        [
            ParameterSpec.Number("onResistance", "Ω", "Resistance when closed.") with { Default = 0.01, Min = 1e-6, Max = 1e6 },
            ParameterSpec.Number("offResistance", "Ω", "Resistance when open.") with { Default = 1e9, Min = 1, Max = 1e15 },
            ParameterSpec.Word("initial", "State at power-up.", "open", "closed") with { DefaultText = "open" },
            ParameterSpec.PointList("schedule", "", "Time schedule [[time, state], ...] with state 1 = closed, 0 = open."),
        ],
        Check = CheckPart,
        Create = def =>
        [
            new Switch(def.Id, def.Id, def.Node("a"), def.Node("b"), def.Parameters.Number("onResistance", 0.01),
                def.Parameters.Number("offResistance", 1e9), def.Parameters.Text("initial", "open") == "closed",
                def.Parameters.Points("schedule")),
        ],
        ConductsDc = true,
    };

    /// <summary>Resistance when closed, ohms.</summary>
    public double OnResistance { get; }

    /// <summary>Resistance when open, ohms.</summary>
    public double OffResistance { get; }

    /// <summary>State at power-up before schedule entries at t ≤ 0.</summary>
    public bool InitiallyClosed { get; }

    /// <summary>Current discrete state (true = closed).</summary>
    public bool IsClosed { get; private set; }

    public int EventCount => 1;

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _b = setup.Node(Nodes[1]);
        _slots = setup.Pair(_a, _b);
    }

    public override void PowerUp()
    {
        IsClosed = InitiallyClosed;
        _next = 0;
        while (_next < _times.Length && _times[_next] <= 0)
        {
            IsClosed = _states[_next];
            _next++;
        }
    }

    public override void Load(LoadContext ctx)
    {
        double g = 1.0 / (IsClosed ? OnResistance : OffResistance);
        ctx.AddCurrent(_a, _b, g * (ctx.V(_a) - ctx.V(_b)));
        _slots.Add(ctx.G, g);
    }

    public override double NextBreakpoint(double time)
    {
        double after = time + 1e-15 * Math.Max(1.0, Math.Abs(time));
        foreach (double t in _times)
        {
            if (t > after) return t;
        }
        return double.PositiveInfinity;
    }

    /// <summary>t − (next scheduled time): negative before it, zero or positive once reached; −1 when none is left.</summary>
    public double EventValue(int index, LoadContext ctx) => _next < _times.Length ? ctx.Time - _times[_next] : -1.0;

    public void OnEvent(int index, LoadContext ctx, EventSink events)
    {
        double reached = ctx.Time + 1e-12 * Math.Max(1.0, Math.Abs(ctx.Time));
        while (_next < _times.Length && _times[_next] <= reached)
        {
            bool was = IsClosed;
            IsClosed = _states[_next];
            _next++;
            if (was != IsClosed) events.Record(this, "contact", StateName(was), StateName(IsClosed));
        }
    }

    private static string StateName(bool closed) => closed ? "closed" : "open";

    private static IEnumerable<string> CheckPart(PartDefinition def)
    {
        double on = def.Parameters.Number("onResistance", 0.01);
        double off = def.Parameters.Number("offResistance", 1e9);
        if (!(off > on))
        {
            yield return string.Create(CultureInfo.InvariantCulture,
                $"offResistance ({EngineeringValue.Format(off, "Ω")}) must be larger than onResistance ({EngineeringValue.Format(on, "Ω")}). hint: typical values are onResistance \"10m\" and offResistance \"1G\"");
        }
        if (def.Parameters.Points("schedule") is { } schedule)
        {
            foreach ((double _, double y) in schedule)
            {
                if (y != 0 && y != 1)
                {
                    yield return string.Create(CultureInfo.InvariantCulture,
                        $"schedule state {y} is neither 0 (open) nor 1 (closed). hint: write [[\"2h\", 1], [\"6h\", 0]]");
                    break;
                }
            }
        }
    }
}
