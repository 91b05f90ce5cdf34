namespace NightSim.Devices.Roles;

/// <summary>A relay coil: its nodes and the coil voltages at which it operates and releases.</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="CoilA">Coil node A.</param>
/// <param name="CoilB">Coil node B.</param>
/// <param name="PullIn">Pull-in (must-operate) coil voltage, V.</param>
/// <param name="DropOut">Drop-out (must-release) coil voltage, V.</param>
/// <param name="CoilResistance">Coil resistance, Ω.</param>
/// <param name="CoilCurrent">Label of the coil-current unknown (A → B), to record: the armature follows the coil current,
/// so the coil current times its resistance is the coil voltage that counts against pull-in.</param>
public sealed record RelayCoilRole(string PartId, string CoilA, string CoilB, double PullIn, double DropOut, double CoilResistance, string CoilCurrent) : PartRole(PartId)
{
    public override string Title => "relay";
}
