using NightSim.Results;

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
            if (n.Missed && MissedNight(facts, n) is Finding missed) yield return missed;
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
                "If that is unwanted, hold the timer's reset pin low for the first second after power-up: a resistor from the supply and a capacitor to ground on the reset pin (e.g. 100 kΩ and 10 µF) release it once the supply has settled.",
                facts.Clock(iv.Start));
        }
    }

    /// <summary>Why a night was missed, stage by stage: the light at the sensor against its switching level, then the
    /// trigger, then the relay (stated by <see cref="StageAnalyzer"/>, so no finding here).</summary>
    private static Finding? MissedNight(RunFacts facts, NightSummary n)
    {
        NightWindow? window = facts.Nights.FirstOrDefault(w => w.Date == n.Date);
        (double from, double to) = window is null ? (0.0, facts.Duration) : (window.From, Math.Min(window.To, facts.Duration));
        string sensor = facts.Sensor is SensorFacts s ? $"light sensor {s.PartId}" : "the light sensor";
        if (facts.Sensor?.SwitchingLux is double level && facts.SensorLux is Func<double, double> lux)
        {
            (double at, double darkest) = Darkest(lux, from, to);
            if (darkest > level)
            {
                return new Finding(Severity.Warning, "never-dark-enough",
                    $"{n.Date:yyyy-MM-dd}: the light at {sensor} never fell below {darkest:0.##} lx (darkest at {Wording.Clock(facts.Clock(at))}) against the circuit's switching level of {level:0.##} lx, so the lamp stayed off all night.",
                    $"Nothing failed: the night here is never darker than {darkest:0.##} lx. If the lamp should come on such nights, raise the switching level above {darkest:0.##} lx (the sensor divider's trimmer) or shade the sensor.",
                    facts.Clock(at), facts.Sensor?.PartId);
            }
        }
        // The trigger pin starts below its level while its network charges at power-up: that firing is not the night's.
        double since = Math.Max(from, facts.PowerUpWindow);
        bool triggered = facts.DeviceEvents.Any(e => e.Kind == DeviceEventKind.TriggerFired && e.Time >= since && e.Time < to);
        bool outputHigh = facts.DeviceEvents.Any(e => e.Kind == DeviceEventKind.TimerOutputHigh && e.Time >= from && e.Time < to);
        if (outputHigh && facts.Relays.Count > 0) return null; // the relay stage failed: StageAnalyzer says how
        string why = triggered
            ? "the timer's trigger fired, but its output never went high (check the reset pin)"
            : "the light fell past the switching level, but the timer's trigger input never went below a third of the supply";
        return new Finding(Severity.Error, "missed-night",
            $"{n.Date:yyyy-MM-dd}: it got dark but the lamp never came on: {why}.",
            triggered
                ? "Keep the reset pin above its threshold (tie it to the supply) while the timer should run."
                : "Check the trigger stage: the sensor stage's output must swing far enough, and fast enough, to pull the trigger pin below a third of the supply.",
            n.Sunset);
    }

    /// <summary>Darkest light within [from, to] (run seconds), sampled every minute and refined around the minimum.</summary>
    public static (double At, double Lux) Darkest(Func<double, double> lux, double from, double to)
    {
        double at = from, min = double.PositiveInfinity;
        for (double t = from; t <= to; t += 60.0)
        {
            double v = lux(t);
            if (v < min) (at, min) = (t, v);
        }
        for (double t = Math.Max(from, at - 60); t <= Math.Min(to, at + 60); t += 1.0)
        {
            double v = lux(t);
            if (v < min) (at, min) = (t, v);
        }
        return (at, min);
    }
}
