using NightSim.Devices;
using NightSim.Results;

namespace NightSim.Transient;

/// <summary>
/// Skipping identical cycles of a self-sustained oscillation of discrete switching (a relay chattering because its lamp
/// lights its own sensor): docs/numerics.md §10.
/// </summary>
/// <remarks>
/// The cycle boundary is a Poincaré section: the instant one chosen event function fires with its device in the same
/// state (the first function that fires after tracking starts). At each boundary the run time, the state (the circuit's
/// unknowns and the devices' own states, <see cref="IInternalState"/>) and the discrete events of the cycle just ended
/// are stored. Once four cycles in a row switched the same devices the same way in the same order, the run jumps N whole
/// cycles forward: the period of the cycles ahead follows the quadratic through the last three periods (Newton's
/// backward formula), the state of the boundary N cycles on is extrapolated linearly, and the events of the skipped
/// cycles are written at their extrapolated times (each moved by its own per-cycle drift). This is envelope following
/// for an autonomous oscillation whose period drifts (Petzold, SIAM J. Numer. Anal. 18(3), 1981, with the period found
/// from the recurrence of the section, as in Gear &amp; Gallivan, "Automatic methods for highly oscillatory ordinary
/// differential equations", Lecture Notes in Mathematics 912, Springer 1982).
/// N is held to: the time error of the quadratic period, about N⁴/24·|Δ³T|, within
/// <see cref="TransientOptions.OscillationTolerance"/> of the span; the period's change over the jump within 30 %; the
/// curvature and size of every state's per-cycle change (as the envelope jump); the sky's change (the light-aware
/// bound); and the room before the next breakpoint (light events, source corners, scheduled switching, stop). After a
/// jump four fresh cycles are simulated in full before the next; near the start and end of a burst, where the period
/// changes fast, the limits leave little room and most cycles are simulated. Never with a periodic source, envelope
/// following or fixed steps.
/// </remarks>
public sealed partial class TransientSolver
{
    private const int OscBoundaries = 5;          // boundaries kept: four full cycles
    private const int OscMaxFiringsPerCycle = 64; // a longer pattern is not treated as one cycle
    private const int OscMaxPointsPerCycle = 512; // accepted points kept for the plots' envelope of skipped cycles
    private const double OscPeriodDrift = 0.3;    // largest relative change of the period over one jump

    private bool _oscEnabled;
    private int _oscSection = -1;      // flattened index of the event function that marks the boundary
    private string? _oscPhase;         // the state its device last recorded before it fires (the same every cycle)
    private int _oscCount;             // boundaries recorded since the last reset
    private int _oscFiringsSince;      // firings since the last boundary
    private readonly double[] _oscTime = new double[OscBoundaries];
    private readonly int[] _oscLog = new int[OscBoundaries];       // event log length at each boundary (before firing)
    private readonly long[] _oscSignature = new long[OscBoundaries]; // of the cycle ending at each boundary
    private double[][] _oscState = [];
    private double[] _oscJump = [];
    private double[] _oscPointTimes = [];
    private double[][] _oscPoints = [];
    private int _oscPointCount;        // accepted points of the running cycle (−1: too many to keep)
    private int _oscLastPointCount;    // of the last complete cycle
    private double[] _oscLastPointTimes = [];
    private double[][] _oscLastPoints = [];

    private void SetUpOscillationSkipping()
    {
        _oscEnabled = _options.OscillationSkipping && _options.FixedStep is null && _envPeriod <= 0
            && double.IsPositiveInfinity(_maxStep) && _eventSource.Length > 0;
        if (!_oscEnabled) return;
        int size = _n + _internalSize;
        _oscState = new double[OscBoundaries][];
        for (int i = 0; i < OscBoundaries; i++) _oscState[i] = new double[size];
        _oscJump = new double[size];
    }

    private int Slot(int boundary) => ((boundary % OscBoundaries) + OscBoundaries) % OscBoundaries;

