using NightSim.Devices;
using NightSim.Supply;

namespace NightSim.Transient;

/// <summary>
/// Mains averaging: a circuit fed from a capacitive dropper runs with the mains cycle-averaged
/// (<see cref="AveragedDropper"/> injects the dropper's mean current into the rectifier's DC outputs and the mains sine is
/// held at 0 V) between windows of full mains detail (the sine on, the averaged current off) around every event, every
/// known breakpoint and one standby sample after power-up (docs/supply.md, "Mains averaging").
/// </summary>
/// <remarks>
/// <list type="bullet">
/// <item>Entering detail: the solver gives the dropper the voltage it has on the periodic steady state at that instant
/// (<see cref="AveragedDropper.SteadyDropperVoltage"/>) and the source's side of the loop the source's value, so the
/// mains returns into a consistent loop at any phase, without inrush; then it restarts. Detail starts at the accepted
/// point of any event in averaged mode (a comparator or timer output, a relay operation: the pull-in that follows its
/// drive by milliseconds is in detail), <see cref="TransientOptions.MainsLeadCycles"/> cycles before every known
/// breakpoint (light events, scheduled edges), and at <see cref="TransientOptions.MainsStandbySample"/>. Without the
/// dropper's place in the loop the entry waits for a rising zero crossing, where the dropper holds only
/// −(V_dc + 2·V_D) on the steady state and about 0 V after its bleeder: nearly consistent.</item>
/// <item>Leaving detail: at a rising zero crossing (landed on as a breakpoint, then a restart), once
/// <see cref="TransientOptions.MainsDetailMinimum"/> has passed since the last event or breakpoint and the rail's mean
/// over each of the last <see cref="TransientOptions.MainsSettledCycles"/> whole cycles moved by at most
/// <see cref="TransientOptions.MainsSettledChange"/> of it plus 1 mV; or once <see cref="TransientOptions.MainsDetailMaximum"/>
/// has passed; never with a known breakpoint near. The dropper's remaining charge then drains through its bleeder
/// behind reverse-biased diodes.</item>
/// <item>Power-up runs averaged; events in its first <see cref="TransientOptions.MainsPowerUp"/> open no window.</item>
/// <item>The mains side's error is held to the tolerance of the mains peak (the charge it moves is C·V_pk-sized):
/// an instantaneous-value tolerance shrinks to microvolts at every zero crossing of a bridge terminal.</item>
/// </list>
/// The switching allocates nothing; it runs at the top of each step (<see cref="MainsAveragingAt"/>).
/// </remarks>
public sealed partial class TransientSolver
{
    /// <summary>The mains side's error bound in units of rtol·V_pk: 10·rtol·V_pk in one step is 10·rtol/2 (0.05 % at the
    /// default rtol) of the charge C·2V_pk the dropper moves each half cycle, which is what the rail sees; measured: about
    /// 60 steps per mains cycle instead of 80 at rtol·V_pk, accuracy against full detail unchanged within 0.1 % of the sag
    /// (docs/supply.md).</summary>
    private const double MainsSideTolerance = 10.0;
    private AveragedDropper? _ma;
    private double _maPeriod;
    private double _maOrigin;          // a rising zero crossing of the mains (the others are k·period from it)
    private double _maStart;           // the sine's start (no zero crossing before it counts)
    private bool _maAveraged;
    private double _maSwitchAt = double.PositiveInfinity; // the planned switch, a rising zero crossing
    private double _maQuietSince;      // detail: the last power-up, event or breakpoint
    private double _maAveragedSince;
    private long _maEventsSeen;
    private long _maBreakpointsSeen;
    private bool _maSuppress;          // NextBreakpoint without the planned switch
    private bool _maSampled;
    private bool _maSampling;          // the window is the standby sample (no event in it so far)
    private double _maDetailMaxStep;
    private double _maAveragedMaxStep;
    private int _maPlus, _maMinus;
    private int _maLiftNode, _maLiftReference; // -2: no lifting
    private int[] _maSourceSide = [];
    private int _maSourceMinus;
    // The rail's mean over whole cycles in detail.
    private long _maCycle = long.MinValue;
    private double _maCycleFrom, _maIntegral, _maLastT, _maLastV;
    private double _maMean0, _maMean1, _maMean2, _maMean3;
    private int _maMeans;

