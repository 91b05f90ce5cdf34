using System.Globalization;
using NightSim.Targets;

namespace NightSim.Reporting;

/// <summary>Shared wording of target checks and the summary across nights (terminal and page).</summary>
public static class TargetsText
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    /// <summary>"21 min", "−0.4 lx", "1 h 05 min", "2 too many".</summary>
    public static string Margin(TargetCheck c)
    {
        if (c.Margin is not double m) return "—";
        return c.Unit switch
        {
            "s" => (m < 0 ? "−" : "+") + ReportText.Duration(Math.Abs(m)),
            "count" => m < 0 ? $"{-m:0} too many" : "0",
            "min" => string.Create(s_inv, $"{m:+0;−0} min"),
            _ => string.Create(s_inv, $"{m:+0.###;−0.###} {c.Unit}"),
        };
    }

    /// <summary>The summary across nights, one line each.</summary>
    public static IReadOnlyList<string> OverviewLines(NightsOverview o, bool hasTargets)
    {
        var lines = new List<string>
        {
            string.Create(s_inv, $"{(hasTargets ? "targets met" : "trouble-free")} on {o.NightsPassed} of {o.Nights} nights ({o.PassRate * 100:0.#} %)"),
        };
        if (o.EarliestSwitchOn is { } e && o.LatestSwitchOn is { } l)
            lines.Add(string.Create(s_inv, $"switch-on from {e.At:yyyy-MM-dd HH:mm} ({e.MinutesAfterSunset:+0;−0} min vs sunset) to {l.At:yyyy-MM-dd HH:mm} ({l.MinutesAfterSunset:+0;−0} min)"));
        if (o.OnTimeMin is double a && o.OnTimeMax is double b)
            lines.Add($"on-time from {ReportText.Duration(a)} to {ReportText.Duration(b)}");
        lines.Add(string.Create(s_inv, $"missed nights {o.MissedNights}, false triggers {o.FalseTriggers}, early offs {o.EarlyOffs}, chatter bursts {o.ChatterBursts}, on at sunrise {o.NightsOnAfterSunrise}, energy {o.EnergyWh:0.##} Wh"));
        if (o.WorstNight is DateOnly w) lines.Add($"worst night {w:yyyy-MM-dd}: {o.WorstReason}");
        return lines;
    }
}
