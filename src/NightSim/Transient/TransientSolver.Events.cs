using NightSim.Results;

namespace NightSim.Transient;

/// <summary>Event location and firing (docs/numerics.md §5): sign changes of event functions between accepted points.</summary>
public sealed partial class TransientSolver
{
    private const double MachineEpsilon = 2.220446049250313e-16;
    private double[] _xDense = [];
    // Event location: values at the bracket ends (real and Illinois-scaled) and the solution at the crossed end.
    private double[] _gLo = [], _gHi = [], _gLoS = [], _gHiS = [];
    private double[] _xHi = [], _qHi = [], _qdHi = [];

    /// <summary>
    /// Event values at (x, t) into <paramref name="g"/>. An exact zero counts as having crossed: it is stored as a
    /// tiny value of the sign opposite to <paramref name="reference"/>, so a function resting on its threshold
    /// fires once and not again.
    /// </summary>
    private void EvaluateEvents(double[] x, double time, double[] g, double[] reference)
    {
        if (!ReferenceEquals(x, _ctx.X)) Array.Copy(x, _ctx.X, _n);
        _ctx.Time = time;
        if (!_ctx.IsOperatingPoint) _ctx.SourceScale = SourceScaleAt(time);
        for (int e = 0; e < _eventSource.Length; e++)
            g[e] = Normalize(_eventSource[e].EventValue(_eventIndex[e], _ctx), reference[e]);
    }

    private static double Normalize(double value, double reference) =>
        value != 0.0 ? value : (reference > 0 ? -double.Epsilon : double.Epsilon);

    private static bool Flipped(double a, double b) => (a < 0 && b > 0) || (a > 0 && b < 0);

    private bool AnyFlip(double[] a, double[] b)
    {
        for (int e = 0; e < a.Length; e++)
            if (Flipped(a[e], b[e])) return true;
        return false;
    }

    /// <summary>
    /// Earliest crossing in (t, t + h], located on real steps (docs/numerics.md §5). The bracket [lo, hi] (step lengths
    /// from t) starts as [0, h]: no function has changed sign at t, some have at t + h. Each trial length h* is a
    /// real re-taken step from t_n (interpolated algebraic unknowns are not a solution); its event values shrink the
    /// bracket. The first trial is the earliest root of the step's dense output (Illinois); later trials are Illinois
    /// (modified regula falsi, Dowell &amp; Jarratt 1971) on the re-taken event values, with bisection whenever the
    /// bracket fails to halve in two trials. Stops when hi − lo ≤ the event time tolerance and returns hi, the first
    /// length known to have crossed, with that step's solution in _xNew/_qNew/_qdNew and its event values in _gNew.
    /// </summary>
    private double LocateAndRetake(double t, double h, bool restart)
    {
        EnsureLocateBuffers();
        int m = _eventSource.Length;
        // Tolerance: ε_t (1e-9 s absolute by default), never below 100ε·(|t| + h) (a few tens of ulps of the absolute
        // time, docs/numerics.md §3), never above 1 µs unless the time resolution itself is coarser.
        double floor = 100.0 * MachineEpsilon * (Math.Abs(t) + h);
        double ttol = Math.Min(Math.Max(_options.EventTimeTolerance, floor), Math.Max(1e-6, floor));
        double thetaTol = ttol / h;

        // Dense-output guess (earliest over the functions that changed sign).
        double best = 1.0;
        for (int e = 0; e < m; e++)
        {
            if (!Flipped(_gOld[e], _gNew[e])) continue;
            double theta = LocateOne(e, t, h, thetaTol);
            if (theta < best) best = theta;
        }

        double lo = 0.0, hi = h;
        Array.Copy(_gOld, _gLo, m);
        Array.Copy(_gNew, _gHi, m);
        Array.Copy(_gLo, _gLoS, m);
        Array.Copy(_gHi, _gHiS, m);
        SaveHi();
        bool stateAtHi = true; // _xNew holds the solution at hi
        int side = 0;          // +1: last trial moved lo, -1: moved hi
        double widthTwoAgo = double.PositiveInfinity; // bracket width before the previous trial
        double proposal = best * h;
        int failures = 0;

        for (int it = 0; it < 200 && hi - lo > ttol; it++)
        {
            double widthBefore = hi - lo;
            double half = 0.5 * ttol;
            double p = proposal;
            if (!(p >= lo + half && p <= hi - half)) p = Math.Clamp(p, lo + half, hi - half);
            if (!(p > lo && p < hi)) p = 0.5 * (lo + hi);

            bool ok = restart ? StepBackwardEuler(t, p, predict: false) : TakeStep(t, p);
            if (!ok)
            {
                // Newton failed on this trial (the full step converged): try the middle of the bracket, give up after
                // three failures and fire at hi.
                stateAtHi = false;
                if (++failures >= 3) break;
                proposal = 0.5 * (lo + hi);
                widthTwoAgo = widthBefore;
                continue;
            }
            stateAtHi = false;
            EvaluateEvents(_xNew, t + p, _gNew, _gOld);
            if (AnyFlip(_gOld, _gNew))
            {
                hi = p;
                Array.Copy(_gNew, _gHi, m);
                Array.Copy(_gNew, _gHiS, m);
                if (side == -1) for (int e = 0; e < m; e++) _gLoS[e] *= 0.5;
                side = -1;
                SaveHi();
                stateAtHi = true;
            }
            else
            {
                lo = p;
                Array.Copy(_gNew, _gLo, m);
                Array.Copy(_gNew, _gLoS, m);
                if (side == 1) for (int e = 0; e < m; e++) _gHiS[e] *= 0.5;
                side = 1;
            }

            // Next trial: earliest regula-falsi root over the functions that changed sign within [lo, hi].
            double next = double.PositiveInfinity;
            for (int e = 0; e < m; e++)
            {
                if (!Flipped(_gLo[e], _gHi[e])) continue;
                double gl = _gLoS[e], gh = _gHiS[e];
                double r = hi - gh * (hi - lo) / (gh - gl);
                if (r < next) next = r;
            }
            double newWidth = hi - lo;
            if (!(next > lo && next < hi) || newWidth > 0.5 * widthTwoAgo) next = 0.5 * (lo + hi);
            widthTwoAgo = widthBefore;
            proposal = next;
        }

        if (!stateAtHi)
        {
            RestoreHi();
            Array.Copy(_gHi, _gNew, m);
        }
        return hi;
    }

