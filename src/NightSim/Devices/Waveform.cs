using NightSim.Netlist;
using NightSim.Units;

namespace NightSim.Devices;

/// <summary>The shape of an independent source's value against run time.</summary>
public enum WaveformShape
{
    /// <summary>Constant value.</summary>
    Dc,
    /// <summary>Trapezoidal pulse, single or periodic.</summary>
    Pulse,
    /// <summary>offset + amplitude · sin(2π f (t − delay) + phase).</summary>
    Sine,
    /// <summary>Piecewise-linear through [t, value] points, constant before the first and after the last.</summary>
    PiecewiseLinear,
}

/// <summary>
/// Value of an independent source against run time, shared by voltage and current sources. Immutable; <see cref="Value"/>
/// is pure and allocation-free; every corner is reported by <see cref="NextBreakpoint"/> so the solver lands on it.
/// Units: time in seconds, values in the source's unit (V or A), frequency in hertz, phase in degrees.
/// </summary>
public sealed class Waveform
{
    private readonly double[] _times;
    private readonly double[] _values;

    private Waveform(WaveformShape shape, double[] times, double[] values)
    {
        Shape = shape;
        _times = times;
        _values = values;
    }

    /// <summary>Which shape this is.</summary>
    public WaveformShape Shape { get; }

    // Pulse: _values = [v1, v2], _times = [delay, rise, width, fall, period]
    // Sine: _values = [offset, amplitude, frequency, delay, phase (rad)]
    // Pwl: _times / _values = the points.

    /// <summary>A constant <paramref name="value"/>.</summary>
    public static Waveform Dc(double value) => new(WaveformShape.Dc, [], [value]);

    /// <summary>A trapezoidal pulse from <paramref name="v1"/> to <paramref name="v2"/>: after <paramref name="delay"/> it
    /// ramps in <paramref name="rise"/>, stays <paramref name="width"/>, ramps back in <paramref name="fall"/>, and repeats
    /// every <paramref name="period"/> (+∞ = once). Times in seconds; zero ramps are taken as 1 ns.</summary>
    public static Waveform Pulse(double v1, double v2, double delay, double rise, double fall, double width, double period)
    {
        rise = Math.Max(rise, 1e-9);
        fall = Math.Max(fall, 1e-9);
        if (!(width >= 0)) throw new ArgumentOutOfRangeException(nameof(width), width, "pulse hold must be ≥ 0 s");
        if (!(period > 0)) throw new ArgumentOutOfRangeException(nameof(period), period, "pulse repeatEvery must be > 0 s");
        if (!double.IsPositiveInfinity(period) && rise + width + fall > period)
            throw new ArgumentException(
                $"pulse riseTime + hold + fallTime ({EngineeringValue.Format(rise + width + fall, "s")}) exceeds repeatEvery ({EngineeringValue.Format(period, "s")}). hint: shorten \"hold\" or lengthen \"repeatEvery\"",
                nameof(period));
        return new(WaveformShape.Pulse, [delay, rise, width, fall, period], [v1, v2]);
    }

    /// <summary>offset + amplitude·sin(2π·frequency·(t − delay) + phase); before <paramref name="delay"/> the value at
    /// t = delay. <paramref name="phaseDegrees"/> in degrees, frequency in hertz.</summary>
    public static Waveform Sine(double offset, double amplitude, double frequency, double delay, double phaseDegrees)
    {
        if (!(frequency >= 0)) throw new ArgumentOutOfRangeException(nameof(frequency), frequency, "frequency must be ≥ 0 Hz");
        return new(WaveformShape.Sine, [], [offset, amplitude, frequency, delay, phaseDegrees * Math.PI / 180.0]);
    }

    /// <summary>Piecewise-linear through <paramref name="points"/> (times strictly increasing).</summary>
    public static Waveform PiecewiseLinear(IReadOnlyList<(double X, double Y)> points)
    {
        if (points.Count == 0) throw new ArgumentException("a piecewise-linear waveform needs at least one point", nameof(points));
        var t = new double[points.Count];
        var v = new double[points.Count];
        for (int i = 0; i < points.Count; i++)
        {
            t[i] = points[i].X;
            v[i] = points[i].Y;
            if (i > 0 && !(t[i] > t[i - 1]))
                throw new ArgumentException(
                    $"piecewise-linear times must increase strictly (point {i}: {EngineeringValue.Format(t[i], "s")} after {EngineeringValue.Format(t[i - 1], "s")})",
                    nameof(points));
        }
        return new(WaveformShape.PiecewiseLinear, t, v);
    }

