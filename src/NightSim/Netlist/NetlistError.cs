using System.Text;

namespace NightSim.Netlist;

/// <summary>One problem found in an input file, with where it stands and what to do about it.</summary>
/// <param name="File">Path as given by the user.</param>
/// <param name="Line">1-based line, 0 if unknown.</param>
/// <param name="Column">1-based column, 0 if unknown.</param>
/// <param name="JsonPath">JSON path, e.g. "$.parts[2].value".</param>
/// <param name="PartId">Id of the part concerned, or null.</param>
/// <param name="Message">What is wrong (no trailing full stop).</param>
/// <param name="Hint">What to try, or null.</param>
public sealed record NetlistError(string File, int Line, int Column, string JsonPath, string? PartId, string Message, string? Hint)
{
    /// <summary>True for a warning (the file is still usable).</summary>
    public bool IsWarning { get; init; }

    /// <summary>"file:line:col: error at $.parts[2].value (part R3): message. hint: …"</summary>
    public override string ToString()
    {
        var sb = new StringBuilder();
        sb.Append(File);
        if (Line > 0) sb.Append(':').Append(Line).Append(':').Append(Column);
        sb.Append(": ").Append(IsWarning ? "warning" : "error").Append(" at ").Append(JsonPath);
        if (!string.IsNullOrEmpty(PartId)) sb.Append(" (part ").Append(PartId).Append(')');
        sb.Append(": ").Append(Message);
        if (!string.IsNullOrEmpty(Hint)) sb.Append(". hint: ").Append(Hint);
        return sb.ToString();
    }
}
