using NightSim.Results;
using NightSim.Runs;

namespace NightSim.Studies;

/// <summary>
/// What the night runs of a study reuse on each worker thread: the trace store (a night's is several megabytes), and the
/// request flag that leaves out the trace table, plot data and zoom windows no study reads (a study keeps each run's
/// <see cref="StudyOutcome"/> only, made before the thread's next run starts).
/// </summary>
public sealed class StudyRunBuffers
{
    private readonly ThreadLocal<TraceBuffers> _traces = new(() => new TraceBuffers());

    /// <summary><paramref name="request"/> as a study's run on the calling thread.</summary>
    public NightRunRequest ForThisThread(NightRunRequest request) =>
        request with { SummaryOnly = true, TraceBuffers = _traces.Value };
}
