using System.Globalization;
using NightSim.Analysis;

namespace NightSim.Reporting;

/// <summary>Shared wording and formats for every report writer (so the page, the JSON and the terminal agree).</summary>
public static class ReportText
{
    /// <summary>ISO 8601 local time with offset, whole seconds: 2026-11-20T17:42:05+01:00.</summary>
    public static string Iso(DateTimeOffset t) => t.ToString("yyyy-MM-dd'T'HH:mm:sszzz", CultureInfo.InvariantCulture);

    /// <summary>Clock time for tables: 17:42:05.</summary>
    public static string Clock(DateTimeOffset? t) => Wording.Clock(t);

    /// <summary>Duration as "4 h 10 min", "12 min 5 s" or "3.2 s".</summary>
    public static string Duration(double seconds) => Wording.Duration(seconds);

    /// <summary>The JSON and display name of a cause: "dusk", "headlight", "self-illumination", …</summary>
    public static string Cause(LoadCause cause) => Wording.Cause(cause);

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
        "Fit a fuse (or fusible resistor) in the live feed; a capacitive-dropper supply needs an X2-class capacitor rated for the mains voltage and a bleeder resistor across it.",
        "Build it into a closed, insulating enclosure; never touch or adjust it while connected; switch mains loads only with contacts rated for them.",
        "NightSim is not a safety assessment. Follow your local electrical codes, and have mains wiring done or checked by a licensed electrician.",
    ];

    /// <summary>
    /// The night as tables show it: at most <paramref name="maxRows"/> on-intervals, the rest folded into one row that
    /// says how many more there were (a chattering relay gives thousands; report.json keeps them all).
    /// </summary>
    public static NightSummary Condensed(NightSummary night, int maxRows)
    {
        if (night.LoadOn.Count <= maxRows || maxRows < 2) return night;
        var shown = night.LoadOn.Take(maxRows - 1).ToList();
        var rest = night.LoadOn.Skip(maxRows - 1).ToList();
        LoadCause common = rest.GroupBy(i => i.Cause).OrderByDescending(g => g.Count()).First().Key;
        LoadInterval last = rest[^1];
        shown.Add(new LoadInterval(rest[0].Start, last.End, rest.Sum(i => i.DurationSeconds), common, rest.Any(i => i.Expected),
            $"{rest.Count} more switch-ons from {Clock(rest[0].Start)} to {Clock(last.Start)}, mostly {Cause(common)}, on for {Duration(rest.Sum(i => i.DurationSeconds))} in all (every one is in report.json)",
            last.EndedBy) { Folded = rest.Count });
        return night with { LoadOn = shown };
    }

    /// <summary>Rows of on-intervals a table shows per night before folding the rest.</summary>
    public const int TableRowsPerNight = 12;
}
