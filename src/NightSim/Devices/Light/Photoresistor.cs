using NightSim.Netlist;

namespace NightSim.Devices.Light;

/// <summary>
/// CdS photoresistor: R(E) = R10·(E/10 lx)^(−γ) in parallel with the dark resistance (textbook photoconductor power law,
/// common practice), with a first-order lag on the conductance: rise time constant while the light increases, a slower
/// decay time constant while it falls.
/// </summary>
/// <remarks>
/// The lag is exact for the step: G(t) = G∞(t) + (G_a − G∞(t))·e^(−(t − t_a)/τ), where (t_a, G_a) is the last accepted
/// point and τ is the rise or decay constant by the sign of G∞ − G_a. Load evaluates it at the iterate's time (so it is
/// consistent inside a step and independent of the step size for light that is constant over the step); Accept commits
/// it. Before the first accepted point the cell is in steady state with its light.
/// </remarks>
public sealed class Photoresistor : Device
{
    private static readonly ParameterSpec s_r10 = ParameterSpec.Number("r10", "Ω", "Resistance at 10 lx") with { Default = 15e3, Min = 1, Max = 1e9 };
    private static readonly ParameterSpec s_gamma = ParameterSpec.Number("gamma", "", "Slope γ = log10(R10/R100)") with { Default = 0.7, Min = 0.1, Max = 2 };
    private static readonly ParameterSpec s_darkResistance = ParameterSpec.Number("darkResistance", "Ω", "Dark resistance (in parallel)") with { Default = 2e6, Min = 1, Max = 1e13 };
    private static readonly ParameterSpec s_riseTime = ParameterSpec.Number("riseTime", "s", "Conductance time constant while light increases") with { Default = 40e-3, Min = 0, Max = 1e4 };
    private static readonly ParameterSpec s_decayTime = ParameterSpec.Number("decayTime", "s", "Conductance time constant while light decreases") with { Default = 1.0, Min = 0, Max = 1e4 };

    public static PartKind Kind { get; } = new()
    {
        Name = "photoresistor",
        Description = "CdS light-dependent resistor: power law in lux, dark resistance, slow decay",
        Pins = ["a", "b"],
        UsesNodeList = true,
        Parameters = [s_r10, s_gamma, s_darkResistance, s_riseTime, s_decayTime, .. LightInput.Specs],
        Create = part =>
        [
            new Photoresistor(part.Id, part.Id, part.Node("a"), part.Node("b"),
                part.Parameters.NumberOrDefault(s_r10), part.Parameters.NumberOrDefault(s_gamma),
                part.Parameters.NumberOrDefault(s_darkResistance), part.Parameters.NumberOrDefault(s_riseTime),
                part.Parameters.NumberOrDefault(s_decayTime), LightInput.FromParameters(part.Parameters)),
        ],
    };

    private readonly double _r10, _gamma, _gDark, _riseTime, _decayTime;
    private readonly LightInput _light;
    private int _a, _b;
    private PairSlots _slots;
    private bool _hasHistory;
    private double _gAccepted;
    private double _tAccepted;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Part id.</param>
    /// <param name="a">First node.</param>
    /// <param name="b">Second node.</param>
    /// <param name="r10">Resistance at 10 lx, Ω.</param>
    /// <param name="gamma">Power-law exponent.</param>
    /// <param name="darkResistance">Dark resistance, Ω.</param>
    /// <param name="riseTime">Time constant while the light increases, s (0: none).</param>
    /// <param name="decayTime">Time constant while the light decreases, s (0: none).</param>
    /// <param name="light">Light input.</param>
    public Photoresistor(string name, string partId, string a, string b, double r10, double gamma, double darkResistance,
        double riseTime, double decayTime, LightInput light)
        : base(name, partId, [a, b])
    {
        _r10 = r10;
        _gamma = gamma;
        _gDark = 1.0 / darkResistance;
        _riseTime = riseTime;
        _decayTime = decayTime;
        _light = light;
        Role = light.Role(partId, Nodes, _decayTime);
    }

    public LightInput Light => _light;

    /// <summary>Steady-state resistance at illuminance <paramref name="lux"/> (lx), Ω, dark resistance included.</summary>
    public double SteadyResistance(double lux) => 1.0 / SteadyConductance(lux);

    /// <summary>Power-law resistance R10·(E/10)^(−γ) without the dark resistance, Ω.</summary>
    public static double LawResistance(double lux, double r10, double gamma) => r10 * Math.Pow(lux / 10.0, -gamma);

    /// <summary>Present (lagged) conductance at the time in <paramref name="ctx"/>, S.</summary>
    public double Conductance(LoadContext ctx)
    {
        double target = SteadyConductance(_light.Lux(ctx));
        if (!_hasHistory) return target;
        double tau = target > _gAccepted ? _riseTime : _decayTime;
        double dt = ctx.Time - _tAccepted;
        if (tau <= 0.0 || dt <= 0.0) return tau <= 0.0 ? target : _gAccepted;
        return target + (_gAccepted - target) * Math.Exp(-dt / tau);
    }

    public override void Setup(SetupContext setup)
    {
        _a = setup.Node(Nodes[0]);
        _b = setup.Node(Nodes[1]);
        _slots = setup.Pair(_a, _b);
        _light.Setup(setup, this);
    }

    public override void PowerUp() => _hasHistory = false;

    public override void Load(LoadContext ctx)
    {
        double g = Conductance(ctx);
        ctx.AddCurrent(_a, _b, g * (ctx.V(_a) - ctx.V(_b)));
        _slots.Add(ctx.G, g);
    }

    public override void Accept(LoadContext ctx)
    {
        _gAccepted = Conductance(ctx);
        _tAccepted = ctx.Time;
        _hasHistory = true;
    }

    public override double NextBreakpoint(double time) => _light.NextBreakpoint(time);

    private double SteadyConductance(double lux) =>
        (lux > 0.0 ? Math.Pow(lux / 10.0, _gamma) / _r10 : 0.0) + _gDark;
}
