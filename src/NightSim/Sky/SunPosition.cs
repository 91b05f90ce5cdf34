namespace NightSim.Sky;

/// <summary>Apparent solar coordinates at one instant (degrees; equation of time in minutes).</summary>
/// <param name="JulianCenturies">T = (JD − 2451545.0)/36525.</param>
/// <param name="MeanLongitude">L0, degrees, 0…360.</param>
/// <param name="MeanAnomaly">M, degrees.</param>
/// <param name="Eccentricity">Earth orbit eccentricity e.</param>
/// <param name="EquationOfCenter">C, degrees.</param>
/// <param name="ApparentLongitude">λ, degrees.</param>
/// <param name="Obliquity">Corrected obliquity ε, degrees.</param>
/// <param name="RightAscension">α, degrees, 0…360.</param>
/// <param name="Declination">δ, degrees.</param>
/// <param name="EquationOfTime">Apparent minus mean solar time, minutes.</param>
public readonly record struct SolarCoordinates(
    double JulianCenturies, double MeanLongitude, double MeanAnomaly, double Eccentricity, double EquationOfCenter,
    double ApparentLongitude, double Obliquity, double RightAscension, double Declination, double EquationOfTime);

/// <summary>Horizontal position of the Sun's centre seen from a site (geometric, no refraction).</summary>
/// <param name="Elevation">Degrees above the horizon (90° − zenith).</param>
/// <param name="Azimuth">Degrees clockwise from north.</param>
public readonly record struct HorizontalPosition(double Elevation, double Azimuth);

/// <summary>
/// Low-precision solar position: the NOAA solar calculation equations after Meeus, <i>Astronomical Algorithms</i>
/// (2nd ed., 1998) chapters 7, 25 and 28 — about 0.01° in position and about a minute in rise/set within ±72°
/// latitude. Pure functions; time in UT (ΔT neglected, as the NOAA equations do).
/// </summary>
public static class SunPosition
{
    private const double Deg = Math.PI / 180.0;
    /// <summary>Julian Day of the Unix epoch 1970-01-01 00:00 UT.</summary>
    public const double UnixEpochJulianDay = 2440587.5;

    /// <summary>Julian Day (UT) of an instant.</summary>
    public static double JulianDay(DateTimeOffset instant)
    {
        long ticks = instant.UtcTicks - DateTime.UnixEpoch.Ticks;
        return UnixEpochJulianDay + ticks / (double)TimeSpan.TicksPerDay;
    }

    /// <summary>The instant of Julian Day <paramref name="julianDay"/> (UT).</summary>
    public static DateTimeOffset FromJulianDay(double julianDay)
    {
        double days = julianDay - UnixEpochJulianDay;
        return new DateTimeOffset(DateTime.UnixEpoch.Ticks + (long)Math.Round(days * TimeSpan.TicksPerDay), TimeSpan.Zero);
    }

    /// <summary>
    /// Julian Day of a calendar date (Meeus ch. 7, eq. 7.1). Dates before 1582-10-15 are read in the Julian
    /// calendar, later ones in the Gregorian; astronomical year numbering (year 0 = 1 BC).
    /// </summary>
    /// <param name="day">Day of month with fraction (e.g. 27.5 = noon of the 27th).</param>
    public static double JulianDay(int year, int month, double day)
    {
        int y = year, m = month;
        if (m <= 2) { y -= 1; m += 12; }
        bool gregorian = year > 1582 || (year == 1582 && (month > 10 || (month == 10 && day >= 15)));
        int b = 0;
        if (gregorian)
        {
            int a = (int)Math.Floor(y / 100.0);
            b = 2 - a + (int)Math.Floor(a / 4.0);
        }
        return Math.Floor(365.25 * (y + 4716)) + Math.Floor(30.6001 * (m + 1)) + day + b - 1524.5;
    }

