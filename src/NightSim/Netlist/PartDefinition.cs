namespace NightSim.Netlist;

/// <summary>Where something stands in an input file, for messages.</summary>
/// <param name="File">Path as given by the user.</param>
/// <param name="JsonPath">JSON path, e.g. "$.parts[3].value".</param>
/// <param name="Line">1-based line, 0 if unknown.</param>
/// <param name="Column">1-based column, 0 if unknown.</param>
public sealed record SourceLocation(string File, string JsonPath, int Line, int Column)
{
    public override string ToString() => Line > 0 ? $"{File}:{Line}:{Column} ({JsonPath})" : $"{File} ({JsonPath})";
}

/// <summary>One validated part of a netlist: id, kind, pin → node map and typed parameters.</summary>
/// <param name="Id">Part id, unique in the netlist ("R1", "U1").</param>
/// <param name="Kind">Catalogue kind ("resistor", "timer-555", …).</param>
/// <param name="Pins">Pin name → node name; ground is always "gnd".</param>
/// <param name="Parameters">Typed SI parameters with defaults applied.</param>
/// <param name="Location">Where the part is written, for messages.</param>
public sealed record PartDefinition(
    string Id,
    string Kind,
    IReadOnlyDictionary<string, string> Pins,
    PartParameters Parameters,
    SourceLocation? Location = null)
{
    /// <summary>The node a pin connects to.</summary>
    public string Node(string pin) => Pins[pin];
}
