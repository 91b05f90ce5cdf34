using NightSim.Netlist;
using NightSim.Inputs;

namespace NightSim.Runs;

/// <summary>The netlist and the scenario do not fit together (a coupling names a part that is not a switched load,
/// noise at a node the netlist does not have, …). Exit code 2 in the CLI.</summary>
public sealed class RunInputException : InputFileException
{
    public RunInputException(IReadOnlyList<string> lines) : base(string.Join(Environment.NewLine, lines)) => Lines = lines;

    public override IReadOnlyList<string> Lines { get; }
}