    /// <summary>True while the mains runs cycle-averaged.</summary>
    public bool MainsAveraged => _maAveraged;

    /// <summary>Find the averaged model among the devices and prepare the switching; the run starts in detail.</summary>
    private void SetUpMainsAveraging()
    {
        if (!_options.MainsAveraging || _options.EnvelopeFollowing || _options.FixedStep is not null) return;
        foreach (Device d in _devices)
            if (d is AveragedDropper m) _ma = m;
        if (_ma is null) return;
        Waveform w = _ma.Source.Waveform;
        _maPeriod = 1.0 / w.SineFrequency;
        _maStart = w.SineStart;
        // Rising zero crossings of sin(2πf(t − start) + φ): t = start + (k − φ/2π)·T.
        _maOrigin = _maStart - w.SinePhase / (2.0 * Math.PI) * _maPeriod;
        _maDetailMaxStep = _maxStep;
        _maAveragedMaxStep = _options.MaxStep;
        foreach (Device d in _devices)
            if (!ReferenceEquals(d, _ma.Source)) _maAveragedMaxStep = Math.Min(_maAveragedMaxStep, d.MaxStep);
        _maPlus = _circuit.IndexOf(_ma.Nodes[0]);
        _maMinus = _circuit.IndexOf(_ma.Nodes[1]);
        _maQuietSince = 0;
        // The mains side swings with the mains: its error is held to a tolerance of the mains peak, as the charge it
        // moves through the dropper is (an instantaneous-value tolerance shrinks to microvolts at every zero crossing of
        // a bridge terminal and makes each commutation hundreds of steps).
        foreach (string node in _ma.MainsNodes)
        {
            int i = _circuit.IndexOf(node);
            if (i < 0) continue;
            _atol[i] = Math.Max(_atol[i], MainsSideTolerance * _options.RelativeTolerance * _ma.Peak);
            _newtonAtol[i] = 0.1 * _atol[i];
        }
        _maLiftNode = _ma.LiftNode is null ? -2 : _circuit.IndexOf(_ma.LiftNode);
        _maLiftReference = _ma.LiftReference is null ? -1 : _circuit.IndexOf(_ma.LiftReference);
        _maSourceSide = [.. _ma.SourceSide.Select(_circuit.IndexOf).Where(i => i >= 0)];
        _maSourceMinus = _circuit.IndexOf(_ma.Source.Nodes[1]);
        if (_maLiftNode == -2)
        {
            // Without the dropper's place in the loop, detail starts only at rising zero crossings: power up in detail.
            _stats.MainsDetailWindows = 1;
            _ma.Active = false;
            _ma.Source.Held = false;
            return;
        }
        // Power up averaged (the restart of Begin follows).
        _maAveraged = true;
        _maAveragedSince = 0;
        _ma.Active = true;
        _ma.Source.Held = true;
        _maxStep = _maAveragedMaxStep;
    }

    /// <summary>The first rising zero crossing of the mains strictly after t + tiny.</summary>
    private double RisingZeroCrossingAfter(double t, double tiny)
    {
        double from = Math.Max(t + tiny, _maStart);
        double k = Math.Floor((from - _maOrigin) / _maPeriod) + 1.0;
        double z = _maOrigin + k * _maPeriod;
        if (z <= t + tiny) z += _maPeriod;
        return z;
    }

    /// <summary>The planned switch as a breakpoint (+∞ without one).</summary>
    private double MainsSwitchAfter(double t, double tiny) =>
        _ma is null || _maSuppress || !(_maSwitchAt > t + tiny) ? double.PositiveInfinity : _maSwitchAt;

    /// <summary>The next breakpoint of the circuit and the light, without the planned switch.</summary>
    private double CircuitBreakpointAfter(double t)
    {
        _maSuppress = true;
        double bp = NextBreakpoint(t);
        _maSuppress = false;
        return bp;
    }

