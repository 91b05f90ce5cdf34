using NightSim.Devices;

namespace NightSim.Transient;

/// <summary>
/// Envelope following for circuits driven by one periodic source (a mains sine): full-detail cycles are simulated, the
/// per-cycle change of the state is measured at the cycle boundaries, and the run jumps many cycles forward along that
/// change (Petzold, "An efficient numerical method for highly oscillatory ordinary differential equations", SIAM J.
/// Numer. Anal. 18(3), 1981: the envelope x(t_k) of a strongly periodic solution is smooth in k and can be integrated
/// with steps of many periods).
/// </summary>
/// <remarks>
/// The envelope step is explicit (x_{k+m} = x_k + m·Δ, Δ the mean change per cycle over the last two cycles) and held to
/// three limits: the curvature of the envelope (m²/2·|x_k − 2x_{k−1} + x_{k−2}| within the envelope tolerance), the size
/// of the change (m·|Δ| within <see cref="TransientOptions.EnvelopeMaxChange"/> of each state's scale — its largest |x|
/// over the last cycle plus 1 V or 1 mA — so a state that is still
/// relaxing is never thrown far), and the events: the value of every event function closest to its threshold in each
/// cycle is extrapolated and the jump ends at most half way to its predicted crossing. A jump never crosses a
/// breakpoint (light events, source corners, schedules) and never starts before the circuit has run
/// <see cref="TransientOptions.EnvelopeDetailWindow"/> of full detail after power-up, any event (a relay operation, a
/// comparator flip) or any breakpoint, so ripple and sag around them are the real waveform. After a jump the solver
/// restarts with a backward-Euler step, which settles the algebraic unknowns on the extrapolated states.
/// </remarks>
public sealed partial class TransientSolver
{
    /// <summary>Per-cycle ratio of successive changes below which a state counts as settling, not drifting.</summary>
    private const double SettlingRatio = 0.9;

    private double _envPeriod;
    private double _envOrigin;
    private double[] _envX0 = [], _envX1 = [], _envX2 = [];
    private double[] _envNear = [], _envNear1 = [], _envNear2 = [];
    private double[] _envCandidate = [], _envG = [], _envSlope = [];
    private bool[] _envSettling = [];
    private double[] _envAmp = [], _envAmp1 = [];  // largest |x| in the running cycle and in the last complete one
    private int _envCycles;            // boundaries recorded since the last disturbance
    private double _envQuietSince;     // time of the last disturbance
    private bool _envSuppressBoundary; // NextBreakpoint without the cycle boundaries
    private long _envLastBoundary = long.MinValue;
    private long _envEventsSeen;

    /// <summary>Set up envelope following when the options ask for it and every periodic source shares one frequency.</summary>
    private void SetUpEnvelope()
    {
        if (!_options.EnvelopeFollowing) return;
        double f = 0, origin = 0;
        foreach (Device d in _devices)
        {
            Waveform? w = d switch { VoltageSource v => v.Waveform, CurrentSource c => c.Waveform, _ => null };
            if (w is null || w.SineFrequency <= 0) continue;
            if (f > 0 && Math.Abs(w.SineFrequency - f) > 1e-9 * f) return; // two frequencies: no common period
            f = w.SineFrequency;
            origin = w.SineStart;
        }
        if (f <= 0) return;
        _envPeriod = 1.0 / f;
        _envOrigin = origin;
        _envX0 = new double[_n];
        _envX1 = new double[_n];
        _envX2 = new double[_n];
        _envCandidate = new double[_n];
        _envSlope = new double[_n];
        _envSettling = new bool[_n];
        _envAmp = new double[_n];
        _envAmp1 = new double[_n];
        int ne = _eventSource.Length;
        _envNear = new double[ne];
        _envNear1 = new double[ne];
        _envNear2 = new double[ne];
        _envG = new double[ne];
        Array.Fill(_envNear, double.PositiveInfinity);
        _envQuietSince = 0;
    }

