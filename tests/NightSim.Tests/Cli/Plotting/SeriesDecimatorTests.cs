using NightSim.Cli.Plotting;

namespace NightSim.Tests.Cli.Plotting;

/// <summary>Per-column thinning of what a plot draws: extremes and on/off edges survive.</summary>
public sealed class SeriesDecimatorTests
{
    [Fact]
    public void Keeps_The_Extremes_And_The_End_Value_Of_Every_Column()
    {
        const int n = 200_000, columns = 500;
        var t = new double[n];
        var v = new double[n];
        var random = new Random(7); // fixed seed
        for (int i = 0; i < n; i++)
        {
            t[i] = i * 0.5;
            v[i] = Math.Sin(i * 1e-4) + 0.01 * random.NextDouble();
        }
        v[31_337] = 40;   // a one-sample spike
        v[150_001] = -40; // a one-sample dip
        (double[] dt, double[] dv) = SeriesDecimator.Decimate(t, v, 0, t[^1], columns);
        Assert.True(dt.Length <= 4 * columns, $"{dt.Length} points");
        for (int i = 1; i < dt.Length; i++) Assert.True(dt[i] > dt[i - 1]);
        Assert.Contains(40.0, dv);
        Assert.Contains(-40.0, dv);
        // Column by column (column of a time: floor of time / column width): the lowest and highest original values are
        // there, and the column ends on its own last value.
        double width = t[^1] / columns;
        int ColumnOf(double x) => (int)Math.Clamp(Math.Floor(x / width), 0, columns - 1);
        var kept = new Dictionary<double, (double Value, int Column)>();
        for (int i = 0; i < dt.Length; i++) kept[dt[i]] = (dv[i], ColumnOf(dt[i]));
        foreach (IGrouping<int, int> column in Enumerable.Range(0, n).GroupBy(i => ColumnOf(t[i])))
        {
            double lo = column.Min(i => v[i]), hi = column.Max(i => v[i]);
            var inColumn = kept.Values.Where(k => k.Column == column.Key).Select(k => k.Value).ToList();
            Assert.Contains(lo, inColumn);
            Assert.Contains(hi, inColumn);
            int last = column.Max();
            Assert.True(kept.TryGetValue(t[last], out var end) && end.Value == v[last], $"column {column.Key} does not end on its own value");
        }
    }

    [Fact]
    public void Every_Chatter_Edge_Stays_A_Visible_Stroke()
    {
        // 24 000 relay operations in 20 minutes at dusk, drawn on a 24-hour plot of 1200 columns (72 s per column).
        var t = new List<double> { 0 };
        var v = new List<double> { 0 };
        double start = 5 * 3600, period = 0.1;
        for (int k = 0; k < 24_000; k++)
        {
            t.Add(start + k * period / 2);
            v.Add(k % 2 == 0 ? 1 : 0);
        }
        t.Add(86400);
        v.Add(0);
        (double[] dt, double[] dv) = SeriesDecimator.Decimate(t, v, 0, 86400, 1200);
        Assert.True(dt.Length < 100, $"{dt.Length} points for the chattering lane");
        // Every column that holds an edge shows both states, so the burst is a solid on/off band over its whole length.
        double width = 86400.0 / 1200;
        for (int c = 0; c < 1200; c++)
        {
            double a = c * width, b = (c + 1) * width;
            bool edge = t.Skip(1).Take(24_000).Any(x => x >= a && x < b);
            if (!edge) continue;
            double[] inColumn = [.. dt.Select((x, k) => (x, k)).Where(p => p.x >= a && p.x < b).Select(p => dv[p.k])];
            Assert.Contains(0.0, inColumn);
            Assert.Contains(1.0, inColumn);
        }
        // The last edge: after it the lamp is off, and the decimated series says so.
        Assert.Equal(0, dv[^1]);
        Assert.Equal(t[^2], dt[^2]);
    }

    [Fact]
    public void Gaps_Are_Kept_And_Short_Series_Are_Untouched()
    {
        double[] t = [.. Enumerable.Range(0, 5000).Select(i => (double)i)];
        double[] v = [.. t.Select(x => x == 2500 ? double.NaN : 1.0)];
        (double[] dt, double[] dv) = SeriesDecimator.Decimate(t, v, 0, 4999, 100);
        Assert.Contains(dv, double.IsNaN);
        Assert.Contains(2500.0, dt);
        (double[] st, double[] sv) = SeriesDecimator.Decimate([0, 1, 2], [3, 4, 5], 0, 2, 100);
        Assert.Equal([0.0, 1, 2], st);
        Assert.Equal([3.0, 4, 5], sv);
    }
}
