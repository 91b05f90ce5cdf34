using NightSim.Netlist;

namespace NightSim.Devices.Light;

/// <summary>
/// Ambient light sensor with a current output: a photodiode and its current amplifier in one two-pin package, as
/// builders use for light meters and dusk switches. A current I = currentPerLux·E + darkCurrent flows in at the supply
/// pin and out of the output pin; a load resistor from the output to ground turns it into a voltage proportional to
/// the light. Near its supply the output runs out of headroom: the current is multiplied by tanh(V/V_h), where
/// V = V(supply) − V(output) and V_h is the headroom voltage (smooth, so Newton sees a continuous slope; the output
/// of an open sensor settles just below its supply instead of running away).
/// </summary>
/// <remarks>
/// Defaults (from memory, the usual order for such sensors): 0.5 µA per lux (100 lx into 10 kΩ gives 0.5 V), 10 nA in
/// darkness, 0.3 V headroom. It follows light in microseconds: no lag.
/// </remarks>
public sealed class LightCurrentSensor : Device, ILightSensor
{
    private static readonly ParameterSpec s_currentPerLux = ParameterSpec.Number("currentPerLux", "A/lx", "Output current per lux") with { Default = 0.5e-6, Min = 0, Max = 1e-2 };
    private static readonly ParameterSpec s_darkCurrent = ParameterSpec.Number("darkCurrent", "A", "Output current in darkness") with { Default = 10e-9, Min = 0, Max = 1e-3 };
    private static readonly ParameterSpec s_headroom = ParameterSpec.Number("headroom", "V", "Voltage across the sensor below which its output current falls off") with { Default = 0.3, Min = 1e-3, Max = 10 };

    public static PartKind Kind { get; } = new()
    {
        Name = "light-current-sensor",
        Description = "Ambient light sensor with current output: currentPerLux × lux + dark current, in at the supply pin, out of the output pin",
        Pins = ["supply", "output"],
        UsesNodeList = true,
        ConductsDc = false,
        Parameters = [s_currentPerLux, s_darkCurrent, s_headroom, .. LightInput.Specs],
        Create = part =>
        [
            new LightCurrentSensor(part.Id, part.Id, part.Node("supply"), part.Node("output"),
                part.Parameters.NumberOrDefault(s_currentPerLux), part.Parameters.NumberOrDefault(s_darkCurrent),
                part.Parameters.NumberOrDefault(s_headroom), LightInput.FromParameters(part.Parameters)),
        ],
    };

    private readonly double _currentPerLux, _darkCurrent, _headroom;
    private readonly LightInput _light;
    private int _supply, _output;
    private PairSlots _slots;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Part id.</param>
    /// <param name="supply">Supply pin node (current flows in here).</param>
    /// <param name="output">Output pin node (current flows out here).</param>
    /// <param name="currentPerLux">Output current per lux, A/lx.</param>
    /// <param name="darkCurrent">Output current in darkness, A.</param>
    /// <param name="headroom">Headroom voltage V_h of the tanh fall-off, V.</param>
    /// <param name="light">Light input.</param>
    public LightCurrentSensor(string name, string partId, string supply, string output, double currentPerLux, double darkCurrent,
        double headroom, LightInput light)
        : base(name, partId, [supply, output])
    {
        _currentPerLux = currentPerLux;
        _darkCurrent = darkCurrent;
        _headroom = headroom;
        _light = light;
        Role = light.Role(partId, Nodes, 0.0);
    }

    public LightInput Light => _light;

    /// <summary>It follows falling light at once (microseconds): 0 s.</summary>
    public double FallTimeConstant(double lux) => 0.0;

    /// <summary>Output current with full headroom at illuminance <paramref name="lux"/> (lx), A.</summary>
    public double FullCurrent(double lux) => _currentPerLux * lux + _darkCurrent;

    public override void Setup(SetupContext setup)
    {
        _supply = setup.Node(Nodes[0]);
        _output = setup.Node(Nodes[1]);
        _slots = setup.Pair(_supply, _output);
        _light.Setup(setup, this);
    }

    public override void Load(LoadContext ctx)
    {
        double full = FullCurrent(_light.Lux(ctx));
        double th = Math.Tanh((ctx.V(_supply) - ctx.V(_output)) / _headroom);
        ctx.AddCurrent(_supply, _output, full * th);
        _slots.Add(ctx.G, full * (1.0 - th * th) / _headroom);
    }

    public override double NextBreakpoint(double time) => _light.NextBreakpoint(time);
}
