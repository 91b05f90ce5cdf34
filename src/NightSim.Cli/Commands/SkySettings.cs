namespace NightSim.Cli.Commands;

/// <summary>Inputs of the <c>sky</c> verb.</summary>
/// <param name="Latitude">Degrees north.</param>
/// <param name="Longitude">Degrees east.</param>
/// <param name="TimeZone">IANA zone id.</param>
/// <param name="Date">First night's date, "YYYY-MM-DD".</param>
/// <param name="Days">Number of nights.</param>
/// <param name="Format">"text" or "json".</param>
/// <param name="PlotFile">SVG or PNG file to draw, or null.</param>
internal sealed record SkySettings(double Latitude, double Longitude, string TimeZone, string Date, int Days, string Format, string? PlotFile);
