namespace NightSim.Studies;

/// <summary>
/// Confidence interval of a proportion by the score method: Wilson, E. B. (1927), "Probable inference, the law of
/// succession, and statistical inference", Journal of the American Statistical Association 22(158), 209–212.
/// Unlike the normal approximation it stays inside [0, 1] and is usable at 0 or n successes.
/// </summary>
public static class Wilson
{
    /// <summary>z for a two-sided 95 % interval.</summary>
    public const double Z95 = 1.959963984540054;

    /// <summary>The interval for <paramref name="successes"/> of <paramref name="n"/> trials.</summary>
    public static (double Low, double High) Interval(int successes, int n, double z = Z95)
    {
        if (n <= 0) return (0, 1);
        double p = (double)successes / n, z2 = z * z;
        double denominator = 1 + z2 / n;
        double centre = (p + z2 / (2.0 * n)) / denominator;
        double half = z / denominator * Math.Sqrt(p * (1 - p) / n + z2 / (4.0 * n * n));
        return (Math.Max(0, centre - half), Math.Min(1, centre + half));
    }
}
