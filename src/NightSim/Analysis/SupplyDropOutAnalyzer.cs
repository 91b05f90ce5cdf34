using NightSim.Results;
using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>A relay dropped out while its coil was still driven because the rail had sagged under it: the supply
/// switched the lamp off. Drop-outs inside a chatter burst are left to <see cref="ChatterAnalyzer"/>, which names the
/// supply as the cause of the burst.</summary>
public sealed class SupplyDropOutAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        if (facts.Supply is not { } s) yield break;
        var bursts = NightAnalysis.ChatterBursts(facts, 0, double.PositiveInfinity);
        foreach (RelayFacts relay in facts.Relays)
        {
            var drops = new List<(double Time, double Rail, CoilAttempt Attempt)>();
            foreach (DiscreteEvent e in facts.DeviceEvents)
            {
                if (e.PartId != relay.PartId || e.Kind != DeviceEventKind.CoilReleased) continue;
                if (bursts.Any(b => e.Time >= b.Start - 1 && e.Time <= b.End + 1)) continue;
                if (s.DroppedOutUnderSag(relay.PartId, e.Time, out double rail)) drops.Add((e.Time, rail, s.AttemptAt(relay.PartId, e.Time)!));
            }
            foreach ((double t, double rail, CoilAttempt a) in drops.Take(StageAnalyzer.Listed))
            {
                yield return new Finding(Severity.Error, "supply-relay-dropout",
                    $"Supply ({s.Description}): relay {relay.PartId} dropped out at {Wording.Clock(facts.Clock(t))} while its coil was still driven: the rail had sagged to {V(rail)} ({V(s.Before(a))} before the coil was driven) and the coil fell to its {V(relay.DropOut)} drop-out. The lamp went off because of the supply, not the timer.",
                    SupplyFixes.ForCurrent(s, relay.PartId), facts.Clock(t), relay.PartId);
            }
            if (drops.Count > StageAnalyzer.Listed)
            {
                yield return new Finding(Severity.Error, "supply-relay-dropout",
                    $"Supply: relay {relay.PartId} dropped out under supply sag {drops.Count - StageAnalyzer.Listed} more times ({drops.Count} in all).",
                    SupplyFixes.ForCurrent(s, relay.PartId), facts.Clock(drops[StageAnalyzer.Listed].Time), relay.PartId);
            }
        }
    }

    private static string V(double volts) => EngineeringValue.Format(volts, "V", 3);
}
