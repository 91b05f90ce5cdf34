using System.Globalization;
using NightSim.Analysis;

namespace NightSim.Reporting;

/// <summary>Shared wording and formats for every report writer (so the page, the JSON and the terminal agree).</summary>
public static class ReportText
{
    /// <summary>ISO 8601 local time with offset, whole seconds: 2026-11-20T17:42:05+01:00.</summary>
    public static string Iso(DateTimeOffset t) => t.ToString("yyyy-MM-dd'T'HH:mm:sszzz", CultureInfo.InvariantCulture);

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

    /// <summary>"info", "warning" or "error".</summary>
    public static string Severity(Severity severity) => severity switch
    {
        Analysis.Severity.Error => "error",
        Analysis.Severity.Warning => "warning",
        _ => "info",
    };

    /// <summary>The mains cautions every design that touches mains prints.</summary>
    public static readonly IReadOnlyList<string> MainsCautions =
    [
        "This design connects to mains. It is NOT isolated: every node, the light sensor included, can carry a lethal voltage while it is plugged in.",
        "Fit a fuse (or fusible resistor) in the live feed, use an X2-class capacitor rated for the mains voltage as the dropper, and a bleeder resistor across it.",
        "Build it into a closed, insulating enclosure; never touch or adjust it while connected; switch mains loads only with contacts rated for them.",
        "NightSim is not a safety assessment. Follow your local electrical codes, and have mains wiring done or checked by a licensed electrician.",
    ];
}
