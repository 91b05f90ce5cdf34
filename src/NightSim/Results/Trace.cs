namespace NightSim.Results;

/// <summary>
/// The recorded waveform of one unknown: (time, value) points in time order. Long runs are decimated per time bucket
/// to the bucket's minimum and maximum (in time order), so no spike is lost; short runs keep every accepted point.
/// </summary>
public sealed class Trace
{
    internal Trace(string name, string unit, double[] times, double[] values, int count)
    {
        Name = name;
        Unit = unit;
        Times = times.AsSpan(0, count).ToArray();
        Values = values.AsSpan(0, count).ToArray();
    }

    /// <summary>Node name or branch label.</summary>
    public string Name { get; }

    /// <summary>"V" for voltages, "A" for branch currents.</summary>
    public string Unit { get; }

    /// <summary>Point times, seconds since the run origin.</summary>
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

    /// <summary>Largest value.</summary>
    public double Max => Values.Count == 0 ? double.NaN : Values.Max();

    /// <summary>Smallest value.</summary>
    public double Min => Values.Count == 0 ? double.NaN : Values.Min();
}
