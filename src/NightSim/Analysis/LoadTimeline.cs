using NightSim.Results;

namespace NightSim.Analysis;

/// <summary>One on-interval of the load with its attributed cause, in run seconds.</summary>
public sealed record AttributedInterval(
    double Start,
    double? End,
    double PowerWatts,
    LoadCause Cause,
    bool Expected,
    string Explanation,
    string EndedBy,
    bool EndedByTimer,
    EventFact? Event);

/// <summary>
/// Turns load transitions into on-intervals and attributes each switch-on to a cause: power-up, the lamp's own
/// light, a darkening light or noise event shortly before, dusk (the first otherwise unexplained switch-on in the
/// dusk window), or unexplained. A dusk-activated trigger fires on a darkening edge, so a light event is blamed for a
/// switch-on that comes between its start and shortly after its end.
/// </summary>
public static class LoadTimeline
{
    /// <summary>Seconds before sunset from which a switch-on may count as dusk (overcast evenings come early).</summary>
    public const double DuskWindowBeforeSunset = 2 * 3600.0;

    /// <summary>Seconds after civil dusk until which an unexplained switch-on may still count as dusk.</summary>
    public const double DuskWindowAfterCivilDusk = 2 * 3600.0;

    /// <summary>Build the attributed intervals of a run, in time order.</summary>
    public static IReadOnlyList<AttributedInterval> Build(RunFacts facts)
    {
        var raw = new List<(double Start, double? End, double Power)>();
        double? onSince = null;
        double power = 0;
        foreach (LoadTransition t in facts.LoadTransitions.OrderBy(t => t.Time))
        {
            if (t.On && onSince is null)
            {
                onSince = t.Time;
                power = t.PowerWatts;
            }
            else if (!t.On && onSince is not null)
            {
                raw.Add((onSince.Value, t.Time, power));
                onSince = null;
            }
        }
        if (onSince is not null) raw.Add((onSince.Value, null, power));

        var result = new List<AttributedInterval>(raw.Count);
        var loadParts = new HashSet<string>(facts.LoadTransitions.Select(l => l.PartId), StringComparer.Ordinal);
        var nightsWithDusk = new HashSet<DateOnly>();
        double? previousEnd = null;
        foreach ((double start, double? end, double p) in raw)
        {
            NightWindow? night = NightOf(facts, start);
            (LoadCause cause, string explanation, EventFact? ev) = Attribute(facts, start, previousEnd, night, nightsWithDusk);
            bool expected = false;
            if (cause == LoadCause.Dusk && night is not null && nightsWithDusk.Add(night.Date)) expected = true;
            else if (cause == LoadCause.Dusk && night is null) expected = result.Count == 0;
            (string endedBy, bool byTimer) = EndedBy(facts, end, loadParts);
            result.Add(new AttributedInterval(start, end, p, cause, expected, explanation, endedBy, byTimer, ev));
            previousEnd = end;
        }
        return result;
    }

    /// <summary>The night window containing run time <paramref name="t"/>, or null.</summary>
    public static NightWindow? NightOf(RunFacts facts, double t)
    {
        foreach (NightWindow n in facts.Nights)
        {
            if (t >= n.From && t < n.To) return n;
        }
        return null;
    }

    private static (LoadCause, string, EventFact?) Attribute(
        RunFacts facts, double t, double? previousEnd, NightWindow? night, HashSet<DateOnly> nightsWithDusk)
    {
        if (t <= facts.PowerUpWindow)
        {
            return (LoadCause.PowerUp, "the circuit powered up with its capacitors empty, which fires the one-shot", null);
        }

        // The relay pulled in again after the supply had dropped it out, its coil driven all along: the supply's doing.
        if (facts.Supply is { } supply && previousEnd is double dropped && facts.LoadTransitions.Count > 0)
        {
            string relay = facts.LoadTransitions[0].PartId;
            if (supply.AttemptAt(relay, t) is { } a && a.Start <= dropped && DroppedBefore(facts, supply, relay, dropped))
            {
                return (LoadCause.Supply, $"the rail recovered after relay {relay} dropped out under supply sag at {Wording.Clock(facts.Clock(dropped))}, and its still-driven coil pulled in again", null);
            }
        }

        // The most recent darkening event whose window (plus the sensor's lag) contains the switch-on.
        EventFact? best = null;
        foreach (EventFact e in facts.Events)
        {
            if (!e.Darkening) continue;
            double lag = e.Cause == LoadCause.Noise ? 1.0 : facts.AttributionLagAt?.Invoke(e.End + 1e-3) ?? facts.AttributionLag;
            if (t >= e.Start - 1e-6 && t <= e.End + lag && (best is null || e.End > best.End)) best = e;
        }
        if (best is not null)
        {
            return (best.Cause, $"{best.Description} at {Wording.Clock(facts.Clock(best.Start))}", best);
        }

        if (facts.LampCouplingLux > 0 && previousEnd is double pe && t - pe <= (facts.AttributionLagAt?.Invoke(pe + 1e-3) ?? facts.AttributionLag))
        {
            return (LoadCause.SelfIllumination,
                $"the lamp's own light ({facts.LampCouplingLux:0.##} lx at the sensor) went out at {Wording.Clock(facts.Clock(pe))}, and the sensor saw darkness again", null);
        }

        bool inDuskWindow = night is null || night.Sunset is null ||
            (facts.Clock(t) >= night.Sunset.Value.AddSeconds(-DuskWindowBeforeSunset) &&
             facts.Clock(t) <= (night.CivilDusk ?? night.Sunset.Value).AddSeconds(DuskWindowAfterCivilDusk));
        bool duskTaken = night is not null && nightsWithDusk.Contains(night.Date);
        if (inDuskWindow && !duskTaken)
        {
            string lux = facts.SkyLux is null ? "" : $" ({facts.SkyLux(t):0.##} lx at the sensor)";
            return (LoadCause.Dusk, "falling daylight crossed the switching level" + lux, null);
        }
        return (LoadCause.Unexplained, "no light or noise event and no dusk edge explains this switch-on", null);
    }

