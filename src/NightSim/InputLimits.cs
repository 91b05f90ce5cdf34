namespace NightSim;

/// <summary>
/// Named limits on what one input may ask for, so a mistyped or hostile file is refused with a clear message (exit 2,
/// the limit named) instead of exhausting memory or running for days. Documented in README.md ("Troubleshooting").
/// </summary>
public static class InputLimits
{
    /// <summary>Largest input file read (netlist or scenario), bytes.</summary>
    public const long MaxInputBytes = 64L * 1024 * 1024;

    /// <summary>Largest report or study shard file read back (`compare`, `merge`), bytes.</summary>
    public const long MaxReportBytes = 1024L * 1024 * 1024;

    /// <summary>Most parts in one netlist.</summary>
    public const int MaxParts = 200_000;

    /// <summary>Most nodes in one netlist (ground not counted).</summary>
    public const int MaxNodes = 200_000;

    /// <summary>Most nights in one run (ten years).</summary>
    public const int MaxNights = 3660;

    /// <summary>Most light or noise events one event definition may produce in one night.</summary>
    public const int MaxEventsPerNight = 100_000;

    /// <summary>Largest light log, bytes.</summary>
    public const long MaxLightLogBytes = 64L * 1024 * 1024;

    /// <summary>Most rows in a light log.</summary>
    public const int MaxLightLogRows = 1_000_000;
}
