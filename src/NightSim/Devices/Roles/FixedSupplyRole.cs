namespace NightSim.Devices.Roles;

/// <summary>A source that holds a node at a constant voltage against ground (a regulated supply).</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="Node">The node it holds.</param>
/// <param name="Volts">Its voltage against ground, V.</param>
public sealed record FixedSupplyRole(string PartId, string Node, double Volts) : PartRole(PartId)
{
    public override string Title => "supply";
}
