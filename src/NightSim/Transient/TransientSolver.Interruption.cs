namespace NightSim.Transient;

/// <summary>Stopping a run from outside (Ctrl+C, SIGTERM, a caller's time box): the step loop checks a token before
/// every step and every retry; the run then ends at its last accepted point with <see cref="Results.SimulationResult.Interrupted"/>.</summary>
public sealed partial class TransientSolver
{
    private CancellationToken _cancellation;
    private bool _interrupted;

    /// <summary>Token checked before every step attempt (a field read, no allocation). Set before <see cref="Run(double)"/>.</summary>
    public CancellationToken Cancellation
    {
        get => _cancellation;
        set => _cancellation = value;
    }

    /// <summary>True (and remembered) once the token asks the run to stop.</summary>
    private bool StopRequested()
    {
        if (_cancellation.IsCancellationRequested) _interrupted = true;
        return _interrupted;
    }
}