    /// <summary>Parameter specs of the waveform choice (constant, pulse, sine, points) in <paramref name="unit"/> ("V" or "A").</summary>
    /// <param name="unit">"V" or "A".</param>
    /// <param name="maxMagnitude">Largest magnitude of a level.</param>
    /// <param name="sineNote">Words appended to the sine's description (a voltage source's mains caution).</param>
    public static IReadOnlyList<ParameterSpec> Specs(string unit, double maxMagnitude, string sineNote = "") =>
    [
        ParameterSpec.Number("constant", unit, $"Constant value ({unit}).") with { Min = -maxMagnitude, Max = maxMagnitude, ExclusiveGroup = "waveform" },
        ParameterSpec.Group("pulse", $"Trapezoidal pulse ({unit}); repeatEvery absent = one pulse.",
            ParameterSpec.Number("base", unit, "Level before and between pulses.") with { Default = 0, Min = -maxMagnitude, Max = maxMagnitude },
            ParameterSpec.Number("peak", unit, "Level during the pulse.") with { Required = true, Min = -maxMagnitude, Max = maxMagnitude },
            ParameterSpec.Number("start", "s", "Time the first rising ramp begins.") with { Default = 0, Min = 0 },
            ParameterSpec.Number("riseTime", "s", "Ramp time from base to peak.") with { Default = 1e-6, Min = 0 },
            ParameterSpec.Number("fallTime", "s", "Ramp time from peak back to base.") with { Default = 1e-6, Min = 0 },
            ParameterSpec.Number("hold", "s", "Time held at peak (absent = stays at peak).") with { Min = 0 },
            ParameterSpec.Number("repeatEvery", "s", "Time from one pulse start to the next (absent = one pulse).") with { Min = 1e-12 }) with { ExclusiveGroup = "waveform" },
        ParameterSpec.Group("sine", $"Sine wave ({unit}), e.g. mains.{sineNote}",
            ParameterSpec.Number("offset", unit, "Mean value.") with { Default = 0, Min = -maxMagnitude, Max = maxMagnitude },
            ParameterSpec.Number("amplitude", unit, "Peak deviation from the offset.") with { Required = true, Min = -maxMagnitude, Max = maxMagnitude },
            ParameterSpec.Number("frequency", "Hz", "Frequency.") with { Required = true, Min = 0, Max = 1e9 },
            ParameterSpec.Number("start", "s", "Start time of the oscillation.") with { Default = 0, Min = 0 },
            ParameterSpec.Number("phase", "°", "Phase at the start, degrees.") with { Default = 0, Min = -360, Max = 360 }) with { ExclusiveGroup = "waveform" },
        ParameterSpec.PointList("points", unit, $"Straight lines through [[time, value], ...] ({unit}), times increasing.") with { ExclusiveGroup = "waveform" },
    ];

    /// <summary>Cross-check for source kinds: exactly one of constant, pulse, sine, points must be given.</summary>
    public static IEnumerable<string> CheckChoice(PartDefinition part)
    {
        PartParameters p = part.Parameters;
        if (!p.Has("constant") && !p.Has("pulse") && !p.Has("sine") && !p.Has("points"))
            yield return "no waveform given. hint: add one of \"constant\": \"12V\", \"pulse\": { … }, \"sine\": { … } or \"points\": [[t, v], …]";
        if (p.Object("pulse") is { } pulse && pulse.Has("repeatEvery") && !pulse.Has("hold"))
            yield return "a repeating pulse needs \"hold\". hint: add \"hold\" (time at peak), shorter than \"repeatEvery\" minus the ramps";
    }

    /// <summary>Builds the waveform from validated part parameters (one of constant, pulse, sine, points; none = constant 0).</summary>
    public static Waveform FromParameters(PartParameters p)
    {
        if (p.Object("pulse") is { } pulse)
        {
            double hold = pulse.Number("hold", double.PositiveInfinity);
            return Pulse(pulse.Number("base", 0), pulse.Number("peak"), pulse.Number("start", 0), pulse.Number("riseTime", 1e-6),
                pulse.Number("fallTime", 1e-6), hold, pulse.Number("repeatEvery", double.PositiveInfinity));
        }
        if (p.Object("sine") is { } sine)
        {
            return Sine(sine.Number("offset", 0), sine.Number("amplitude"), sine.Number("frequency"), sine.Number("start", 0),
                sine.Number("phase", 0));
        }
        if (p.Points("points") is { } points) return PiecewiseLinear(points);
        return Dc(p.Number("constant", 0));
    }

    /// <summary>Steps per period a sine needs (second-order method, a few per cent of amplitude at most; common practice
    /// for sampling a sinusoid finely enough to draw and to resolve threshold crossings).</summary>
    public const double StepsPerSinePeriod = 20.0;

    /// <summary>The longest step that still follows this waveform, seconds: 1/(20·f) for a sine, +∞ otherwise (corners of
    /// pulses and piecewise-linear waveforms are breakpoints). A sine has no corners, and a node a source holds carries no
    /// error estimate, so without this limit the step control would not see it at all.</summary>
    public double MaxStep => Shape == WaveformShape.Sine && _values[2] > 0 ? 1.0 / (StepsPerSinePeriod * _values[2]) : double.PositiveInfinity;

