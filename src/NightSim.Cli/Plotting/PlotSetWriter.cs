using NightSim.Reporting;
using OxyPlot;

namespace NightSim.Cli.Plotting;

/// <summary>
/// Draws every plot of a run (the whole night, one zoom per switching event) into a folder as SVG and PNG, and
/// returns the inline figures for report.html — one call for the simulate verb.
/// </summary>
public static class PlotSetWriter
{
    /// <summary>Write <c>{FileStem}.svg</c> and <c>{FileStem}.png</c> for each plot into <paramref name="directory"/>.</summary>
    public static PlotSetResult WriteAll(IReadOnlyList<PlotData> plots, string directory)
    {
        var files = new List<PlotFiles>(plots.Count);
        var figures = new List<HtmlFigure>(plots.Count);
        var warnings = new List<string>();
        for (int i = 0; i < plots.Count; i++)
        {
            PlotData data = plots[i];
            PlotModel model = NightPlotBuilder.Build(data);
            PlotFiles written = PlotWriter.Write(model, directory, data.FileStem);
            files.Add(written);
            if (written.Warning is not null && !warnings.Contains(written.Warning)) warnings.Add(written.Warning);
            figures.Add(new HtmlFigure(data.Title, PlotWriter.ToInlineSvg(model, "fig" + (i + 1).ToString(System.Globalization.CultureInfo.InvariantCulture) + "-", includeTitle: false)));
        }
        return new PlotSetResult(files, figures, warnings);
    }
}
