using NightSim.Results;

namespace NightSim.Transient;

/// <summary>Event location and firing (numerics.md §5): sign changes of event functions between accepted points.</summary>
public sealed partial class TransientSolver
{
    private const double MachineEpsilon = 2.220446049250313e-16;
    private double[] _xDense = [];

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
    /// Earliest crossing in (t, t + h] by Illinois iteration (Dowell &amp; Jarratt 1971) on the step's dense output,
    /// then the step is re-taken from t_n to that time (interpolated algebraic unknowns are not a solution), growing by
    /// the time tolerance until some function has really changed sign. Returns the step actually taken.
    /// </summary>
    private double LocateAndRetake(double t, double h, bool restart)
    {
        if (_xDense.Length != _n) _xDense = new double[_n];
        double ttol = Math.Max(_options.EventTimeTolerance, 100.0 * MachineEpsilon * (Math.Abs(t) + h));
        double thetaTol = ttol / h;
        double best = 1.0;
        for (int e = 0; e < _eventSource.Length; e++)
        {
            if (!Flipped(_gOld[e], _gNew[e])) continue;
            double theta = LocateOne(e, t, h, thetaTol);
            if (theta < best) best = theta;
        }
        if (best >= 1.0 - thetaTol) return h;

        double hStar = best * h;
        double grow = ttol;
        for (int attempt = 0; attempt < 8 && hStar < h; attempt++)
        {
            bool ok = restart ? StepBackwardEuler(t, hStar, predict: false) : TakeStep(t, hStar);
            if (!ok) break;
            EvaluateEvents(_xNew, t + hStar, _gNew, _gOld);
            if (AnyFlip(_gOld, _gNew)) return hStar;
            hStar += grow;
            grow *= 4.0;
        }
        // Fall back to the full step (it converged before and has a sign change).
        if (restart) StepBackwardEuler(t, h, predict: false); else TakeStep(t, h);
        EvaluateEvents(_xNew, t + h, _gNew, _gOld);
        return h;
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