    /// <summary>
    /// At every accepted point (before the next step): switch when the point is the planned switch, else watch for
    /// events and breakpoints, measure the rail's cycle means in detail and plan the next switch.
    /// </summary>
    private void MainsAveragingAt()
    {
        if (_ma is null) return;
        double t = _time.Value;
        double tiny = 4.0 * (Math.BitIncrement(Math.Max(Math.Abs(t), 1e-300)) - Math.Abs(t)) + 1e-15;
        bool events = _stats.Events != _maEventsSeen;
        bool landed = _stats.Breakpoints != _maBreakpointsSeen;
        _maEventsSeen = _stats.Events;
        _maBreakpointsSeen = _stats.Breakpoints;

        if (t >= _maSwitchAt - tiny)
        {
            _maSwitchAt = double.PositiveInfinity;
            if (_maAveraged && !_maSampled && _options.MainsStandbySample > 0 && t + tiny >= _options.MainsStandbySample) _maSampling = true;
            if (_maAveraged) EnterDetail(t); else EnterAveraged(t);
            return;
        }

        if (_maAveraged)
        {
            double due = double.PositiveInfinity;
            if ((events || landed) && t >= _options.MainsPowerUp)
            {
                // With the dropper's steady charge known, detail starts at once: the operation that follows the
                // event (a relay pulling in milliseconds after its drive) is in detail.
                if (_maLiftNode != -2)
                {
                    _maSwitchAt = double.PositiveInfinity;
                    EnterDetail(t);
                    return;
                }
                due = RisingZeroCrossingAfter(t, tiny);
            }
            // One window of standby after power-up: the supply's standby figures (rail, Zener current, ripple at the
            // trigger) come from full-detail cycles.
            double sample = _options.MainsStandbySample;
            if (!_maSampled && _maLiftNode != -2 && sample > 0 && sample < _stop)
            {
                if (t + tiny >= sample)
                {
                    _maSampled = true;
                    _maSampling = true;
                    _maSwitchAt = double.PositiveInfinity;
                    EnterDetail(t);
                    return;
                }
                due = Math.Min(due, sample);
            }
            double bp = t >= _options.MainsPowerUp ? CircuitBreakpointAfter(t) : double.PositiveInfinity;
            if (bp < _stop)
            {
                double lead = bp - _options.MainsLeadCycles * _maPeriod;
                if (_maLiftNode != -2)
                {
                    // MainsLeadCycles before the breakpoint, lifted.
                    if (lead <= t + tiny)
                    {
                        _maSwitchAt = double.PositiveInfinity;
                        EnterDetail(t);
                        return;
                    }
                    due = Math.Min(due, lead);
                }
                else
                {
                    // The last rising zero crossing at least MainsLeadCycles before the breakpoint (or the next one).
                    double z = _maOrigin + Math.Floor((lead - _maOrigin) / _maPeriod) * _maPeriod;
                    due = Math.Min(due, z > t + tiny ? z : RisingZeroCrossingAfter(t, tiny));
                }
            }
            _maSwitchAt = Math.Min(_maSwitchAt, due);
            return;
        }

        double v = (_maPlus >= 0 ? _x[_maPlus] : 0.0) - (_maMinus >= 0 ? _x[_maMinus] : 0.0);
        ObserveRailCycle(t, v);
        if (events || landed)
        {
            _maSampling = false;
            _maQuietSince = t;
            _maMeans = 0;
            _maSwitchAt = double.PositiveInfinity;
        }
        if (double.IsPositiveInfinity(_maSwitchAt) && MayLeaveDetail(t))
            _maSwitchAt = RisingZeroCrossingAfter(t, tiny);
    }

    /// <summary>True when the detail window may end: its least length passed and the rail settled (or its longest length
    /// passed), and no known breakpoint is near.</summary>
    private bool MayLeaveDetail(double t)
    {
        double since = t - _maQuietSince;
        double least = _maQuietSince == 0 ? Math.Max(_options.MainsDetailMinimum, _options.MainsPowerUp) : _options.MainsDetailMinimum;
        if (since < least) return false;
        // The standby sample needs whole cycles of the settled standby, not a settling check of its own.
        if (since < _options.MainsDetailMaximum && !_maSampling && !RailSettled()) return false;
        double bp = CircuitBreakpointAfter(t);
        return !(bp < _stop) || bp - t > (_options.MainsLeadCycles + 3) * _maPeriod;
    }

    private bool RailSettled()
    {
        int cycles = Math.Clamp(_options.MainsSettledCycles, 2, 4);
        if (_maMeans < cycles) return false;
        double tol = _options.MainsSettledChange * Math.Abs(_maMean0) + 1e-3;
        return Math.Abs(_maMean0 - _maMean1) <= tol
            && (cycles < 3 || Math.Abs(_maMean1 - _maMean2) <= tol)
            && (cycles < 4 || Math.Abs(_maMean2 - _maMean3) <= tol);
    }

