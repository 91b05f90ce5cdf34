namespace NightSim.Results;

/// <summary>
/// The recorded waveform of one unknown. <see cref="Times"/>/<see cref="Values"/> are accepted points of the solver
/// (decimated by time in long runs, switching edges and breakpoints always kept; every trace of a run has the same
/// times). <see cref="EnvelopeTimes"/>/<see cref="EnvelopeValues"/> keep each time bucket's minimum and maximum point
/// (in time order), so no spike is lost: plots and <see cref="Min"/>/<see cref="Max"/> use them.
/// </summary>
public sealed class Trace
{
    internal Trace(string name, string unit, double[] times, double[] values, int count,
        double[] envelopeTimes, double[] envelopeValues, int envelopeCount)
    {
        Name = name;
        Unit = unit;
        Times = times.AsSpan(0, count).ToArray();
        Values = values.AsSpan(0, count).ToArray();
        EnvelopeTimes = envelopeTimes.AsSpan(0, envelopeCount).ToArray();
        EnvelopeValues = envelopeValues.AsSpan(0, envelopeCount).ToArray();
    }

    /// <summary>Times of the envelope points (each bucket's minimum and maximum), seconds.</summary>
    public IReadOnlyList<double> EnvelopeTimes { get; }

    /// <summary>Values of the envelope points in <see cref="Unit"/>.</summary>
    public IReadOnlyList<double> EnvelopeValues { get; }

    /// <summary>Node name or branch label.</summary>
    public string Name { get; }

    /// <summary>"V" for voltages, "A" for branch currents.</summary>
    public string Unit { get; }

    /// <summary>Times of the accepted points kept, seconds since the run origin.</summary>
    public IReadOnlyList<double> Times { get; }

    /// <summary>Point values in <see cref="Unit"/>.</summary>
    public IReadOnlyList<double> Values { get; }

    /// <summary>Value at <paramref name="time"/> by linear interpolation between points (clamped at the ends).</summary>
    public double At(double time)
    {
        int n = Times.Count;
        if (n == 0) return double.NaN;
        if (time <= Times[0]) return Values[0];
        if (time >= Times[n - 1]) return Values[n - 1];
        int lo = 0, hi = n - 1;
        while (hi - lo > 1)
        {
            int mid = (lo + hi) >> 1;
            if (Times[mid] <= time) lo = mid; else hi = mid;
        }
        double t0 = Times[lo], t1 = Times[hi];
        return t1 > t0 ? Values[lo] + (Values[hi] - Values[lo]) * (time - t0) / (t1 - t0) : Values[hi];
    }

    /// <summary>Largest value at any accepted point.</summary>
    public double Max => EnvelopeValues.Count == 0 ? double.NaN : Math.Max(EnvelopeValues.Max(), Values.Max());

    /// <summary>Smallest value at any accepted point.</summary>
    public double Min => EnvelopeValues.Count == 0 ? double.NaN : Math.Min(EnvelopeValues.Min(), Values.Min());
}
