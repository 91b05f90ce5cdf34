namespace NightSim.Transient;

/// <summary>How an accepted step ended; decides how the next one starts (<c>TransientSolver.ContinueAfter</c>).</summary>
internal enum StepEnd
{
    /// <summary>An ordinary point: the controller's proposal is the next step.</summary>
    Smooth,
    /// <summary>Landed on a breakpoint where the sources are smooth: the next step is sized to the next breakpoint.</summary>
    Landed,
    /// <summary>Landed on an ideal source edge: x is inconsistent just after it, so the next step is a restart.</summary>
    SourceJump,
    /// <summary>Discrete events fired at the point: the next step is a restart.</summary>
    EventsFired,
}
