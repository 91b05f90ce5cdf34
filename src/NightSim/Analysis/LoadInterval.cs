namespace NightSim.Analysis;

/// <summary>One interval with the load energised.</summary>
/// <param name="Start">Clock time it switched on (site local time with offset).</param>
/// <param name="End">Clock time it switched off; null when still on at the end of the run.</param>
/// <param name="DurationSeconds">On-time in seconds (to the end of the run when <paramref name="End"/> is null).</param>
/// <param name="Cause">What switched it on.</param>
/// <param name="Expected">True for the one intended dusk switch-on of the night.</param>
/// <param name="Explanation">The cause in plain words, e.g. "headlight at 23:41:07, 40 lx at the sensor for 4 s".</param>
/// <param name="EndedBy">What ended it in plain words ("timer ran out", "reset by daylight", "supply sag", "end of run").</param>
public sealed record LoadInterval(
    DateTimeOffset Start,
    DateTimeOffset? End,
    double DurationSeconds,
    LoadCause Cause,
    bool Expected,
    string Explanation,
    string EndedBy)
{
    /// <summary>0 for a real interval; for a table row that stands for several folded intervals, how many (its
    /// start is the first one's, its end the last one's, its duration their total on-time).</summary>
    public int Folded { get; init; }
}
