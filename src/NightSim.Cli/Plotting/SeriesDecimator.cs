namespace NightSim.Cli.Plotting;

/// <summary>
/// Thins a series to what a plot of a given width can show: per pixel column, the first point, the lowest, the highest
/// and the last, in time order. Every spike and dip keeps its extreme, every on/off edge of a state series stays a
/// vertical stroke (a column in which the state changed holds both its off and its on value), and the value at each
/// column's end is the data's own. A chattering relay's 24 000 edges become at most four points per column instead of
/// tens of thousands of SVG coordinates.
/// </summary>
public static class SeriesDecimator
{
    /// <summary>Columns used for the plots: one per pixel of the widest plot image.</summary>
    public const int DefaultColumns = PlotWriter.DefaultWidth;

    /// <summary>The points to draw of an ascending series over [<paramref name="from"/>, <paramref name="to"/>] at
    /// <paramref name="columns"/> columns. Points before <paramref name="from"/> fall in the first column and points after
    /// <paramref name="to"/> in the last (the clipped series' edge points). A NaN value (a gap) is always kept, and splits
    /// its column. A series with at most four points per column on average is returned unchanged.</summary>
    public static (double[] Times, double[] Values) Decimate(IReadOnlyList<double> times, IReadOnlyList<double> values,
        double from, double to, int columns = DefaultColumns)
    {
        if (times.Count != values.Count) throw new ArgumentException($"{times.Count} times but {values.Count} values");
        int n = times.Count;
        if (n <= 4 * columns || !(to > from) || columns < 1) return ([.. times], [.. values]);
        double width = (to - from) / columns;
        var t = new List<double>(4 * columns + 8);
        var v = new List<double>(4 * columns + 8);
        int i = 0;
        while (i < n)
        {
            long column = Column(times[i], from, width, columns);
            if (!double.IsFinite(values[i]))
            {
                t.Add(times[i]);
                v.Add(values[i]);
                i++;
                continue;
            }
            int start = i, iMin = i, iMax = i;
            while (i < n && double.IsFinite(values[i]) && Column(times[i], from, width, columns) == column)
            {
                if (values[i] < values[iMin]) iMin = i;
                if (values[i] > values[iMax]) iMax = i;
                i++;
            }
            int last = i - 1;
            int lo = Math.Min(iMin, iMax), hi = Math.Max(iMin, iMax);
            int previous = -1;
            foreach (int k in (int[])[start, lo, hi, last])
            {
                if (k == previous) continue;
                t.Add(times[k]);
                v.Add(values[k]);
                previous = k;
            }
        }
        return ([.. t], [.. v]);
    }

    private static long Column(double time, double from, double width, int columns) =>
        Math.Clamp((long)Math.Floor((time - from) / width), 0, columns - 1);
}
