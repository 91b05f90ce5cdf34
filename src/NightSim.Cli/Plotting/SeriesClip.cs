namespace NightSim.Cli.Plotting;

/// <summary>How a series is drawn between its points, which decides how a cut edge point is placed.</summary>
public enum SeriesShape
{
    /// <summary>Straight lines from point to point (voltages, lux).</summary>
    Line,
    /// <summary>Each value holds until the next point (on/off states).</summary>
    Steps,
}

/// <summary>
/// Cuts a series to the plotted window before it is handed to the plot library. Every point inside the window is kept,
/// and so is the point just outside each edge, so the curve enters and leaves the frame as the data says. When that
/// outside point lies far beyond the edge (a detail plot of 80 ms cut from a capture of minutes: the neighbour can sit
/// a hundred thousand pixels away), it is replaced by the point where its segment crosses a line just outside the
/// frame: inside the frame the drawing is the same, but the renderer no longer draws (and dashes) a segment across a
/// hundred thousand pixels it then throws away.
/// </summary>
public static class SeriesClip
{
    /// <summary>How far outside the window (as a fraction of its span) an outside neighbour may lie and still be kept
    /// as it is; a farther one is moved in along its segment to this distance.</summary>
    public const double Margin = 0.02;

    /// <summary>The points of (<paramref name="times"/>, <paramref name="values"/>) to draw in [<paramref name="from"/>,
    /// <paramref name="to"/>]: every point inside, and one point just outside each edge when the data reaches past it.
    /// Times must be ascending. Values may be NaN (a gap); a gap next to an edge is kept as a gap.</summary>
    public static (double[] Times, double[] Values) Clip(IReadOnlyList<double> times, IReadOnlyList<double> values,
        double from, double to, SeriesShape shape = SeriesShape.Line)
    {
        if (times.Count != values.Count) throw new ArgumentException($"{times.Count} times but {values.Count} values");
        int n = times.Count;
        if (n == 0 || !(to > from)) return ([], []);
        // a = first index inside (t >= from), b = one past the last index inside (t <= to).
        int a = LowerBound(times, from);
        int b = UpperBound(times, to);
        double margin = Margin * (to - from);
        var t = new List<double>(b - a + 2);
        var v = new List<double>(b - a + 2);
        if (a > 0)
        {
            (double tt, double vv) = Edge(times, values, a - 1, a < n ? a : -1, from - margin, shape, before: true);
            t.Add(tt);
            v.Add(vv);
        }
        for (int i = a; i < b; i++)
        {
            t.Add(times[i]);
            v.Add(values[i]);
        }
        if (b < n)
        {
            (double tt, double vv) = Edge(times, values, b, b > 0 ? b - 1 : -1, to + margin, shape, before: false);
            t.Add(tt);
            v.Add(vv);
        }
        return ([.. t], [.. v]);
    }

    /// <summary>The outside point <paramref name="outside"/> as drawn: itself when it lies within the margin, else the
    /// point of its segment to <paramref name="inside"/> (the nearest point on the other side of the edge) at
    /// <paramref name="limit"/>.</summary>
    private static (double T, double V) Edge(IReadOnlyList<double> times, IReadOnlyList<double> values, int outside, int inside,
        double limit, SeriesShape shape, bool before)
    {
        double to = times[outside], vo = values[outside];
        bool near = before ? to >= limit : to <= limit;
        if (near || inside < 0) return (to, vo);
        double ti = times[inside], vi = values[inside];
        if (!double.IsFinite(vo) || !double.IsFinite(vi)) return (limit, double.NaN);
        if (shape == SeriesShape.Steps)
        {
            // The value that holds at the limit: the earlier point's value, whichever side it is on.
            return (limit, before ? vo : vi);
        }
        double span = ti - to;
        if (span == 0) return (limit, vi);
        double f = (limit - to) / span;
        return (limit, vo + f * (vi - vo));
    }

    private static int LowerBound(IReadOnlyList<double> times, double x)
    {
        int lo = 0, hi = times.Count;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (times[mid] < x) lo = mid + 1; else hi = mid;
        }
        return lo;
    }

    private static int UpperBound(IReadOnlyList<double> times, double x)
    {
        int lo = 0, hi = times.Count;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (times[mid] <= x) lo = mid + 1; else hi = mid;
        }
        return lo;
    }
}
