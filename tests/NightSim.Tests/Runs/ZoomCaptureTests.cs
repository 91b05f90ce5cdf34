using NightSim.Runs;

namespace NightSim.Tests.Runs;

public class ZoomCaptureTests
{
    // Windows hold every point from Before seconds ahead of their event (plus the last point before that) to After
    // seconds after it, each in its own rows of the shared store, and filling them allocates nothing.
    [Fact]
    public void Windows_Keep_Their_Own_Points_Without_Allocating()
    {
        var capture = new ZoomCapture([0, -1, 1], ringSize: 64, maxWindows: 3, storeRows: 256) { Before = 2.0, After = 3.0 };
        double[] x = new double[2];
        void Add(double t)
        {
            x[0] = t;
            x[1] = 10 * t;
            capture.Add(t, x);
        }
        for (int i = 0; i < 20; i++) Add(i * 0.5);             // t = 0 … 9.5
        long before = GC.GetAllocatedBytesForCurrentThread();
        capture.Mark(9.5, "load on");                           // window 1: 7.5 − one point … 12.5
        for (int i = 20; i < 60; i++) Add(i * 0.5);             // t = 10 … 29.5
        capture.Mark(29.5, "load off");                         // window 2: 27.5 − one point … 32.5
        for (int i = 60; i < 70; i++) Add(i * 0.5);
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;

        Assert.Equal(2, capture.Windows.Count);
        ZoomCapture.Window w1 = capture.Windows[0], w2 = capture.Windows[1];
        Assert.Equal(9.5, w1.EventTime);
        Assert.Equal(7.0, w1.Times[0]);                         // the point before the window comes along
        Assert.Equal(12.5, w1.Times[^1]);
        Assert.Equal(12, w1.Count);                             // 7.0, 7.5 … 12.5
        Assert.Equal(27.0, w2.Times[0]);
        Assert.Equal(32.5, w2.Times[^1]);
        Assert.Equal(w1.Times, w1.Column(0));                   // column 0: unknown 0 = t
        Assert.All(w1.Column(1), v => Assert.Equal(0.0, v));    // column 1: ground
        Assert.Equal(w2.Times.Select(t => 10 * t), w2.Column(2));
        Assert.Equal("load off", w2.Labels[0].Label);
        Assert.Equal(0, allocated);
    }

    [Fact]
    public void The_Store_Grows_When_Windows_Outrun_It()
    {
        var capture = new ZoomCapture([0], ringSize: 16, maxWindows: 1, storeRows: 16) { Before = 1.0, After = 1000.0 };
        double[] x = new double[1];
        capture.Add(0, x);
        capture.Mark(0, "load on");
        for (int i = 1; i <= 100; i++)
        {
            x[0] = i;
            capture.Add(i, x);
        }
        ZoomCapture.Window w = capture.Windows[0];
        Assert.Equal(101, w.Count);
        Assert.Equal(Enumerable.Range(0, 101).Select(i => (double)i), w.Column(0));
    }
}
