namespace NightSim.Studies;

/// <summary>
/// One part parameter that differs between bought parts: its nominal value and the extremes of its tolerance band,
/// in SI units. Draws are uniform between the extremes (common practice for tolerance bands), or uniform in the
/// logarithm when <see cref="LogScale"/> (a leakage current spanning decades).
/// </summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="Parameter">Parameter name as written in the netlist.</param>
/// <param name="Nominal">Value a single run uses.</param>
/// <param name="Low">Lower extreme.</param>
/// <param name="High">Upper extreme.</param>
/// <param name="LogScale">Draw uniformly in log(value).</param>
/// <param name="Source">Where the band comes from, in plain words ("tolerance 5 %", "IEC 60384-4 limit").</param>
/// <param name="Unit">SI unit for printing ("Ω", "F", "A", "V", "" for a ratio).</param>
public sealed record Variation(string PartId, string Parameter, double Nominal, double Low, double High, bool LogScale, string Source, string Unit = "")
{
    /// <summary>Upper end of random draws when it differs from the worst case <see cref="High"/> (a leakage current:
    /// parts scatter around the typical value, the catalogue limit is the worst case), or null.</summary>
    public double? DrawHigh { get; init; }

    /// <summary>"PART.parameter", the key in study files.</summary>
    public string Key => PartId + "." + Parameter;

    /// <summary>The value at <paramref name="u"/> ∈ [0, 1) across the band.</summary>
    public double At(double u)
    {
        double high = DrawHigh ?? High;
        return LogScale && Low > 0
            ? Math.Exp(Math.Log(Low) + u * (Math.Log(high) - Math.Log(Low)))
            : Low + u * (high - Low);
    }
}
