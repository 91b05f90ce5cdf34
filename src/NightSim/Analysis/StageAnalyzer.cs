using NightSim.Results;

namespace NightSim.Analysis;

/// <summary>
/// The stages between the trigger and the contacts, from the devices' typed events: a trigger held low longer than
/// the timing period (the output then follows the trigger, not the timer), and a timer output that went high while
/// the relay coil stayed below its pull-in voltage (the contacts never closed) — unless a mains-fed supply sagged
/// under the coil, which <see cref="SupplyPullInAnalyzer"/> reports. Each finding names the part and its role, with
/// the numbers.
/// </summary>
public sealed class StageAnalyzer : IResultAnalyzer
{
    /// <summary>Instances of one finding stated one by one before the rest are summed up.</summary>
    public const int Listed = 3;

    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (Finding f in TriggerHeld(facts)) yield return f;
        foreach (Finding f in RelayNotPullingIn(facts)) yield return f;
    }

    /// <summary>Spans (run seconds) between an event of kind <paramref name="begin"/> and the next of kind
    /// <paramref name="end"/> of the same part; an open span ends with the run.</summary>
    public static List<(string Part, double Start, double End, bool Open)> Spans(RunFacts facts, DeviceEventKind begin, DeviceEventKind end)
    {
        var open = new Dictionary<string, double>(StringComparer.Ordinal);
        var spans = new List<(string, double, double, bool)>();
        foreach (DiscreteEvent e in facts.DeviceEvents)
        {
            if (e.Kind == begin) open.TryAdd(e.PartId, e.Time);
            else if (e.Kind == end && open.Remove(e.PartId, out double start)) spans.Add((e.PartId, start, e.Time, false));
        }
        foreach ((string part, double start) in open) spans.Add((part, start, facts.Duration, true));
        spans.Sort((a, b) => a.Item2.CompareTo(b.Item2));
        return spans;
    }

    private static IEnumerable<Finding> TriggerHeld(RunFacts facts)
    {
        foreach (TimerFacts timer in facts.Timers)
        {
            double period = timer.ClosedFormWidth;
            if (!double.IsFinite(period)) continue;
            var held = Spans(facts, DeviceEventKind.TriggerFired, DeviceEventKind.TriggerReleased)
                .Where(s => s.Part == timer.PartId && s.End - s.Start > period).ToList();
            foreach ((_, double start, double end, bool open) in held.Take(Listed))
            {
                string until = open ? "to the end of the run" : $"until {Wording.Clock(facts.Clock(end))}";
                yield return new Finding(Severity.Error, "trigger-held",
                    $"Timer {timer.PartId} (one-shot timer), trigger input: held below a third of the supply for {Wording.Duration(end - start)} from {Wording.Clock(facts.Clock(start))} {until}, longer than its timing period of {Wording.Duration(period)}. The output follows the trigger while it is held, so the on-time was set by the trigger{(open ? "" : " (it ended when the trigger was released)")}, not by the timer.",
                    "Couple the trigger through a capacitor (e.g. 10 nF in series, with 100 kΩ from the trigger pin to the supply) so that only the falling edge reaches it; the timer then sets the on-time.",
                    facts.Clock(start), timer.PartId);
            }
            if (held.Count > Listed)
            {
                yield return new Finding(Severity.Error, "trigger-held",
                    $"Timer {timer.PartId}: the trigger input was held low longer than the timing period {held.Count - Listed} more times ({held.Count} in all).",
                    "Couple the trigger through a capacitor so that only the falling edge reaches it.", facts.Clock(held[Listed].Start), timer.PartId);
            }
        }
    }

    private static IEnumerable<Finding> RelayNotPullingIn(RunFacts facts)
    {
        if (facts.Relays.Count == 0) yield break;
        var outputHigh = Spans(facts, DeviceEventKind.TimerOutputHigh, DeviceEventKind.TimerOutputLow);
        foreach (RelayFacts relay in facts.Relays)
        {
            var failed = new List<(string Timer, double Start, double End, double Peak)>();
            foreach ((string timer, double start, double end, _) in outputHigh)
            {
                bool pulled = facts.DeviceEvents.Any(e => e.PartId == relay.PartId && e.Kind == DeviceEventKind.CoilPulledIn && e.Time >= start && e.Time <= end + 0.1);
                if (pulled) continue;
                double peak = relay.CoilPeak(start, end);
                if (double.IsNaN(peak) || Math.Abs(peak) >= relay.PullIn) continue;
                // A supply that sagged under the coil is the fault there, not the drive (SupplyPullInAnalyzer says so).
                if (facts.Supply is { } supply && supply.Attempts.Any(a => a.Relay == relay.PartId && a.Start <= end && a.End >= start && supply.ExplainsNoPullIn(a, relay.PullIn))) continue;
                failed.Add((timer, start, end, peak));
            }
            foreach ((string timer, double start, double end, double peak) in failed.Take(Listed))
            {
                yield return new Finding(Severity.Error, "relay-not-pulling-in",
                    $"Relay {relay.PartId} (relay coil): timer {timer}'s output was high from {Wording.Clock(facts.Clock(start))} for {Wording.Duration(end - start)}, but the coil reached only {Math.Abs(peak):0.0#} V against its {relay.PullIn:0.0#} V pull-in, so the contacts never closed. The trigger and the timer worked; the relay drive is the fault.",
                    "Drive the coil through a transistor from the timer output (an NPN with a base resistor, and a flyback diode across the coil), or use a relay whose pull-in voltage is well below what the output delivers under the coil's load.",
                    facts.Clock(start), relay.PartId);
            }
            if (failed.Count > Listed)
            {
                yield return new Finding(Severity.Error, "relay-not-pulling-in",
                    $"Relay {relay.PartId}: the coil stayed below its pull-in {failed.Count - Listed} more times while a timer output was high ({failed.Count} in all).",
                    "Drive the coil through a transistor from the timer output.", facts.Clock(failed[Listed].Start), relay.PartId);
            }
        }
    }
}
