namespace NightSim.Sky;

/// <summary>
/// Low-precision Moon: the short series of the <i>Astronomical Almanac</i> "low-precision formulae for the Moon"
/// (about 0.3° in longitude and 0.2° in latitude — ample for moonlight), converted to the horizon with the mean
/// sidereal time of Meeus eq. 12.4. Geocentric positions; the USNO Circular 171 moonlight formula applies its own
/// parallax correction. Pure functions, time in UT.
/// </summary>
public static class MoonPosition
{
    private const double Deg = Math.PI / 180.0;

    /// <summary>Geocentric ecliptic longitude and latitude of the Moon, degrees.</summary>
    public static (double Longitude, double Latitude) Ecliptic(double julianDay)
    {
        double t = (julianDay - 2451545.0) / 36525.0;
        double lambda = 218.32 + 481267.881 * t
            + 6.29 * Sin(135.0 + 477198.87 * t) - 1.27 * Sin(259.3 - 413335.36 * t)
            + 0.66 * Sin(235.7 + 890534.22 * t) + 0.21 * Sin(269.9 + 954397.74 * t)
            - 0.19 * Sin(357.5 + 35999.05 * t) - 0.11 * Sin(186.5 + 966404.03 * t);
        double beta = 5.13 * Sin(93.3 + 483202.02 * t) + 0.28 * Sin(228.2 + 960400.89 * t)
            - 0.28 * Sin(318.3 + 6003.15 * t) - 0.17 * Sin(217.6 - 407332.21 * t);
        return (Mod360(lambda), beta);
    }

    /// <summary>Geocentric right ascension and declination, degrees.</summary>
    public static (double RightAscension, double Declination) Equatorial(double julianDay)
    {
        var (lambda, beta) = Ecliptic(julianDay);
        double eps = SunPosition.Coordinates(julianDay).Obliquity * Deg;
        double l = lambda * Deg, b = beta * Deg;
        double ra = Math.Atan2(Math.Sin(l) * Math.Cos(eps) - Math.Tan(b) * Math.Sin(eps), Math.Cos(l));
        double dec = Math.Asin(Math.Sin(b) * Math.Cos(eps) + Math.Cos(b) * Math.Sin(eps) * Math.Sin(l));
        return (Mod360(ra / Deg), dec / Deg);
    }

    /// <summary>Geocentric altitude of the Moon's centre, degrees, seen from (lat, lon east).</summary>
    public static double Altitude(double julianDay, double latitude, double longitude)
    {
        var (ra, dec) = Equatorial(julianDay);
        double d = julianDay - 2451545.0;
        double gmst = 280.46061837 + 360.98564736629 * d; // Meeus eq. 12.4 without the T² and T³ terms (< 0.01° this century)
        double h = (gmst + longitude - ra) * Deg;
        double phi = latitude * Deg, dr = dec * Deg;
        double s = Math.Sin(phi) * Math.Sin(dr) + Math.Cos(phi) * Math.Cos(dr) * Math.Cos(h);
        return Math.Asin(Math.Clamp(s, -1.0, 1.0)) / Deg;
    }

    /// <summary>Elongation of the Moon from the Sun, degrees (0 new, 180 full).</summary>
    public static double Elongation(double julianDay)
    {
        var (lambda, beta) = Ecliptic(julianDay);
        double sun = SunPosition.Coordinates(julianDay).ApparentLongitude;
        double c = Math.Cos(beta * Deg) * Math.Cos((lambda - sun) * Deg);
        return Math.Acos(Math.Clamp(c, -1.0, 1.0)) / Deg;
    }

    private static double Sin(double degrees) => Math.Sin(degrees * Deg);

    private static double Mod360(double x)
    {
        double r = x % 360.0;
        return r < 0 ? r + 360.0 : r;
    }
}
