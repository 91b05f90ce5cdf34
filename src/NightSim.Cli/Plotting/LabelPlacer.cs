namespace NightSim.Cli.Plotting;

/// <summary>A rectangle in screen units (y grows downwards).</summary>
public readonly record struct ScreenBox(double Left, double Top, double Right, double Bottom)
{
    public double Width => Right - Left;
    public double Height => Bottom - Top;

    public bool Overlaps(ScreenBox o) => Left < o.Right && o.Left < Right && Top < o.Bottom && o.Top < Bottom;

    public ScreenBox Inflate(double d) => new(Left - d, Top - d, Right + d, Bottom + d);

    /// <summary>True when the segment from (x0, y0) to (x1, y1) touches the box (Liang–Barsky clipping).</summary>
    public bool Crosses(double x0, double y0, double x1, double y1)
    {
        double t0 = 0, t1 = 1, dx = x1 - x0, dy = y1 - y0;
        return Clip(-dx, x0 - Left, ref t0, ref t1) && Clip(dx, Right - x0, ref t0, ref t1)
            && Clip(-dy, y0 - Top, ref t0, ref t1) && Clip(dy, Bottom - y0, ref t0, ref t1);
    }

    private static bool Clip(double p, double q, ref double t0, ref double t1)
    {
        if (p == 0) return q >= 0;
        double r = q / p;
        if (p < 0)
        {
            if (r > t1) return false;
            if (r > t0) t0 = r;
        }
        else
        {
            if (r < t0) return false;
            if (r < t1) t1 = r;
        }
        return true;
    }
}

/// <summary>A curve drawn in a panel, in screen units, its points in ascending x (a plotted time series).</summary>
/// <param name="Xs">Screen x of each point, ascending.</param>
/// <param name="Ys">Screen y of each point (NaN: a gap).</param>
/// <param name="Weight">How bad it is to write over it: a trace more than a dashed reference line.</param>
public sealed record ScreenCurve(double[] Xs, double[] Ys, double Weight);

/// <summary>One panel the labels may go into, with what is drawn in it.</summary>
/// <param name="Area">The panel's plot area.</param>
/// <param name="Curves">Its curves.</param>
/// <param name="Boxes">Other things not to write over (lane labels), each with its weight.</param>
public sealed record LabelPanel(ScreenBox Area, IReadOnlyList<ScreenCurve> Curves, IReadOnlyList<(ScreenBox Box, double Weight)> Boxes);

/// <summary>A label to place beside a vertical marker line at screen x <paramref name="X"/>, with its box size.</summary>
public readonly record struct LabelRequest(double X, double Width, double Height);

/// <summary>
/// Places the labels of vertical marker lines (sunset, a false trigger) where they cover no curve: each label is tried
/// to the right and to the left of its line, at a ladder of heights, in each panel (the top panel first), and takes the
/// free spot with the least cost. Writing over a trace costs most, then over another label, a dashed reference line,
/// another marker's line; labels are placed left to right and each placed label is an obstacle for the next, so labels
/// of close markers stagger instead of printing over each other.
/// </summary>
public static class LabelPlacer
{
    /// <summary>Gap between a label and its line, and the clearance kept around curves, in screen units.</summary>
    public const double Gap = 3, Clearance = 2;

    /// <summary>Heights tried per panel and side (evenly from the top to the bottom of the panel).</summary>
    public const int Rungs = 9;

    /// <summary>Cost of covering another label; a trace's own weight is its curve's <see cref="ScreenCurve.Weight"/>.</summary>
    public const double LabelWeight = 500, MarkerLineWeight = 20, OutsideWeight = 1e6;

    /// <summary>Trace weights: a solid trace, a dashed reference line.</summary>
    public const double TraceWeight = 1000, ReferenceWeight = 150;

    /// <summary>The box of each label, in the order given.</summary>
    public static ScreenBox[] Place(IReadOnlyList<LabelRequest> labels, IReadOnlyList<LabelPanel> panels)
    {
        var placed = new ScreenBox[labels.Count];
        var taken = new List<ScreenBox>();
        int[] order = [.. Enumerable.Range(0, labels.Count).OrderBy(i => labels[i].X)];
        foreach (int i in order)
        {
            LabelRequest r = labels[i];
            double best = double.PositiveInfinity;
            ScreenBox choice = default;
            int preference = 0;
            foreach (LabelPanel p in panels)
            {
                foreach (ScreenBox c in Candidates(r, p.Area))
                {
                    double cost = Cost(c, r, p, labels, taken) + preference++ * 1e-3;
                    if (cost < best)
                    {
                        best = cost;
                        choice = c;
                    }
                }
            }
            placed[i] = choice;
            taken.Add(choice);
        }
        return placed;
    }

    /// <summary>Right of the line, then left, each from the top of the panel down.</summary>
    private static IEnumerable<ScreenBox> Candidates(LabelRequest r, ScreenBox area)
    {
        double room = area.Height - r.Height - 2 * Gap;
        foreach (bool right in (bool[])[true, false])
        {
            double left = right ? r.X + Gap : r.X - Gap - r.Width;
            for (int k = 0; k < Rungs; k++)
            {
                double top = area.Top + Gap + (room > 0 ? room * k / (Rungs - 1) : 0);
                yield return new ScreenBox(left, top, left + r.Width, top + r.Height);
                if (room <= 0) break;
            }
        }
    }

    private static double Cost(ScreenBox c, LabelRequest r, LabelPanel p, IReadOnlyList<LabelRequest> labels, List<ScreenBox> taken)
    {
        double cost = 0;
        if (c.Left < p.Area.Left || c.Right > p.Area.Right || c.Top < p.Area.Top || c.Bottom > p.Area.Bottom) cost += OutsideWeight;
        ScreenBox clear = c.Inflate(Clearance);
        foreach (ScreenCurve curve in p.Curves)
        {
            if (Crosses(curve, clear)) cost += curve.Weight;
        }
        foreach ((ScreenBox box, double weight) in p.Boxes)
        {
            if (box.Overlaps(clear)) cost += weight;
        }
        foreach (ScreenBox t in taken)
        {
            if (t.Overlaps(clear)) cost += LabelWeight;
        }
        foreach (LabelRequest other in labels)
        {
            if (other.X != r.X && other.X > clear.Left && other.X < clear.Right) cost += MarkerLineWeight;
        }
        return cost;
    }

    /// <summary>True when some segment of the curve touches the box; only the segments over the box's x range are tested.</summary>
    public static bool Crosses(ScreenCurve curve, ScreenBox box)
    {
        double[] xs = curve.Xs, ys = curve.Ys;
        int n = xs.Length;
        if (n == 0) return false;
        // The first point at or right of the box's left edge; the segment before it may cross into the box.
        int lo = 0, hi = n;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (xs[mid] < box.Left) lo = mid + 1; else hi = mid;
        }
        int i = Math.Max(0, lo - 1);
        if (n == 1) return double.IsFinite(ys[0]) && box.Crosses(xs[0], ys[0], xs[0], ys[0]);
        for (; i < n - 1; i++)
        {
            if (xs[i] > box.Right) break;
            if (!double.IsFinite(ys[i]) || !double.IsFinite(ys[i + 1])) continue;
            if (box.Crosses(xs[i], ys[i], xs[i + 1], ys[i + 1])) return true;
        }
        return false;
    }
}
