using NightSim.Cli.Plotting;
using NightSim.Reporting;
using NightSim.Tests.Reporting;

namespace NightSim.Tests.Cli.Plotting;

/// <summary>All plots of a run in one call: files per plot and inline figures for the page (invented demo data).</summary>
public sealed class PlotSetWriterTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("nightsim-plotset-").FullName;

    public void Dispose() => Directory.Delete(_dir, true);

    [Fact]
    public void WritesEachPlotAndReturnsFiguresInOrder()
    {
        PlotSetResult r = PlotSetWriter.WriteAll([DemoReportData.NightPlot(), DemoReportData.ZoomPlot()], _dir);
        Assert.Equal(2, r.Files.Count);
        Assert.Equal([DemoReportData.NightPlot().Title, DemoReportData.ZoomPlot().Title], r.Figures.Select(f => f.Title));
        Assert.All(r.Files, f => Assert.True(File.Exists(f.SvgPath)));
        Assert.All(r.Files, f => Assert.True(f.PngPath is null || File.Exists(f.PngPath)));
        Assert.Contains("id=\"fig1-", r.Figures[0].Svg, StringComparison.Ordinal);
        Assert.Contains("id=\"fig2-", r.Figures[1].Svg, StringComparison.Ordinal);
        // The page shows the title as the caption, so the inline plot leaves it out; the file keeps it.
        Assert.DoesNotContain(">" + DemoReportData.NightPlot().Title + "<", r.Figures[0].Svg, StringComparison.Ordinal);
        Assert.Contains(">" + DemoReportData.NightPlot().Title + "<", File.ReadAllText(r.Files[0].SvgPath), StringComparison.Ordinal);
    }

    [Fact]
    public void MismatchedSeriesIsRejectedBeforeAnyFile()
    {
        PlotData bad = DemoReportData.NightPlot() with { Series = [new PlotSeries("broken", "V", PlotPanel.Voltages, [0, 1, 2], [1, 2])] };
        var e = Assert.Throws<ArgumentException>(() => PlotSetWriter.WriteAll([bad], _dir));
        Assert.Contains("'broken'", e.Message, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFiles(_dir));
    }
}