    /// <summary>True when <paramref name="relay"/> released under supply sag within the second before the load went off
    /// at <paramref name="off"/> (the contacts open after the release travel).</summary>
    private static bool DroppedBefore(RunFacts facts, SupplyFacts supply, string relay, double off)
    {
        IReadOnlyList<DiscreteEvent> events = facts.DeviceEvents;
        int lo = 0, hi = events.Count;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (events[mid].Time < off - 1.0) lo = mid + 1; else hi = mid;
        }
        for (int i = lo; i < events.Count && events[i].Time <= off + 1e-6; i++)
        {
            DiscreteEvent e = events[i];
            if (e.PartId == relay && e.Kind == DeviceEventKind.CoilReleased && supply.DroppedOutUnderSag(relay, e.Time, out _)) return true;
        }
        return false;
    }

    private static (string, bool) EndedBy(RunFacts facts, double? end, HashSet<string> loadParts)
    {
        if (end is null) return ("still on at the end of the run", false);
        // The timer output going low shortly before the load went off, and the input change that made it go low.
        // Device events are in time order: start at the first one inside the last second (binary search; a
        // chattering night has thousands).
        IReadOnlyList<DiscreteEvent> events = facts.DeviceEvents;
        int lo = 0, hi = events.Count;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (events[mid].Time < end.Value - 1.0) lo = mid + 1; else hi = mid;
        }
        int outputLow = -1;
        for (int i = lo; i < events.Count && events[i].Time <= end.Value + 1e-6; i++)
        {
            if (events[i].Kind == DeviceEventKind.TimerOutputLow && !loadParts.Contains(events[i].PartId)) outputLow = i;
        }
        if (outputLow < 0)
        {
            // A relay that released while its coil was still driven, with the rail sagged: the supply switched it off.
            if (facts.Supply is { } supply)
            {
                DiscreteEvent? release = null;
                for (int i = lo; i < events.Count && events[i].Time <= end.Value + 1e-6; i++)
                {
                    if (events[i].Kind == DeviceEventKind.CoilReleased && loadParts.Contains(events[i].PartId)) release = events[i];
                }
                if (release is not null && supply.DroppedOutUnderSag(release.PartId, release.Time, out double rail))
                    return ($"the relay dropped out under supply sag: the rail fell to {rail:0.##} V while the coil was still driven", false);
            }
            return ("switched off (the relay dropped out without a timer change: supply sag?)", false);
        }
        string timer = events[outputLow].PartId;
        for (int i = outputLow; i >= 0; i--)
        {
            DiscreteEvent e = events[i];
            if (e.PartId != timer) continue;
            switch (e.Kind)
            {
                case DeviceEventKind.ThresholdReached: return ("timer ran out", true);
                case DeviceEventKind.TriggerReleased: return ($"timer {timer}'s trigger input was released{By(facts, e.Time)}", false);
                case DeviceEventKind.ResetHeld: return ($"timer {timer} was reset", false);
            }
        }
        return ($"timer {timer}'s output went low", false);
    }

    /// <summary>" by &lt;light event&gt; at &lt;clock&gt;" when a scenario light event was lighting the sensor when the
    /// trigger was released (a headlight pass that brightened a trigger held low), else "".</summary>
    private static string By(RunFacts facts, double t)
    {
        foreach (EventFact e in facts.Events)
        {
            if (e.Cause != LoadCause.Noise && t >= e.Start - 1e-6 && t <= e.End + 1.0)
                return $" by {e.Description} at {Wording.Clock(facts.Clock(e.Start))}";
        }
        return "";
    }
}
