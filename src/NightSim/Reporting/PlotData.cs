namespace NightSim.Reporting;

/// <summary>Which stacked panel of a night plot a series belongs to.</summary>
public enum PlotPanel
{
    /// <summary>Illuminance at the sensor, lux, log axis.</summary>
    Light,
    /// <summary>Circuit voltages (sensor node, trigger pin, timing capacitor with its 1/3 and 2/3 levels), volts.</summary>
    Voltages,
    /// <summary>On/off states (relay contact, load), 0 or 1.</summary>
    States,
}

/// <summary>One plotted series: run times (seconds since <see cref="PlotData.Origin"/>) and values in SI.</summary>
/// <param name="Title">Legend text, e.g. "trigger pin (node trig)".</param>
/// <param name="Unit">"lx", "V", "" for states.</param>
/// <param name="Panel">Panel it is drawn in.</param>
/// <param name="Times">Run times, seconds, ascending.</param>
/// <param name="Values">Values, same length as <paramref name="Times"/>.</param>
/// <param name="Dashed">Draw as a dashed reference line (e.g. 2/3 of supply).</param>
public sealed record PlotSeries(string Title, string Unit, PlotPanel Panel, double[] Times, double[] Values, bool Dashed = false);

/// <summary>A vertical marker at a clock time (sunset, civil dusk, a false trigger).</summary>
/// <param name="Time">Run time, seconds.</param>
/// <param name="Label">Short text ("sunset", "civil dusk", "headlight 23:41").</param>
/// <param name="Emphasis">True for markers about problems (drawn stronger).</param>
public sealed record PlotMarker(double Time, string Label, bool Emphasis = false);

/// <summary>Everything needed to draw one time window of a run. Engine-side data only; drawing is a CLI concern.</summary>
public sealed record PlotData
{
    /// <summary>Plot title.</summary>
    public required string Title { get; init; }

    /// <summary>Clock time of run time 0 (site local, with offset).</summary>
    public required DateTimeOffset Origin { get; init; }

    /// <summary>Site time zone, for clock-time axis labels across daylight-saving changes.</summary>
    public TimeZoneInfo? TimeZone { get; init; }

    /// <summary>Window start and end, run seconds.</summary>
    public required double From { get; init; }
    public required double To { get; init; }

    public IReadOnlyList<PlotSeries> Series { get; init; } = [];
    public IReadOnlyList<PlotMarker> Markers { get; init; } = [];

    /// <summary>True: the time axis shows seconds of run time ("1.25 s") instead of the clock (a plain transient, a
    /// supply run from power-up).</summary>
    public bool RunTimeAxis { get; init; }

    /// <summary>File-name stem without extension, e.g. "night-2026-11-20" or "zoom-01-headlight".</summary>
    public required string FileStem { get; init; }
}
