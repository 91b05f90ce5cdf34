namespace NightSim.Sky;

/// <summary>
/// The Sun's elevation and the Moon's altitude and elongation on a light profile's time grid for one site and window.
/// The runs of a study share the site and the nights, so the grid is computed once and shared (read-only) by every
/// profile of the same site, start and length; the few most recent grids are kept. Thread-safe.
/// </summary>
public sealed class SkyGrid
{
    private const int Kept = 16;
    private static readonly object s_lock = new();
    private static readonly List<SkyGrid> s_recent = [];

    private readonly double _jd0, _step, _latitude, _longitude;
    private double[]? _moonAltitude, _moonElongation;

    private SkyGrid(double jd0, double step, int points, double latitude, double longitude)
    {
        _jd0 = jd0;
        _step = step;
        _latitude = latitude;
        _longitude = longitude;
        SunElevation = new double[points];
        for (int i = 0; i < points; i++) SunElevation[i] = SunPosition.Elevation(jd0 + i * step / 86400.0, latitude, longitude);
    }

    /// <summary>Geometric solar elevation at grid point i (run time i·step), degrees. Shared: do not write.</summary>
    public double[] SunElevation { get; }

    /// <summary>Moon altitude at each grid point, degrees (computed on first use). Shared: do not write.</summary>
    public double[] MoonAltitude
    {
        get
        {
            EnsureMoon();
            return _moonAltitude!;
        }
    }

    /// <summary>Moon elongation from the Sun at each grid point, degrees (computed on first use). Shared: do not write.</summary>
    public double[] MoonElongation
    {
        get
        {
            EnsureMoon();
            return _moonElongation!;
        }
    }

    private void EnsureMoon()
    {
        lock (this)
        {
            if (_moonAltitude is not null) return;
            int n = SunElevation.Length;
            var alt = new double[n];
            var elong = new double[n];
            for (int i = 0; i < n; i++)
            {
                double jd = _jd0 + i * _step / 86400.0;
                alt[i] = MoonPosition.Altitude(jd, _latitude, _longitude);
                elong[i] = MoonPosition.Elongation(jd);
            }
            _moonElongation = elong;
            _moonAltitude = alt;
        }
    }

    /// <summary>The grid of <paramref name="points"/> points <paramref name="step"/> seconds apart from Julian day
    /// <paramref name="jd0"/> at the site, computed or shared.</summary>
    public static SkyGrid For(double jd0, double step, int points, double latitude, double longitude)
    {
        lock (s_lock)
        {
            foreach (SkyGrid g in s_recent)
                if (g._jd0 == jd0 && g._step == step && g.SunElevation.Length == points && g._latitude == latitude && g._longitude == longitude)
                    return g;
        }
        var grid = new SkyGrid(jd0, step, points, latitude, longitude);
        lock (s_lock)
        {
            if (s_recent.Count == Kept) s_recent.RemoveAt(0);
            s_recent.Add(grid);
        }
        return grid;
    }
}
