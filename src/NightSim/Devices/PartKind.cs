using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Describes one netlist part kind: its JSON name, pins, parameters and the factory that turns a validated
/// <see cref="PartDefinition"/> into engine devices. Each part kind file declares one static <c>Kind</c> of this type
/// and <see cref="PartCatalog"/> lists it once.
/// </summary>
public sealed class PartKind
{
    /// <summary>JSON "kind", e.g. "resistor".</summary>
    public required string Name { get; init; }

    /// <summary>One line for help and the schema.</summary>
    public required string Description { get; init; }

    /// <summary>Pin names in order. Two-terminal kinds (<see cref="UsesNodeList"/>) are written as "nodes": [a, b] in
    /// this order; multi-pin kinds as "pins": { name: node }.</summary>
    public required IReadOnlyList<string> Pins { get; init; }

    /// <summary>Pins that may be left out (e.g. a 555's control pin, a relay's contacts); a pin left out is absent from
    /// <see cref="PartDefinition.Pins"/> and the kind's factory handles its absence.</summary>
    public IReadOnlyList<string> OptionalPins { get; init; } = [];

    /// <summary>True: the netlist writes "nodes": [...] in pin order; false: "pins": { name: node }.</summary>
    public bool UsesNodeList { get; init; }

    /// <summary>Parameters this kind accepts.</summary>
    public required IReadOnlyList<ParameterSpec> Parameters { get; init; }

    /// <summary>Cross-parameter checks after each value passed its own range check; returns messages (with hints).</summary>
    public Func<PartDefinition, IEnumerable<string>>? Check { get; init; }

    /// <summary>Builds the engine devices of a validated part (composites expand into primitives with internal nodes
    /// named "&lt;id&gt;.&lt;name&gt;").</summary>
    public required Func<PartDefinition, IEnumerable<Device>> Create { get; init; }

    /// <summary>True when the part's pins form a DC path between them (used by the "no DC path to ground" check);
    /// a capacitor is false, a resistor true.</summary>
    public bool ConductsDc { get; init; } = true;

    /// <summary>Pin pairs that are joined by an ideal voltage constraint (voltage sources), for the source-loop check.</summary>
    public bool IsVoltageSource { get; init; }

    /// <summary>True for a part that faces mains (a relay switching a named load, a mains-level source): a design with
    /// one prints the mains cautions.</summary>
    public Func<PartDefinition, bool> FacesMains { get; init; } = _ => false;

    /// <summary>Notes printed after the kind's parameter table in the part-kind reference (docs/part-kinds.md), e.g.
    /// a caution; null when none.</summary>
    public string? Notes { get; init; }

    /// <summary>Voltage from which a source counts as mains-level, V.</summary>
    public const double MainsVoltage = 50.0;

    /// <summary>Pins that must not all sit on one node: shorted together the part cannot work (a relay coil that can
    /// never carry current, a current source driving into itself). The loader makes that an error; any other part
    /// with every pin on one node gets a warning.</summary>
    public IReadOnlyList<string> PinsThatMustDiffer { get; init; } = [];
}