    /// <summary>After each accepted point: keep it for the envelope of skipped cycles while a section is tracked.</summary>
    private void OscillationObserve()
    {
        if (!_oscEnabled || _oscSection < 0 || _oscPointCount < 0) return;
        if (_oscPointCount == OscMaxPointsPerCycle)
        {
            _oscPointCount = -1;
            return;
        }
        if (_oscPoints.Length == 0)
        {
            _oscPointTimes = new double[OscMaxPointsPerCycle];
            _oscLastPointTimes = new double[OscMaxPointsPerCycle];
            _oscPoints = new double[OscMaxPointsPerCycle][];
            _oscLastPoints = new double[OscMaxPointsPerCycle][];
            for (int i = 0; i < OscMaxPointsPerCycle; i++)
            {
                _oscPoints[i] = new double[_n];
                _oscLastPoints[i] = new double[_n];
            }
        }
        _oscPointTimes[_oscPointCount] = _time.Value;
        Array.Copy(_x, _oscPoints[_oscPointCount], _n);
        _oscPointCount++;
    }

    /// <summary>
    /// At an accepted point where events are about to fire: note a cycle boundary and, when the last four cycles were
    /// alike, jump whole cycles forward (the events then fire at the new point).
    /// </summary>
    private void OscillationAtEvents()
    {
        if (!_oscEnabled) return;
        double t = _time.Value;
        if (_oscSection < 0 || ++_oscFiringsSince > OscMaxFiringsPerCycle)
        {
            // Track the first function that fires now; until it recurs in the same phase nothing is known.
            int first = Array.IndexOf(_fire, true);
            if (first < 0) return;
            _oscSection = first;
            _oscPhase = LastRecordOf(first);
            _oscCount = 0;
        }
        else if (!_fire[_oscSection] || !string.Equals(LastRecordOf(_oscSection), _oscPhase, StringComparison.Ordinal))
        {
            return; // an event inside the cycle
        }
        _oscFiringsSince = 0;

        // A boundary. A light edge inside the cycle just ended breaks the pattern: start counting again.
        int k = _oscCount;
        if (k > 0 && _light is not null && _light.NextBreakpoint(_oscTime[Slot(k - 1)]) <= t) k = 0;
        int slot = Slot(k);
        _oscTime[slot] = t;
        _oscLog[slot] = _eventLog.Events.Count;
        Array.Copy(_x, _oscState[slot], _n);
        int at = _n;
        foreach (IInternalState d in _internal)
        {
            d.ReadInternalState(_oscState[slot].AsSpan(at, d.InternalStateCount));
            at += d.InternalStateCount;
        }
        _oscSignature[slot] = k > 0 ? CycleSignature(_oscLog[Slot(k - 1)], _oscLog[slot]) : 0;
        _oscCount = k + 1;
        // The accepted points of the cycle just ended become the template of a skipped cycle.
        if (k > 0 && _oscPointCount >= 0 && _oscPoints.Length > 0)
        {
            (_oscPoints, _oscLastPoints) = (_oscLastPoints, _oscPoints);
            (_oscPointTimes, _oscLastPointTimes) = (_oscLastPointTimes, _oscPointTimes);
            _oscLastPointCount = _oscPointCount;
        }
        else
        {
            _oscLastPointCount = -1;
        }
        _oscPointCount = 0;
        if (_oscCount >= OscBoundaries) TrySkipCycles(k);
    }

    /// <summary>The new-state word of the last event recorded by the device of event function <paramref name="e"/>
    /// within the last few cycles' worth of the log (an event function gives no direction of its own: it is positive
    /// whenever its device should switch), or null.</summary>
    private string? LastRecordOf(int e)
    {
        if (_eventSource[e] is not Device d) return null;
        List<LoggedEvent> log = _eventLog.Events;
        int stop = Math.Max(0, log.Count - 4 * OscMaxFiringsPerCycle);
        for (int i = log.Count - 1; i >= stop; i--)
            if (ReferenceEquals(log[i].Device, d.Name)) return log[i].To;
        return null;
    }

    /// <summary>A hash of the devices, kinds and new states of the events in [from, to) of the event log, and their
    /// number: two cycles with the same signature switched the same way.</summary>
    private long CycleSignature(int from, int to)
    {
        if (to - from > OscMaxFiringsPerCycle * 4) return -1;
        long h = to - from;
        List<LoggedEvent> log = _eventLog.Events;
        for (int i = from; i < to; i++)
        {
            LoggedEvent e = log[i];
            h = h * 1_000_003 + e.Device.GetHashCode();
            h = h * 1_000_003 + (int)e.Kind;
            h = h * 1_000_003 + e.To.GetHashCode();
        }
        return h;
    }

