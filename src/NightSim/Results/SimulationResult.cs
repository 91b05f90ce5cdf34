namespace NightSim.Results;

/// <summary>Everything one transient run produced. Immutable.</summary>
public sealed class SimulationResult
{
    public SimulationResult(
        IReadOnlyList<Trace> traces,
        IReadOnlyList<DiscreteEvent> events,
        SolverStatistics statistics,
        double stopTime,
        DateTimeOffset? origin,
        SimulationFailure? failure)
    {
        Traces = traces;
        Events = events;
        Statistics = statistics;
        StopTime = stopTime;
        Origin = origin;
        Failure = failure;
    }

    /// <summary>Recorded traces, in the order asked for.</summary>
    public IReadOnlyList<Trace> Traces { get; }

    /// <summary>Discrete state changes in time order.</summary>
    public IReadOnlyList<DiscreteEvent> Events { get; }

    /// <summary>Solver statistics.</summary>
    public SolverStatistics Statistics { get; }

    /// <summary>Run time reached, seconds (the requested stop time unless the run failed).</summary>
    public double StopTime { get; }

    /// <summary>Clock time of run time 0 when the run had a light signal; null otherwise.</summary>
    public DateTimeOffset? Origin { get; }

    /// <summary>Why the run stopped early, or null when it completed.</summary>
    public SimulationFailure? Failure { get; }

    /// <summary>True when the run was stopped from outside (a cancellation token) before its stop time;
    /// <see cref="StopTime"/> is then the last accepted point.</summary>
    public bool Interrupted { get; init; }

    /// <summary>True when the run reached its stop time.</summary>
    public bool Succeeded => Failure is null && !Interrupted;

    /// <summary>The trace of a node or branch label, or null.</summary>
    public Trace? Trace(string name) => Traces.FirstOrDefault(t => t.Name == name);
}
