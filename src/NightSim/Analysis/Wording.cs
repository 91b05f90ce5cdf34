using System.Globalization;

namespace NightSim.Analysis;

/// <summary>How findings write clock times, durations and causes (the report writers use the same wording through
/// <c>Reporting.ReportText</c>, so the page, the JSON and the terminal agree).</summary>
public static class Wording
{
    /// <summary>Clock time for tables: 17:42:05.</summary>
    public static string Clock(DateTimeOffset? t) => t is null ? "—" : t.Value.ToString("HH:mm:ss", CultureInfo.InvariantCulture);

    /// <summary>Duration as "4 h 10 min", "12 min 5 s" or "3.2 s".</summary>
    public static string Duration(double seconds)
    {
        if (double.IsNaN(seconds)) return "—";
        if (seconds < 60) return seconds.ToString(seconds < 10 ? "0.##" : "0", CultureInfo.InvariantCulture) + " s";
        long s = (long)Math.Round(seconds);
        long h = s / 3600, m = s % 3600 / 60, sec = s % 60;
        if (h > 0) return m > 0 ? $"{h} h {m} min" : $"{h} h";
        return sec > 0 ? $"{m} min {sec} s" : $"{m} min";
    }

    /// <summary>A long span in years: "137 years", "4.8 years", "7.5 months" (below a year).</summary>
    public static string Years(double years) => years >= 100
        ? years.ToString("#,0", CultureInfo.InvariantCulture) + " years"
        : years >= 1 ? years.ToString("0.#", CultureInfo.InvariantCulture) + " years"
        : (years * 12).ToString("0.#", CultureInfo.InvariantCulture) + " months";

    /// <summary>The JSON and display name of a cause: "dusk", "headlight", "self-illumination", …</summary>
    public static string Cause(LoadCause cause) => cause switch
    {
        LoadCause.Dusk => "dusk",
        LoadCause.Headlight => "headlight",
        LoadCause.Lightning => "lightning",
        LoadCause.SteadyLight => "steady-light",
        LoadCause.SelfIllumination => "self-illumination",
        LoadCause.Noise => "noise",
        LoadCause.Supply => "supply",
        LoadCause.PowerUp => "power-up",
        _ => "unexplained",
    };
}
