
namespace NightSim.Analysis;

/// <summary>Night-level outcomes: the dusk switch-on against sunset and civil dusk, missed nights, a lamp still on at
/// sunrise, and a power-up firing.</summary>
public sealed class NightOutcomeAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (NightSummary n in nights)
        {
            LoadInterval? dusk = n.LoadOn.FirstOrDefault(l => l.Expected);
            if (dusk is not null && n.Sunset is DateTimeOffset sunset)
            {
                double minutes = (dusk.Start - sunset).TotalMinutes;
                string lux = n.SwitchLevelLux is double l ? $" at {l:0.##} lx at the sensor" : "";
                string rel = minutes >= 0 ? $"{minutes:0} min after sunset" : $"{-minutes:0} min before sunset";
                string civil = n.CivilDusk is DateTimeOffset cd ? $", civil dusk {Wording.Clock(cd)}" : "";
                Severity sev = minutes < -15 ? Severity.Warning : Severity.Info;
                string? fix = minutes < -15 ? "The switching level is too high: it switches on in daylight on dull evenings. Lower the sensor divider's threshold (trimmer) or shade the sensor less." : null;
                yield return new Finding(sev, "dusk-switch-on",
                    $"{n.Date:yyyy-MM-dd}: switched on at {Wording.Clock(dusk.Start)}{lux}, {rel} ({Wording.Clock(sunset)}{civil}).",
                    fix, dusk.Start);
            }
            if (n.Missed)
            {
                yield return new Finding(Severity.Error, "missed-night",
                    $"{n.Date:yyyy-MM-dd}: it got dark but the lamp never came on.",
                    "Check the switching level against the night's darkest light at the sensor (street lights, moon), and the trigger stage's drive.",
                    n.Sunset);
            }
            if (n.OnAfterSunrise)
            {
                yield return new Finding(Severity.Warning, "on-after-sunrise",
                    $"{n.Date:yyyy-MM-dd}: the lamp was still on at sunrise ({Wording.Clock(n.Sunrise)}).",
                    "Shorten the on-time, or reset the timer when daylight returns.",
                    n.Sunrise);
            }
        }
        if (!facts.HasSwitchedLoad)
        {
            yield return new Finding(Severity.Info, "no-switched-load",
                "The circuit has no relay or named load, so there is no switch-on to report; the traces and plots show what it did.",
                "Add a relay with \"load\" and \"loadPower\" to get switch-on times, causes and energy.");
        }
        foreach (AttributedInterval iv in intervals.Where(i => i.Cause == LoadCause.PowerUp))
        {
            yield return new Finding(Severity.Info, "power-up-trigger",
                $"At power-up ({Wording.Clock(facts.Clock(iv.Start))}) the one-shot fired and the lamp stayed on {(iv.End is double e ? Wording.Duration(e - iv.Start) : "to the end of the run")}: after every power cut the lamp comes on once.",
                "If that is unwanted, hold the trigger high for a moment at power-up (an RC on the reset pin).",
                facts.Clock(iv.Start));
        }
    }
}