    /// <summary>Jump N cycles on from boundary <paramref name="k"/> when the last four cycles were alike and the limits
    /// allow N ≥ 2.</summary>
    private void TrySkipCycles(int k)
    {
        int s0 = Slot(k), s1 = Slot(k - 1), s2 = Slot(k - 2), s3 = Slot(k - 3), s4 = Slot(k - 4);
        long sig = _oscSignature[s0];
        if (sig == -1 || _oscLog[s0] == _oscLog[s1]) return;
        for (int j = 1; j < OscBoundaries - 1; j++)
            if (_oscSignature[Slot(k - j)] != sig) return;
        double t = _oscTime[s0];
        double T0 = t - _oscTime[s1], T1 = _oscTime[s1] - _oscTime[s2], T2 = _oscTime[s2] - _oscTime[s3], T3 = _oscTime[s3] - _oscTime[s4];
        if (!(T0 > 0 && T1 > 0 && T2 > 0 && T3 > 0)) return;
        // Backward differences of the period: the period of the cycles ahead is the quadratic through the last three.
        double d1 = T0 - T1, d2 = T0 - 2.0 * T1 + T2, d3 = T0 - 3.0 * T1 + 3.0 * T2 - T3;
        // Boundaries are located to the event tolerance (at least 100ε·t): a third difference below this is noise.
        double ttol = Math.Max(_options.EventTimeTolerance, 100.0 * MachineEpsilon * Math.Abs(t));
        double curv3 = Math.Max(0.0, Math.Abs(d3) - 16.0 * ttol);
        double tol = _options.OscillationTolerance;

        double n = _options.OscillationMaxCycles;
        // Time error of the quadratic period, about N⁴/24·|Δ³T|, within tol·N·T (the count of cycles within tol).
        if (curv3 > 0) n = Math.Min(n, Math.Floor(Math.Cbrt(24.0 * tol * T0 / curv3)));
        // The period may change by at most OscPeriodDrift over the jump.
        double slope = Math.Abs(d1) + 0.5 * Math.Abs(d2);
        if (slope > 0) n = Math.Min(n, Math.Floor(OscPeriodDrift * T0 / slope));
        if (Math.Abs(d2) > 0) n = Math.Min(n, Math.Floor(Math.Sqrt(2.0 * OscPeriodDrift * T0 / Math.Abs(d2))));
        if (n < 2) return;

        // States: curvature and size of the per-cycle change, as for the envelope jump.
        double[] x0 = _oscState[s0], x1 = _oscState[s1], x2 = _oscState[s2];
        double maxChange = _options.EnvelopeMaxChange;
        for (int i = 0; i < x0.Length && n >= 2; i++)
        {
            bool unknown = i < _n;
            if (unknown && !_inNorm[i]) continue; // algebraic unknowns follow the states (the restart settles them)
            double a1 = x0[i] - x1[i], a2 = x1[i] - x2[i];
            double scale, floorNoise;
            if (unknown)
            {
                scale = Math.Max(Math.Abs(x0[i]), Math.Abs(x1[i])) + (_circuit.Kinds[i] == Mna.UnknownKind.Branch ? 1e-3 : 1.0);
                floorNoise = 10.0 * (_options.RelativeTolerance * scale + _atol[i]);
            }
            else
            {
                scale = Math.Max(Math.Abs(x0[i]), Math.Abs(x1[i]));
                floorNoise = 10.0 * _options.RelativeTolerance * scale;
            }
            if (!(scale > 0)) continue;
            double curvature = Math.Max(0.0, Math.Abs(a1 - a2) - floorNoise);
            if (curvature > 0) n = Math.Min(n, Math.Floor(Math.Sqrt(2.0 * tol * scale / curvature)));
            if (Math.Abs(a1) > floorNoise) n = Math.Min(n, Math.Floor(maxChange * scale / Math.Abs(a1)));
        }
        if (n < 2) return;

        // Room: the sky's change, the next breakpoint and the stop, with two periods to spare.
        double span = SkipSpan(n, T0, d1, d2);
        double room = NextBreakpoint(t) - t - 4.0 * T0;
        room = Math.Min(room, _stop - t - 4.0 * T0);
        if (_light is not null) room = Math.Min(room, _light.StepLimit(t, _options.LightChange));
        while (n >= 2 && span > room)
        {
            n = Math.Floor(n * Math.Max(0.5, room / span));
            span = SkipSpan(n, T0, d1, d2);
        }
        if (n < 2) return;
        SkipCycles((int)n, k, T0, d1, d2, span);
    }

