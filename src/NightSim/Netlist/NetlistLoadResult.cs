namespace NightSim.Netlist;

/// <summary>Outcome of reading a netlist: the definition when valid, and every error and warning found.</summary>
/// <param name="Definition">The validated netlist, or null when there are errors.</param>
/// <param name="Errors">Every error, in file order.</param>
/// <param name="Warnings">Warnings (the netlist is still usable).</param>
public sealed record NetlistLoadResult(NetlistDefinition? Definition, IReadOnlyList<NetlistError> Errors, IReadOnlyList<NetlistError> Warnings)
{
    /// <summary>True when the netlist loaded without errors.</summary>
    public bool IsValid => Definition is not null && Errors.Count == 0;
}
