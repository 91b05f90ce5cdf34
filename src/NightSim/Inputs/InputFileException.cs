namespace NightSim.Inputs;

/// <summary>
/// Base of every "the input file is wrong" failure (netlist, scenario, …). The CLI turns it into exit code 2 and prints
/// <see cref="Lines"/> on stderr, never a stack trace.
/// </summary>
public abstract class InputFileException : Exception
{
    protected InputFileException(string message) : base(message) { }

    /// <summary>One line per problem, ready to print.</summary>
    public abstract IReadOnlyList<string> Lines { get; }
}
