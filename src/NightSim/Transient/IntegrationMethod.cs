namespace NightSim.Transient;

/// <summary>Implicit integration formula of the transient solver.</summary>
public enum IntegrationMethod
{
    /// <summary>TR-BDF2 (γ = 2 − √2): L-stable, second order, one-step. The default.</summary>
    TrBdf2,
    /// <summary>Backward Euler: first order, L-stable; robust, damps heavily.</summary>
    BackwardEuler,
    /// <summary>Trapezoidal rule: second order, A-stable but not L-stable (rings after jumps). For tests.</summary>
    Trapezoidal,
}
