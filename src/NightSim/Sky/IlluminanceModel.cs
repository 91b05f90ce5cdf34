namespace NightSim.Sky;

/// <summary>
/// Horizontal illuminance from the Sun against solar elevation: the model of U.S. Naval Observatory Circular No. 171
/// (Janiczek &amp; DeYoung, 1987), which covers daylight and twilight. Sky factor: 1 clear, 2 thin cloud, 3 average
/// cloud, 10 dark stratus (same source). The model switches its refraction term at −5/6° and is therefore
/// discontinuous there (≈ 34 % step): never compare values exactly at that elevation.
/// </summary>
public static class IlluminanceModel
{
    /// <summary>Night-sky floor of the model for a clear sky, lux (divided by the sky factor).</summary>
    public const double ClearNightFloorLux = 0.0005;

    /// <summary>Solar constant term of the model, lux.</summary>
    public const double SolarTermLux = 133775.0;

    /// <summary>Elevation at which the model switches its refraction term, degrees (−5/6°).</summary>
    public const double RefractionSwitchElevation = -5.0 / 6.0;

    /// <summary>Illuminance from the Sun alone, lux, for geometric elevation <paramref name="elevation"/> (degrees).</summary>
    /// <param name="skyFactor">1 clear … 10 dark stratus; must be ≥ 1 (values below are allowed but unphysical).</param>
    public static double SunLux(double elevation, double skyFactor = 1.0)
    {
        const double deg = Math.PI / 180.0;
        double h = elevation;
        double ha = h < RefractionSwitchElevation ? h : h + 1.0 / (60.0 * Math.Tan((h + 8.6 / (h + 4.42)) * deg));
        double har = ha * deg;
        double u = Math.Sin(har);
        const double x = 753.66156;
        double s = Math.Asin(Math.Min(1.0, x * Math.Cos(har) / (x + 1.0)));
        double m = x * (Math.Cos(s) - u) + Math.Cos(s);
        double mm = Math.Exp(-0.21 * m) * u + 0.0289 * Math.Exp(-0.042 * m) * (1.0 + (ha + 90.0) * u / 57.29577951);
        double e = SolarTermLux * mm / skyFactor;
        return e > 0 ? e : 0.0;
    }

    /// <summary>Sun plus the model's night floor (0.0005 lx / sky factor), lux. No Moon.</summary>
    public static double SkyLux(double elevation, double skyFactor = 1.0)
        => SunLux(elevation, skyFactor) + ClearNightFloorLux / skyFactor;

    /// <summary>
    /// The elevation (degrees) at which <see cref="SkyLux"/> equals <paramref name="lux"/>, by bisection on
    /// −30°…+60°; NaN when the level is outside the model's range there. The model increases with elevation.
    /// </summary>
    public static double ElevationForLux(double lux, double skyFactor = 1.0)
    {
        double lo = -30.0, hi = 60.0;
        if (SkyLux(lo, skyFactor) > lux || SkyLux(hi, skyFactor) < lux) return double.NaN;
        for (int i = 0; i < 60; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (SkyLux(mid, skyFactor) < lux) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }
}
