namespace NightSim.Results;

/// <summary>Why a run stopped early: when, which unknowns would not settle, and what to try.</summary>
/// <param name="Time">Run time of the failure, seconds.</param>
/// <param name="Reason">What went wrong, in plain words.</param>
/// <param name="WorstNodes">Unknowns (node names or branch labels) with the largest Newton corrections, worst first.</param>
/// <param name="Hint">What to try.</param>
public sealed record SimulationFailure(double Time, string Reason, IReadOnlyList<string> WorstNodes, string Hint)
{
    /// <summary>Value of each of <see cref="WorstNodes"/> at the last accepted point (V on nodes, A on branches).</summary>
    public IReadOnlyList<double> WorstValues { get; init; } = [];

    /// <summary>Netlist part ids connected to the worst nodes, in netlist order.</summary>
    public IReadOnlyList<string> Parts { get; init; } = [];

    /// <summary>One message for the terminal.</summary>
    public override string ToString() =>
        $"simulation failed at t = {Time.ToString("G6", System.Globalization.CultureInfo.InvariantCulture)} s: {Reason}" +
        (WorstNodes.Count > 0 ? $" (worst: {string.Join(", ", WorstNodes)})" : "") + $". {Hint}";
}
