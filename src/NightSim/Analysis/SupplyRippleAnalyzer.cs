using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>The rail's ripple reaches the timer's trigger pin: in a standby mains cycle the pin swings against its
/// trigger level (a third of the supply) by at least <see cref="Share"/> of its distance from it, so a little more
/// ripple, or a little less margin at dusk, fires or holds the one-shot on the ripple.</summary>
public sealed class SupplyRippleAnalyzer : IResultAnalyzer
{
    /// <summary>Swing over margin from which the ripple is reported.</summary>
    public const double Share = 0.5;

    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        if (facts.Supply is not { Ripple: { } r } s || !(r.TriggerSwing >= Share * r.TriggerMargin) || r.TriggerSwing < 1e-3) yield break;
        yield return new Finding(Severity.Warning, "supply-ripple-at-trigger",
            $"Supply ({s.Description}): the rail's ripple reaches the trigger pin of timer {r.TimerId}. At {Wording.Clock(facts.Clock(r.Time))}, in standby, the rail rippled by {V(r.RailRipple)} peak to peak and the trigger pin swung by {V(r.TriggerSwing)} against its trigger level (a third of the supply), coming within {V(r.TriggerMargin)} of it: the ripple takes {100 * r.TriggerSwing / r.TriggerMargin:0} % of the trigger margin.",
            $"Smooth the rail: a larger smoothing capacitor{(s.ReservoirId is null ? "" : $" than {s.ReservoirId}'s {EngineeringValue.Format(s.ReservoirCapacitance, "F", 3)}")}, or an RC filter in the timer's supply (e.g. 100 Ω and 100 µF); or keep the trigger pin further from a third of the supply while it rests.",
            facts.Clock(r.Time), r.TimerId);
    }

    private static string V(double volts) => EngineeringValue.Format(volts, "V", 3);
}
