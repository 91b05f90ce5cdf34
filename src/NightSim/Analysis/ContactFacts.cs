namespace NightSim.Analysis;

/// <summary>
/// The contacts of one relay that switches a named load, and that load, as the analysis sees them: the load's power,
/// voltage and kind with the kind's typical switch-on (inrush) multiple and power factor (common-practice values, from
/// the device side's lookup table), and the contact rating the part states. Unknown numbers are null (or NaN for the
/// multiples of a load whose kind is not stated).
/// </summary>
/// <param name="PartId">Relay part id.</param>
/// <param name="Load">Load name ("lamp").</param>
/// <param name="PowerWatts">Load power when on, W.</param>
/// <param name="Voltage">RMS voltage the load runs on, V.</param>
public sealed record ContactFacts(string PartId, string Load, double PowerWatts, double Voltage)
{
    /// <summary>The load kind's netlist word ("incandescent"), or null when the part does not state it.</summary>
    public string? Kind { get; init; }

    /// <summary>The load kind in plain words ("incandescent (filament) lamp"), or null.</summary>
    public string? KindTitle { get; init; }

    /// <summary>Power factor when running: stated on the part, else the kind's typical value, else 1.</summary>
    public double PowerFactor { get; init; } = 1.0;

    /// <summary>True when the part states the power factor (false: the kind's typical value or 1).</summary>
    public bool PowerFactorStated { get; init; }

    /// <summary>Lower end of the kind's typical switch-on peak, × the steady current (NaN: kind not stated).</summary>
    public double InrushLow { get; init; } = double.NaN;

    /// <summary>Upper end of the kind's typical switch-on peak, × the steady current (NaN: kind not stated).</summary>
    public double InrushHigh { get; init; } = double.NaN;

    /// <summary>How long the switch-on peak typically lasts, s (NaN: kind not stated).</summary>
    public double InrushSeconds { get; init; } = double.NaN;

    /// <summary>The same in plain words ("a few milliseconds …"), or null.</summary>
    public string? InrushDuration { get; init; }

    /// <summary>Where the kind's values come from (common practice, from memory), or null.</summary>
    public string? InrushSource { get; init; }

    /// <summary>Rated contact current for a resistive load, A, or null.</summary>
    public double? ContactCurrent { get; init; }

    /// <summary>Rated contact voltage, V, or null.</summary>
    public double? ContactVoltage { get; init; }

    /// <summary>Electrical life, operations (a switch-on and its switch-off each), or null.</summary>
    public double? ContactLife { get; init; }

    /// <summary>Switch-on peak the contacts take, A (their inrush rating, or a common-practice multiple of the
    /// resistive rating), or null.</summary>
    public double? InrushLimit { get; init; }

    /// <summary>True when <see cref="InrushLimit"/> is the part's own inrush rating.</summary>
    public bool InrushLimitStated { get; init; }

    /// <summary>The multiple of the resistive rating taken as the switch-on limit when no inrush rating is stated.</summary>
    public double InrushLimitMultiple { get; init; } = 3.0;

    /// <summary>Steady (RMS) load current, A: I = P / (V · power factor) (real power of a sinusoidal supply).</summary>
    public double SteadyCurrent => PowerWatts / (Voltage * PowerFactor);

    /// <summary>The load in words: "the 60 W incandescent (filament) lamp 'lamp' on 230 V".</summary>
    public string LoadWords => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"the {PowerWatts:0.##} W {KindTitle ?? "load"} '{Load}' on {Voltage:0.##} V");

    /// <summary>The upper end of the kind's typical switch-on peak, A, or null when the kind is not stated.</summary>
    public double? PeakInrush => double.IsNaN(InrushHigh) ? null : InrushHigh * SteadyCurrent;
}
