namespace NightSim.Analysis;

/// <summary>
/// One plain-language finding about a run: what happened, with the numbers, and the usual fix.
/// </summary>
/// <param name="Severity">How much it matters.</param>
/// <param name="Code">Stable identifier, e.g. "timer-never-ends", "false-trigger-headlight", "relay-chatter".</param>
/// <param name="Message">What happened, with numbers and clock times, in plain words.</param>
/// <param name="Fix">The usual fix, or null.</param>
/// <param name="At">Clock time the finding refers to, or null for the whole run.</param>
/// <param name="Part">Netlist part the finding is about, or null.</param>
public sealed record Finding(Severity Severity, string Code, string Message, string? Fix = null, DateTimeOffset? At = null, string? Part = null);
