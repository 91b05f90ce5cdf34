using NightSim.Reporting;
using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>The timer stage against a timing electrolytic at its catalogue leakage limit (IEC 60384-4): the charging
/// current available at the 2/3 threshold compared with the largest leakage a part may have and still be in spec.</summary>
public sealed class LeakageLimitAnalyzer : IResultAnalyzer
{
    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (TimerFacts t in facts.Timers)
        {
            if (double.IsNaN(t.LeakageLimit)) continue;
            double available = t.AvailableCurrent;
            string cap = t.CapacitorId is null ? "the timing capacitor" : $"timing capacitor {t.CapacitorId}";
            string avail = EngineeringValue.Format(available, "A", 3), limit = EngineeringValue.Format(t.LeakageLimit, "A", 3);
            double ratio = t.LeakageLimit / available;
            if (ratio >= 1)
            {
                yield return new Finding(Severity.Warning, "timer-leakage-limit",
                    $"Timer stage ({t.PartId}): {cap} may leak up to {limit} and still be in spec (IEC 60384-4 limit), more than the {avail} charging current at the 2/3 threshold: a part at that limit never lets the timer end.",
                    "Lower the timing resistor and raise the capacitance so the charging current at the threshold is well above the limit, use a film capacitor, or count oscillator cycles for long times.",
                    null, t.CapacitorId ?? t.PartId);
            }
            else
            {
                yield return new Finding(ratio > 0.5 ? Severity.Warning : Severity.Info, "timer-leakage-limit",
                    $"Timer stage ({t.PartId}): {cap} at its catalogue leakage limit ({limit}, IEC 60384-4) would take {ratio * 100:0} % of the {avail} charging current at the 2/3 threshold.",
                    ratio > 0.5 ? "Raise the charging current at the threshold (smaller resistor, larger capacitor) or choose a low-leakage part." : null,
                    null, t.CapacitorId ?? t.PartId);
            }
        }
    }
}
