using NightSim.Studies;

namespace NightSim.Tests.Studies;

public sealed class StatisticsTests
{
    // Worked examples of the score interval: Newcombe, R. G. (1998), "Two-sided confidence intervals for the single
    // proportion: comparison of seven methods", Statistics in Medicine 17, 857–872, Table I (from memory; the 0/20
    // case is also z²/(n + z²) by hand, Wilson 1927 with p̂ = 0).
    [Theory]
    [InlineData(81, 263, 0.2553, 0.3662)]
    [InlineData(15, 148, 0.0624, 0.1605)]
    [InlineData(0, 20, 0.0, 0.1611)]
    [InlineData(1, 29, 0.0061, 0.1718)]
    public void Wilson_Interval_Matches_Published_Examples(int x, int n, double low, double high)
    {
        (double lo, double hi) = Wilson.Interval(x, n);
        Assert.Equal(low, lo, 4);
        Assert.Equal(high, hi, 4);
    }

    // Hyndman, R. J. and Fan, Y. (1996), "Sample quantiles in statistical packages", The American Statistician 50(4),
    // definition 7: for 1…10 the 5th, 50th and 95th percentiles are 1.45, 5.5 and 9.55 (h = (n − 1)p + 1).
    [Theory]
    [InlineData(5, 1.45)]
    [InlineData(50, 5.5)]
    [InlineData(95, 9.55)]
    [InlineData(0, 1.0)]
    [InlineData(100, 10.0)]
    public void Percentile_Follows_Definition_7(double p, double expected)
    {
        double[] data = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
        Assert.Equal(expected, Percentile.Of(data, p), 12);
    }
}