    /// <summary>The largest magnitude the waveform reaches, in its unit: |offset| + |amplitude| for a sine, the larger
    /// level of a pulse, the largest point of a piecewise-linear waveform.</summary>
    public double PeakMagnitude => Shape switch
    {
        WaveformShape.Sine => Math.Abs(_values[0]) + Math.Abs(_values[1]),
        WaveformShape.Pulse => Math.Max(Math.Abs(_values[0]), Math.Abs(_values[1])),
        _ => _values.Length == 0 ? 0.0 : _values.Max(Math.Abs),
    };

    /// <summary>Frequency of a sine, hertz; 0 for every other shape.</summary>
    public double SineFrequency => Shape == WaveformShape.Sine ? _values[2] : 0.0;

    /// <summary>Amplitude (peak deviation from the offset) of a sine, in the waveform's unit; 0 for every other shape.</summary>
    public double SineAmplitude => Shape == WaveformShape.Sine ? _values[1] : 0.0;

    /// <summary>Offset (mean) of a sine, in the waveform's unit; 0 for every other shape.</summary>
    public double SineOffset => Shape == WaveformShape.Sine ? _values[0] : 0.0;

    /// <summary>This sine with another <paramref name="amplitude"/> and <paramref name="frequency"/> (offset, start and
    /// phase kept): the mains of another country.</summary>
    /// <exception cref="InvalidOperationException">The waveform is not a sine.</exception>
    public Waveform WithSine(double amplitude, double frequency) => Shape == WaveformShape.Sine
        ? Sine(_values[0], amplitude, frequency, _values[3], _values[4] * 180.0 / Math.PI)
        : throw new InvalidOperationException("only a sine has an amplitude and a frequency");

    /// <summary>Start time of a sine (its phase origin), seconds; 0 for every other shape.</summary>
    public double SineStart => Shape == WaveformShape.Sine ? _values[3] : 0.0;

    /// <summary>Phase of a sine at its start, radians; 0 for every other shape.</summary>
    public double SinePhase => Shape == WaveformShape.Sine ? _values[4] : 0.0;

    /// <summary>Value at run time <paramref name="time"/> (seconds), in the source's unit. Pure.</summary>
    public double Value(double time)
    {
        switch (Shape)
        {
            case WaveformShape.Dc:
                return _values[0];
            case WaveformShape.Pulse:
            {
                double v1 = _values[0], v2 = _values[1];
                double delay = _times[0], rise = _times[1], width = _times[2], fall = _times[3], period = _times[4];
                double tt = time - delay;
                if (tt <= 0) return v1;
                if (!double.IsPositiveInfinity(period)) tt -= Math.Floor(tt / period) * period;
                if (tt < rise) return v1 + (v2 - v1) * tt / rise;
                tt -= rise;
                if (tt <= width) return v2;
                tt -= width;
                if (tt < fall) return v2 + (v1 - v2) * tt / fall;
                return v1;
            }
            case WaveformShape.Sine:
            {
                double tt = Math.Max(0, time - _values[3]);
                return _values[0] + _values[1] * Math.Sin(2 * Math.PI * _values[2] * tt + _values[4]);
            }
            default:
            {
                double[] t = _times;
                if (time <= t[0]) return _values[0];
                if (time >= t[^1]) return _values[^1];
                int hi = Array.BinarySearch(t, time);
                if (hi >= 0) return _values[hi];
                hi = ~hi;
                int lo = hi - 1;
                return _values[lo] + (_values[hi] - _values[lo]) * (time - t[lo]) / (t[hi] - t[lo]);
            }
        }
    }

    /// <summary>The first corner strictly after <paramref name="time"/> (seconds), +∞ if none. Corners within a relative
    /// 1e-15 (≈ 4 ulp) of <paramref name="time"/> count as reached (so asking again at a landed corner moves on; a
    /// coarser tolerance would skip corners a few ns ahead of a step ending late in a day).</summary>
    public double NextBreakpoint(double time)
    {
        double after = time + 1e-15 * Math.Max(1.0, Math.Abs(time));
        switch (Shape)
        {
            case WaveformShape.Pulse:
            {
                double delay = _times[0], rise = _times[1], width = _times[2], fall = _times[3], period = _times[4];
                Span<double> corners = [0, rise, rise + width, rise + width + fall];
                if (double.IsPositiveInfinity(period))
                {
                    foreach (double c in corners)
                    {
                        double b = delay + c;
                        if (b > after && !double.IsPositiveInfinity(b)) return b;
                    }
                    return double.PositiveInfinity;
                }
                double n = Math.Max(0, Math.Floor((time - delay) / period));
                for (int k = 0; k < 2; k++)
                {
                    double start = delay + (n + k) * period;
                    foreach (double c in corners)
                    {
                        if (start + c > after) return start + c;
                    }
                }
                return double.PositiveInfinity;
            }
            case WaveformShape.Sine:
                return _values[3] > after ? _values[3] : double.PositiveInfinity;
            case WaveformShape.PiecewiseLinear:
            {
                foreach (double t in _times)
                {
                    if (t > after) return t;
                }
                return double.PositiveInfinity;
            }
            default:
                return double.PositiveInfinity;
        }
    }
}
