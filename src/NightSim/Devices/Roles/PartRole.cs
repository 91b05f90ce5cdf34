namespace NightSim.Devices.Roles;

/// <summary>
/// What a part is to the analysis of a finished run, stated by the device itself: the analysis asks for roles and
/// never matches part kinds or parameter names. A new device kind states its role in its own file.
/// </summary>
/// <param name="PartId">Netlist part id.</param>
public abstract record PartRole(string PartId)
{
    /// <summary>The role in plain words for findings ("light sensor", "one-shot timer", "relay").</summary>
    public abstract string Title { get; }
}
