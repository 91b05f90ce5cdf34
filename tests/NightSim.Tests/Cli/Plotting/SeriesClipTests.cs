using NightSim.Cli.Plotting;

namespace NightSim.Tests.Cli.Plotting;

/// <summary>Cutting a series to the plotted window: nothing inside is lost, the curve still enters and leaves the frame
/// along the data's own segments, and far neighbours no longer make the renderer draw across thousands of pixels.</summary>
public sealed class SeriesClipTests
{
    [Fact]
    public void Keeps_Every_Point_Inside_And_The_Points_Just_Outside_The_Edges()
    {
        double[] t = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
        double[] v = [.. t.Select(x => x * x)];
        // Window [3.5, 7.5]; its span is 4, so a neighbour within 2 % of it (0.08) counts as just outside. The
        // neighbours here are 0.5 away: they are moved in along their segments to 0.08 outside the edges.
        (double[] ct, double[] cv) = SeriesClip.Clip(t, v, 3.5, 7.5);
        Assert.Equal([4.0, 5, 6, 7], ct[1..^1]);
        Assert.Equal([16.0, 25, 36, 49], cv[1..^1]);
        double margin = SeriesClip.Margin * 4;
        Assert.Equal(3.5 - margin, ct[0], 12);
        Assert.Equal(7.5 + margin, ct[^1], 12);
        // On the straight segment from (3, 9) to (4, 16), and from (7, 49) to (8, 64): drawn exactly as before.
        Assert.Equal(9 + (ct[0] - 3) * 7, cv[0], 9);
        Assert.Equal(49 + (ct[^1] - 7) * 15, cv[^1], 9);
    }

    [Fact]
    public void Near_Neighbours_Are_Kept_As_They_Are()
    {
        double[] t = [0.99, 1.0, 1.5, 2.0, 2.01];
        double[] v = [5, 6, 7, 8, 9];
        (double[] ct, double[] cv) = SeriesClip.Clip(t, v, 1.0, 2.0);
        Assert.Equal(t, ct);
        Assert.Equal(v, cv);
    }

    [Fact]
    public void A_Far_Neighbour_Of_A_Detail_Window_Is_Brought_In_To_The_Margin()
    {
        // A 0.08 s detail window cut from a capture whose previous point lies 600 s earlier (a slow step before the
        // event): drawn as is, that segment would run 10 million pixels to the left of the frame.
        double[] t = [0, 600, 600.01, 600.02, 600.08, 1200];
        double[] v = [12, 12, 2, 5, 11, 12];
        (double[] ct, double[] cv) = SeriesClip.Clip(t, v, 600.005, 600.085);
        double margin = SeriesClip.Margin * 0.08;
        Assert.Equal(600.005 - margin, ct[0], 9);
        Assert.Equal(600.085 + margin, ct[^1], 9);
        Assert.Equal([600.01, 600.02, 600.08], ct[1..^1]);
        Assert.True(ct[0] - 600.005 > -0.01 && ct[^1] - 600.085 < 0.01);
        // The first inside point's segment started at (600, 12): the edge point lies on it.
        Assert.Equal(12 + (ct[0] - 600) / 0.01 * (2 - 12), cv[0], 6);
    }

    [Fact]
    public void States_Hold_Their_Value_To_The_Edge()
    {
        double[] t = [0, 1000, 1000.5, 5000];
        double[] v = [0, 1, 0, 1];
        (double[] ct, double[] cv) = SeriesClip.Clip(t, v, 999, 1001, SeriesShape.Steps);
        Assert.Equal([0.0, 1, 0, 0], cv); // off until 1000, on, off at 1000.5, still off at the right edge
        Assert.Equal(1000, ct[1]);
        Assert.Equal(1000.5, ct[2]);
    }

    [Fact]
    public void A_Gap_Beside_An_Edge_Stays_A_Gap()
    {
        // Window [100.5, 101.5] (margin 0.02): the point before it is a gap (NaN), the one after lies 0.5 away.
        (double[] ct, double[] cv) = SeriesClip.Clip([0, 100, 101, 102], [1, double.NaN, 2, 3], 100.5, 101.5);
        Assert.Equal(3, ct.Length);
        Assert.True(double.IsNaN(cv[0]));
        Assert.Equal(101, ct[1]);
        Assert.Equal(2, cv[1]);
        Assert.Equal(101.5 + SeriesClip.Margin, ct[2], 12);
        Assert.Equal(2 + 0.5 + SeriesClip.Margin, cv[2], 12); // on the segment from (101, 2) to (102, 3)
    }

    [Fact]
    public void Data_Inside_The_Window_Is_Returned_Whole()
    {
        (double[] t, double[] v) = SeriesClip.Clip([1, 2, 3], [4, 5, 6], 0, 10);
        Assert.Equal([1.0, 2, 3], t);
        Assert.Equal([4.0, 5, 6], v);
    }
}
