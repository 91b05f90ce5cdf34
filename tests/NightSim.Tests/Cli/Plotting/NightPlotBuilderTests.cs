using NightSim.Cli.Plotting;
using NightSim.Reporting;
using NightSim.Tests.Reporting;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace NightSim.Tests.Cli.Plotting;

/// <summary>The plot model: stacked panels, clock-time labels, log-axis floor, markers (invented demo data).</summary>
public sealed class NightPlotBuilderTests
{
    private static Axis XAxis(PlotModel m) => m.Axes.Single(a => a.Position == AxisPosition.Bottom);

    [Fact]
    public void NightHasThreeStackedPanelsWithLogLightAxis()
    {
        PlotModel m = NightPlotBuilder.Build(DemoReportData.NightPlot());
        List<Axis> left = m.Axes.Where(a => a.Position == AxisPosition.Left).ToList();
        Assert.Equal(3, left.Count);
        Assert.IsType<LogarithmicAxis>(left.Single(a => a.Key == nameof(PlotPanel.Light)));
        // Panels do not overlap: each ends below the start of the one above it.
        List<Axis> ordered = left.OrderByDescending(a => a.EndPosition).ToList();
        for (int i = 1; i < ordered.Count; i++) Assert.True(ordered[i].EndPosition < ordered[i - 1].StartPosition);
        Assert.Equal(8, m.Series.Count);
        Assert.Equal(2, m.Series.OfType<StairStepSeries>().Count());
        Assert.Equal("DejaVu Sans", m.DefaultFont);
    }

    [Fact]
    public void ClockLabelsCrossMidnight()
    {
        PlotData data = DemoReportData.NightPlot();
        Axis x = XAxis(NightPlotBuilder.Build(data));
        // The axis coordinate is seconds since local midnight of the origin's day (origin is 12:00 local).
        double shift = 12 * 3600;
        Assert.Equal("16:00", x.LabelFormatter(4 * 3600 + shift));
        Assert.Equal("00:00", x.LabelFormatter(12 * 3600 + shift));
        Assert.Equal("07:30", x.LabelFormatter(19.5 * 3600 + shift));
        Assert.Equal(data.From + shift, x.Minimum);
        Assert.Equal(data.To + shift, x.Maximum);
        Assert.Equal(0, (x.Minimum) % x.MajorStep); // ticks on round clock times (16:00 is on the 2 h grid)
    }

    [Fact]
    public void ZoomLabelsShowSecondsOrFractions()
    {
        PlotData zoom = DemoReportData.ZoomPlot();
        Axis x = XAxis(NightPlotBuilder.Build(zoom));
        Assert.Equal("23:41:07", x.LabelFormatter(DemoReportData.HeadlightAt + 12 * 3600));
        PlotData narrow = zoom with { From = DemoReportData.HeadlightAt, To = DemoReportData.HeadlightAt + 0.035 }; // 5 ms ticks
        Axis xn = XAxis(NightPlotBuilder.Build(narrow));
        Assert.Equal("23:41:07.025", xn.LabelFormatter(DemoReportData.HeadlightAt + 0.025 + 12 * 3600));
    }

    [Fact]
    public void MultiDayLabelsCarryTheDate()
    {
        PlotData data = DemoReportData.NightPlot() with { From = 0, To = 2.5 * 86400 };
        Axis x = XAxis(NightPlotBuilder.Build(data));
        Assert.Equal("11-21 00:00", x.LabelFormatter(86400));
        Assert.True((x.Maximum - x.Minimum) / x.MajorStep <= 8);
    }

    [Fact]
    public void DarkAndNegativeLuxSitOnTheLogFloor()
    {
        double[] t = [0, 10, 20, 30];
        PlotData data = DemoReportData.NightPlot() with
        {
            From = 0, To = 30,
            Series = [new PlotSeries("illuminance", "lx", PlotPanel.Light, t, [50, 0, -1e-3, 1e-6])],
            Markers = [],
        };
        PlotModel m = NightPlotBuilder.Build(data);
        var line = m.Series.OfType<LineSeries>().Single();
        Assert.Equal([50, NightPlotBuilder.LuxFloor, NightPlotBuilder.LuxFloor, NightPlotBuilder.LuxFloor], line.Points.Select(p => p.Y));
        var y = (LogarithmicAxis)m.Axes.Single(a => a.Key == nameof(PlotPanel.Light));
        Assert.Equal(NightPlotBuilder.LuxFloor, y.Minimum);
        Assert.Equal(100, y.Maximum, 9);
    }

    [Fact]
    public void MarkersSpanEveryPanelAndAreLabelledOnce()
    {
        PlotData data = DemoReportData.NightPlot();
        PlotModel m = NightPlotBuilder.Build(data);
        List<LineAnnotation> lines = m.Annotations.OfType<LineAnnotation>().ToList();
        Assert.Equal(data.Markers.Count * 3, lines.Count);
        // The lines carry no text; one label per marker, placed clear of the curves when the plot is drawn.
        Assert.All(lines, l => Assert.Null(l.Text));
        MarkerLabels labels = Assert.Single(m.Annotations.OfType<MarkerLabels>());
        Assert.Equal(data.Markers.Select(k => k.Label), labels.Labels.Select(l => l.Text));
        MarkerLabel headlight = labels.Labels.Single(l => l.Text == "headlight 23:41");
        Assert.NotEqual(labels.Labels.Single(l => l.Text == "sunset 16:31").Color, headlight.Color); // emphasis drawn differently
        Assert.True(headlight.Bold);
    }

    [Fact]
    public void SeriesAreCutToTheWindow()
    {
        PlotData zoom = DemoReportData.ZoomPlot();
        PlotModel m = NightPlotBuilder.Build(zoom);
        LineSeries light = m.Series.OfType<LineSeries>().First();
        double shift = 12 * 3600;
        // At most one sample either side of the 10 s window; inside it, every sample of the 20 ms grid.
        Assert.True(light.Points.Count(p => p.X < zoom.From + shift) <= 1);
        Assert.True(light.Points.Count(p => p.X > zoom.To + shift) <= 1);
        Assert.True(light.Points.Count >= 450);
    }

    [Fact]
    public void EmptyWindowIsRejected()
    {
        PlotData bad = DemoReportData.NightPlot() with { From = 100, To = 100 };
        Assert.Throws<ArgumentException>(() => NightPlotBuilder.Build(bad));
    }
}
