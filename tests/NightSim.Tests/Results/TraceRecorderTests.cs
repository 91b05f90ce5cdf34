using NightSim.Results;

namespace NightSim.Tests.Results;

/// <summary>The trace store: exact points for short runs, min/max per bucket for long ones (no spike lost).</summary>
public sealed class TraceRecorderTests
{
    [Fact]
    public void Keeps_Every_Point_While_Buckets_Hold_At_Most_Two()
    {
        var rec = new TraceRecorder([0], ["a"], ["V"], 0, 10, 100);
        for (int k = 0; k <= 10; k++) rec.Record(k, [k * 0.5]);
        var t = rec.Build()[0];
        Assert.Equal(11, t.Times.Count);
        Assert.Equal(2.5, t.At(5), 15);
        Assert.Equal(1.25, t.At(2.5), 15);
    }

    [Fact]
    public void Decimates_A_Long_Run_Without_Losing_A_Spike()
    {
        // 1 000 000 samples of a slow sine with one single-sample spike (both signs on two signals).
        const int N = 1_000_000, Buckets = 500;
        var rec = new TraceRecorder([0, 1], ["up", "down"], ["V", "A"], 0, 1, Buckets);
        for (int k = 0; k < N; k++)
        {
            double t = k / (double)N;
            double v = Math.Sin(2 * Math.PI * t);
            rec.Record(t, k == 123_457 ? [v + 10, v - 10] : [v, v]);
        }
        var traces = rec.Build();
        foreach (var tr in traces) Assert.True(tr.Times.Count <= 2 * Buckets + 4, $"{tr.Times.Count} points kept");
        Assert.Equal(Math.Sin(2 * Math.PI * 0.123457) + 10, traces[0].Max, 12);
        Assert.Equal(Math.Sin(2 * Math.PI * 0.123457) - 10, traces[1].Min, 12);
        Assert.Equal(0.123457, traces[0].Times[traces[0].Values.ToList().IndexOf(traces[0].Max)], 12);
        // The envelope survives: the sine's extremes are kept too.
        Assert.True(traces[1].Max > 0.99999);
        // Points stay in time order.
        for (int k = 1; k < traces[0].Times.Count; k++) Assert.True(traces[0].Times[k] >= traces[0].Times[k - 1]);
    }
}
