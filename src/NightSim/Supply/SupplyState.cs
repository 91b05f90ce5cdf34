namespace NightSim.Supply;

/// <summary>A Zener's current and dissipation in one load state.</summary>
/// <param name="PartId">Zener part id.</param>
/// <param name="CurrentMin">Least reverse current (cathode → anode) in the measured cycles, A (negative: conducting forward).</param>
/// <param name="CurrentMax">Largest reverse current, A.</param>
/// <param name="CurrentMean">Mean reverse current, A.</param>
/// <param name="Power">Mean dissipation, W.</param>
public sealed record ZenerReading(string PartId, double CurrentMin, double CurrentMax, double CurrentMean, double Power);

/// <summary>A relay coil in one load state: its voltage as it counts against pull-in (coil current times coil resistance).</summary>
/// <param name="PartId">Relay part id.</param>
/// <param name="VoltageMean">Mean coil voltage, V.</param>
/// <param name="VoltageMin">Least coil voltage, V.</param>
/// <param name="VoltageMax">Largest coil voltage, V.</param>
/// <param name="PullIn">Pull-in voltage at the coil's temperature, V.</param>
/// <param name="DropOut">Drop-out voltage at the coil's temperature, V.</param>
/// <param name="Energised">True when the armature was pulled in at the end of the state.</param>
public sealed record CoilReading(string PartId, double VoltageMean, double VoltageMin, double VoltageMax, double PullIn, double DropOut, bool Energised);

/// <summary>A resistor or capacitor in one load state.</summary>
/// <param name="PartId">Part id.</param>
/// <param name="Power">Mean dissipation, W (a resistor: mean of v²/R); NaN for a capacitor.</param>
/// <param name="PeakVoltage">Largest |v| across it, V.</param>
/// <param name="RmsVoltage">RMS voltage across it, V.</param>
public sealed record PartReading(string PartId, double Power, double PeakVoltage, double RmsVoltage);

/// <summary>One load state of the supply at its periodic steady state, measured over whole mains cycles.</summary>
/// <param name="Key">"standby-day", "standby-night", "relay-on" (or "timer-on" without a relay).</param>
/// <param name="Description">How the state was reached, in plain words.</param>
/// <param name="Lux">Light on the sensors, lux.</param>
/// <param name="Settled">True when the rail reached its periodic steady state (else: measured when time ran out).</param>
/// <param name="SettleSeconds">Time from the start of the state to the end of the measured cycles, s.</param>
/// <param name="From">Run time the measured cycles start, s.</param>
/// <param name="To">Run time they end, s.</param>
public sealed record SupplyState(string Key, string Description, double Lux, bool Settled, double SettleSeconds, double From, double To)
{
    /// <summary>Mean rail voltage, V (NaN without a rail).</summary>
    public double RailMean { get; init; } = double.NaN;
    public double RailMin { get; init; } = double.NaN;
    public double RailMax { get; init; } = double.NaN;

    /// <summary>Peak-to-peak ripple on the rail, V.</summary>
    public double Ripple => RailMax - RailMin;

    /// <summary>RMS current drawn from the mains (through the dropper), A.</summary>
    public double DropperCurrentRms { get; init; }

    public IReadOnlyList<ZenerReading> Zeners { get; init; } = [];
    public IReadOnlyList<CoilReading> Coils { get; init; } = [];
    public IReadOnlyList<PartReading> Parts { get; init; } = [];

    /// <summary>Something the reader must know about this state (not settled, not reached), or null.</summary>
    public string? Note { get; init; }
}
