namespace NightSim.Netlist;

/// <summary>A validated netlist: what the loader hands to the engine. Immutable.</summary>
/// <param name="Name">Circuit name.</param>
/// <param name="Description">Optional free text.</param>
/// <param name="Parts">Parts in file order.</param>
/// <param name="SourceFile">Path as given by the user (for messages), or "" when built in code.</param>
public sealed record NetlistDefinition(string Name, string? Description, IReadOnlyList<PartDefinition> Parts, string SourceFile = "")
{
    /// <summary>The part with this id, or null.</summary>
    public PartDefinition? Part(string id) => Parts.FirstOrDefault(p => p.Id == id);

    /// <summary>A copy with one part's parameters replaced (sweeps and spreads).</summary>
    public NetlistDefinition WithPart(PartDefinition part) =>
        this with { Parts = Parts.Select(p => p.Id == part.Id ? part : p).ToList() };
}