    private void EnsureLocateBuffers()
    {
        if (_xDense.Length != _n)
        {
            _xDense = new double[_n];
            _xHi = new double[_n];
            _qHi = new double[_n];
            _qdHi = new double[_n];
        }
        int m = _eventSource.Length;
        if (_gLo.Length != m)
        {
            _gLo = new double[m];
            _gHi = new double[m];
            _gLoS = new double[m];
            _gHiS = new double[m];
        }
    }

    private void SaveHi()
    {
        Array.Copy(_xNew, _xHi, _n);
        Array.Copy(_qNew, _qHi, _n);
        Array.Copy(_qdNew, _qdHi, _n);
    }

    private void RestoreHi()
    {
        Array.Copy(_xHi, _xNew, _n);
        Array.Copy(_qHi, _qNew, _n);
        Array.Copy(_qdHi, _qdNew, _n);
    }

    private double LocateOne(int e, double t, double h, double thetaTol)
    {
        double lo = 0.0, hi = 1.0, glo = _gOld[e], ghi = _gNew[e];
        if (_lastStepWasTrBdf2)
        {
            double gg = EventAt(e, s_gamma, t, h, glo);
            if (Flipped(glo, gg)) { hi = s_gamma; ghi = gg; }
            else { lo = s_gamma; glo = gg; }
        }
        int side = 0;
        for (int it = 0; it < 100 && hi - lo > thetaTol; it++)
        {
            double theta = hi - ghi * (hi - lo) / (ghi - glo);
            if (!(theta > lo && theta < hi)) theta = 0.5 * (lo + hi);
            double gm = EventAt(e, theta, t, h, glo);
            if (Flipped(glo, gm))
            {
                hi = theta;
                ghi = gm;
                if (side == -1) glo *= 0.5;
                side = -1;
            }
            else
            {
                lo = theta;
                glo = gm;
                if (side == 1) ghi *= 0.5;
                side = 1;
            }
        }
        return hi;
    }

    private double EventAt(int e, double theta, double t, double h, double reference)
    {
        DenseOutput(theta, _xDense);
        Array.Copy(_xDense, _ctx.X, _n);
        _ctx.Time = t + theta * h;
        _ctx.SourceScale = SourceScaleAt(_ctx.Time);
        return Normalize(_eventSource[e].EventValue(_eventIndex[e], _ctx), reference);
    }

    /// <summary>
    /// Fire every function flagged in _fire at the accepted point, then re-evaluate all functions at the same point
    /// and fire those that flipped because of it; at most <see cref="TransientOptions.MaxLogicPasses"/> passes.
    /// </summary>
    private bool FireEvents()
    {
        double t = _time.Value;
        _eventLog.Time = t;
        for (int pass = 0; ; pass++)
        {
            bool any = false;
            for (int e = 0; e < _fire.Length; e++) any |= _fire[e];
            if (!any) return true;
            if (pass >= _options.MaxLogicPasses)
            {
                var names = new List<string>();
                for (int e = 0; e < _fire.Length; e++)
                    if (_fire[e] && _eventSource[e] is Devices.Device d) names.Add(d.Name);
                _failure = new SimulationFailure(t, $"endless switching loop: still switching after {_options.MaxLogicPasses} logic passes", names,
                    "check the logic for a loop without hysteresis or delay (a comparator feeding back on its own input)");
                return false;
            }
            Array.Copy(_x, _ctx.X, _n);
            _ctx.Time = t;
            _ctx.SourceScale = SourceScaleAt(t);
            for (int e = 0; e < _fire.Length; e++)
            {
                if (!_fire[e]) continue;
                _eventSource[e].OnEvent(_eventIndex[e], _ctx, _eventLog);
                _stats.Events++;
            }
            EvaluateEvents(_x, t, _gNew, _gOld);
            for (int e = 0; e < _fire.Length; e++)
            {
                bool fireNext = !_fire[e] && Flipped(_gOld[e], _gNew[e]);
                _gOld[e] = _gNew[e];
                _fire[e] = fireNext;
            }
        }
    }
}
