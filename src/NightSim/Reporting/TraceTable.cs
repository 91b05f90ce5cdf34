namespace NightSim.Reporting;

/// <summary>
/// The column model behind trace.csv: one shared time base and named value columns of equal length.
/// </summary>
/// <param name="Origin">Clock time of run time 0 (site local, with offset).</param>
/// <param name="TimeZone">Site time zone for the clock column, or null to keep the origin's offset.</param>
/// <param name="Times">Run times, seconds, ascending.</param>
/// <param name="Names">Column names with units, e.g. "sens_volts", "illuminance_lux", "load_on" (1 while the load is on, else 0).</param>
/// <param name="Columns">Values in SI, one array per name, each as long as <paramref name="Times"/>. NaN is written as an empty cell.</param>
public sealed record TraceTable(
    DateTimeOffset Origin,
    TimeZoneInfo? TimeZone,
    double[] Times,
    IReadOnlyList<string> Names,
    IReadOnlyList<double[]> Columns)
{
    /// <summary>No rows and no columns (a study's run keeps no trace table).</summary>
    public static TraceTable Empty { get; } = new(DateTimeOffset.UnixEpoch, null, [], [], []);

    /// <summary>Throws <see cref="ArgumentException"/> when names and columns do not match or a column has the wrong length.</summary>
    public void Validate()
    {
        if (Names.Count != Columns.Count)
            throw new ArgumentException($"trace table has {Names.Count} names but {Columns.Count} columns");
        for (int i = 0; i < Columns.Count; i++)
        {
            if (Columns[i].Length != Times.Length)
                throw new ArgumentException(
                    $"trace column '{Names[i]}' has {Columns[i].Length} values but there are {Times.Length} times");
        }
    }
}
