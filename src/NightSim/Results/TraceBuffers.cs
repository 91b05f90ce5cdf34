namespace NightSim.Results;

/// <summary>
/// Storage a <see cref="TraceRecorder"/> may take over from the run before it on the same thread, so that the runs of a
/// study do not each allocate their trace store (several megabytes a night). The traces of a run that used these buffers
/// are valid only until the next run that uses them starts: a study reduces each run to its outcome first. Not
/// thread-safe: one per worker thread.
/// </summary>
public sealed class TraceBuffers
{
    internal double[][] Times = [];
    internal double[][] Values = [];
    internal double[] RowTimes = [];
    internal double[][] RowValues = [];

    /// <summary>Arrays of exactly <paramref name="length"/> for <paramref name="count"/> signals, from the last run when
    /// they fit, else new.</summary>
    internal static double[][] Take(ref double[][] kept, int count, int length)
    {
        if (kept.Length != count || (count > 0 && kept[0].Length != length))
        {
            kept = new double[count][];
            for (int s = 0; s < count; s++) kept[s] = new double[length];
        }
        return kept;
    }
}
