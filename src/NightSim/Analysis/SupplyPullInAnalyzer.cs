using NightSim.Results;
using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>A relay coil was driven but the supply sagged so far under it that the coil never reached its pull-in
/// voltage (without the sag it would have): the supply, not the drive, is the fault. <see cref="StageAnalyzer"/> leaves
/// these drives to this analyser.</summary>
public sealed class SupplyPullInAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        if (facts.Supply is not { } s) yield break;
        foreach (RelayFacts relay in facts.Relays)
        {
            var failed = s.Attempts.Where(a => a.Relay == relay.PartId && !PulledIn(facts, relay.PartId, a) && s.ExplainsNoPullIn(a, relay.PullIn)).ToList();
            foreach (CoilAttempt a in failed.Take(StageAnalyzer.Listed))
            {
                yield return new Finding(Severity.Error, "supply-relay-cannot-pull-in",
                    $"Supply ({s.Description}): relay {relay.PartId} could not pull in at {Wording.Clock(facts.Clock(a.Start))}: as its coil was driven the rail sagged from {V(s.Before(a))} to {V(a.RailMin)}, and the coil reached only {V(a.CoilPeak)} against its {V(relay.PullIn)} pull-in. The relay drive switched on; the supply cannot carry the coil's current.",
                    SupplyFixes.ForCurrent(s, relay.PartId), facts.Clock(a.Start), relay.PartId);
            }
            if (failed.Count > StageAnalyzer.Listed)
            {
                yield return new Finding(Severity.Error, "supply-relay-cannot-pull-in",
                    $"Supply: relay {relay.PartId} could not pull in {failed.Count - StageAnalyzer.Listed} more times ({failed.Count} in all) as the rail sagged under its coil.",
                    SupplyFixes.ForCurrent(s, relay.PartId), facts.Clock(failed[StageAnalyzer.Listed].Start), relay.PartId);
            }
        }
    }

    private static string V(double volts) => EngineeringValue.Format(volts, "V", 3);

    /// <summary>True when <paramref name="relay"/> pulled in during drive <paramref name="a"/>.</summary>
    public static bool PulledIn(RunFacts facts, string relay, CoilAttempt a) =>
        facts.DeviceEvents.Any(e => e.PartId == relay && e.Kind == DeviceEventKind.CoilPulledIn && e.Time >= a.Start - 1e-6 && e.Time <= a.End + 0.1);
}
