namespace NightSim.Reporting;

/// <summary>One plot for the page: a caption and the plot as an inline SVG element (no XML prolog or doctype).</summary>
/// <param name="Title">Caption, e.g. "Night of 2026-11-20".</param>
/// <param name="Svg">The &lt;svg …&gt;…&lt;/svg&gt; markup, with a viewBox so it scales to the page width.</param>
public sealed record HtmlFigure(string Title, string Svg);