    /// <summary>Solar coordinates at Julian Day <paramref name="julianDay"/>.</summary>
    public static SolarCoordinates Coordinates(double julianDay)
    {
        double t = (julianDay - 2451545.0) / 36525.0;
        double l0 = Mod360(280.46646 + t * (36000.76983 + 0.0003032 * t));
        double m = Mod360(357.52911 + t * (35999.05029 - 0.0001537 * t));
        double e = 0.016708634 - t * (0.000042037 + 0.0000001267 * t);
        double mr = m * Deg;
        double c = Math.Sin(mr) * (1.914602 - t * (0.004817 + 0.000014 * t))
                 + Math.Sin(2 * mr) * (0.019993 - 0.000101 * t)
                 + 0.000289 * Math.Sin(3 * mr);
        double omega = 125.04 - 1934.136 * t;
        double lambda = l0 + c - 0.00569 - 0.00478 * Math.Sin(omega * Deg);
        double eps0 = 23.0 + (26.0 + (21.448 - t * (46.815 + t * (0.00059 - 0.001813 * t))) / 60.0) / 60.0;
        double eps = eps0 + 0.00256 * Math.Cos(omega * Deg);
        double lr = lambda * Deg, er = eps * Deg;
        double dec = Math.Asin(Math.Sin(er) * Math.Sin(lr)) / Deg;
        double ra = Mod360(Math.Atan2(Math.Cos(er) * Math.Sin(lr), Math.Cos(lr)) / Deg);
        double y = Math.Tan(er / 2);
        y *= y;
        double l0r = l0 * Deg;
        double eot = 4.0 / Deg * (y * Math.Sin(2 * l0r) - 2 * e * Math.Sin(mr) + 4 * e * y * Math.Sin(mr) * Math.Cos(2 * l0r)
                                  - 0.5 * y * y * Math.Sin(4 * l0r) - 1.25 * e * e * Math.Sin(2 * mr));
        return new SolarCoordinates(t, l0, m, e, c, lambda, eps, ra, dec, eot);
    }

    /// <summary>Geometric elevation and azimuth of the Sun's centre at <paramref name="instant"/> seen from (lat, lon).</summary>
    /// <param name="latitude">Degrees north.</param>
    /// <param name="longitude">Degrees east.</param>
    public static HorizontalPosition Horizontal(DateTimeOffset instant, double latitude, double longitude)
        => Horizontal(JulianDay(instant), latitude, longitude);

    /// <summary>Geometric elevation and azimuth at Julian Day (UT) <paramref name="julianDay"/>.</summary>
    public static HorizontalPosition Horizontal(double julianDay, double latitude, double longitude)
    {
        SolarCoordinates sc = Coordinates(julianDay);
        double minutesUt = (julianDay - 0.5 - Math.Floor(julianDay - 0.5)) * 1440.0;
        double trueSolar = minutesUt + sc.EquationOfTime + 4.0 * longitude;
        trueSolar -= 1440.0 * Math.Floor(trueSolar / 1440.0);
        double h = (trueSolar / 4.0 - 180.0) * Deg;
        double phi = latitude * Deg, dec = sc.Declination * Deg;
        double cosZ = Math.Clamp(Math.Sin(phi) * Math.Sin(dec) + Math.Cos(phi) * Math.Cos(dec) * Math.Cos(h), -1.0, 1.0);
        double elevation = 90.0 - Math.Acos(cosZ) / Deg;
        double az = Math.Atan2(Math.Sin(h), Math.Cos(h) * Math.Sin(phi) - Math.Tan(dec) * Math.Cos(phi)) / Deg + 180.0;
        return new HorizontalPosition(elevation, Mod360(az));
    }

    /// <summary>Geometric elevation only, degrees.</summary>
    public static double Elevation(double julianDay, double latitude, double longitude)
        => Horizontal(julianDay, latitude, longitude).Elevation;

    private static double Mod360(double x)
    {
        double r = x % 360.0;
        return r < 0 ? r + 360.0 : r;
    }
}
