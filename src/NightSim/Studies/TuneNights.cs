using System.Globalization;
using NightSim.Sky;

namespace NightSim.Studies;

/// <summary>One night a tune checks: its date and why it is there.</summary>
/// <param name="Label">"longest night", "shortest night", "scenario night", "21 Mar", or the date given.</param>
/// <param name="Date">Local date of the evening.</param>
/// <param name="Nights">Nights to run from that evening (the scenario's own count for its own night, else 1).</param>
public sealed record TuneNight(string Label, DateOnly Date, int Nights = 1)
{
    /// <summary>The scenario moved to this night; its events, weather and seed stay as they are.</summary>
    public LightScenario Apply(LightScenario scenario) => scenario with { Start = Date, Nights = Nights };

    public string Text => Label + " " + Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
}

/// <summary>
/// Which nights a tune checks. "worst" (the default): the site's longest and shortest nights of the scenario's year
/// (the December and June solstices, swapped south of the equator) plus the scenario's own night with its events;
/// "year": the 21st of every month plus the scenario's night; or a comma-separated list of dates.
/// </summary>
public static class TuneNights
{
    /// <summary>The nights for <paramref name="spec"/>; null with <paramref name="error"/> when malformed.</summary>
    public static IReadOnlyList<TuneNight>? Parse(string spec, LightScenario scenario, out string? error)
    {
        error = null;
        int year = scenario.Start.Year;
        var own = new TuneNight("scenario night", scenario.Start, scenario.Nights);
        var list = new List<TuneNight>();
        switch (spec.Trim().ToLowerInvariant())
        {
            case "worst":
            {
                bool north = scenario.Site.Latitude >= 0;
                list.Add(new TuneNight("longest night", new DateOnly(year, north ? 12 : 6, 21)));
                list.Add(new TuneNight("shortest night", new DateOnly(year, north ? 6 : 12, 21)));
                list.Add(own);
                break;
            }
            case "year":
                for (int m = 1; m <= 12; m++) list.Add(new TuneNight(CultureInfo.InvariantCulture.DateTimeFormat.GetAbbreviatedMonthName(m), new DateOnly(year, m, 21)));
                list.Add(own);
                break;
            default:
                foreach (string part in spec.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
                {
                    if (!DateOnly.TryParseExact(part, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out DateOnly d))
                    {
                        error = $"--nights: '{part}' is not a date; write worst, year or dates like 2026-06-21,2026-12-21";
                        return null;
                    }
                    list.Add(d == scenario.Start ? own : new TuneNight("night", d));
                }
                if (list.Count == 0) { error = "--nights: give worst, year or at least one date"; return null; }
                break;
        }
        // One entry per date; the scenario's own night keeps its label.
        return list.GroupBy(n => n.Date).Select(g => g.FirstOrDefault(n => n.Label == "scenario night") ?? g.First()).ToList();
    }
}
