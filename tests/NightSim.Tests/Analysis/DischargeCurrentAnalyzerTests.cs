using NightSim.Analysis;
using NightSim.Results;

namespace NightSim.Tests.Analysis;

/// <summary>The timer stage's discharge dump, on hand-made facts (invented demo data): peak V/(R_path + R_on) by Ohm's
/// law against the transistor's safe current, and the series resistor that brings it there.</summary>
public sealed class DischargeCurrentAnalyzerTests
{
    private static readonly DateTimeOffset s_origin = new(2026, 11, 20, 12, 0, 0, TimeSpan.Zero);

    private static RunFacts Facts(DischargeFacts discharge, params DiscreteEvent[] events) => new()
    {
        Origin = s_origin,
        Duration = 86400,
        DeviceEvents = events,
        Timers = [new TimerFacts("U1", 1e6, 3.3e-3, 12.0, 0, double.PositiveInfinity) { Discharge = discharge }],
    };

    [Fact]
    public void Capacitor_Dumped_Above_The_Safe_Current_Is_Reported_With_A_Series_Resistor()
    {
        // 8 V into 10 Ω: 800 mA, limited to 200 mA, above 100 mA safe. 8 V / 0.1 A − 10 Ω = 70 Ω → 82 Ω (E12, IEC 60063).
        var d = new DischargeFacts(8.0, 0.0, 10.0, 0.2, 0.1);
        Finding f = Assert.Single(new DischargeCurrentAnalyzer().Analyze(
            Facts(d, new DiscreteEvent(9 * 3600.0, "U1.latch", "U1", "q", "high", "low", DeviceEventKind.TimerOutputLow)), [], []));
        Assert.Equal("timer-discharge-current", f.Code);
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Equal("U1", f.Part);
        Assert.Equal(s_origin.AddHours(9), f.At);
        Assert.Contains("3.3 mF at 8.0 V", f.Message, StringComparison.Ordinal);
        Assert.Contains("800 mA through its 10 Ω on-resistance", f.Message, StringComparison.Ordinal);
        Assert.Contains("limits it to about 200 mA", f.Message, StringComparison.Ordinal);
        Assert.Contains("above the 100 mA", f.Message, StringComparison.Ordinal);
        Assert.Contains("at least 70 Ω (e.g. 82 Ω)", f.Fix, StringComparison.Ordinal);
        Assert.DoesNotContain("timer-555", f.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Dump_Within_The_Safe_Current_Says_Nothing()
    {
        // 8 V through 82 Ω + 10 Ω: 87 mA < 100 mA.
        Assert.Empty(new DischargeCurrentAnalyzer().Analyze(Facts(new DischargeFacts(8.0, 82.0, 10.0, 0.2, 0.1)), [], []));
    }

    // IEC 60063 (Preferred number series for resistors and capacitors), E12: 10 12 15 18 22 27 33 39 47 56 68 82.
    [Theory]
    [InlineData(70.0, 82.0)]
    [InlineData(385.0, 390.0)]
    [InlineData(390.0, 390.0)]
    [InlineData(470.0, 470.0)]
    [InlineData(8300.0, 10000.0)]
    [InlineData(1.0, 1.0)]
    [InlineData(0.0011, 0.0012)]
    public void Preferred_Value_At_Or_Above(double value, double e12) =>
        Assert.Equal(e12, NightSim.Units.PreferredValues.E12AtOrAbove(value));
}
