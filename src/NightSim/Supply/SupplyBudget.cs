using NightSim.Devices.Roles;
using NightSim.Units;

namespace NightSim.Supply;

/// <summary>
/// What <c>nightsim supply</c> reports: the mains, the supply's parts as recognised from their roles, each load state
/// at its periodic steady state, every part against its ratings at its worst state, how fast the bleeder makes the
/// dropper safe after unplugging, the relay's pull-in, the problems in plain words and the mains cautions. Without a
/// sine source only <see cref="Message"/> and the cautions are set.
/// </summary>
public sealed record SupplyBudget
{
    public required string CircuitName { get; init; }

    /// <summary>The supply's parts, or null when no mains-fed supply was found.</summary>
    public SupplySection? Section { get; init; }

    /// <summary>Why there is no budget ("no mains-fed supply found …"), or null.</summary>
    public string? Message { get; init; }

    /// <summary>Mains RMS voltage the budget was made at, V.</summary>
    public double MainsRms { get; init; }

    /// <summary>Mains peak, V: √2 times the RMS (plus the offset, if any).</summary>
    public double MainsPeak { get; init; }

    /// <summary>Mains frequency, Hz.</summary>
    public double Frequency { get; init; }

    /// <summary>True when --mains or --hz replaced the netlist's values.</summary>
    public bool Overridden { get; init; }

    public IReadOnlyList<SupplyState> States { get; init; } = [];
    public IReadOnlyList<PartStress> Parts { get; init; } = [];

    /// <summary>The dropper's discharge through its bleeder after unplugging, or null without a dropper.</summary>
    public BleederDischarge? Bleeder { get; init; }

    /// <summary>The rail and coil through the relay's pull-in, or null without a relay.</summary>
    public PullInTransient? PullIn { get; init; }

    /// <summary>Problems found, each a plain sentence with its numbers and the usual fix.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

    /// <summary>The mains cautions (<see cref="MainsExposure"/>).</summary>
    public IReadOnlyList<string> Cautions { get; init; } = [];

    /// <summary>The dropper current worked by hand, A: V_rms·2πf·C (the capacitive reactance carries nearly the whole
    /// mains voltage while the rail is small against it; any circuits textbook). NaN without a dropper.</summary>
    public double HandDropperCurrent { get; init; } = double.NaN;

    /// <summary>CPU time of the runs, s.</summary>
    public double CpuSeconds { get; init; }

    /// <summary>Simulated time of the runs, s.</summary>
    public double SimulatedSeconds { get; init; }

    /// <summary>The state with key <paramref name="key"/>, or null.</summary>
    public SupplyState? State(string key) => States.FirstOrDefault(s => s.Key == key);

    /// <summary>A value with its unit; currents below 1 nA read as 0 (a starved Zener's leakage is noise to a budget).</summary>
    private static string F(double value, string unit) =>
        unit == "A" && Math.Abs(value) < 1e-9 ? "0 A" : EngineeringValue.Format(value, unit, 3);

    /// <summary>Assembles the budget from the measured states.</summary>
    internal static SupplyBudget From(string name, SupplySection section, IReadOnlyList<SupplyState> states, PullInTransient? pullIn,
        IReadOnlyList<string> cautions, bool overridden, double cpu, double simulated)
    {
        SineSourceRole src = section.Source;
        var parts = new List<PartStress>();
        foreach (ResistorRole r in section.Resistors)
        {
            (SupplyState worst, PartReading reading) = Worst(states, r.PartId, p => p.Power);
            double peak = states.Max(s => Reading(s, r.PartId).PeakVoltage);
            parts.Add(new PartStress(r.PartId, section.PartTitle(r.PartId), reading.Power, r.PowerRating, peak, false, r.VoltageRating, worst.Key));
        }
        for (int k = 0; k < section.Zeners.Count; k++)
        {
            JunctionRole z = section.Zeners[k];
            SupplyState worst = states.MaxBy(s => s.Zeners[k].Power)!;
            parts.Add(new PartStress(z.PartId, section.PartTitle(z.PartId), worst.Zeners[k].Power, z.PowerRating, z.BreakdownVoltage, false, null, worst.Key));
        }
        foreach (CapacitorRole c in section.Capacitors)
        {
            bool dropper = section.Droppers.Contains(c);
            (SupplyState worst, PartReading reading) = Worst(states, c.PartId, p => dropper ? p.RmsVoltage : p.PeakVoltage);
            parts.Add(new PartStress(c.PartId, section.PartTitle(c.PartId), double.NaN, null, dropper ? reading.RmsVoltage : reading.PeakVoltage,
                dropper, c.RatedVoltage, worst.Key));
        }

        BleederDischarge? bleeder = null;
        if (section.Droppers.Count > 0)
        {
            double conductance = section.Bleeders.Sum(b => 1.0 / b.Resistance) + section.Droppers.Sum(d => 1.0 / d.LeakageResistance);
            double v0 = section.Droppers.Max(d => states.Max(s => Reading(s, d.PartId).PeakVoltage));
            bleeder = new BleederDischarge(conductance > 0 ? 1.0 / conductance : double.PositiveInfinity, section.DropperCapacitance, v0);
        }

        var budget = new SupplyBudget
        {
            CircuitName = name,
            Section = section,
            MainsRms = src.Rms,
            MainsPeak = Math.Abs(src.Offset) + Math.Abs(src.Amplitude),
            Frequency = src.Frequency,
            Overridden = overridden,
            States = states,
            Parts = parts,
            Bleeder = bleeder,
            PullIn = pullIn,
            Cautions = cautions,
            HandDropperCurrent = section.Droppers.Count > 0 ? src.Rms * 2 * Math.PI * src.Frequency * section.DropperCapacitance : double.NaN,
            CpuSeconds = cpu,
            SimulatedSeconds = simulated,
        };
        return budget with { Warnings = Problems(budget) };
    }

