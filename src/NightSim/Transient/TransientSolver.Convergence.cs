namespace NightSim.Transient;

/// <summary>
/// Convergence aids at a failing step (docs/numerics.md §6): damped Newton on the retries, then pseudo-transient
/// continuation with a small capacitance on every node that has none of its own.
/// </summary>
/// <remarks>
/// <para><b>Damped Newton.</b> After a failed step, the retries scale each Newton correction so that no node voltage
/// moves by more than <see cref="TransientOptions.NewtonVoltageStepLimit"/> in one iteration (the direction is kept:
/// a damped Newton step, P. Deuflhard, <i>Newton Methods for Nonlinear Problems</i>, Springer 2004, ch. 3). Junction
/// voltages are limited in every iteration anyway, logarithmically above the critical voltage (L. W. Nagel, PhD thesis,
/// Memorandum No. ERL-M520, University of California, Berkeley, 1975).</para>
/// <para><b>Pseudo-transient continuation.</b> A node without capacitance is an algebraic unknown. In a regenerative
/// stage (two transistors with positive feedback, a latch) the algebraic equations fold over where the stage switches:
/// past the fold there is no nearby solution for Newton to find at any step size. When the step has shrunk to its
/// minimum without converging, every such node gets <see cref="TransientOptions.ContinuationCapacitance"/> to ground for
/// a short stretch of steps. The term α·C then grows without bound as h shrinks, so Newton converges at small steps
/// and the jump becomes a fast transient the steps follow (C. T. Kelley and D. E. Keyes, "Convergence analysis of
/// pseudo-transient continuation", SIAM J. Numer. Anal. 35(2), 508–523, 1998; the step is the pseudo time). Real nodes
/// carry at least that much wiring capacitance (common practice: a picofarad or so per node). The capacitance is taken
/// away again once the steps have grown past <see cref="TransientOptions.ContinuationEndStep"/> or after
/// <see cref="ContinuationSteps"/> accepted steps; it is never part of the error norm, and it is not there in steady
/// running: left on a relay coil's node it would form a high-Q tank with the coil.</para>
/// </remarks>
public sealed partial class TransientSolver
{
    /// <summary>Accepted steps after which the continuation capacitance is taken away in any case.</summary>
    private const int ContinuationSteps = 400;

    /// <summary>Per unknown: true for a node without device charge (found once, at the start state).</summary>
    private bool[]? _chargeFreeNode;

    /// <summary>True while the continuation capacitance is on.</summary>
    private bool _continuation;

    /// <summary>Accepted steps since the continuation capacitance went on.</summary>
    private int _continuationAccepted;

    /// <summary>True while the retries at a point after a Newton failure use damped corrections.</summary>
    private bool _damped;

    /// <summary>Mark the nodes without charge of their own (call after an evaluation at the start state).</summary>
    private void FindChargeFreeNodes()
    {
        var hasCharge = new bool[_n];
        for (int s = 0; s < _slotRow.Length; s++)
            if (_ctx.C[s] != 0.0) hasCharge[_slotRow[s]] = true;
        var rows = new bool[_n];
        int[] diag = _circuit.NodeDiagonal;
        for (int i = 0; i < _n; i++) rows[i] = diag[i] >= 0 && !hasCharge[i];
        _chargeFreeNode = rows;
    }

    /// <summary>Add the continuation capacitance to Q and C while it is on (called from every evaluation).</summary>
    private void AddContinuationCapacitance()
    {
        if (!_continuation || _chargeFreeNode is not { } rows) return;
        double c0 = _options.ContinuationCapacitance;
        int[] diag = _circuit.NodeDiagonal;
        double[] x = _ctx.X, q = _ctx.Q, c = _ctx.C;
        for (int i = 0; i < _n; i++)
        {
            if (!rows[i]) continue;
            q[i] += c0 * x[i];
            c[diag[i]] += c0;
        }
    }

    /// <summary>
    /// Switch the continuation capacitance on at a failing point: the charge history of the accepted point gains it and
    /// the next step is a backward-Euler restart. False when it is already on, switched off or there is nothing to add.
    /// </summary>
    private bool StartContinuation()
    {
        if (_continuation || !(_options.ContinuationCapacitance > 0) || _chargeFreeNode is not { } rows) return false;
        if (Array.IndexOf(rows, true) < 0) return false;
        _continuation = true;
        _continuationAccepted = 0;
        ShiftChargeHistory(rows, _options.ContinuationCapacitance);
        _stats.Continuations++;
        return true;
    }

    /// <summary>Count an accepted step; take the capacitance away once the steps have grown or enough have passed.</summary>
    private void NoteContinuationStep(double h)
    {
        if (!_continuation) return;
        if (++_continuationAccepted < ContinuationSteps && h < _options.ContinuationEndStep) return;
        _continuation = false;
        ShiftChargeHistory(_chargeFreeNode!, -_options.ContinuationCapacitance);
        // The nodes are algebraic again: settle them with a backward-Euler restart.
        _needRestart = true;
        _havePrev = false;
        _h = Math.Min(_h, _options.FixedStep ?? _options.RestartStep);
    }

    private void ShiftChargeHistory(bool[] rows, double c0)
    {
        for (int i = 0; i < _n; i++)
        {
            if (!rows[i]) continue;
            _q[i] += c0 * _x[i];
            _qd[i] = 0.0;
        }
    }

    /// <summary>
    /// Scale the Newton correction in _rhs so that no node voltage moves by more than the limit (damped retries only).
    /// </summary>
    private void DampCorrection()
    {
        if (!_damped) return;
        double limit = _options.NewtonVoltageStepLimit;
        if (!(limit > 0)) return;
        int[] diag = _circuit.NodeDiagonal;
        double worst = 0;
        for (int i = 0; i < _n; i++)
            if (diag[i] >= 0) worst = Math.Max(worst, Math.Abs(_rhs[i]));
        if (!(worst > limit)) return;
        double f = limit / worst;
        for (int i = 0; i < _n; i++) _rhs[i] *= f;
        _stats.DampedIterations++;
    }
}
