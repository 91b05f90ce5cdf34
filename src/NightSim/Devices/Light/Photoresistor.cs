using NightSim.Netlist;

namespace NightSim.Devices.Light;

/// <summary>
/// CdS photoresistor: R(E) = R10·(E/10 lx)^(−γ) in parallel with the dark resistance (textbook photoconductor law:
/// a straight line on log-log axes, γ = log10(R10/R100), common practice), with a first-order lag on the conductance:
/// a rise time constant while the light increases, a slower decay time constant while it falls. Both slow down in dim
/// light as τ(E) = τ10·(10 lx/E)^k (from memory: cadmium-sulphide cells respond in tens of milliseconds in daylight
/// and in seconds or more near darkness; the power law is common practice for describing that); k = 0 gives
/// fixed time constants.
/// </summary>
/// <remarks>
/// The lag is exact for a target conductance that moves linearly over the step; where the target moves by more than
/// 10 % over a step, the step is split into sub-intervals along the light's own course (every edge of the light is a
/// breakpoint the solver lands on, so between two of them the light is monotone and the ends bound its change). With (t_a, G_a, G∞a) the last accepted
/// point, its target, x = (t − t_a)/τ and Δ = G∞(t) − G∞a, the first-order response to the ramp is
/// G(t) = G_a·e^(−x) + G∞a·(1 − e^(−x)) + Δ·(1 − (1 − e^(−x))/x), independent of the step size (a constant target is
/// the case Δ = 0). τ is the rise or decay constant by the sign of G∞ − G_a; with k ≠ 0 the rate 1/τ is averaged over
/// the step's two ends (trapezoid). Load evaluates it at the iterate's time (consistent inside a step); Accept commits
/// it. Before the first accepted point the cell is in steady state with its light.
/// </remarks>
public sealed class Photoresistor : Device, ILightSensor, IInternalState
{
    private static readonly ParameterSpec s_r10 = ParameterSpec.Number("r10", "Ω", "Resistance at 10 lx") with { Default = 15e3, Min = 1, Max = 1e9 };
    private static readonly ParameterSpec s_r10Tolerance = ParameterSpec.Number("r10Tolerance", "", "Relative spread of r10 between parts, for `nightsim spread` (common practice: ±30 % for photoresistors).") with { Default = 0.3, Min = 0, Max = 0.9 };
    private static readonly ParameterSpec s_gammaTolerance = ParameterSpec.Number("gammaTolerance", "", "Relative spread of gamma between parts, for `nightsim spread`.") with { Default = 0.1, Min = 0, Max = 0.9 };
    private static readonly ParameterSpec s_gamma = ParameterSpec.Number("gamma", "", "Slope γ = log10(R10/R100)") with { Default = 0.7, Min = 0.1, Max = 2 };
    private static readonly ParameterSpec s_darkResistance = ParameterSpec.Number("darkResistance", "Ω", "Dark resistance (in parallel)") with { Default = 2e6, Min = 1, Max = 1e13 };
    private static readonly ParameterSpec s_riseTime = ParameterSpec.Number("riseTime", "s", "Conductance time constant at 10 lx while light increases") with { Default = 40e-3, Min = 0, Max = 1e4 };
    private static readonly ParameterSpec s_decayTime = ParameterSpec.Number("decayTime", "s", "Conductance time constant at 10 lx while light decreases") with { Default = 1.0, Min = 0, Max = 1e4 };
    private static readonly ParameterSpec s_slowdown = ParameterSpec.Number("slowdownExponent", "",
        "Exponent k: time constants grow as (10 lx/E)^k in dim light (0: fixed; about 0.5–1 for real cells, from memory)") with { Default = 0.0, Min = 0, Max = 2 };

    /// <summary>Illuminance below which the time constants stop growing, lx (keeps them finite in the dark).</summary>
    public const double SlowdownFloorLux = 1e-3;

    public static PartKind Kind { get; } = new()
    {
        Name = "photoresistor",
        Description = "CdS light-dependent resistor: power law in lux, dark resistance, slow decay",
        Pins = ["a", "b"],
        UsesNodeList = true,
        Parameters = [s_r10, s_gamma, s_darkResistance, s_riseTime, s_decayTime, s_slowdown, .. LightInput.Specs, s_r10Tolerance, s_gammaTolerance],
        Create = part =>
        [
            new Photoresistor(part.Id, part.Id, part.Node("a"), part.Node("b"),
                part.Parameters.NumberOrDefault(s_r10), part.Parameters.NumberOrDefault(s_gamma),
                part.Parameters.NumberOrDefault(s_darkResistance), part.Parameters.NumberOrDefault(s_riseTime),
                part.Parameters.NumberOrDefault(s_decayTime), LightInput.FromParameters(part.Parameters),
                part.Parameters.NumberOrDefault(s_slowdown)),
        ],
    };