    private static PartReading Reading(SupplyState s, string id) => s.Parts.First(p => p.PartId == id);

    private static (SupplyState, PartReading) Worst(IReadOnlyList<SupplyState> states, string id, Func<PartReading, double> by)
    {
        SupplyState worst = states.MaxBy(s => by(Reading(s, id)))!;
        return (worst, Reading(worst, id));
    }

    /// <summary>The problems of a budget as plain sentences, supply stage named, with numbers and the usual fix.</summary>
    private static List<string> Problems(SupplyBudget b)
    {
        var list = new List<string>();
        SupplySection s = b.Section!;
        string dropper = s.Droppers.Count > 0
            ? $"the {F(s.DropperCapacitance, "F")} dropper {string.Join("+", s.Droppers.Select(d => d.PartId))} from {F(b.MainsRms, "V")} {b.Frequency:0.##} Hz"
            : $"the {F(b.MainsRms, "V")} {b.Frequency:0.##} Hz source {s.Source.PartId}";

        if (s.RailZener is { } zener)
        {
            int k = s.Zeners.ToList().IndexOf(zener);
            SupplyState best = b.States.MaxBy(st => st.Zeners[k].CurrentMean)!;
            foreach (SupplyState st in b.States)
            {
                ZenerReading z = st.Zeners[k];
                if (z.CurrentMin >= SupplyThresholds.RegulationLost * zener.TestCurrent) continue;
                list.Add($"Supply: {dropper} cannot hold the rail in the {st.Key} state: the current of Zener {zener.PartId} falls to {F(Math.Max(0, z.CurrentMin), "A")} " +
                    $"({F(best.Zeners[k].CurrentMean, "A")} on average in the {best.Key} state), so it no longer regulates; the rail averages {F(st.RailMean, "V")} and dips to {F(st.RailMin, "V")} against its {F(zener.BreakdownVoltage, "V")} Zener voltage. " +
                    FixForCurrent(b, st));
            }
        }
        if (b.PullIn is { } p && p.CoilPeak >= 0.5 * p.DropOut)
        {
            if (p.PullInTime is null)
            {
                list.Add($"Supply: relay {p.RelayId} cannot pull in: as its coil was driven the rail sagged from {F(p.RailBefore, "V")} to {F(p.RailMin, "V")}, and the coil reached only {F(p.CoilPeak, "V")} against its {F(p.PullIn, "V")} pull-in. " +
                    FixForCurrent(b, b.States[^1]));
            }
            else if (p.Operations > 1)
            {
                list.Add($"Supply: relay {p.RelayId} pulled in and dropped out {p.Operations} times after it was driven: the rail sagged from {F(p.RailBefore, "V")} to {F(p.RailMin, "V")} under the coil, below what holds it. " +
                    FixForCurrent(b, b.States[^1]));
            }
        }
        foreach (PartStress part in b.Parts)
        {
            if (part.PowerFraction > 1)
                list.Add($"Supply: {part.Title} {part.PartId} dissipates {F(part.Power, "W")} in the {part.WorstState} state, over its {F(part.PowerRating!.Value, "W")} rating. Fit a part rated for at least {F(part.Power / PartStress.Derating, "W")} (half-rated use, common practice).");
            else if (part.PowerFraction > PartStress.Derating)
                list.Add($"Supply: {part.Title} {part.PartId} dissipates {F(part.Power, "W")} in the {part.WorstState} state, {part.PowerFraction * 100:0}% of its {F(part.PowerRating!.Value, "W")} rating; inside a closed enclosure use it at no more than half (common practice): a {F(part.Power / PartStress.Derating, "W")} part.");
            if (part.VoltageFraction > 1)
                list.Add($"Supply: {part.Title} {part.PartId} sees {F(part.Voltage, "V")}{(part.VoltageIsRms ? " RMS" : " peak")}, over its {F(part.VoltageRating!.Value, "V")} rating. Fit a part rated for the voltage{(s.Droppers.Any(d => d.PartId == part.PartId) ? " (an X2-class capacitor rated for the mains, e.g. 275 V or 305 V AC)" : double.IsFinite(part.Power) ? " (or two resistors of half the value in series)" : "")}.");
        }
        if (b.Bleeder is { } bl)
        {
            string ids = string.Join("+", s.Droppers.Select(d => d.PartId));
            if (double.IsPositiveInfinity(bl.Resistance))
                list.Add($"Supply: no bleeder across the dropper {ids}: after unplugging it keeps up to {F(bl.StartVoltage, "V")} on the plug pins. Fit a resistor of at most {F(bl.LargestBleederForPlugPins, "Ω")} across it, rated for the mains peak (or two in series).");
            else if (!bl.MeetsPlugPinLimit)
                list.Add($"Supply: the bleeder across {ids} leaves {F(bl.VoltageAfterOneSecond, "V")} on the dropper one second after unplugging (the plug-pin limit is {F(BleederDischarge.PlugPinVoltage, "V")} after one second, {BleederDischarge.PlugPinSource}); τ = {F(bl.TimeConstant, "s")}. Use at most {F(bl.LargestBleederForPlugPins, "Ω")}.");
        }
        return list;
    }

