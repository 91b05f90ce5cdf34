namespace NightSim.Devices.Roles;

/// <summary>A device that can state what it is to a linear DC network at rest (capacitors open): conductances,
/// constant currents and the capacitance it puts between nodes. Used to reduce the network around a node to its
/// Thevenin equivalent (the charging network a timer's timing node sees) whatever the wiring.</summary>
public interface IDcElement
{
    void StampDc(DcNetwork network);
}
