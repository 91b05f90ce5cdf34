namespace NightSim.Sky;

/// <summary>
/// Horizontal illuminance from the Sun against solar elevation: the model of U.S. Naval Observatory Circular No. 171
/// (Janiczek &amp; DeYoung, 1987), which covers daylight and twilight. Sky factor: 1 clear, 2 thin cloud, 3 average
/// cloud, 10 dark stratus (same source). The published model switches its refraction term at −5/6° and steps there
/// (≈ 34 %, e.g. 662 → 436 lx), which no sky does; here the day branch (with refraction) and the twilight branch
/// (without) are joined by a geometric blend over <see cref="BlendLowElevation"/>…<see cref="BlendHighElevation"/>
/// (−1° … −2/3°, ±1/6° around the switch) with a smoothstep weight, so the curve is continuous with a continuous
/// slope. Outside the band each branch is the published model unchanged (its table values at 0° and −1° hold).
/// </summary>
public static class IlluminanceModel
{
    /// <summary>Night-sky floor of the model for a clear sky, lux (divided by the sky factor).</summary>
    public const double ClearNightFloorLux = 0.0005;

    /// <summary>Solar constant term of the model, lux.</summary>
    public const double SolarTermLux = 133775.0;

    /// <summary>Elevation at which the published model switches its refraction term, degrees (−5/6°).</summary>
    public const double RefractionSwitchElevation = -5.0 / 6.0;

    /// <summary>Lower edge of the band joining the two branches, degrees: below it, the twilight branch alone.</summary>
    public const double BlendLowElevation = -1.0;

    /// <summary>Upper edge of the band joining the two branches, degrees: above it, the day branch alone.</summary>
    public const double BlendHighElevation = -2.0 / 3.0;

    /// <summary>Illuminance from the Sun alone, lux, for geometric elevation <paramref name="elevation"/> (degrees).</summary>
    /// <param name="skyFactor">1 clear … 10 dark stratus; must be ≥ 1 (values below are allowed but unphysical).</param>
    public static double SunLux(double elevation, double skyFactor = 1.0)
    {
        double h = elevation;
        if (h <= BlendLowElevation) return Branch(h, refraction: false, skyFactor);
        if (h >= BlendHighElevation) return Branch(h, refraction: true, skyFactor);
        // Geometric blend with a smoothstep weight: continuous value and slope at both band edges, increasing
        // throughout because the day branch lies above the twilight branch inside the band.
        double twilight = Branch(h, refraction: false, skyFactor), day = Branch(h, refraction: true, skyFactor);
        if (!(twilight > 0) || !(day > 0)) return Math.Max(twilight, day);
        double u = (h - BlendLowElevation) / (BlendHighElevation - BlendLowElevation);
        double w = u * u * (3.0 - 2.0 * u);
        return Math.Exp((1.0 - w) * Math.Log(twilight) + w * Math.Log(day));
    }

    /// <summary>One branch of the published model: with the refraction term (day, valid above −5/6°) or without
    /// (twilight, valid below), lux.</summary>
    public static double Branch(double elevation, bool refraction, double skyFactor = 1.0)
    {
        const double deg = Math.PI / 180.0;
        double h = elevation;
        double ha = refraction ? h + 1.0 / (60.0 * Math.Tan((h + 8.6 / (h + 4.42)) * deg)) : h;
        double har = ha * deg;
        double u = Math.Sin(har);
        const double x = 753.66156;
        double s = Math.Asin(Math.Min(1.0, x * Math.Cos(har) / (x + 1.0)));
        double m = x * (Math.Cos(s) - u) + Math.Cos(s);
        double mm = Math.Exp(-0.21 * m) * u + 0.0289 * Math.Exp(-0.042 * m) * (1.0 + (ha + 90.0) * u / 57.29577951);
        double e = SolarTermLux * mm / skyFactor;
        return e > 0 ? e : 0.0;
    }

    /// <summary>
    /// Moonlight on a horizontal surface, lux, by the same Circular 171 model: phase term
    /// P = 0.892·exp(−3.343/tan(ε/2)^0.632) + 0.0344(sin ε − ε cos ε), P ← 0.418·P/(1 − 0.005 cos ε − 0.03 sin Z),
    /// E = P·M(h − 0.95 cos h)/sky, with M the air-mass term of <see cref="SunLux"/> (SunLux = 133775·M).
    /// </summary>
    /// <param name="altitude">Geocentric altitude of the Moon, degrees.</param>
    /// <param name="elongation">Elongation from the Sun, degrees (180 = full).</param>
    /// <param name="skyFactor">Sky factor, as for the Sun.</param>
    public static double MoonLux(double altitude, double elongation, double skyFactor = 1.0)
    {
        const double deg = Math.PI / 180.0;
        double e = Math.Clamp(elongation, 1e-6, 180.0) * deg;
        double z = altitude * deg;
        double p = 0.892 * Math.Exp(-3.343 / Math.Pow(Math.Tan(e / 2), 0.632)) + 0.0344 * (Math.Sin(e) - e * Math.Cos(e));
        p = 0.418 * p / (1 - 0.005 * Math.Cos(e) - 0.03 * Math.Sin(z));
        double hm = altitude - 0.95 * Math.Cos(z);
        // SunLux(h) = 133775·M(h) for sky 1, so M(h) = SunLux(h)/133775.
        double lux = p * SunLux(hm, 1.0) / SolarTermLux / skyFactor;
        return lux > 0 ? lux : 0.0;
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
