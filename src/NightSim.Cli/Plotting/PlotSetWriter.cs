using System.Globalization;
using NightSim.Reporting;
using OxyPlot;

namespace NightSim.Cli.Plotting;

/// <summary>
/// Draws every plot of a run (the nights, one zoom per switching event) into a folder as SVG and PNG, and returns the
/// inline figures for report.html: each plot is built once and exported to SVG once for both its file and its figure.
/// The plots are independent, so they are drawn in parallel; the results keep the input order.
/// </summary>
public static class PlotSetWriter
{
    /// <summary>Write <c>{FileStem}.svg</c> and <c>{FileStem}.png</c> for each plot into <paramref name="directory"/>.</summary>
    /// <param name="plots">What to draw.</param>
    /// <param name="directory">Output folder.</param>
    /// <param name="guard">Wraps each plot's writing (the CLI turns an I/O failure into exit 5 naming the file); its
    /// first argument is the SVG file's path.</param>
    /// <param name="leading">Plots already built (an overview of many nights), written and shown before <paramref name="plots"/>,
    /// with their file stems and captions.</param>
    public static PlotSetResult WriteAll(IReadOnlyList<PlotData> plots, string directory,
        Func<string, Func<(PlotFiles, HtmlFigure)>, (PlotFiles, HtmlFigure)>? guard = null,
        IReadOnlyList<(PlotModel Model, string Stem, string Caption)>? leading = null)
    {
        // Build every model first: a malformed series is refused before any file is written.
        var jobs = new List<(PlotModel Model, string Stem, string Caption)>(plots.Count + (leading?.Count ?? 0));
        if (leading is not null) jobs.AddRange(leading);
        foreach (PlotData data in plots) jobs.Add((NightPlotBuilder.Build(data), data.FileStem, data.Title));
        var results = new (PlotFiles Files, HtmlFigure Figure)[jobs.Count];
        guard ??= (_, write) => write();
        try
        {
            Parallel.For(0, jobs.Count, new ParallelOptions { MaxDegreeOfParallelism = Math.Clamp(Environment.ProcessorCount, 1, 4) }, i =>
            {
                (PlotModel model, string stem, string caption) = jobs[i];
                string prefix = "fig" + (i + 1).ToString(CultureInfo.InvariantCulture) + "-";
                results[i] = guard(Path.Combine(directory, stem + ".svg"), () => PlotWriter.WriteWithFigure(model, directory, stem, caption, prefix));
            });
        }
        catch (AggregateException e) when (e.InnerExceptions.Count > 0)
        {
            // The first failure as it was thrown (an output failure names its file), not wrapped.
            System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(e.InnerExceptions[0]).Throw();
        }
        var warnings = new List<string>();
        foreach ((PlotFiles f, _) in results)
        {
            if (f.Warning is not null && !warnings.Contains(f.Warning)) warnings.Add(f.Warning);
        }
        return new PlotSetResult([.. results.Select(r => r.Files)], [.. results.Select(r => r.Figure)], warnings);
    }
}
