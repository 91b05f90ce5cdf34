namespace NightSim.Supply;

/// <summary>
/// How fast the bleeder empties the dropper capacitor after the plug is pulled: an RC discharge from the highest
/// voltage the capacitor holds in use, V(t) = V₀·e^(−t/RC), so the time to a safe voltage is t = R·C·ln(V₀/V_safe)
/// (first-order RC discharge, any circuits textbook). R is the bleeder (resistors across the dropper, in parallel,
/// with the capacitor's own stated leakage resistance), C the dropper capacitance.
/// </summary>
/// <param name="Resistance">Discharge resistance, Ω (+∞: no bleeder).</param>
/// <param name="Capacitance">Dropper capacitance, F.</param>
/// <param name="StartVoltage">V₀: the largest |v| across the dropper in any load state, V.</param>
public sealed record BleederDischarge(double Resistance, double Capacitance, double StartVoltage)
{
    /// <summary>Safe voltage used, V: 60 V DC, the limit of the lowest energy class ES1 for a DC voltage (IEC 62368-1,
    /// Audio/video, information and communication technology equipment — Safety requirements; from memory), the
    /// usual touch limit for a charged part.</summary>
    public const double SafeVoltage = 60.0;

    /// <summary>Where <see cref="SafeVoltage"/> comes from, for reports.</summary>
    public const string SafeVoltageSource = "the ES1 limit for a DC voltage in IEC 62368-1, from memory";

    /// <summary>Plug-pin limit one second after unplugging, V: 34 V (IEC 60335-1, Household and similar electrical
    /// appliances — Safety — General requirements, clause 22.5; from memory).</summary>
    public const double PlugPinVoltage = 34.0;

    /// <summary>Where <see cref="PlugPinVoltage"/> comes from, for reports.</summary>
    public const string PlugPinSource = "IEC 60335-1 clause 22.5, from memory";

    /// <summary>Discharge time constant R·C, s (+∞ without a bleeder).</summary>
    public double TimeConstant => Resistance * Capacitance;

    /// <summary>Seconds until the capacitor is below <paramref name="safe"/> volts: R·C·ln(V₀/V_safe), 0 when it
    /// never holds more; +∞ without a bleeder.</summary>
    public double SecondsTo(double safe) => StartVoltage <= safe ? 0.0 : TimeConstant * Math.Log(StartVoltage / safe);

    /// <summary>Seconds until below <see cref="SafeVoltage"/>.</summary>
    public double SecondsToSafe => SecondsTo(SafeVoltage);

    /// <summary>Voltage left one second after unplugging, V: V₀·e^(−1 s/RC).</summary>
    public double VoltageAfterOneSecond => double.IsPositiveInfinity(TimeConstant) ? StartVoltage : StartVoltage * Math.Exp(-1.0 / TimeConstant);

    /// <summary>True when one second after unplugging the capacitor holds no more than <see cref="PlugPinVoltage"/>.</summary>
    public bool MeetsPlugPinLimit => VoltageAfterOneSecond <= PlugPinVoltage;

    /// <summary>The largest bleeder that still meets the plug-pin limit at 1 s: R = 1 s / (C·ln(V₀/34 V)), Ω.</summary>
    public double LargestBleederForPlugPins => StartVoltage <= PlugPinVoltage ? double.PositiveInfinity : 1.0 / (Capacitance * Math.Log(StartVoltage / PlugPinVoltage));
}