    /// <summary>Length of the next N cycles when the period moves along the quadratic through the last three:
    /// Σ_{j=1..N} (T + j·∇T + j(j+1)/2·∇²T) = N·T + N(N+1)/2·∇T + N(N+1)(N+2)/6·∇²T (Newton's backward formula).</summary>
    private static double SkipSpan(double n, double period, double d1, double d2) =>
        n * period + 0.5 * n * (n + 1.0) * d1 + n * (n + 1.0) * (n + 2.0) / 6.0 * d2;

    private void SkipCycles(int cycles, int k, double period, double d1, double d2, double span)
    {
        int s0 = Slot(k), s1 = Slot(k - 1), s2 = Slot(k - 2);
        double t = _oscTime[s0], tPrev = _oscTime[s1], tPrev2 = _oscTime[s2];
        List<LoggedEvent> log = _eventLog.Events;
        int last = _oscLog[s1], count = _oscLog[s0] - _oscLog[s1], before = _oscLog[s2];

        // The events of the skipped cycles: the last cycle's events, each moved by its own per-cycle drift.
        for (int j = 0; j < cycles; j++)
        {
            double start = t + SkipSpan(j, period, d1, d2);
            double next = t + SkipSpan(j + 1, period, d1, d2);
            for (int i = 0; i < count; i++)
            {
                LoggedEvent e = log[last + i];
                double offset = e.Time - tPrev;
                double drift = offset - (log[before + i].Time - tPrev2);
                double when = Math.Clamp(start + offset + (j + 1) * drift, start, next);
                log.Add(e with { Time = when });
            }
        }
        // The plots' envelope of the skipped cycles: the accepted points of the last one, moved along.
        if (_recorder is not null && _oscLastPointCount > 0)
        {
            for (int j = 0; j < cycles; j++)
            {
                double shift = SkipSpan(j + 1, period, d1, d2);
                for (int p = 0; p < _oscLastPointCount; p++)
                    _recorder.RecordEnvelopeOnly(_oscLastPointTimes[p] + shift, _oscLastPoints[p]);
            }
        }

        // The state of the boundary N cycles on.
        double[] x0 = _oscState[s0], x1 = _oscState[s1];
        for (int i = 0; i < _oscJump.Length; i++) _oscJump[i] = x0[i] + cycles * (x0[i] - x1[i]);
        double tNew = t + span;
        Array.Copy(_oscJump, _x, _n);
        _time.Set(tNew);
        Array.Copy(_x, _ctx.X, _n);
        _ctx.Time = tNew;
        _ctx.SourceScale = SourceScaleAt(tNew);
        int at = _n;
        foreach (IInternalState d in _internal)
        {
            d.WriteInternalState(_oscJump.AsSpan(at, d.InternalStateCount), _ctx);
            at += d.InternalStateCount;
        }
        Evaluate(_x, tNew);
        Array.Copy(_ctx.Q, _q, _n);
        Array.Clear(_qd);
        Array.Copy(_x, _ctx.X, _n);
        _ctx.Time = tNew;
        foreach (Device d in _devices) d.Accept(_ctx);
        RecordPoint(keepRow: true);
        // Event values at the new point; the section's own flag stays set and it fires here.
        EvaluateEvents(_x, tNew, _gNew, _gOld);
        Array.Copy(_gNew, _gOld, _gOld.Length);
        _havePrev = false;
        _stats.OscillationJumps++;
        _stats.SkippedOscillationCycles += cycles;
        // Measure afresh: the first boundary after the jump starts the count.
        _oscCount = 0;
        _oscPointCount = -1;
        _oscLastPointCount = -1;
        Accepted?.Invoke(this);
    }
}
