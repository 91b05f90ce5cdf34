namespace NightSim.Analysis;

/// <summary>How much a finding matters to the builder.</summary>
public enum Severity
{
    /// <summary>Worth knowing; nothing to fix.</summary>
    Info,
    /// <summary>Works here, but with little margin or an unwanted behaviour on some nights.</summary>
    Warning,
    /// <summary>Does not do the job (never ends, never switches, switches in daylight, exceeds a rating).</summary>
    Error,
}
