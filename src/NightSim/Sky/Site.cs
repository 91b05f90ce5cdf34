namespace NightSim.Sky;

/// <summary>An observing site: geographic position and civil time zone.</summary>
/// <param name="Name">Free text shown in reports.</param>
/// <param name="Latitude">Degrees, north positive, −90…90.</param>
/// <param name="Longitude">Degrees, east positive, −180…180.</param>
/// <param name="TimeZone">The site's civil zone (IANA id), daylight saving included.</param>
/// <param name="Elevation">Height above sea level, metres (informative; the models here do not use it).</param>
public sealed record Site(string Name, double Latitude, double Longitude, TimeZoneInfo TimeZone, double Elevation = 0.0)
{
    /// <summary>Finds a zone by IANA id ("Europe/Berlin"); false with a message when unknown.</summary>
    public static bool TryFindTimeZone(string? id, out TimeZoneInfo zone, out string? error)
    {
        zone = TimeZoneInfo.Utc;
        error = null;
        if (string.IsNullOrWhiteSpace(id))
        {
            error = "time zone is empty; give an IANA id such as \"Europe/Berlin\" or \"UTC\"";
            return false;
        }
        try
        {
            zone = TimeZoneInfo.FindSystemTimeZoneById(id.Trim());
            return true;
        }
        catch (Exception ex) when (ex is TimeZoneNotFoundException or InvalidTimeZoneException)
        {
            error = $"unknown time zone \"{id}\"; give an IANA id such as \"Europe/Berlin\", \"America/Denver\" or \"UTC\"";
            return false;
        }
    }

    /// <summary>Checks latitude and longitude ranges; returns null when valid, else a message.</summary>
    public static string? ValidateCoordinates(double latitude, double longitude)
    {
        if (!double.IsFinite(latitude) || latitude < -90 || latitude > 90)
            return $"latitude {latitude.ToString(System.Globalization.CultureInfo.InvariantCulture)} is outside −90…90 degrees (north positive)";
        if (!double.IsFinite(longitude) || longitude < -180 || longitude > 180)
            return $"longitude {longitude.ToString(System.Globalization.CultureInfo.InvariantCulture)} is outside −180…180 degrees (east positive)";
        return null;
    }

    /// <summary>
    /// The instant of local clock time <paramref name="local"/> in this site's zone. A time skipped by a daylight-saving
    /// change is moved forward by the gap; a repeated time takes its first (daylight-saving) occurrence.
    /// </summary>
    public DateTimeOffset ToInstant(DateTime local) => LocalClock.ToInstant(TimeZone, local);

    /// <summary>Local noon of <paramref name="date"/> in this site's zone.</summary>
    public DateTimeOffset LocalNoon(DateOnly date) => ToInstant(date.ToDateTime(new TimeOnly(12, 0)));
}
