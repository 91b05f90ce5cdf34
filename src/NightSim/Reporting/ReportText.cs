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

    /// <summary>The cautions of a low-voltage design whose relay switches a mains lamp (the circuit itself is not on
    /// the mains, its contacts and the lamp wiring are).</summary>
    public static readonly IReadOnlyList<string> ContactCautions =
    [
        "The circuit runs from a low voltage, but its relay switches a mains lamp: the relay contacts, their terminals and the lamp wiring carry a lethal voltage.",
        "Use a relay whose contacts are rated for the mains voltage and the lamp's current (inrush included), keep mains wiring apart from the low-voltage side with the clearance its rating asks, and fuse the lamp circuit.",
        "Build it into a closed, insulating enclosure and never touch the contact side while it is connected.",
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

    /// <summary>Illuminance as every table, verdict and plot label shows it: two decimals at most ("1.4", "20.79"),
    /// the same precision the findings use, and three significant digits below 0.01 lx.</summary>
    public static string Lux(double lux) =>
        lux != 0 && Math.Abs(lux) < 0.01 ? lux.ToString("0.###", CultureInfo.InvariantCulture) : lux.ToString("0.##", CultureInfo.InvariantCulture);

    /// <summary>True when the night went as intended: switched on by dusk, no false trigger, no early off, no chatter,
    /// not missed, not on at sunrise.</summary>
    public static bool NightOk(NightSummary n) =>
        !n.Missed && n.FalseTriggers == 0 && n.EarlyOffs == 0 && n.ChatterBursts == 0 && !n.OnAfterSunrise;

    /// <summary>The night in one line: when the load came on and went off, and anything that went wrong. E.g.
    /// "on 17:05:08 (dusk, 1.4 lx), off 21:00:35 (timer ran out) after 3 h 55 min; no false trigger".</summary>
    public static string Verdict(NightSummary n)
    {
        var parts = new List<string>();
        LoadInterval? dusk = n.LoadOn.FirstOrDefault(i => i.Expected) ?? n.LoadOn.FirstOrDefault();
        if (n.Missed || dusk is null)
        {
            parts.Add(n.Missed ? "MISSED: it got dark but the lamp never came on" : "the lamp never came on");
        }
        else
        {
            string level = dusk.Expected && n.SwitchLevelLux is double lux ? $", {Lux(lux)} lx" : "";
            string on = $"on {Clock(dusk.Start)} ({Cause(dusk.Cause)}{level})";
            string off = dusk.End is null ? "still on at the end of the run" : $"off {Clock(dusk.End)} ({dusk.EndedBy}) after {Duration(dusk.DurationSeconds)}";
            parts.Add(on + ", " + off);
        }
        int falseTriggers = n.FalseTriggers;
        if (falseTriggers == 0) parts.Add("no false trigger");
        else
        {
            IEnumerable<string> which = n.LoadOn.Where(i => !i.Expected && i.Folded == 0).Take(3).Select(i => $"{Cause(i.Cause)} {Clock(i.Start)}");
            parts.Add($"{falseTriggers} FALSE TRIGGER{(falseTriggers == 1 ? "" : "S")} ({string.Join(", ", which)}{(falseTriggers > 3 ? ", …" : "")})");
        }
        if (n.EarlyOffs > 0) parts.Add($"cut short {n.EarlyOffs}×");
        if (n.ChatterBursts > 0) parts.Add($"relay chattered ({n.ChatterBursts} burst{(n.ChatterBursts == 1 ? "" : "s")}, {n.RelayOperations} operations)");
        if (n.OnAfterSunrise) parts.Add("STILL ON AT SUNRISE");
        return string.Join("; ", parts);
    }

    /// <summary>Rows of on-intervals a table shows per night before folding the rest.</summary>
    public const int TableRowsPerNight = 12;
}
