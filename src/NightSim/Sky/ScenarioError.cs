using NightSim.Inputs;
namespace NightSim.Sky;

/// <summary>One problem found in a scenario or light-log file.</summary>
/// <param name="File">File name as given (or "(text)").</param>
/// <param name="Path">JSON path such as "$.events[2].peakLux", or a CSV location such as "line 14".</param>
/// <param name="Message">What is wrong.</param>
/// <param name="Hint">How to fix it, or null.</param>
/// <param name="Line">1-based line, or 0 when unknown.</param>
/// <param name="Column">1-based column, or 0 when unknown.</param>
public sealed record ScenarioError(string File, string Path, string Message, string? Hint = null, int Line = 0, int Column = 0)
{
    /// <summary>"file:line:column: error at path: message. hint: …" (the file as given, as netlist errors are).</summary>
    public override string ToString()
    {
        string where = Line > 0 ? $"{File}:{Line}:{Column}" : File;
        string hint = string.IsNullOrEmpty(Hint) ? "" : $". hint: {Hint}";
        return $"{where}: error at {Path}: {Message}{hint}";
    }
}

/// <summary>Thrown when a scenario cannot be used; carries every problem found, not only the first.</summary>
public sealed class ScenarioException : Inputs.InputFileException
{
    public ScenarioException(IReadOnlyList<ScenarioError> errors)
        : base(string.Join(Environment.NewLine, errors.Select(e => e.ToString()))) => Errors = errors;

    /// <inheritdoc />
    public override IReadOnlyList<string> Lines => [.. Errors.Select(e => e.ToString())];

    /// <summary>All problems, in file order.</summary>
    public IReadOnlyList<ScenarioError> Errors { get; }
}
