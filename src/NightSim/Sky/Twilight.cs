namespace NightSim.Sky;

/// <summary>
/// Sunset, sunrise and twilight limits by locating where the Sun's geometric elevation
/// (<see cref="SunPosition"/>) crosses the event elevations: −0.8333° for sunrise/sunset (34′ refraction + 16′
/// semidiameter; USNO <i>Almanac for Computers</i>, Meeus ch. 15), −6° civil, −12° nautical, −18° astronomical
/// (AMS Glossary of Meteorology). Crossings are bracketed on a 5-minute grid across the night window and refined by
/// bisection to 0.01 s, which handles polar day and night, 23 h and 25 h nights, and any longitude without the
/// sign conventions of hour-angle formulas.
/// </summary>
public static class Twilight
{
    /// <summary>Sunrise and sunset elevation of the Sun's centre, degrees.</summary>
    public const double SunriseElevation = -0.8333;
    /// <summary>Civil twilight limit, degrees.</summary>
    public const double CivilElevation = -6.0;
    /// <summary>Nautical twilight limit, degrees.</summary>
    public const double NauticalElevation = -12.0;
    /// <summary>Astronomical twilight limit, degrees.</summary>
    public const double AstronomicalElevation = -18.0;

    private const double GridSeconds = 300.0;

    /// <summary>Local noon of <paramref name="date"/> and of the next day: the night window.</summary>
    public static (DateTimeOffset Start, DateTimeOffset End) NightWindow(Site site, DateOnly date)
        => (site.LocalNoon(date), site.LocalNoon(date.AddDays(1)));

    /// <summary>All sun events of the night of <paramref name="date"/> at <paramref name="site"/>.</summary>
    public static SolarEvents ForNight(Site site, DateOnly date)
    {
        ArgumentNullException.ThrowIfNull(site);
        var scan = new Scan(site, date);
        var set = scan.Crossings(SunriseElevation);
        var civil = scan.Crossings(CivilElevation);
        var naut = scan.Crossings(NauticalElevation);
        var astro = scan.Crossings(AstronomicalElevation);
        return new SolarEvents(date, set.Dusk, civil.Dusk, naut.Dusk, astro.Dusk, astro.Dawn, naut.Dawn, civil.Dawn, set.Dawn);
    }

    /// <summary>
    /// When the clear-sky (or <paramref name="skyFactor"/>) illuminance of <see cref="IlluminanceModel.SkyLux"/> crosses
    /// each of <paramref name="levels"/> (lux) in the night of <paramref name="date"/>.
    /// </summary>
    public static IReadOnlyList<LuxCrossing> LuxCrossings(Site site, DateOnly date, IReadOnlyList<double> levels, double skyFactor = 1.0)
    {
        ArgumentNullException.ThrowIfNull(site);
        ArgumentNullException.ThrowIfNull(levels);
        var scan = new Scan(site, date);
        var result = new List<LuxCrossing>(levels.Count);
        foreach (double lux in levels)
        {
            double h = IlluminanceModel.ElevationForLux(lux, skyFactor);
            if (double.IsNaN(h)) { result.Add(new LuxCrossing(lux, null, null)); continue; }
            var c = scan.Crossings(h);
            result.Add(new LuxCrossing(lux, c.Dusk, c.Dawn));
        }
        return result;
    }

    /// <summary>Falling and rising crossings of elevation <paramref name="elevation"/> (degrees) in the night of <paramref name="date"/>.</summary>
    public static (DateTimeOffset? Dusk, DateTimeOffset? Dawn) ElevationCrossings(Site site, DateOnly date, double elevation)
        => new Scan(site, date).Crossings(elevation);

    private sealed class Scan
    {
        private readonly Site _site;
        private readonly double _jd0;
        private readonly double _stepDays;
        private readonly double[] _elevation;

        public Scan(Site site, DateOnly date)
        {
            _site = site;
            var (start, end) = NightWindow(site, date);
            _jd0 = SunPosition.JulianDay(start);
            double seconds = (end - start).TotalSeconds;
            int n = (int)Math.Ceiling(seconds / GridSeconds);
            _stepDays = seconds / n / 86400.0;
            _elevation = new double[n + 1];
            for (int i = 0; i <= n; i++) _elevation[i] = Elev(_jd0 + i * _stepDays);
        }

        private double Elev(double jd) => SunPosition.Elevation(jd, _site.Latitude, _site.Longitude);

        public (DateTimeOffset? Dusk, DateTimeOffset? Dawn) Crossings(double h0)
        {
            int duskIndex = -1;
            for (int i = 0; i + 1 < _elevation.Length; i++)
            {
                if (_elevation[i] >= h0 && _elevation[i + 1] < h0) { duskIndex = i; break; }
            }
            int dawnIndex = -1;
            for (int i = duskIndex < 0 ? 0 : duskIndex + 1; i + 1 < _elevation.Length; i++)
            {
                if (_elevation[i] < h0 && _elevation[i + 1] >= h0) { dawnIndex = i; break; }
            }
            DateTimeOffset? dusk = duskIndex < 0 ? null : Refine(duskIndex, h0, falling: true);
            DateTimeOffset? dawn = dawnIndex < 0 ? null : Refine(dawnIndex, h0, falling: false);
            return (dusk, dawn);
        }

        private DateTimeOffset Refine(int index, double h0, bool falling)
        {
            double lo = _jd0 + index * _stepDays, hi = lo + _stepDays;
            for (int k = 0; k < 40 && (hi - lo) * 86400.0 > 0.01; k++)
            {
                double mid = 0.5 * (lo + hi);
                bool above = Elev(mid) >= h0;
                if (above == falling) lo = mid; else hi = mid;
            }
            DateTimeOffset utc = SunPosition.FromJulianDay(0.5 * (lo + hi));
            return LocalClock.ToLocal(_site.TimeZone, utc);
        }
    }
}
