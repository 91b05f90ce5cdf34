using NightSim.Netlist;

namespace NightSim.Devices.Light;

/// <summary>
/// NPN phototransistor (two terminals, base open): a base photocurrent I_B = base responsivity·E is amplified by the
/// current gain β; with the collector dark current the available collector current is I_L = β·I_B + I_dark, and the
/// device saturates at low collector-emitter voltage: I_C = I_L·(1 − e^(−V_CE/V_knee)). Below 0 V it continues as the
/// tangent at 0 (I_L·V_CE/V_knee), so the reverse direction conducts little and Newton stays smooth.
/// </summary>
/// <remarks>
/// Defaults give k = β·base responsivity = 0.5 µA/lx and 10 nA dark current, an eye-corrected NPN part class
/// (from memory); V_knee 0.1 V from memory; 10 pF collector-emitter capacitance from memory.
/// </remarks>
public sealed class Phototransistor : Device, ILightSensor
{
    private static readonly ParameterSpec s_baseResponsivity = ParameterSpec.Number("baseResponsivity", "A/lx", "Base photocurrent per lux") with { Default = 1e-9, Min = 0, Max = 1e-3 };
    private static readonly ParameterSpec s_currentGain = ParameterSpec.Number("currentGain", "", "Current gain β from base photocurrent to collector") with { Default = 500.0, Min = 1, Max = 1e5 };
    private static readonly ParameterSpec s_darkCurrent = ParameterSpec.Number("darkCurrent", "A", "Collector dark current") with { Default = 10e-9, Min = 0, Max = 1e-3 };
    private static readonly ParameterSpec s_kneeVoltage = ParameterSpec.Number("kneeVoltage", "V", "Saturation knee: I_C reaches 63 % of I_L at this V_CE") with { Default = 0.1, Min = 1e-3, Max = 5 };
    private static readonly ParameterSpec s_capacitance = ParameterSpec.Number("capacitance", "F", "Collector-emitter capacitance") with { Default = 10e-12, Min = 0, Max = 1e-6 };

    public static PartKind Kind { get; } = new()
    {
        Name = "phototransistor",
        Description = "NPN phototransistor: base photocurrent × gain + dark current, saturating at low V_CE",
        Pins = ["collector", "emitter"],
        UsesNodeList = true,
        Parameters = [s_baseResponsivity, s_currentGain, s_darkCurrent, s_kneeVoltage, s_capacitance, .. LightInput.Specs],
        Create = part =>
        [
            new Phototransistor(part.Id, part.Id, part.Node("collector"), part.Node("emitter"),
                part.Parameters.NumberOrDefault(s_baseResponsivity), part.Parameters.NumberOrDefault(s_currentGain),
                part.Parameters.NumberOrDefault(s_darkCurrent), part.Parameters.NumberOrDefault(s_kneeVoltage),
                part.Parameters.NumberOrDefault(s_capacitance), LightInput.FromParameters(part.Parameters)),
        ],
    };

    private readonly double _baseResponsivity, _beta, _darkCurrent, _knee, _capacitance;
    private readonly LightInput _light;

    /// <inheritdoc />
    public LightInput Light => _light;

    /// <inheritdoc />
    public double FallTimeConstant(double lux) => 0.0;
    private int _c, _e;
    private PairSlots _slots;

    public Phototransistor(string name, string partId, string collector, string emitter, double baseResponsivity,
        double currentGain, double darkCurrent, double kneeVoltage, double capacitance, LightInput light)
        : base(name, partId, [collector, emitter])
    {
        _baseResponsivity = baseResponsivity;
        _beta = currentGain;
        _darkCurrent = darkCurrent;
        _knee = kneeVoltage;
        _capacitance = capacitance;
        _light = light;
        Role = light.Role(partId, Nodes, 0.0);
    }

    /// <summary>Available collector current I_L = β·I_B,ph + I_dark at the time in <paramref name="ctx"/>, A.</summary>
    public double AvailableCurrent(LoadContext ctx) => _beta * _baseResponsivity * _light.Lux(ctx) + _darkCurrent;

    public override void Setup(SetupContext setup)
    {
        _c = setup.Node(Nodes[0]);
        _e = setup.Node(Nodes[1]);
        _slots = setup.Pair(_c, _e);
        _light.Setup(setup, this);
    }

    public override void Load(LoadContext ctx)
    {
        double v = ctx.V(_c) - ctx.V(_e);
        double il = AvailableCurrent(ctx);
        double i, g;
        if (v >= 0.0)
        {
            double e = Math.Exp(-v / _knee);
            i = il * (1.0 - e);
            g = il * e / _knee;
        }
        else
        {
            g = il / _knee;
            i = g * v;
        }
        g += ctx.Gmin;
        i += ctx.Gmin * v;
        ctx.AddCurrent(_c, _e, i);
        _slots.Add(ctx.G, g);
        ctx.AddCharge(_c, _e, _capacitance * v);
        _slots.Add(ctx.C, _capacitance);
    }

    public override double NextBreakpoint(double time) => _light.NextBreakpoint(time);
}
