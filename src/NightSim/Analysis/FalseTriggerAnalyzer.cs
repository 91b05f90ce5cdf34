using NightSim.Reporting;

namespace NightSim.Analysis;

/// <summary>Every switch-on that was not the night's dusk switch-on: what caused it, how long the lamp stayed on,
/// and the usual fix for that cause.</summary>
public sealed class FalseTriggerAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (AttributedInterval iv in intervals)
        {
            if (iv.Expected || iv.Cause is LoadCause.PowerUp or LoadCause.Dusk) continue;
            string on = ReportText.Clock(facts.Clock(iv.Start));
            string lasted = iv.End is double e ? "for " + ReportText.Duration(e - iv.Start) : "until the end of the run";
            string cause = ReportText.Cause(iv.Cause);
            string message = $"At {on} the lamp switched on again {lasted}: {iv.Explanation}.";
            yield return new Finding(Severity.Warning, "false-trigger-" + cause, message, Fix(iv.Cause), facts.Clock(iv.Start));
        }
    }

    /// <summary>The usual fix per cause (common practice among builders of dusk switches).</summary>
    public static string Fix(LoadCause cause) => cause switch
    {
        LoadCause.Headlight => "Aim or shield the sensor away from the road (a short tube, facing north or down), or add a latch that holds the timer off until daylight returns.",
        LoadCause.Lightning => "Add a delay longer than a flash (a few seconds of RC after the sensor stage) or a latch that holds the timer off until daylight returns.",
        LoadCause.SteadyLight => "Keep the porch or street light out of the sensor's view, or make the trigger need daylight first (a re-arm latch).",
        LoadCause.SelfIllumination => "Keep the lamp's light off the sensor (shield, aim), raise the OFF level well above the ON level, or latch off until daylight.",
        LoadCause.Noise => "Put a capacitor (e.g. 10–100 nF) from the trigger pin to ground, keep the trigger line short, and suppress the relay coil.",
        LoadCause.Supply => "Size the supply for the relay's pull-in current with margin, and decouple the timer's supply.",
        _ => "Look at the trigger pin and sensor traces around this time in the zoom plot.",
    };
}
