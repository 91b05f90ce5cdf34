using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Tests.Demos;

namespace NightSim.Tests.Runs;

/// <summary>What the plots of the driveway demo show (the look is checked on the regenerated pictures in plots/).</summary>
public sealed class PlotContentTests
{
    private static IReadOnlyList<PlotData> Plots => DemoRuns.Run("garden-path-driveway").Plots;

    [Fact]
    public void Night_Plot_Draws_The_Switching_Level_On_Lux_And_Sensor_Panels()
    {
        PlotData night = Plots.Single(p => p.FileStem.StartsWith("night-", StringComparison.Ordinal));
        NightRunResult run = DemoRuns.Run("garden-path-driveway");
        double level = run.Report.Nights[0].SwitchLevelLux!.Value;
        PlotSeries lux = Assert.Single(night.Series, s => s.Panel == PlotPanel.Light && s.Dashed);
        Assert.All(lux.Values, v => Assert.Equal(level, v));
        Assert.Equal($"switching level {ReportText.Lux(level)} lx", lux.Title);
        // The sensor line sits where the sensor trace was at the dusk switch-on.
        PlotSeries sensorLine = Assert.Single(night.Series, s => s.Title.StartsWith("sensor at switch-on", StringComparison.Ordinal));
        PlotSeries sensor = night.Series.Single(s => s.Title.StartsWith("sensor (node", StringComparison.Ordinal));
        Assert.InRange(sensorLine.Values[0], sensor.Values.Min(), sensor.Values.Max());
        Assert.Single(night.Series, s => s.Panel == PlotPanel.States);
    }

    [Fact]
    public void Each_Zoom_Is_Sized_To_Its_Event_And_Details_Leave_Out_A_Flat_Light_Panel()
    {
        PlotData dusk = Plots.Single(p => p.FileStem == "zoom-01-lamp-on-dusk");
        Assert.True(dusk.To - dusk.From >= 5 * 60, $"dusk zoom spans {dusk.To - dusk.From} s");
        PlotData headlight = Plots.Single(p => p.FileStem.StartsWith("zoom-", StringComparison.Ordinal) && p.FileStem.EndsWith("headlight", StringComparison.Ordinal));
        Assert.InRange(headlight.To - headlight.From, 5, 20);
        PlotData detail = Plots.Single(p => p.FileStem.StartsWith("detail-", StringComparison.Ordinal) && p.FileStem.EndsWith("headlight", StringComparison.Ordinal));
        Assert.DoesNotContain(detail.Series, s => s.Panel == PlotPanel.Light);
        Assert.Contains(detail.Series, s => s.Panel == PlotPanel.Voltages);
    }
}