    private readonly double _r10, _gamma, _gDark, _riseTime, _decayTime, _slowdown;
    private readonly LightInput _light;
    private int _a, _b;
    private PairSlots _slots;
    private bool _hasHistory;
    private double _gAccepted;
    private double _tAccepted;
    private double _targetAccepted;
    private double _luxAccepted;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Part id.</param>
    /// <param name="a">First node.</param>
    /// <param name="b">Second node.</param>
    /// <param name="r10">Resistance at 10 lx, Ω.</param>
    /// <param name="gamma">Power-law exponent.</param>
    /// <param name="darkResistance">Dark resistance, Ω.</param>
    /// <param name="riseTime">Time constant at 10 lx while the light increases, s (0: none).</param>
    /// <param name="decayTime">Time constant at 10 lx while the light decreases, s (0: none).</param>
    /// <param name="light">Light input.</param>
    /// <param name="slowdownExponent">k in τ(E) = τ10·(10 lx/E)^k (0: fixed time constants).</param>
    public Photoresistor(string name, string partId, string a, string b, double r10, double gamma, double darkResistance,
        double riseTime, double decayTime, LightInput light, double slowdownExponent = 0.0)
        : base(name, partId, [a, b])
    {
        _r10 = r10;
        _gamma = gamma;
        _gDark = 1.0 / darkResistance;
        _riseTime = riseTime;
        _decayTime = decayTime;
        _light = light;
        _slowdown = slowdownExponent;
        Role = light.Role(partId, Nodes, _decayTime);
    }

    /// <inheritdoc />
    public LightInput Light => _light;

    /// <inheritdoc />
    public double FallTimeConstant(double lux) => TimeConstant(_decayTime, lux, _slowdown);

    /// <summary>Steady-state resistance at illuminance <paramref name="lux"/> (lx), Ω, dark resistance included.</summary>
    public double SteadyResistance(double lux) => 1.0 / SteadyConductance(lux);

    /// <summary>Power-law resistance R10·(E/10)^(−γ) without the dark resistance, Ω.</summary>
    public static double LawResistance(double lux, double r10, double gamma) => r10 * Math.Pow(lux / 10.0, -gamma);

    /// <summary>Time constant at illuminance <paramref name="lux"/>: τ10·(10 lx/E)^k, E floored at
    /// <see cref="SlowdownFloorLux"/>, s.</summary>
    public static double TimeConstant(double tau10, double lux, double exponent) =>
        exponent == 0.0 ? tau10 : tau10 * Math.Pow(10.0 / Math.Max(lux, SlowdownFloorLux), exponent);

    /// <summary>Present (lagged) conductance at the time in <paramref name="ctx"/>, S.</summary>
    public double Conductance(LoadContext ctx)
    {
        double lux = _light.Lux(ctx);
        if (!_hasHistory) return SteadyConductance(lux);
        // Newton evaluates the same instant two or more times per stage: the lag does not depend on the unknowns.
        if (ctx.Time == _cacheTime && _tAccepted == _cacheAccepted && lux == _cacheLux && _gAccepted == _cacheFrom && _luxAccepted == _cacheLuxFrom) return _cacheG;
        double target = SteadyConductance(lux);
        double dt = ctx.Time - _tAccepted;
        // Where the target moves by more than SubstepChange (in ln) over the step (a headlight's ramp, a lightning
        // stroke's decay), the light's own course through the step is followed in sub-intervals: the result then does
        // not depend on how long the solver's step is.
        double change = Math.Abs(Math.Log(target / _targetAccepted));
        double g;
        if (!(dt > 0.0) || !(change > SubstepChange))
        {
            g = Relax(_gAccepted, _targetAccepted, target, _luxAccepted, lux, dt);
        }
        else
        {
            int n = (int)Math.Min(MaxSubsteps, Math.Ceiling(change / SubstepChange));
            g = _gAccepted;
            double tPrev = _tAccepted, targetPrev = _targetAccepted, luxPrev = _luxAccepted;
            for (int k = 1; k <= n; k++)
            {
                double tk = k == n ? ctx.Time : _tAccepted + dt * k / n;
                double luxK = k == n ? lux : _light.Lux(ctx, tk);
                double targetK = k == n ? target : SteadyConductance(luxK);
                g = Relax(g, targetPrev, targetK, luxPrev, luxK, tk - tPrev);
                tPrev = tk;
                targetPrev = targetK;
                luxPrev = luxK;
            }
        }
        _cacheTime = ctx.Time;
        _cacheAccepted = _tAccepted;
        _cacheLux = lux;
        _cacheFrom = _gAccepted;
        _cacheLuxFrom = _luxAccepted;
        _cacheG = g;
        return g;
    }

