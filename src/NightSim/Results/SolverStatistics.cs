namespace NightSim.Results;

/// <summary>What the transient solver did in one run.</summary>
public sealed class SolverStatistics
{
    /// <summary>Accepted time steps.</summary>
    public long AcceptedSteps { get; internal set; }

    /// <summary>Steps rejected by the error test or by a Newton failure.</summary>
    public long RejectedSteps { get; internal set; }

    /// <summary>Of the rejected steps, those rejected because Newton did not converge.</summary>
    public long NewtonFailures { get; internal set; }

    /// <summary>Newton iterations (one linear solve each).</summary>
    public long NewtonIterations { get; internal set; }

    /// <summary>Steps accepted at the smallest step although the error test failed (time resolution late in very long
    /// runs, or an edge sharper than h_min); 0 in a healthy run.</summary>
    public long ForcedSteps { get; internal set; }

    /// <summary>Newton corrections scaled down by the damping of retries after a failed step.</summary>
    public long DampedIterations { get; internal set; }

    /// <summary>Times a failing step was rescued by pseudo-transient continuation (a temporary node capacitance).</summary>
    public long Continuations { get; internal set; }

    /// <summary>Numeric LU factorisations.</summary>
    public long Factorizations { get; internal set; }

    /// <summary>Pivot-order choices (first analysis and re-pivots).</summary>
    public long PivotAnalyses { get; internal set; }

    /// <summary>Discrete events fired.</summary>
    public long Events { get; internal set; }

    /// <summary>Envelope jumps taken (envelope following only).</summary>
    public long EnvelopeJumps { get; internal set; }

    /// <summary>Periods of the periodic source skipped by envelope jumps.</summary>
    public long SkippedCycles { get; internal set; }

    /// <summary>Windows of full mains detail a cycle-averaged supply run entered (power-up included; 0 when the run was
    /// in full detail throughout).</summary>
    public long MainsDetailWindows { get; internal set; }

    /// <summary>Simulated time the mains supply ran cycle-averaged, seconds.</summary>
    public double MainsAveragedSeconds { get; internal set; }

    /// <summary>Jumps over identical cycles of an oscillation (docs/numerics.md §10).</summary>
    public long OscillationJumps { get; internal set; }

    /// <summary>Oscillation cycles skipped by those jumps (their events are written, their steps are not taken).</summary>
    public long SkippedOscillationCycles { get; internal set; }

    /// <summary>Breakpoints landed on exactly.</summary>
    public long Breakpoints { get; internal set; }

    /// <summary>Smallest accepted step, seconds (0 when no step was taken).</summary>
    public double MinStep { get; internal set; }

    /// <summary>Largest accepted step, seconds.</summary>
    public double MaxStep { get; internal set; }

    /// <summary>Processor time spent in the run, seconds.</summary>
    public double CpuSeconds { get; internal set; }

    /// <summary>Bytes allocated on the solver's thread from accepted step <see cref="SteadyFromStep"/> to the end of the
    /// run (the step loop, the accepted-point callback and event firing; not setup or result building).</summary>
    public long SteadyAllocatedBytes { get; internal set; }

    /// <summary>Accepted steps over which <see cref="SteadyAllocatedBytes"/> was counted.</summary>
    public long SteadySteps { get; internal set; }

    /// <summary>Accepted step from which allocation is counted (buffers sized on first use are in place by then).</summary>
    public const long SteadyFromStep = 200;

    /// <summary>Allocated bytes per accepted step after <see cref="SteadyFromStep"/>; 0 when the run was shorter.</summary>
    public double AllocatedBytesPerStep => SteadySteps > 0 ? SteadyAllocatedBytes / (double)SteadySteps : 0.0;

    internal void NoteStep(double h)
    {
        AcceptedSteps++;
        if (MinStep == 0 || h < MinStep) MinStep = h;
        if (h > MaxStep) MaxStep = h;
    }
}
