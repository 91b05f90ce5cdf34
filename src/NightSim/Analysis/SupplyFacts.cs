namespace NightSim.Analysis;

/// <summary>A span of a run in which the supply's Zener stopped regulating.</summary>
/// <param name="RelayOn">True for the relay-on state (a relay coil driven), false for standby.</param>
/// <param name="First">Run time the Zener current first fell below its regulating level in this state, s.</param>
/// <param name="Seconds">Time spent below it in this state, s.</param>
/// <param name="ZenerMin">Least Zener current in this state, A.</param>
/// <param name="RailMin">Least rail voltage while it did not regulate, V.</param>
public sealed record RegulationLoss(bool RelayOn, double First, double Seconds, double ZenerMin, double RailMin)
{
    /// <summary>Total time in this state after regulation was first established, s.</summary>
    public double StateSeconds { get; init; }
}

/// <summary>One time a relay coil was driven (it drew at least half its drop-out current), with the rail around it.</summary>
/// <param name="Relay">Relay part id.</param>
/// <param name="Start">Run time the drive began, s.</param>
/// <param name="End">Run time it ended (the end of the run when still driven), s.</param>
/// <param name="RailBefore">Mean rail over the last whole mains cycle before the drive, V (NaN when none).</param>
/// <param name="RailMin">Least rail voltage while driven, V.</param>
/// <param name="CoilPeak">Largest coil voltage (current × resistance) while driven, V.</param>
public sealed record CoilAttempt(string Relay, double Start, double End, double RailBefore, double RailMin, double CoilPeak);

/// <summary>The mains cycle in which the rail's ripple came nearest to the trigger level (standby, full mains detail).</summary>
/// <param name="Time">Run time of the cycle, s.</param>
/// <param name="RailRipple">Peak-to-peak rail ripple in that cycle, V.</param>
/// <param name="TriggerSwing">Peak-to-peak swing of the trigger pin against its trigger level in that cycle, V.</param>
/// <param name="TriggerMargin">Least distance of the trigger pin above its trigger level in that cycle, V.</param>
/// <param name="TimerId">Timer part id.</param>
public sealed record RippleAtTrigger(double Time, double RailRipple, double TriggerSwing, double TriggerMargin, string TimerId);

/// <summary>
/// What the analysis knows about a mains-fed supply after a run: its parts (from the devices' roles), the rail, when its
/// Zener stopped regulating in each load state, the rail at every relay drive, and the ripple at the trigger pin.
/// Null in <see cref="RunFacts.Supply"/> when the circuit runs from an ideal rail.
/// </summary>
public sealed record SupplyFacts
{
    /// <summary>The supply in a few words, e.g. "the 470 nF dropper CX from 230 V 50 Hz".</summary>
    public required string Description { get; init; }

    /// <summary>Mains RMS voltage, V, and frequency, Hz.</summary>
    public double MainsRms { get; init; }
    public double Frequency { get; init; }

    /// <summary>Dropper capacitance, F (0 without a dropper), and its part ids.</summary>
    public double DropperCapacitance { get; init; }
    public IReadOnlyList<string> Droppers { get; init; } = [];

    /// <summary>Rail nodes (plus, minus).</summary>
    public required string RailPlus { get; init; }
    public required string RailMinus { get; init; }

    /// <summary>The rail's Zener (id, voltage V, test current A), or null.</summary>
    public string? ZenerId { get; init; }
    public double ZenerVoltage { get; init; } = double.NaN;
    public double ZenerTestCurrent { get; init; } = double.NaN;

    /// <summary>The smoothing capacitor (id, F), or null.</summary>
    public string? ReservoirId { get; init; }
    public double ReservoirCapacitance { get; init; }

    /// <summary>Mean rail over the whole mains cycles in standby, V (NaN when none were seen).</summary>
    public double StandbyRail { get; init; } = double.NaN;

    /// <summary>Mean Zener current over the whole mains cycles in standby, A (NaN when none).</summary>
    public double StandbyZenerCurrent { get; init; } = double.NaN;

    /// <summary>Mean RMS mains current over the whole cycles in standby, A (NaN when none).</summary>
    public double StandbyMainsCurrent { get; init; } = double.NaN;

    /// <summary>Coil resistance of each relay, Ω.</summary>
    public IReadOnlyDictionary<string, double> CoilResistance { get; init; } = new Dictionary<string, double>();

    /// <summary>Where the Zener stopped regulating, per load state (at most one each).</summary>
    public IReadOnlyList<RegulationLoss> Losses { get; init; } = [];

    /// <summary>Every relay drive (the first few hundred), in time order.</summary>
    public IReadOnlyList<CoilAttempt> Attempts { get; init; } = [];

    /// <summary>The cycle of least trigger margin against its ripple, or null (no timer, or no whole cycle in standby).</summary>
    public RippleAtTrigger? Ripple { get; init; }

    /// <summary>Rail voltage at a run time, V (from the recorded rows); null when not recorded.</summary>
    public Func<double, double>? RailAt { get; init; }

    /// <summary>The rail the supply should hold: the Zener voltage, else the standby rail, V.</summary>
    public double NominalRail => double.IsFinite(ZenerVoltage) ? ZenerVoltage : StandbyRail;

    /// <summary>The drive of <paramref name="relay"/> that covers run time <paramref name="time"/>, or null.</summary>
    public CoilAttempt? AttemptAt(string relay, double time) =>
        Attempts.FirstOrDefault(a => a.Relay == relay && time >= a.Start - 1e-6 && time <= a.End + 1e-6);

    /// <summary>The rail before a drive: measured, else the nominal rail, V.</summary>
    public double Before(CoilAttempt a) => double.IsFinite(a.RailBefore) ? a.RailBefore : NominalRail;

    /// <summary>True when the supply explains a coil that stayed below its pull-in while driven: the rail sagged by
    /// at least <see cref="SagFraction"/> of its level, and the sag is what the coil lacked (its peak plus the sag
    /// reaches the pull-in).</summary>
    public bool ExplainsNoPullIn(CoilAttempt a, double pullIn)
    {
        double before = Before(a);
        double sag = before - a.RailMin;
        return double.IsFinite(sag) && sag >= SagFraction * before && a.CoilPeak + sag >= pullIn;
    }

    /// <summary>True when a relay released at <paramref name="time"/> while its coil was still driven and the rail had
    /// sagged by at least <see cref="SagFraction"/>: the supply dropped it out.</summary>
    public bool DroppedOutUnderSag(string relay, double time, out double rail)
    {
        rail = double.NaN;
        if (AttemptAt(relay, time) is not { } a) return false;
        rail = RailAt?.Invoke(time) ?? a.RailMin;
        double before = Before(a);
        return double.IsFinite(rail) && before - rail >= SagFraction * before;
    }

    /// <summary>A rail this fraction below its level counts as sagging.</summary>
    public const double SagFraction = 0.05;
}
