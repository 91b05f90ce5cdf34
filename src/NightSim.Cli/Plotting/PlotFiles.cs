namespace NightSim.Cli.Plotting;

/// <summary>What <see cref="PlotWriter.Write"/> wrote.</summary>
/// <param name="SvgPath">The SVG file.</param>
/// <param name="PngPath">The PNG file, or null when PNG export was skipped.</param>
/// <param name="Warning">Why PNG export was skipped ("install fonts-dejavu-core …"), or null.</param>
public sealed record PlotFiles(string SvgPath, string? PngPath, string? Warning);
