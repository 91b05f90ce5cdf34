namespace NightSim.Devices.Roles;

/// <summary>A capacitor: its nodes, its capacitance and the rated voltage the part states (a dropper in series with the
/// mains, a reservoir on the rail, a timing capacitor: which one it is follows from where it sits, not from the part).</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="P">Node of pin p.</param>
/// <param name="N">Node of pin n.</param>
/// <param name="Capacitance">Capacitance, F.</param>
public sealed record CapacitorRole(string PartId, string P, string N, double Capacitance) : PartRole(PartId)
{
    public override string Title => "capacitor";

    /// <summary>Rated voltage, V (the part's <c>ratedVoltage</c>); null when not stated.</summary>
    public double? RatedVoltage { get; init; }

    /// <summary>Leakage across the dielectric as a resistance, Ω (+∞: none stated).</summary>
    public double LeakageResistance { get; init; } = double.PositiveInfinity;
}
