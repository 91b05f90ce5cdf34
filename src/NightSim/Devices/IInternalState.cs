namespace NightSim.Devices;

/// <summary>
/// A device that keeps part of its continuous state itself, outside the circuit's unknowns (a photoresistor's lagging
/// conductance). The error estimate cannot see that state, so the device bounds the step by how fast it changes; the
/// solver reads and sets it when it moves the whole state of the circuit at once (when it skips identical cycles of an
/// oscillation, docs/numerics.md §10). Allocation-free.
/// </summary>
public interface IInternalState
{
    /// <summary>The longest step from the last accepted point over which the device's own state changes by no more than
    /// <paramref name="change"/> in ln at its present rate, seconds (+∞: no bound).</summary>
    double InternalStepLimit(double change);

    /// <summary>Number of values (fixed for the run).</summary>
    int InternalStateCount { get; }

    /// <summary>The values at the last accepted point into <paramref name="into"/>.</summary>
    void ReadInternalState(Span<double> into);

    /// <summary>Set the values as at an accepted point at ctx.Time with the solution ctx.X.</summary>
    void WriteInternalState(ReadOnlySpan<double> from, LoadContext ctx);
}
