using NightSim.Analysis;
using NightSim.Runs;

namespace NightSim.Tests.Demos;

public sealed class LeakageLimitDemoTests
{
    [Fact]
    public void Leaky_Timer_Demo_Compares_The_Charging_Current_With_The_Catalogue_Limit()
    {
        // netlists/long-timer-leaky.json: 4700 µF, 16 V electrolytic charged through 1 MΩ from 12 V. IEC 60384-4 limit
        // 0.01·C·U_R = 0.01 × 4700 µF × 16 V = 752 µA; charging current at the 2/3 threshold (12 V − 8 V)/1 MΩ = 4 µA
        // (555 threshold at 2/3 of the supply, common practice).
        NightRunResult r = DemoRuns.Run("long-timer-leaky");
        Finding f = Assert.Single(r.Report.Findings, x => x.Code == "timer-leakage-limit");
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Contains("752 µA", f.Message, StringComparison.Ordinal);
        Assert.Contains("4 µA", f.Message, StringComparison.Ordinal);
        Assert.Contains("never", f.Message, StringComparison.Ordinal);
        Assert.Equal("CTIM", f.Part);
    }
}
