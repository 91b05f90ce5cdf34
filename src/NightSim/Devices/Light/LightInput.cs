using NightSim.Netlist;

namespace NightSim.Devices.Light;

/// <summary>
/// What a light sensor sees: a named light channel (default "sensor") times a gain (aim, shade, lens). When the run
/// has no light signal, the part's own constant "lux" or "luxPoints" [[t, lux], …] is used instead (its
/// corners are breakpoints), else the run's constant lux. Light the circuit adds to the channel (lamp self-illumination)
/// is added in every case. Immutable apart from the channel index resolved at Setup.
/// </summary>
public sealed class LightInput
{
    public static readonly ParameterSpec ChannelSpec = new("channel", ParameterType.Text, "", "Light channel the sensor reads") { DefaultText = "sensor" };
    public static readonly ParameterSpec GainSpec = ParameterSpec.Number("lightGain", "", "Factor on the channel's illuminance (aim, shade, lens)") with { Default = 1.0, Min = 0, Max = 1e3 };
    public static readonly ParameterSpec LuxSpec = ParameterSpec.Number("lux", "lx", "Constant illuminance when the run has no light signal") with { Min = 0, Max = 2e5, ExclusiveGroup = "light" };
    public static readonly ParameterSpec LuxPointsSpec = ParameterSpec.PointList("luxPoints", "lx", "Illuminance along straight lines through [[t, lux], …] when the run has no light signal") with { ExclusiveGroup = "light" };

    /// <summary>The four parameters every light sensor accepts.</summary>
    public static IReadOnlyList<ParameterSpec> Specs { get; } = [ChannelSpec, GainSpec, LuxSpec, LuxPointsSpec];

    private readonly double[] _times;
    private readonly double[] _values;
    private readonly double? _constant;
    private int _channel = -1;

    /// <param name="channelName">Channel name.</param>
    /// <param name="gain">Factor on the channel's illuminance.</param>
    /// <param name="constantLux">Constant illuminance without a light signal, lx, or null.</param>
    /// <param name="pwl">Piecewise-linear illuminance (t in s, lx) without a light signal, or null.</param>
    public LightInput(string channelName, double gain, double? constantLux, IReadOnlyList<(double X, double Y)>? pwl)
    {
        ChannelName = channelName;
        Gain = gain;
        _constant = constantLux;
        _times = pwl is null ? [] : pwl.Select(p => p.X).ToArray();
        _values = pwl is null ? [] : pwl.Select(p => p.Y).ToArray();
    }

    /// <summary>Reads channel, gain, lux and luxPoints from a part's parameters.</summary>
    public static LightInput FromParameters(PartParameters p) =>
        new(p.TextOrDefault(ChannelSpec), p.NumberOrDefault(GainSpec), p.OptionalNumber(LuxSpec.Name), p.Points(LuxPointsSpec.Name));

    public string ChannelName { get; }

    /// <summary>True when the part has its own constant or piecewise-linear lux: a run without a light signal then
    /// uses that, not the run's constant lux.</summary>
    public bool HasOwnLight => _constant is not null || _times.Length > 0;

    public double Gain { get; }

    /// <summary>Resolve the channel index. A run with a light signal that lacks the channel is refused, for every sensor
    /// kind alike (a sensor reading nothing would sit in the dark all day).</summary>
    /// <exception cref="LightChannelException">The run's light has no such channel.</exception>
    public void Setup(SetupContext setup, Device owner)
    {
        _channel = setup.LightChannel(ChannelName);
        if (_channel < 0 && setup.HasLightSignal) throw new LightChannelException(owner.PartId, ChannelName);
    }

    /// <summary>The role a sensor with this input states (channel, nodes, lag).</summary>
    public Roles.LightSensorRole Role(string partId, IReadOnlyList<string> nodes, double lagSeconds) => new(partId, ChannelName, nodes, lagSeconds);

    /// <summary>Illuminance on the sensor at ctx.Time, lux (never negative).</summary>
    public double Lux(LoadContext ctx) => Lux(ctx, ctx.Time);

    /// <summary>Illuminance on the sensor at run time <paramref name="time"/>, lux (never negative), with the discrete
    /// state of <paramref name="ctx"/> (a lamp lighting its own sensor). Allocation-free.</summary>
    public double Lux(LoadContext ctx, double time)
    {
        double lux = ctx.Light is not null && _channel >= 0
            ? ctx.Light.Lux(_channel, time)
            : _times.Length > 0 ? Pwl(time) : _constant ?? ctx.ConstantLux;
        return Math.Max(0.0, lux * Gain);
    }

    /// <summary>The first corner of the part's own light waveform strictly after <paramref name="time"/>, s; +∞ if none.</summary>
    public double NextBreakpoint(double time)
    {
        int k = FirstAfter(time);
        return k < _times.Length ? _times[k] : double.PositiveInfinity;
    }

    private double Pwl(double time)
    {
        if (time <= _times[0]) return _values[0];
        if (time >= _times[^1]) return _values[^1];
        int k = FirstAfter(time); // _times[k - 1] <= time < _times[k]
        double w = (time - _times[k - 1]) / (_times[k] - _times[k - 1]);
        return _values[k - 1] + w * (_values[k] - _values[k - 1]);
    }

    /// <summary>Index of the first corner strictly after <paramref name="time"/> (binary search: a recorded day of
    /// lux samples has thousands of corners and every device load asks).</summary>
    private int FirstAfter(double time)
    {
        int lo = 0, hi = _times.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (_times[mid] <= time) lo = mid + 1; else hi = mid;
        }
        return lo;
    }
}
