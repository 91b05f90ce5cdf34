
namespace NightSim.Analysis;

/// <summary>Bursts of relay operations within seconds: the relay buzzes and the lamp flickers. The cause is named: the
/// supply, when the relay dropped out in the burst while its coil was still driven and the rail had sagged under it;
/// else the lamp's own light or too little hysteresis.</summary>
public sealed class ChatterAnalyzer : IResultAnalyzer
{
    /// <summary>The supply's part in a burst between <paramref name="start"/> and <paramref name="end"/> (run seconds):
    /// the relay, the sentence and the fix; null when no drop-out in it came from a sagging rail.</summary>
    public static (string Relay, string Why, string Fix)? SupplyCause(RunFacts facts, double start, double end)
    {
        if (facts.Supply is not { } s) return null;
        foreach (Results.DiscreteEvent e in facts.DeviceEvents)
        {
            if (e.Kind != Results.DeviceEventKind.CoilReleased || e.Time < start - 1 || e.Time > end + 1) continue;
            if (!s.DroppedOutUnderSag(e.PartId, e.Time, out double rail)) continue;
            CoilAttempt a = s.AttemptAt(e.PartId, e.Time)!;
            return (e.PartId,
                $"The supply causes it ({s.Description}): relay {e.PartId}'s coil stayed driven, but each pull-in sags the rail from {Units.EngineeringValue.Format(s.Before(a), "V", 3)} (down to {Units.EngineeringValue.Format(rail, "V", 3)} at the drop-out at {Wording.Clock(facts.Clock(e.Time))}), the coil drops out, the rail recovers and the coil pulls in again.",
                SupplyFixes.ForCurrent(s, e.PartId));
        }
        return null;
    }

    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach ((double start, double end, int ops) in NightAnalysis.ChatterBursts(facts, 0, double.PositiveInfinity))
        {
            string at = Wording.Clock(facts.Clock(start));
            string until = Wording.Clock(facts.Clock(end));
            if (SupplyCause(facts, start, end) is { } supply)
            {
                yield return new Finding(Severity.Error, "relay-chatter",
                    $"The relay chattered: {ops} operations between {at} and {until} ({NightAnalysis.ChatterOperations} or more within a minute). {supply.Why}",
                    supply.Fix, facts.Clock(start), supply.Relay);
                continue;
            }
            string why = facts.LampCouplingLux > 0
                ? $" The lamp adds {facts.LampCouplingLux:0.##} lx at its own sensor, so each switch-on brightens the sensor and each switch-off darkens it: a loop."
                : " The switching stage has too little hysteresis for a slowly changing light level.";
            yield return new Finding(Severity.Error, "relay-chatter",
                $"The relay chattered: {ops} operations between {at} and {until} ({NightAnalysis.ChatterOperations} or more within a minute).{why}",
                "Add hysteresis (positive feedback, or use the timer's own 1/3 and 2/3 levels), an off-delay longer than the loop, and keep the lamp's light off the sensor.",
                facts.Clock(start));
        }
    }
}
