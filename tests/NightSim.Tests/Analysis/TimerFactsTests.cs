using NightSim.Analysis;

namespace NightSim.Tests.Analysis;

public class TimerFactsTests
{
    // Textbook 555 one-shot: T = RC·ln 3 (check-values Q7, [CALC]).
    [Fact]
    public void IdealWidthIsLn3RC() =>
        Assert.Equal(109.861, new TimerFacts("U1", 1e6, 100e-6, 12, 0, double.PositiveInfinity).ClosedFormWidth, 3);

    // Constant drain I_p: t = RC·ln(A/(A − 2V/3)), A = V − I_p·R (check-values §6 drain sweep, [CALC]).
    [Theory]
    [InlineData(0.5e-6, 118.96)]
    [InlineData(1e-6, 129.93)]
    [InlineData(2e-6, 160.94)]
    [InlineData(3e-6, 219.72)]
    [InlineData(3.9e-6, 439.44)]
    public void DrainLengthensWidth(double drain, double expected) =>
        Assert.Equal(expected, new TimerFacts("U1", 1e6, 100e-6, 12, drain, double.PositiveInfinity).ClosedFormWidth, 2);

    // 4 µA at 1 MΩ and 12 V: I·R ≥ V/3, the threshold is never reached (check-values §6).
    [Fact]
    public void FourMicroampsNeverEnds()
    {
        var t = new TimerFacts("U1", 1e6, 100e-6, 12, 4e-6, double.PositiveInfinity);
        Assert.True(double.IsPositiveInfinity(t.ClosedFormWidth));
        Assert.True(t.MarginCurrent <= 1e-15);
    }

    // Leakage resistance: never fires if R_L ≤ 2R; R_L 10 MΩ → 120.16 s (check-values §6, [CALC]).
    [Fact]
    public void LeakageResistance()
    {
        Assert.Equal(120.16, new TimerFacts("U1", 1e6, 100e-6, 12, 0, 10e6).ClosedFormWidth, 2);
        Assert.True(double.IsPositiveInfinity(new TimerFacts("U1", 1e6, 100e-6, 12, 0, 2e6).ClosedFormWidth));
        Assert.True(new TimerFacts("U1", 1e6, 100e-6, 12, 0, 2e6).MarginCurrent <= 1e-12);
    }
}