    /// <summary>Largest change of ln(target conductance) followed in one piece; a larger change over a step is split
    /// into equal sub-intervals of time (the light between two breakpoints is monotone, so its ends bound it).</summary>
    public const double SubstepChange = 0.1;

    /// <summary>Most sub-intervals per step.</summary>
    public const int MaxSubsteps = 256;

    private double _cacheTime = double.NaN, _cacheAccepted = double.NaN, _cacheLux = double.NaN, _cacheFrom = double.NaN, _cacheLuxFrom = double.NaN, _cacheG;

    /// <summary>The lag over <paramref name="dt"/> from <paramref name="g"/> with the target moving linearly between
    /// the two values; the rise or decay time constant by the sign of the end target against g.</summary>
    private double Relax(double g, double targetStart, double targetEnd, double luxStart, double luxEnd, double dt)
    {
        double tau10 = targetEnd > g ? _riseTime : _decayTime;
        if (tau10 <= 0.0) return targetEnd;
        if (dt <= 0.0) return g;
        // Rate 1/τ averaged over the interval's ends (exact for k = 0).
        double rate = _slowdown == 0.0
            ? 1.0 / tau10
            : 0.5 * (1.0 / TimeConstant(tau10, luxStart, _slowdown) + 1.0 / TimeConstant(tau10, luxEnd, _slowdown));
        return RampResponse(g, targetStart, targetEnd, dt * rate);
    }

    /// <summary>
    /// First-order lag y' = (u − y)/τ over a step of x = Δt/τ time constants from y(0) = <paramref name="start"/>, with
    /// u moving linearly from <paramref name="targetStart"/> to <paramref name="targetEnd"/>:
    /// y = y0·e^(−x) + u0·(1 − e^(−x)) + (u1 − u0)·(1 − (1 − e^(−x))/x) (closed form of a linear ODE, common practice).
    /// </summary>
    public static double RampResponse(double start, double targetStart, double targetEnd, double x)
    {
        if (!(x > 0.0)) return start;
        double decay = Math.Exp(-x);
        // φ = (1 − e^(−x))/x, by its series where the difference would cancel.
        double phi = x < 1e-4 ? 1.0 - x / 2.0 + x * x / 6.0 : (1.0 - decay) / x;
        return start * decay + targetStart * (1.0 - decay) + (targetEnd - targetStart) * (1.0 - phi);
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
        _luxAccepted = _light.Lux(ctx);
        _targetAccepted = SteadyConductance(_luxAccepted);
        _tAccepted = ctx.Time;
        _hasHistory = true;
    }

    public override double NextBreakpoint(double time) => _light.NextBreakpoint(time);

    /// <remarks>d ln G/dt = (G∞ − G)/(τ·G) at the last accepted point: right after the light jumps (a lamp switched, a
    /// headlight gone) the conductance relaxes over seconds although nothing in the circuit's unknowns moves, and a
    /// step longer than the relaxation could step over the threshold crossing it causes. While the cell follows a slowly
    /// changing sky, G lags its target by τ·d ln G∞/dt and this bound equals the light-aware one.</remarks>
    public double InternalStepLimit(double change)
    {
        if (!_hasHistory) return double.PositiveInfinity;
        double gap = Math.Abs(_targetAccepted - _gAccepted);
        if (!(gap > 0)) return double.PositiveInfinity;
        double tau10 = _targetAccepted > _gAccepted ? _riseTime : _decayTime;
        if (!(tau10 > 0)) return double.PositiveInfinity;
        double tau = TimeConstant(tau10, _luxAccepted, _slowdown);
        return change * tau * _gAccepted / gap;
    }

    /// <summary>One value: the lagging conductance, S.</summary>
    public int InternalStateCount => 1;

    public void ReadInternalState(Span<double> into) => into[0] = _gAccepted;

    public void WriteInternalState(ReadOnlySpan<double> from, LoadContext ctx)
    {
        _gAccepted = from[0];
        _luxAccepted = _light.Lux(ctx);
        _targetAccepted = SteadyConductance(_luxAccepted);
        _tAccepted = ctx.Time;
        _hasHistory = true;
    }

    private double SteadyConductance(double lux) =>
        (lux > 0.0 ? Math.Pow(lux / 10.0, _gamma) / _r10 : 0.0) + _gDark;
}
