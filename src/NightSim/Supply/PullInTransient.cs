namespace NightSim.Supply;

/// <summary>The rail and the relay coil through the relay's pull-in (or its attempt), recorded at every accepted point
/// of the run that drove the circuit into the relay-on state.</summary>
/// <param name="RelayId">The relay watched (the first one), or null without a relay.</param>
/// <param name="Start">Run time the drive began (the trigger press, or power-up without a timer), s.</param>
/// <param name="PullInTime">Run time the coil first reached pull-in after <paramref name="Start"/>, s; null if never.</param>
/// <param name="RailBefore">Mean rail over the last whole cycle before <paramref name="Start"/>, V (NaN from power-up).</param>
/// <param name="RailMin">Least rail voltage after <paramref name="Start"/>, V.</param>
/// <param name="CoilPeak">Largest coil voltage after <paramref name="Start"/>, V.</param>
/// <param name="PullIn">The coil's pull-in voltage, V.</param>
/// <param name="DropOut">The coil's drop-out voltage, V.</param>
/// <param name="Operations">Pull-ins and drop-outs after <paramref name="Start"/>.</param>
public sealed record PullInTransient(string? RelayId, double Start, double? PullInTime, double RailBefore, double RailMin, double CoilPeak,
    double PullIn, double DropOut, int Operations)
{
    /// <summary>Run times of the recorded points, s.</summary>
    public double[] Times { get; init; } = [];

    /// <summary>Rail voltage at those times, V.</summary>
    public double[] Rail { get; init; } = [];

    /// <summary>Coil voltage (coil current times coil resistance) at those times, V.</summary>
    public double[] Coil { get; init; } = [];

    /// <summary>Run times the armature pulled in (true) or dropped out (false).</summary>
    public IReadOnlyList<(double Time, bool Energised)> Changes { get; init; } = [];

    /// <summary>Sag from the rail before the drive to its least value, V.</summary>
    public double Sag => RailBefore - RailMin;
}
