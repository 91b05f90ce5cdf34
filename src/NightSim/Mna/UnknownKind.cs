namespace NightSim.Mna;

/// <summary>What an unknown of the MNA system stands for.</summary>
public enum UnknownKind
{
    /// <summary>Voltage of a netlist node (V).</summary>
    Node,
    /// <summary>Voltage of a device-internal node (V), e.g. behind a series resistance.</summary>
    InternalNode,
    /// <summary>A branch current (A): voltage sources, inductors, behavioural outputs.</summary>
    Branch,
}
