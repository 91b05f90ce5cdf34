namespace NightSim.Devices.Roles;

/// <summary>A light sensor: which light channel it reads, the nodes it connects, and how slowly it follows falling
/// light (the lag after which a switch-on can still be blamed on a light event that ended).</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="Channel">Light channel name.</param>
/// <param name="Nodes">Circuit nodes of its terminals.</param>
/// <param name="LagSeconds">Time constant with which it follows falling light, s (0: none).</param>
public sealed record LightSensorRole(string PartId, string Channel, IReadOnlyList<string> Nodes, double LagSeconds) : PartRole(PartId)
{
    public override string Title => "light sensor";
}
