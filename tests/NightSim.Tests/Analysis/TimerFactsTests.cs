using NightSim.Analysis;

namespace NightSim.Tests.Analysis;

public class TimerFactsTests
{
    // Textbook 555 one-shot: T = RC·ln 3 (the 555 monostable relation, Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 7); 1 MΩ · 100 µF · ln 3 = 109.861 s.
    [Fact]
    public void IdealWidthIsLn3RC() =>
        Assert.Equal(109.861, new TimerFacts("U1", 1e6, 100e-6, 12, 0, double.PositiveInfinity).ClosedFormWidth, 3);

    // Constant drain I_p: t = RC·ln(A/(A − 2V/3)), A = V − I_p·R (textbook RC charging with a constant drain, solved for
    // the 2/3 threshold; the expected values are computed from that formula).
    [Theory]
    [InlineData(0.5e-6, 118.96)]
    [InlineData(1e-6, 129.93)]
    [InlineData(2e-6, 160.94)]
    [InlineData(3e-6, 219.72)]
    [InlineData(3.9e-6, 439.44)]
    public void DrainLengthensWidth(double drain, double expected) =>
        Assert.Equal(expected, new TimerFacts("U1", 1e6, 100e-6, 12, drain, double.PositiveInfinity).ClosedFormWidth, 2);

    // 4 µA at 1 MΩ and 12 V: I·R ≥ V/3, the threshold is never reached (the charging current left at
    // the threshold is (V/3)/R = 4 µA).
    [Fact]
    public void FourMicroampsNeverEnds()
    {
        var t = new TimerFacts("U1", 1e6, 100e-6, 12, 4e-6, double.PositiveInfinity);
        Assert.True(double.IsPositiveInfinity(t.ClosedFormWidth));
        Assert.True(t.MarginCurrent <= 1e-15);
    }

    // Leakage resistance: never fires if R_L ≤ 2R; R_L 10 MΩ → 120.16 s (Thevenin equivalent of R and R_L:
    // V∞ = V·R_L/(R + R_L), τ = C·(R ∥ R_L), t = τ·ln(V∞/(V∞ − 2V/3)); computed from that formula).
    [Fact]
    public void LeakageResistance()
    {
        Assert.Equal(120.16, new TimerFacts("U1", 1e6, 100e-6, 12, 0, 10e6).ClosedFormWidth, 2);
        Assert.True(double.IsPositiveInfinity(new TimerFacts("U1", 1e6, 100e-6, 12, 0, 2e6).ClosedFormWidth));
        Assert.True(new TimerFacts("U1", 1e6, 100e-6, 12, 0, 2e6).MarginCurrent <= 1e-12);
    }
}