    /// <summary>Integrate the rail over whole mains cycles (trapezoidal, each segment split at the cycle boundary).</summary>
    private void ObserveRailCycle(double t, double v)
    {
        long k = (long)Math.Floor((t - _maOrigin) / _maPeriod + 1e-9);
        if (_maCycle == long.MinValue)
        {
            _maCycle = k;
            _maCycleFrom = t;
            _maLastT = t;
            _maLastV = v;
            _maIntegral = 0;
            return;
        }
        while (k > _maCycle)
        {
            double tb = _maOrigin + (_maCycle + 1) * _maPeriod;
            double vb = t > _maLastT ? _maLastV + (v - _maLastV) * Math.Clamp((tb - _maLastT) / (t - _maLastT), 0.0, 1.0) : v;
            _maIntegral += 0.5 * (_maLastV + vb) * Math.Max(0.0, tb - _maLastT);
            double cycleStart = _maOrigin + _maCycle * _maPeriod;
            if (_maCycleFrom <= cycleStart + 1e-9 * _maPeriod)
            {
                (_maMean3, _maMean2, _maMean1) = (_maMean2, _maMean1, _maMean0);
                _maMean0 = _maIntegral / _maPeriod;
                _maMeans++;
            }
            _maCycle++;
            _maCycleFrom = tb;
            _maLastT = tb;
            _maLastV = vb;
            _maIntegral = 0;
        }
        _maIntegral += 0.5 * (_maLastV + v) * (t - _maLastT);
        _maLastT = t;
        _maLastV = v;
    }

    private void EnterAveraged(double t)
    {
        _maSampling = false;
        _maAveraged = true;
        _maAveragedSince = t;
        _ma!.Active = true;
        _ma.Source.Held = true;
        _maxStep = _maAveragedMaxStep;
        RestartAfterSwitch();
    }

    private void EnterDetail(double t)
    {
        _maAveraged = false;
        if (t >= _options.MainsStandbySample - 1e-9) _maSampled = true;
        _stats.MainsAveragedSeconds += t - _maAveragedSince;
        _stats.MainsDetailWindows++;
        _ma!.Active = false;
        _ma.Source.Held = false;
        _maxStep = _maDetailMaxStep;
        _maQuietSince = t;
        _maMeans = 0;
        _maCycle = long.MinValue;
        if (_maLiftNode != -2)
        {
            // Give the dropper its charge on the periodic steady state at this instant (its bleeder has emptied it while
            // the mains was held): the source comes back with the dropper where a running supply has it, no inrush.
            double vdc = (_maPlus >= 0 ? _x[_maPlus] : 0.0) - (_maMinus >= 0 ? _x[_maMinus] : 0.0);
            double vc = _ma.SteadyDropperVoltage(t, vdc);
            // The source's plus side takes the source's value above its minus (it was held at 0 V), then the dropper's
            // rectifier side its voltage below that.
            if (_maSourceSide.Length > 0)
            {
                double above = (_maSourceMinus >= 0 ? _x[_maSourceMinus] : 0.0) + _ma.Source.Waveform.Value(t);
                foreach (int i in _maSourceSide) _x[i] = above;
            }
            double reference = _maLiftReference >= 0 ? _x[_maLiftReference] : 0.0;
            if (_maLiftNode >= 0) _x[_maLiftNode] = reference - _ma.LiftSign * vc;
            Evaluate(_x, t);
            Array.Copy(_ctx.Q, _q, _n);
        }
        RestartAfterSwitch();
    }

    /// <summary>The sources and the averaged current change at the switch: restart with a backward-Euler step.</summary>
    private void RestartAfterSwitch()
    {
        _needRestart = true;
        _havePrev = false;
        _h = _options.RestartStep;
    }

    /// <summary>At the end of the run: the averaged time up to the stop.</summary>
    private void FinishMainsAveraging()
    {
        if (_ma is null) return;
        if (_maAveraged) _stats.MainsAveragedSeconds += _time.Value - _maAveragedSince;
        _maAveraged = false;
    }
}
