using NightSim.Results;

namespace NightSim.Tests.Results;

/// <summary>The trace store: rows that are accepted points (decimated by time, marked points kept), and a min/max
/// envelope per bucket (no spike lost).</summary>
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
        foreach (var tr in traces) Assert.True(tr.EnvelopeTimes.Count <= 2 * Buckets + 4, $"{tr.EnvelopeTimes.Count} envelope points kept");
        foreach (var tr in traces) Assert.InRange(tr.Times.Count, Buckets - 1, Buckets + 2);
        Assert.Equal(Math.Sin(2 * Math.PI * 0.123457) + 10, traces[0].Max, 12);
        Assert.Equal(Math.Sin(2 * Math.PI * 0.123457) - 10, traces[1].Min, 12);
        Assert.Equal(0.123457, traces[0].EnvelopeTimes[traces[0].EnvelopeValues.ToList().IndexOf(traces[0].Max)], 12);
        // The envelope survives: the sine's extremes are kept too.
        Assert.True(traces[1].Max > 0.99999);
        // Points stay in time order.
        for (int k = 1; k < traces[0].EnvelopeTimes.Count; k++) Assert.True(traces[0].EnvelopeTimes[k] >= traces[0].EnvelopeTimes[k - 1]);
        // Every row is a recorded point: value = the signal at exactly that row's time.
        for (int k = 0; k < traces[0].Times.Count; k++)
        {
            double t = traces[0].Times[k];
            Assert.Equal(Math.Sin(2 * Math.PI * t), traces[0].Values[k], 12);
        }
    }

    [Fact]
    public void Rows_Keep_Marked_Points_The_Point_Before_Them_And_The_Last_Point()
    {
        // 1 000 points over 1 s with 10 buckets: a row every 0.1 s, plus the marked point at 0.5005 s and the point just
        // before it (0.5004 s), and the final point (0.999 s).
        var rec = new TraceRecorder([0], ["a"], ["V"], 0, 1, 10);
        for (int k = 0; k < 1000; k++)
        {
            double t = k / 1000.0;
            rec.Record(t, [t * t], keep: k == 500);
        }
        Trace tr = rec.Build()[0];
        Assert.Contains(0.5, tr.Times);
        Assert.Contains(0.499, tr.Times);
        Assert.Contains(0.999, tr.Times);
        Assert.InRange(tr.Times.Count, 10, 14);
        for (int k = 0; k < tr.Times.Count; k++) Assert.Equal(tr.Times[k] * tr.Times[k], tr.Values[k], 15);
        for (int k = 1; k < tr.Times.Count; k++) Assert.True(tr.Times[k] > tr.Times[k - 1]);
    }
}