    /// <summary>The usual fixes for a supply short of current in <paramref name="state"/>. The dropper delivers in
    /// proportion to its capacitance (I ∝ C at fixed voltages); its DC output is taken as the full-wave average of its
    /// RMS current, 2√2/π·I_rms (a bridge; a half-wave rectifier delivers half, so the capacitor named is then a lower
    /// bound). The Zener is to keep its test current, the usual least design current (common practice).</summary>
    private static string FixForCurrent(SupplyBudget b, SupplyState state)
    {
        SupplySection s = b.Section!;
        var fixes = new List<string>();
        double keep = s.RailZener?.TestCurrent ?? 0;
        double zenerMean = s.RailZener is { } rz ? Math.Max(0, state.Zeners[s.Zeners.ToList().IndexOf(rz)].CurrentMean) : 0;
        double railTarget = s.RailZener?.BreakdownVoltage ?? b.States[0].RailMean;
        CoilReading? coil = state.Coils.FirstOrDefault(c => c.Energised || c.VoltageMean >= SupplyThresholds.Driven * c.DropOut);
        RelayCoilRole? role = coil is null ? null : s.Relays.First(r => r.PartId == coil.PartId);
        // What the circuit would draw at the regulated rail: the loads are taken as resistive, so everything the dropper
        // delivers now (all of it goes into the loads while the Zener is starved) scales with the rail; plus what the
        // Zener lacks of its test current.
        double delivered = state.DropperCurrentRms * SupplyThresholds.FullWaveAverageOverRms;
        double rail = state.RailMean;
        double scale = double.IsFinite(railTarget) && rail > 0 && rail < railTarget ? railTarget / rail : 1.0;
        double needed = delivered * scale + Math.Max(0, keep - zenerMean);
        if (s.Droppers.Count > 0 && needed > delivered && delivered > 0)
        {
            double c = PreferredValues.E12AtOrAbove(s.DropperCapacitance * needed / delivered);
            fixes.Add($"a larger dropper capacitor, about {F(c, "F")} instead of {F(s.DropperCapacitance, "F")} (X2 class, rated for the mains, e.g. 275 V or 305 V AC; it also raises the standby dissipation in the Zener)");
        }
        else if (s.Droppers.Count > 0)
        {
            fixes.Add("a larger dropper capacitor (X2 class, rated for the mains)");
        }
        if (coil is not null && role is not null && double.IsFinite(railTarget))
        {
            // What the coil may draw at the regulated rail: what the dropper delivers, less the other loads at that
            // rail and the Zener's test current.
            double coilNow = coil.VoltageMean / role.CoilResistance;
            double allowed = delivered - (delivered - coilNow) * scale - keep;
            fixes.Add(allowed > 0
                ? $"a relay whose coil draws less: at {F(railTarget, "V")} a coil of {F(railTarget / allowed, "Ω")} or more ({F(allowed, "A")}), instead of {F(role.CoilResistance, "Ω")}"
                : $"a relay whose coil draws far less (at {F(railTarget, "V")} this supply has about {F(Math.Max(0, delivered - (delivered - coilNow) * scale), "A")} for the coil and its Zener together, less than the Zener's {F(keep, "A")} test current leaves room for)");
        }
        if (s.Reservoir is { } reservoir)
            fixes.Add($"a larger smoothing capacitor than {F(reservoir.Capacitance, "F")} {(coil is not null ? "to carry the pull-in surge" : "to fill the ripple troughs")}");
        return "Fix: " + string.Join("; or ", fixes) + ".";
    }
}
