using System.Text.RegularExpressions;
using System.Xml.Linq;
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
    public void TheFigureIsTheFilesDrawingWithoutItsTitleBand()
    {
        PlotSetResult r = PlotSetWriter.WriteAll([DemoReportData.NightPlot()], _dir);
        string file = File.ReadAllText(r.Files[0].SvgPath), figure = r.Figures[0].Svg;
        // One export serves both: every curve of the file is in the figure with the same coordinates.
        static List<string> Curves(string svg) => [.. Regex.Matches(svg, "<polyline points=\"([^\"]+)\"").Select(m => m.Groups[1].Value)];
        Assert.Equal(Curves(file), Curves(figure));
        Assert.NotEmpty(Curves(file));
        // The figure's view box starts below the title band the file keeps.
        Match box = Regex.Match(figure, "viewBox=\"0 ([0-9.]+) 1200 ([0-9.]+)\"");
        Assert.True(box.Success, figure[..200]);
        double cut = double.Parse(box.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);
        Assert.InRange(cut, 10, 60);
        Assert.Equal(780 - cut, double.Parse(box.Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture), 3);
        XDocument.Parse(figure);
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
