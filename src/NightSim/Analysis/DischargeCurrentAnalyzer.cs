using NightSim.Results;
using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>
/// The timer stage's discharge transistor: when a one-shot ends, its timing capacitor is dumped through the transistor
/// at a peak of V/(R_path + R_on) (Ohm's law at the first instant), or the transistor's own limit. Above the current the
/// transistor takes safely again and again, a series resistor in the discharge path is the usual fix (common practice);
/// the finding gives its value. Read from the timer's facts (its role), never from part kinds.
/// </summary>
public sealed class DischargeCurrentAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (TimerFacts timer in facts.Timers)
        {
            if (timer.Discharge is not DischargeFacts d || !d.AboveSafe) continue;
            // When it happened in this run: the first time the timer's output went low (the discharge switching on).
            DiscreteEvent? first = facts.DeviceEvents.FirstOrDefault(e => e.PartId == timer.PartId && e.Kind == DeviceEventKind.TimerOutputLow && e.Time > facts.PowerUpWindow);
            string peak = EngineeringValue.Format(d.CircuitPeak, "A", 3);
            string limited = d.CircuitPeak > d.CurrentLimit
                ? $"; the transistor limits it to about {EngineeringValue.Format(d.CurrentLimit, "A", 3)}"
                : "";
            string path = d.PathResistance > 0 ? $" and {EngineeringValue.Format(d.PathResistance, "Ω", 3)} in the discharge path" : "";
            double needed = d.SeriesResistanceNeeded;
            double series = PreferredValues.E12AtOrAbove(Math.Max(needed, 1.0));
            double emptied = 5 * (series + d.PathResistance + d.OnResistance) * timer.Capacitance;
            yield return new Finding(Severity.Warning, "timer-discharge-current",
                $"Timer {timer.PartId} (one-shot timer), discharge: when the on-time ends, the timing capacitor ({EngineeringValue.Format(timer.Capacitance, "F", 3)} at {d.Voltage:0.0#} V) is dumped through the discharge transistor: {peak} through its {EngineeringValue.Format(d.OnResistance, "Ω", 3)} on-resistance{path}{limited}, above the {EngineeringValue.Format(d.SafeCurrent, "A", 3)} it takes safely again and again. It may fail after a number of nights.",
                $"Put a resistor of at least {EngineeringValue.Format(needed, "Ω", 3)} (e.g. {EngineeringValue.Format(series, "Ω", 3)}) in series between the discharge pin and the timing capacitor (the threshold pin stays on the capacitor); the capacitor still empties in about {EngineeringValue.Format(emptied, "s", 2)}.",
                first is null ? null : facts.Clock(first.Time), timer.PartId);
        }
    }
}
