using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>The supply's Zener stopped regulating (its current fell to about zero) in a load state: in which state,
/// from when, for how long, and how far the rail fell below the Zener voltage. Brief dips shorter than
/// <see cref="MinSeconds"/> in all are left out (a pull-in surge the supply rides through).</summary>
public sealed class SupplyRegulationAnalyzer : IResultAnalyzer
{
    /// <summary>Least time without regulation in one state that is reported, s (five mains cycles at 50 Hz).</summary>
    public const double MinSeconds = 0.1;

    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        if (facts.Supply is not { ZenerId: string zener } s) yield break;
        string? relay = facts.Relays.FirstOrDefault()?.PartId;
        foreach (RegulationLoss loss in s.Losses)
        {
            if (loss.Seconds < MinSeconds) continue;
            string state = loss.RelayOn ? $"while relay {relay} was driven" : "in standby (no relay driven)";
            double share = loss.StateSeconds > 0 ? 100 * loss.Seconds / loss.StateSeconds : double.NaN;
            string spare = loss.RelayOn && double.IsFinite(s.StandbyZenerCurrent) && relay is not null && s.CoilResistance.TryGetValue(relay, out double r)
                ? $" In standby the Zener carried {EngineeringValue.Format(s.StandbyZenerCurrent, "A", 3)} on average; the coil wants {EngineeringValue.Format(s.ZenerVoltage / r, "A", 3)} at {EngineeringValue.Format(s.ZenerVoltage, "V", 3)}."
                : "";
            yield return new Finding(Severity.Warning, "supply-regulation-lost",
                $"Supply ({s.Description}): the rail Zener {zener} stopped regulating {state} from {Wording.Clock(facts.Clock(loss.First))}, for {Wording.Duration(loss.Seconds)} in all" +
                (double.IsFinite(share) ? $" ({share:0.#} % of the time in that state)" : "") +
                $": its current fell to {EngineeringValue.Format(loss.ZenerMin < 1e-9 ? 0 : loss.ZenerMin, "A", 3)} and the rail sagged to {EngineeringValue.Format(loss.RailMin, "V", 3)}, {EngineeringValue.Format(s.ZenerVoltage - loss.RailMin, "V", 3)} below its {EngineeringValue.Format(s.ZenerVoltage, "V", 3)}.{spare}",
                SupplyFixes.ForCurrent(s, loss.RelayOn ? relay : null), facts.Clock(loss.First), zener);
        }
    }
}
