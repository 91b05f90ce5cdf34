using NightSim.Inputs;
namespace NightSim.Netlist;

/// <summary>A netlist could not be loaded; carries every problem found.</summary>
public sealed class NetlistException : InputFileException
{
    public NetlistException(IReadOnlyList<NetlistError> errors)
        : base(errors.Count == 1 ? errors[0].ToString() : $"{errors.Count} problems in the netlist; first: {errors.FirstOrDefault()}")
    {
        Errors = errors;
    }

    /// <summary>Every problem, in file order.</summary>
    public IReadOnlyList<NetlistError> Errors { get; }

    public override IReadOnlyList<string> Lines => Errors.Select(e => e.ToString()).ToList();
}
