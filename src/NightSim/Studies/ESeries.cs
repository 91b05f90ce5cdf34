namespace NightSim.Studies;

/// <summary>
/// The preferred-number series of resistor and capacitor values (IEC 60063, "Preferred number series for resistors
/// and capacitors"): E6, E12 and E24, one decade each.
/// </summary>
public static class ESeries
{
    private static readonly double[] s_e6 = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
    private static readonly double[] s_e12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
    private static readonly double[] s_e24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

    /// <summary>The decade of series "E6", "E12" or "E24", or null.</summary>
    public static IReadOnlyList<double>? Decade(string name) => name.ToUpperInvariant() switch
    {
        "E6" => s_e6,
        "E12" => s_e12,
        "E24" => s_e24,
        _ => null,
    };

    /// <summary>Every value of the series from <paramref name="low"/> to <paramref name="high"/> inclusive (both &gt; 0).</summary>
    public static List<double> Between(IReadOnlyList<double> decade, double low, double high)
    {
        var list = new List<double>();
        int first = (int)Math.Floor(Math.Log10(low)) - 1, last = (int)Math.Ceiling(Math.Log10(high)) + 1;
        for (int e = first; e <= last; e++)
        {
            foreach (double m in decade)
            {
                // Round to the series' two significant digits so 4.7e-9 is exactly what "4n7" parses to.
                double v = double.Parse((m * Math.Pow(10, e)).ToString("G2", System.Globalization.CultureInfo.InvariantCulture), System.Globalization.CultureInfo.InvariantCulture);
                if (v >= low * (1 - 1e-9) && v <= high * (1 + 1e-9)) list.Add(v);
            }
        }
        return list;
    }
}
