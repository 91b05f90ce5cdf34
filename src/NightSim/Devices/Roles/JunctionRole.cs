namespace NightSim.Devices.Roles;

/// <summary>A diode or a Zener diode: its nodes, its reverse breakdown (+∞ for a plain rectifier diode) and the ratings
/// the part states. A Zener across a supply rail is its shunt regulator.</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="Anode">Anode node.</param>
/// <param name="Cathode">Cathode node.</param>
/// <param name="BreakdownVoltage">Reverse breakdown (Zener) voltage, V; +∞ when the part has none.</param>
public sealed record JunctionRole(string PartId, string Anode, string Cathode, double BreakdownVoltage) : PartRole(PartId)
{
    public override string Title => IsZener ? "Zener diode" : "diode";

    /// <summary>True for a part that regulates in reverse breakdown.</summary>
    public bool IsZener => double.IsFinite(BreakdownVoltage);

    /// <summary>Reverse current at which <see cref="BreakdownVoltage"/> is stated (the Zener test current), A.</summary>
    public double TestCurrent { get; init; } = 1e-3;

    /// <summary>Rated dissipation, W; null when the part does not state one.</summary>
    public double? PowerRating { get; init; }
}
