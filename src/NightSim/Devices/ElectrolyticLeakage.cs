namespace NightSim.Devices;

/// <summary>
/// Leakage current of aluminium electrolytic capacitors: the catalogue limit after charging and the typical value a
/// part settles to.
/// </summary>
public static class ElectrolyticLeakage
{
    /// <summary>Floor of the catalogue limit, amperes (3 µA).</summary>
    public const double LimitFloor = 3e-6;

    /// <summary>Typical leakage after hours at working voltage as a fraction of the catalogue limit (from memory:
    /// general-purpose parts settle at a few per cent of the limit once polarised).</summary>
    public const double TypicalFraction = 0.02;

    /// <summary>
    /// The leakage limit after charging at rated voltage: I = 0.01·C·V_R (C in µF, V_R in V, I in µA, i.e. 0.01 s⁻¹·C·V_R
    /// in SI) or 3 µA, whichever is larger (IEC 60384-4, aluminium electrolytic capacitors with solid and non-solid
    /// electrolyte, leakage current requirement).
    /// </summary>
    /// <param name="capacitance">Rated capacitance, F.</param>
    /// <param name="ratedVoltage">Rated voltage, V.</param>
    /// <returns>Amperes.</returns>
    public static double Limit(double capacitance, double ratedVoltage) => Math.Max(0.01 * capacitance * ratedVoltage, LimitFloor);

    /// <summary>Typical leakage used when a part states none: <see cref="TypicalFraction"/> of <see cref="Limit"/>, A.</summary>
    public static double Typical(double capacitance, double ratedVoltage) => TypicalFraction * Limit(capacitance, ratedVoltage);
}
