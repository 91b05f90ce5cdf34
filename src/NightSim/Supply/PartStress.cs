namespace NightSim.Supply;

/// <summary>How hard a part works at its worst load state, against the ratings it states.</summary>
/// <param name="PartId">Part id.</param>
/// <param name="Title">Its place in the supply ("bleeder", "dropper capacitor", "rail Zener", "resistor").</param>
/// <param name="Power">Worst mean dissipation over the load states, W; NaN for a capacitor.</param>
/// <param name="PowerRating">Rated dissipation, W; null when not stated (or a capacitor).</param>
/// <param name="Voltage">The voltage judged against the rating, V: the peak |v| (an RMS for a dropper capacitor, whose
/// rating is an AC RMS voltage).</param>
/// <param name="VoltageIsRms">True when <paramref name="Voltage"/> is an RMS value.</param>
/// <param name="VoltageRating">Rated voltage, V; null when not stated.</param>
/// <param name="WorstState">The load state of the worst dissipation (or voltage for a capacitor).</param>
public sealed record PartStress(string PartId, string Title, double Power, double? PowerRating, double Voltage, bool VoltageIsRms, double? VoltageRating, string WorstState)
{
    /// <summary>Share of the rated dissipation a part may use continuously (common practice: derate resistors and Zeners
    /// to half their rating in a closed enclosure).</summary>
    public const double Derating = 0.5;

    /// <summary>Dissipation over rating (NaN when not rated).</summary>
    public double PowerFraction => PowerRating is double r && double.IsFinite(Power) ? Power / r : double.NaN;

    /// <summary>Voltage over rating (NaN when not rated).</summary>
    public double VoltageFraction => VoltageRating is double r ? Voltage / r : double.NaN;

    /// <summary>"over rating", "above half its rating", "ok", or "no rating given".</summary>
    public string Verdict =>
        PowerFraction > 1 || VoltageFraction > 1 ? "over rating"
        : PowerFraction > Derating ? "above half its rating"
        : PowerRating is null && VoltageRating is null ? "no rating given"
        : "ok";
}
