
namespace NightSim.Analysis;

/// <summary>Bursts of relay operations within seconds: the relay buzzes and the lamp flickers.</summary>
public sealed class ChatterAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach ((double start, double end, int ops) in NightAnalysis.ChatterBursts(facts, 0, double.PositiveInfinity))
        {
            string at = Wording.Clock(facts.Clock(start));
            string until = Wording.Clock(facts.Clock(end));
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
