using NightSim.Runs;

namespace NightSim.Tests.Runs;

public class NightTracesTests
{
    // A min/max envelope per bucket keeps every extreme: a lone spike and a burst of on/off steps both survive.
    [Fact]
    public void ThinningKeepsSpikesAndBursts()
    {
        int n = 100_000;
        var t = new double[n];
        var v = new double[n];
        for (int i = 0; i < n; i++)
        {
            t[i] = i;
            v[i] = i is > 50_000 and < 50_200 ? i % 2 : 0.5; // a burst of 0/1 toggles
        }
        v[12_345] = 99; // a one-sample spike
        (double[] tt, double[] vv) = NightTraces.Thin(t, v, 0, n);
        Assert.True(tt.Length <= NightTraces.MaxPlotPoints);
        Assert.Contains(99.0, vv);
        Assert.Contains(0.0, vv);
        Assert.Contains(1.0, vv);
        Assert.Equal(0, tt[0]);
        Assert.Equal(n - 1, tt[^1]);
        for (int i = 1; i < tt.Length; i++) Assert.True(tt[i] >= tt[i - 1]);
    }

    [Fact]
    public void ShortSeriesAreKept()
    {
        (double[] tt, double[] vv) = NightTraces.Thin([0, 1, 2], [3, 4, 5], 0, 2);
        Assert.Equal([0.0, 1, 2], tt);
        Assert.Equal([3.0, 4, 5], vv);
    }
}
