using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>The one-shot's on-time: leakage margin at the threshold (static), the closed form, and what the run
/// measured — including a timer that never ends.</summary>
public sealed class TimerAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (TimerFacts t in facts.Timers)
        {
            double available = t.AvailableCurrent;
            double drain = available - t.MarginCurrent;
            string avail = EngineeringValue.Format(available, "A", 3);
            string drains = EngineeringValue.Format(drain, "A", 3);
            if (t.MarginCurrent <= 0)
            {
                yield return new Finding(Severity.Error, "timer-never-ends",
                    $"Timer {t.PartId}: the timing capacitor's charging current at the 2/3 threshold is {avail}, but leakage and input current drain {drains}: the capacitor never reaches the threshold, so the timer never ends.",
                    t.IsCmos
                        ? "Use a smaller timing resistor with a larger low-leakage (film) capacitor, or an oscillator plus a binary counter for hours."
                        : "Use a smaller timing resistor with a larger low-leakage capacitor, a CMOS timer (picoampere inputs), or an oscillator plus a binary counter for hours.",
                    null, t.PartId);
            }
            else if (t.MarginCurrent < 0.5 * available)
            {
                yield return new Finding(Severity.Warning, "timer-leakage-margin",
                    $"Timer {t.PartId}: of the {avail} charging current at the threshold, leakage and input current take {drains}; the on-time is {Wording.Duration(t.ClosedFormWidth)} instead of {Wording.Duration(t.IdealWidth)} and moves with temperature and the capacitor's age.",
                    t.IsCmos
                        ? "Lower the timing resistor and raise the capacitance, or use a film capacitor."
                        : "Lower the timing resistor and raise the capacitance, or use a film capacitor and a CMOS timer.",
                    null, t.PartId);
            }
        }

        foreach (AttributedInterval iv in intervals)
        {
            if (!iv.Expected) continue;
            if (iv.End is null)
            {
                yield return new Finding(Severity.Error, "still-on-at-end",
                    $"The lamp switched on at {Wording.Clock(facts.Clock(iv.Start))} and was still on when the run ended {Wording.Duration(facts.Duration - iv.Start)} later.",
                    "Check the timer's leakage margin and that the trigger is released (a trigger held low keeps the output high).",
                    facts.Clock(iv.Start));
            }
            else if (facts.Timers.Count > 0 && !double.IsInfinity(facts.Timers[0].ClosedFormWidth))
            {
                double expected = facts.Timers[0].ClosedFormWidth, actual = iv.End.Value - iv.Start;
                double dev = (actual - expected) / expected;
                // Only an on-period the timer ended says something about the timer; one ended by its trigger, its reset or
                // the supply is named by the finding for that stage.
                yield return new Finding(iv.EndedByTimer && Math.Abs(dev) > 0.1 ? Severity.Warning : Severity.Info, "on-time",
                    $"On for {Wording.Duration(actual)} from {Wording.Clock(facts.Clock(iv.Start))} ({iv.EndedBy}); the timer's closed form with leakage gives {Wording.Duration(expected)} ({dev * 100:+0.0;-0.0;0.0} %).",
                    null, facts.Clock(iv.Start));
            }
        }
    }
}
