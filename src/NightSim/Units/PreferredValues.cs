namespace NightSim.Units;

/// <summary>Preferred number series for resistors and capacitors (IEC 60063, Preferred number series for resistors and
/// capacitors): the E12 series, twelve values per decade.</summary>
public static class PreferredValues
{
    private static readonly double[] s_e12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];

    private static double Tidy(double v) =>
        double.Parse(v.ToString("G3", System.Globalization.CultureInfo.InvariantCulture), System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>The smallest E12 value at or above <paramref name="value"/> (which must be positive and finite).</summary>
    /// <exception cref="ArgumentOutOfRangeException">Not positive and finite.</exception>
    public static double E12AtOrAbove(double value)
    {
        if (!(value > 0) || !double.IsFinite(value)) throw new ArgumentOutOfRangeException(nameof(value), value, "a positive, finite value");
        double decade = Math.Pow(10, Math.Floor(Math.Log10(value)));
        foreach (double m in s_e12)
        {
            double candidate = m * decade;
            // Tolerate the rounding of m·decade (4.7·100 is 470.00000000000006) and return the value as written.
            if (candidate >= value * (1 - 1e-12)) return Tidy(candidate);
        }
        return Tidy(10 * decade);
    }
}