    /// <summary>The first cycle boundary strictly after t + tiny, or +∞ when envelope following is off.</summary>
    private double EnvelopeBoundaryAfter(double t, double tiny)
    {
        if (_envPeriod <= 0 || _envSuppressBoundary) return double.PositiveInfinity;
        double k = Math.Floor((t + tiny - _envOrigin) / _envPeriod) + 1.0;
        double b = _envOrigin + k * _envPeriod;
        if (b <= t + tiny) b += _envPeriod;
        return b;
    }

    /// <summary>Index of the cycle boundary at t, or -1 when t is not on one.</summary>
    private long BoundaryIndex(double t)
    {
        double k = Math.Round((t - _envOrigin) / _envPeriod);
        if (k < 1) return -1;
        double b = _envOrigin + k * _envPeriod;
        return Math.Abs(t - b) <= 1e-9 * _envPeriod + 4.0 * (Math.BitIncrement(Math.Abs(t)) - Math.Abs(t)) ? (long)k : -1;
    }

    /// <summary>
    /// After each accepted point: track each event function's value nearest its threshold in this cycle, note
    /// disturbances (events fired, landings on breakpoints that are not cycle boundaries), and at a boundary shift the
    /// stored boundary states.
    /// </summary>
    private void EnvelopeObserve(bool landed)
    {
        if (_envPeriod <= 0) return;
        double t = _time.Value;
        for (int e = 0; e < _envNear.Length; e++)
            if (Math.Abs(_gOld[e]) < Math.Abs(_envNear[e])) _envNear[e] = _gOld[e];
        for (int i = 0; i < _n; i++)
            if (Math.Abs(_x[i]) > _envAmp[i]) _envAmp[i] = Math.Abs(_x[i]);
        long k = landed ? BoundaryIndex(t) : -1;
        if (_stats.Events != _envEventsSeen || (landed && k < 0))
        {
            _envEventsSeen = _stats.Events;
            _envCycles = 0;
            _envQuietSince = t;
        }
        if (k < 0 || k == _envLastBoundary) return;
        _envLastBoundary = k;
        (_envX0, _envX1, _envX2) = (_envX2, _envX0, _envX1); // X0 ← newest, X1 ← previous, X2 ← the one before
        Array.Copy(_x, _envX0, _n);
        (_envNear2, _envNear1, _envNear) = (_envNear1, _envNear, _envNear2);
        Array.Fill(_envNear, double.PositiveInfinity);
        (_envAmp1, _envAmp) = (_envAmp, _envAmp1);
        Array.Clear(_envAmp);
        _envCycles++;
    }

