using NightSim.Reporting;

namespace NightSim.Cli.Plotting;

/// <summary>What <see cref="PlotSetWriter.WriteAll"/> produced.</summary>
/// <param name="Files">One entry per plot: its SVG file and PNG file (or null when skipped).</param>
/// <param name="Figures">The plots as inline SVG figures for <see cref="HtmlReportWriter"/>, in the same order.</param>
/// <param name="Warnings">Distinct warnings to show once (e.g. the missing-font note), possibly empty.</param>
public sealed record PlotSetResult(IReadOnlyList<PlotFiles> Files, IReadOnlyList<HtmlFigure> Figures, IReadOnlyList<string> Warnings);
