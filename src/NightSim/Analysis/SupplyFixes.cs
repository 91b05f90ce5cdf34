using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>The usual fixes for a supply that cannot carry the relay, with numbers from the run: a larger dropper
/// capacitor (its current grows in proportion to its capacitance), a relay coil that draws less, a larger smoothing
/// capacitor for the pull-in surge.</summary>
public static class SupplyFixes
{
    /// <summary>Mean of a full-wave rectified sine over its RMS, 2√2/π (any circuits textbook): what a bridge hands the
    /// rail of the dropper's RMS current.</summary>
    public static readonly double FullWaveAverageOverRms = 2.0 * Math.Sqrt(2.0) / Math.PI;

    private static string F(double value, string unit) => EngineeringValue.Format(value, unit, 3);

    /// <summary>The fixes for a supply short of current while relay <paramref name="relay"/> (or none) is on. With the
    /// standby figures of the run: the rail must carry in relay-on what it carried in standby (the current it delivered
    /// less the Zener's share), plus the coil at the Zener voltage, plus the Zener's test current (the usual least design
    /// current, common practice); the dropper delivers 2√2/π of its RMS current into a bridge (a half-wave rectifier
    /// half of it, so the capacitor named is then a lower bound).</summary>
    public static string ForCurrent(SupplyFacts s, string? relay)
    {
        var fixes = new List<string>();
        double vz = s.NominalRail;
        double delivered = s.StandbyMainsCurrent * FullWaveAverageOverRms;
        double spare = double.IsFinite(s.StandbyZenerCurrent) ? s.StandbyZenerCurrent : double.NaN;
        double keep = double.IsFinite(s.ZenerTestCurrent) ? s.ZenerTestCurrent : 0.0;
        double coilR = relay is not null && s.CoilResistance.TryGetValue(relay, out double r) ? r : double.NaN;
        if (s.DropperCapacitance > 0)
        {
            double coil = double.IsFinite(coilR) && double.IsFinite(vz) ? vz / coilR : 0.0;
            double needed = delivered - (double.IsFinite(spare) ? spare : 0.0) + coil + keep;
            fixes.Add(double.IsFinite(needed) && delivered > 0 && needed > delivered
                ? $"a larger dropper capacitor, about {F(PreferredValues.E12AtOrAbove(s.DropperCapacitance * needed / delivered), "F")} instead of {F(s.DropperCapacitance, "F")} (X2 class, rated for the mains, e.g. 275 V or 305 V AC)"
                : "a larger dropper capacitor (X2 class, rated for the mains, e.g. 275 V or 305 V AC)");
        }
        if (double.IsFinite(coilR) && double.IsFinite(vz))
        {
            fixes.Add(double.IsFinite(spare) && spare > keep
                ? $"a relay whose coil draws less: the supply spares about {F(spare - keep, "A")} for it at {F(vz, "V")}, a coil of {F(vz / (spare - keep), "Ω")} or more instead of {F(coilR, "Ω")}"
                : $"a relay whose coil draws far less than the {F(vz / coilR, "A")} of this {F(coilR, "Ω")} coil");
        }
        if (s.ReservoirId is not null)
            fixes.Add($"a larger smoothing capacitor than {s.ReservoirId}'s {F(s.ReservoirCapacitance, "F")} {(relay is null ? "to fill the ripple troughs" : "to carry the pull-in surge")}");
        return fixes.Count == 0 ? "Give the supply more current for the relay coil." : "Fit " + string.Join("; or ", fixes) + ".";
    }
}