    /// <summary>
    /// At a cycle boundary after enough quiet full-detail cycles: jump m cycles forward along the envelope when the
    /// limits allow m ≥ 2. Returns true when it jumped.
    /// </summary>
    private bool TryEnvelopeJump()
    {
        if (_envPeriod <= 0 || _envCycles < 3 || _needRestart) return false;
        double t = _time.Value;
        if (BoundaryIndex(t) != _envLastBoundary) return false;
        if (t - _envQuietSince < _options.EnvelopeDetailWindow) return false;
        double T = _envPeriod;

        // Room before the next breakpoint (two full cycles are kept before it) and the stop time.
        _envSuppressBoundary = true;
        double tiny = 4.0 * (Math.BitIncrement(Math.Max(Math.Abs(t), 1e-300)) - Math.Abs(t)) + 1e-15;
        double bp = NextBreakpoint(t);
        _envSuppressBoundary = false;
        double room = Math.Min(bp - 2.0 * T, _stop) - t - tiny;
        double m = Math.Floor(Math.Min(room, _options.EnvelopeMaxJump) / T);

        double rtol = _options.EnvelopeTolerance;
        double maxChange = _options.EnvelopeMaxChange;
        for (int i = 0; i < _n; i++)
        {
            double d1 = _envX0[i] - _envX1[i], d2 = _envX1[i] - _envX2[i];
            // A state whose per-cycle change shrinks by 10 % or more each cycle (or flips sign) is settling onto the
            // periodic solution: it is carried at its last boundary value plus the rest of its geometric decay
            // d1·ρ/(1 − ρ), and does not limit the jump. Every other state drifts and is extrapolated linearly.
            double rho = d2 != 0 ? d1 / d2 : 0.0;
            _envSettling[i] = rho < SettlingRatio;
            _envSlope[i] = _envSettling[i] ? (rho > 0 ? d1 * rho / (1.0 - rho) : 0.0) : 0.5 * (d1 + d2);
            if (_envSettling[i] || !_inNorm[i] || m < 2) continue;
            double slope = _envSlope[i];
            // Scale: the largest |x| over the last cycle (a node that swings with the mains is held to its swing, as the
            // step control holds it within each step) plus 1 V or 1 mA.
            double scale = Math.Max(_envAmp1[i], Math.Abs(_envX0[i])) + (_circuit.Kinds[i] == Mna.UnknownKind.Branch ? 1e-3 : 1.0);
            // A second difference within the step control's own tolerance (rtol·scale per step, summed over a cycle's
            // differing step pattern) is noise of the full-detail cycles, not curvature of the envelope.
            double curvature = Math.Max(0.0, Math.Abs(d1 - d2) - 10.0 * (_options.RelativeTolerance * scale + _atol[i]));
            double mc = curvature > 0 ? Math.Floor(Math.Sqrt(2.0 * rtol * scale / curvature)) : double.PositiveInfinity;
            m = Math.Min(m, mc);
            double ms = slope != 0 ? Math.Floor(maxChange * scale / Math.Abs(slope)) : double.PositiveInfinity;
            m = Math.Min(m, ms);
        }
        for (int e = 0; e < _envNear.Length && m >= 2; e++)
        {
            double now = _envNear1[e], before = _envNear2[e];
            if (!double.IsFinite(now) || !double.IsFinite(before)) return false;
            double step = now - before;
            if (step == 0 || Math.Sign(step) == Math.Sign(now)) continue; // moving away from its threshold
            double cycles = Math.Abs(now / step);
            m = Math.Min(m, Math.Floor(0.5 * cycles));
        }
        if (m < 2) return false;

        // Candidate state; refuse (and shorten) when any event function would already have changed sign.
        for (int attempt = 0; attempt < 4 && m >= 2; attempt++)
        {
            for (int i = 0; i < _n; i++) _envCandidate[i] = _envX0[i] + (_envSettling[i] ? _envSlope[i] : m * _envSlope[i]);
            double tNew = _envOrigin + (_envLastBoundary + m) * T;
            EvaluateEvents(_envCandidate, tNew, _envG, _gOld);
            if (AnyFlip(_gOld, _envG))
            {
                m = Math.Floor(m / 4);
                continue;
            }
            Jump(tNew, (long)m);
            return true;
        }
        return false;
    }

    private void Jump(double tNew, long cycles)
    {
        Array.Copy(_envCandidate, _x, _n);
        _time.Set(tNew);
        Evaluate(_x, tNew);
        Array.Copy(_ctx.Q, _q, _n);
        for (int i = 0; i < _n; i++) _qd[i] = 0;
        Array.Copy(_x, _ctx.X, _n);
        _ctx.Time = tNew;
        foreach (Device d in _devices) d.Accept(_ctx);
        RecordPoint(keepRow: true);
        EvaluateEvents(_x, tNew, _gNew, _gOld);
        Array.Copy(_gNew, _gOld, _gOld.Length);
        _envLastBoundary += cycles;
        _stats.EnvelopeJumps++;
        _stats.SkippedCycles += cycles;
        // The boundary states before the jump no longer describe the neighbourhood: start measuring again, and let the
        // first cycle after the jump (the restart settling the fast states) pass unmeasured.
        _envCycles = -1;
        Array.Fill(_envNear, double.PositiveInfinity);
        _needRestart = true;
        _havePrev = false;
        _h = _options.RestartStep;
        Accepted?.Invoke(this);
    }
}
