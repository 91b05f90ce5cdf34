namespace NightSim.Devices;

/// <summary>One row of <see cref="LoadInrushTable"/>: what a kind of load draws at switch-on and when running.</summary>
/// <param name="Kind">The kind of load.</param>
/// <param name="Word">Its netlist word (relay parameter <c>loadKind</c>).</param>
/// <param name="Title">Plain words for reports ("incandescent lamp").</param>
/// <param name="MultipleLow">Lower end of the typical switch-on peak, as a multiple of the steady (RMS) current.</param>
/// <param name="MultipleHigh">Upper end of the typical switch-on peak, as a multiple of the steady current; the peak
/// the contacts are judged against.</param>
/// <param name="Duration">How long the peak lasts, s (typical order of magnitude).</param>
/// <param name="DurationText">The same in plain words for reports.</param>
/// <param name="PowerFactor">Typical power factor when running (real power ÷ (RMS voltage × RMS current)).</param>
/// <param name="Source">Where the row's values come from.</param>
public sealed record LoadInrush(LoadKind Kind, string Word, string Title, double MultipleLow, double MultipleHigh,
    double Duration, string DurationText, double PowerFactor, string Source);
