using NightSim.Results;

namespace NightSim.Supply;

/// <summary>A run of the supply budget failed numerically: when, where, and what to try (exit code 3 at the command line).</summary>
public sealed class SupplyRunException(SimulationFailure failure, double lux)
    : Exception($"the supply run at {lux:G3} lx on the sensors failed: {failure}")
{
    /// <summary>The solver's account of the failure.</summary>
    public SimulationFailure Failure { get; } = failure;
}
