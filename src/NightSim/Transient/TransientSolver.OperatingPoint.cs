using NightSim.Netlist;
using NightSim.Mna;

namespace NightSim.Transient;

/// <summary>DC operating point (docs/numerics.md §7): Newton with limiting, then gmin stepping, then source stepping.</summary>
public sealed partial class TransientSolver
{
    /// <summary>Solve the DC operating point of a fresh circuit (devices at their power-up state).</summary>
    /// <param name="circuit">A circuit not used by another run.</param>
    /// <param name="options">Tolerances and Newton caps; null for the defaults.</param>
    /// <param name="solution">Node voltages (V) and branch currents (A), or null on failure.</param>
    public static bool TrySolveOperatingPoint(Circuit circuit, TransientOptions? options, out double[]? solution)
    {
        var solver = new TransientSolver(circuit, (options ?? TransientOptions.Default) with { Start = StartMode.OperatingPoint });
        foreach (Devices.Device d in solver._devices) d.PowerUp();
        solver.SetTolerancesForDc();
        bool ok = solver.SolveOperatingPoint();
        solution = ok ? [.. solver._x] : null;
        return ok;
    }

    /// <summary>
    /// The circuit at rest with its discrete states settled: an operating point, then every event function that says
    /// its device's state disagrees with that point (a positive value: a comparator decided the other way, a relay
    /// coil above pull-in) fires, time moves on far enough for output ramps and delays to finish, and the operating
    /// point is solved again, until no state changes (at most <see cref="TransientOptions.MaxLogicPasses"/> passes).
    /// A plain operating point keeps the power-up states, so a comparator between the sensor and the trigger would
    /// never switch at rest.
    /// </summary>
    /// <returns>False when an operating point is not found or the states never settle.</returns>
    public static bool TrySolveRestingPoint(Circuit circuit, TransientOptions? options, out double[]? solution)
    {
        const double Later = 1e3; // s between passes: longer than any output ramp or switching delay
        solution = null;
        var solver = new TransientSolver(circuit, (options ?? TransientOptions.Default) with { Start = StartMode.OperatingPoint });
        foreach (Devices.Device d in solver._devices) d.PowerUp();
        solver.SetTolerancesForDc();
        double time = 0.0;
        for (int pass = 0; pass <= solver._options.MaxLogicPasses; pass++)
        {
            solver._opTime = time;
            if (!solver.SolveOperatingPoint()) return false;
            Array.Fill(solver._gOld, 1.0); // an exact zero counts as agreeing
            solver.EvaluateEvents(solver._x, time, solver._gNew, solver._gOld);
            bool any = false;
            for (int e = 0; e < solver._eventSource.Length; e++)
            {
                if (solver._gNew[e] <= 0.0) continue;
                solver._eventSource[e].OnEvent(solver._eventIndex[e], solver._ctx, solver._eventLog);
                any = true;
            }
            if (!any)
            {
                solution = [.. solver._x];
                return true;
            }
            time += Later;
        }
        return false;
    }

    private void SetTolerancesForDc()
    {
        for (int i = 0; i < _n; i++)
        {
            bool branch = _circuit.Kinds[i] == Mna.UnknownKind.Branch;
            _atol[i] = branch ? _options.CurrentTolerance : _options.VoltageTolerance;
            _newtonAtol[i] = 0.1 * _atol[i];
        }
    }

    /// <summary>Solve j(x) = 0 from the guess in _x; on success _x holds the operating point.</summary>
    private bool SolveOperatingPoint()
    {
        SetTolerancesForDc();
        _ctx.IsOperatingPoint = true;
        var zero = new double[_n];
        var start = (double[])_x.Clone();
        var good = new double[_n];
        try
        {
            // 1. Plain Newton with limiting, junctions from their own initial guess.
            _opGmin = _options.Gmin;
            _ctx.SourceScale = 1.0;
            if (TryDc(start, zero, initJunctions: true)) return true;

            // 2. gmin stepping: a shunt on every node from 1e-2 S down, ÷10 per success, smaller steps after a failure.
            Array.Copy(start, good, _n);
            double g = 1e-2, factor = 10.0;
            bool first = true;
            while (true)
            {
                _opGmin = g;
                if (TryDc(good, zero, initJunctions: first))
                {
                    first = false;
                    Array.Copy(_ctx.X, good, _n);
                    if (g <= _options.Gmin) break;
                    g = Math.Max(g / factor, _options.Gmin);
                }
                else
                {
                    if (first) break;
                    g *= factor;
                    factor = Math.Sqrt(factor);
                    if (factor < 1.05) { first = true; break; }
                    g /= factor;
                }
            }
            if (!first)
            {
                _opGmin = _options.Gmin;
                if (TryDc(good, zero, initJunctions: false)) return true;
            }

            // 3. Source stepping: independent sources scaled 0 → 1.
            _opGmin = _options.Gmin;
            Array.Clear(good);
            double lambda = 0.0, step = 0.1;
            _ctx.SourceScale = 0.0;
            if (!TryDc(good, zero, initJunctions: true)) return false;
            Array.Copy(_ctx.X, good, _n);
            while (lambda < 1.0)
            {
                double next = Math.Min(1.0, lambda + step);
                _ctx.SourceScale = next;
                if (TryDc(good, zero, initJunctions: false))
                {
                    Array.Copy(_ctx.X, good, _n);
                    lambda = next;
                    step *= 2.0;
                }
                else
                {
                    step *= 0.25;
                    if (step < 1e-6) return false;
                }
            }
            return true;
        }
        finally
        {
            _ctx.IsOperatingPoint = false;
            _ctx.SourceScale = 1.0;
            _opGmin = 0.0;
        }
    }

    private bool TryDc(double[] guess, double[] zero, bool initJunctions)
    {
        Array.Copy(guess, _ctx.X, _n);
        _ctx.InitJunctions = initJunctions;
        bool ok = Newton(_opTime, 0.0, zero);
        _ctx.InitJunctions = false;
        if (ok) Array.Copy(_ctx.X, _x, _n);
        return ok;
    }
}
