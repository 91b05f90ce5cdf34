namespace NightSim.Studies;

/// <summary>
/// Sample percentiles by linear interpolation between order statistics: definition 7 of Hyndman, R. J. and Fan, Y.
/// (1996), "Sample quantiles in statistical packages", The American Statistician 50(4), 361–365 (the default of most
/// statistics libraries).
/// </summary>
public static class Percentile
{
    /// <summary>The <paramref name="p"/>-th percentile (0…100) of <paramref name="sorted"/> (ascending), or NaN when empty.</summary>
    public static double Of(IReadOnlyList<double> sorted, double p)
    {
        if (sorted.Count == 0) return double.NaN;
        double h = (sorted.Count - 1) * p / 100.0;
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, sorted.Count - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }
}
