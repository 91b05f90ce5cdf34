namespace NightSim.Devices.Roles;

/// <summary>A sine voltage source: the mains (or a transformer winding) feeding a supply. Its amplitude is the peak
/// (√2 times the RMS of a mains sine).</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="Plus">Node of its + pin (the line, for the mains).</param>
/// <param name="Minus">Node of its − pin (the neutral).</param>
/// <param name="Amplitude">Peak deviation from the offset, V.</param>
/// <param name="Frequency">Frequency, Hz.</param>
/// <param name="CurrentLabel">Label of its branch-current unknown (A, from + through the source to −; negative while it
/// delivers power), to record or read.</param>
public sealed record SineSourceRole(string PartId, string Plus, string Minus, double Amplitude, double Frequency, string CurrentLabel) : PartRole(PartId)
{
    public override string Title => IsMains ? "mains source" : "AC source";

    /// <summary>Mean value, V.</summary>
    public double Offset { get; init; }

    /// <summary>Run time the sine starts (a cycle boundary), s.</summary>
    public double Start { get; init; }

    /// <summary>RMS value of the sine about its offset, V: amplitude/√2.</summary>
    public double Rms => Math.Abs(Amplitude) / Math.Sqrt(2.0);

    /// <summary>True from 50 V peak (the upper bound of extra-low voltage, as <c>Supply.MainsExposure</c>).</summary>
    public bool IsMains => Math.Abs(Offset) + Math.Abs(Amplitude) >= PartKind.MainsVoltage;
}
