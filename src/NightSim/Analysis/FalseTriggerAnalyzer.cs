
namespace NightSim.Analysis;

/// <summary>Every switch-on that was not the night's dusk switch-on: what caused it, how long the lamp stayed on,
/// and the usual fix for that cause.</summary>
public sealed class FalseTriggerAnalyzer : IResultAnalyzer
{
    /// <summary>False triggers of one cause stated one by one before the rest are summed up in one finding.</summary>
    public const int ListedPerCause = 3;

    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (IGrouping<LoadCause, AttributedInterval> group in intervals
                     .Where(iv => !iv.Expected && iv.Cause is not (LoadCause.PowerUp or LoadCause.Dusk))
                     .GroupBy(iv => iv.Cause))
        {
            string cause = Wording.Cause(group.Key);
            var all = group.ToList();
            foreach (AttributedInterval iv in all.Take(ListedPerCause))
            {
                string on = Wording.Clock(facts.Clock(iv.Start));
                string lasted = iv.End is double e ? "for " + Wording.Duration(e - iv.Start) : "until the end of the run";
                string message = $"At {on} the lamp switched on again {lasted}: {iv.Explanation}.";
                yield return new Finding(Severity.Warning, "false-trigger-" + cause, message, Fix(group.Key), facts.Clock(iv.Start));
            }
            if (all.Count > ListedPerCause)
            {
                AttributedInterval first = all[ListedPerCause], last = all[^1];
                yield return new Finding(Severity.Warning, "false-trigger-" + cause,
                    $"{all.Count - ListedPerCause} more switch-ons caused by {cause} between {Wording.Clock(facts.Clock(first.Start))} and {Wording.Clock(facts.Clock(last.Start))} ({all.Count} in all).",
                    Fix(group.Key), facts.Clock(first.Start));
            }
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
