namespace NightSim.Devices.Roles;

/// <summary>A resistor: its nodes, its resistance and the ratings the part states, so that a supply budget can judge
/// its dissipation and the voltage across it (a bleeder across a mains dropper sees the mains peak).</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="A">Node of pin a.</param>
/// <param name="B">Node of pin b.</param>
/// <param name="Resistance">Resistance, Ω.</param>
public sealed record ResistorRole(string PartId, string A, string B, double Resistance) : PartRole(PartId)
{
    public override string Title => "resistor";

    /// <summary>Rated dissipation, W; null when the part does not state one.</summary>
    public double? PowerRating { get; init; }

    /// <summary>Rated (limiting element) voltage, V; null when the part does not state one.</summary>
    public double? VoltageRating { get; init; }
}
