using NightSim.Netlist;

namespace NightSim.Devices.Light;

/// <summary>
/// Photodiode: photocurrent I_ph = responsivity·E + dark current flowing from cathode to anode inside the device, an
/// ideal junction (Shockley, I_S, N) from anode to cathode, and a constant junction capacitance.
/// </summary>
/// <remarks>
/// Above the forward voltage at which the junction carries 0.1 A the exponential continues as its tangent line, so
/// Newton cannot overflow (continuous value and slope; a photodiode is not meant to be driven that hard).
/// Defaults: 0.04 µA/lx for a 7.5 mm² silicon PIN cell in daylight (order of magnitude: ≈ 0.6 A/W near 900 nm from
/// memory, times 7.5 mm², with 100 lx of daylight ≈ 1 W/m²) and 2 nA dark current (from memory); 50 pF junction
/// capacitance from memory.
/// </remarks>
public sealed class Photodiode : Device, ILightSensor
{
    private static readonly ParameterSpec s_responsivity = ParameterSpec.Number("responsivity", "A/lx", "Photocurrent per lux") with { Default = 0.04e-6, Min = 0, Max = 1e-3 };
    private static readonly ParameterSpec s_darkCurrent = ParameterSpec.Number("darkCurrent", "A", "Dark (reverse) current") with { Default = 2e-9, Min = 0, Max = 1e-3 };
    private static readonly ParameterSpec s_capacitance = ParameterSpec.Number("capacitance", "F", "Junction capacitance") with { Default = 50e-12, Min = 0, Max = 1e-6 };
    private static readonly ParameterSpec s_saturationCurrent = ParameterSpec.Number("saturationCurrent", "A", "Junction saturation current I_S") with { Default = 1e-12, Min = 1e-20, Max = 1e-3 };
    private static readonly ParameterSpec s_emission = ParameterSpec.Number("emission", "", "Junction emission coefficient N") with { Default = 1.0, Min = 0.5, Max = 5 };

    public static PartKind Kind { get; } = new()
    {
        Name = "photodiode",
        Description = "Photodiode: photocurrent = responsivity × lux + dark current, junction and capacitance",
        Pins = ["anode", "cathode"],
        UsesNodeList = true,
        Parameters = [s_responsivity, s_darkCurrent, s_capacitance, s_saturationCurrent, s_emission, .. LightInput.Specs],
        Create = part =>
        [
            new Photodiode(part.Id, part.Id, part.Node("anode"), part.Node("cathode"),
                part.Parameters.NumberOrDefault(s_responsivity), part.Parameters.NumberOrDefault(s_darkCurrent),
                part.Parameters.NumberOrDefault(s_capacitance), part.Parameters.NumberOrDefault(s_saturationCurrent),
                part.Parameters.NumberOrDefault(s_emission), LightInput.FromParameters(part.Parameters)),
        ],
    };

    private const double BoltzmannOverCharge = 1.380649e-23 / 1.602176634e-19; // V/K

    private readonly double _responsivity, _darkCurrent, _capacitance, _is, _n;
    private readonly LightInput _light;

    /// <inheritdoc />
    public LightInput Light => _light;

    /// <inheritdoc />
    public double FallTimeConstant(double lux) => 0.0;
    private int _anode, _cathode;
    private PairSlots _slots;

    public Photodiode(string name, string partId, string anode, string cathode, double responsivity, double darkCurrent,
        double capacitance, double saturationCurrent, double emission, LightInput light)
        : base(name, partId, [anode, cathode])
    {
        _responsivity = responsivity;
        _darkCurrent = darkCurrent;
        _capacitance = capacitance;
        _is = saturationCurrent;
        _n = emission;
        _light = light;
        Role = light.Role(partId, Nodes, 0.0);
    }

    /// <summary>Photocurrent plus dark current at the time in <paramref name="ctx"/>, A (cathode → anode inside).</summary>
    public double Photocurrent(LoadContext ctx) => _responsivity * _light.Lux(ctx) + _darkCurrent;

    /// <summary>Voltage scale over which the dark (leakage) current sets in under reverse bias, volts.</summary>
    public const double DarkVoltageScale = 0.05;

    public override void Setup(SetupContext setup)
    {
        _anode = setup.Node(Nodes[0]);
        _cathode = setup.Node(Nodes[1]);
        _slots = setup.Pair(_anode, _cathode);
        _light.Setup(setup, this);
    }

    public override void Load(LoadContext ctx)
    {
        double v = ctx.V(_anode) - ctx.V(_cathode);
        double nvt = _n * BoltzmannOverCharge * ctx.Temperature;
        double vMax = nvt * Math.Log(0.1 / _is + 1.0);
        double id, gd;
        if (v <= vMax)
        {
            double e = Math.Exp(v / nvt);
            id = _is * (e - 1.0);
            gd = _is * e / nvt;
        }
        else
        {
            double e = Math.Exp(vMax / nvt);
            gd = _is * e / nvt;
            id = _is * (e - 1.0) + gd * (v - vMax);
        }
        gd += ctx.Gmin;
        id += ctx.Gmin * v;
        // The dark current is reverse leakage: it flows under reverse bias and fades at zero bias, so a dark, open
        // diode does not charge itself forward: I_dark·tanh(−v/0.05 V) for v < 0, nothing forward.
        double light = _responsivity * _light.Lux(ctx);
        double th = v < 0 ? Math.Tanh(-v / DarkVoltageScale) : 0.0;
        double dark = _darkCurrent * th;
        double gDark = v < 0 ? _darkCurrent * (1.0 - th * th) / DarkVoltageScale : 0.0;
        ctx.AddCurrent(_anode, _cathode, id - light - dark);
        _slots.Add(ctx.G, gd + gDark);
        ctx.AddCharge(_anode, _cathode, _capacitance * v);
        _slots.Add(ctx.C, _capacitance);
    }

    public override double NextBreakpoint(double time) => _light.NextBreakpoint(time);
}
