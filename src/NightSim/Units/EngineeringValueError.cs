namespace NightSim.Units;

/// <summary>Why a value could not be read, and what to write instead.</summary>
/// <param name="Message">What is wrong, quoting the value.</param>
/// <param name="Hint">What to write instead.</param>
public sealed record EngineeringValueError(string Message, string Hint)
{
    public override string ToString() => $"{Message}; {Hint}";
}
