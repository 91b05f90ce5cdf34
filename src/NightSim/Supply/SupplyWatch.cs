using NightSim.Analysis;
using NightSim.Devices.Roles;
using NightSim.Mna;
using NightSim.Results;
using NightSim.Units;

namespace NightSim.Supply;

/// <summary>
/// Watches a mains-fed supply through a night run, at every accepted point and without allocating: the rail, the rail
/// Zener's current per load state (standby, or a relay coil driven: drawing at least half its drop-out current), every
/// relay drive with the rail before and during it, and, in standby cycles simulated in full mains detail, the trigger
/// pin's distance from its trigger level against its swing. <see cref="Facts"/> turns it into <see cref="SupplyFacts"/>.
/// </summary>
public sealed class SupplyWatch
{
    /// <summary>Relay drives remembered; later ones are counted only.</summary>
    public const int MaxAttempts = 256;

    /// <summary>Accepted points a mains cycle needs to count as simulated in full detail (not jumped over).</summary>
    public const int FullDetailSteps = 8;

    /// <summary>Time after a relay drive starts or ends before standby cycles count for the ripple, s.</summary>
    public const double Quiet = 1.0;

    /// <summary>Without a rail Zener, standby cycles count from this run time on (the supply has come up), s.</summary>
    public const double PowerUp = 5.0;

    private readonly SupplySection _section;
    private readonly int _plus, _minus, _line, _coil, _trigger, _timerGround;
    private readonly ITerminalCurrent? _zener;
    private readonly double _zenerTest, _coilResistance, _driven, _triggerFraction, _period, _origin;

    // Regulation per state (0 standby, 1 relay on).
    private bool _established;
    private readonly double[] _first = [double.NaN, double.NaN];
    private readonly double[] _lost = new double[2];
    private readonly double[] _stateTime = new double[2];
    private readonly double[] _zenerMin = [double.PositiveInfinity, double.PositiveInfinity];
    private readonly double[] _railMinLost = [double.PositiveInfinity, double.PositiveInfinity];
    private double _lastTime = double.NaN;
    private bool _lastLost;
    private int _lastState;

    // Relay drives.
    private readonly double[] _aStart = new double[MaxAttempts], _aEnd = new double[MaxAttempts], _aBefore = new double[MaxAttempts];
    private readonly double[] _aRailMin = new double[MaxAttempts], _aCoilPeak = new double[MaxAttempts];
    private int _attempts;
    private bool _driving;
    private double _lapse = double.NaN;
    private double _lastChange = double.NegativeInfinity;

    // The current mains cycle.
    private long _cycle = long.MinValue;
    private int _steps;
    private double _cStart, _cRailSum, _cRailMin, _cRailMax, _cMarginMin, _cMarginMax, _cZenerSum, _cLineSq, _cPrevT, _cPrevRail, _cPrevZener, _cPrevLine;
    private bool _cStandby;
    private double _lastCycleRail = double.NaN;
    // Standby whole cycles.
    private int _standbyCycles;
    private double _standbyRail, _standbyZener, _standbyLine;
    private double _rTime = double.NaN, _rRipple, _rSwing, _rMargin;
    private double _rScore = double.NegativeInfinity;

    private SupplyWatch(Circuit circuit, SupplySection section)
    {
        _section = section;
        int Ix(string node) => Netlist.Ground.Is(node) ? -1 : circuit.IndexOf(node);
        _plus = Ix(section.Rail!.Plus);
        _minus = Ix(section.Rail.Minus);
        _line = circuit.IndexOf(section.Source.CurrentLabel);
        if (section.RailZener is { } z)
        {
            _zener = circuit.Devices.First(d => ReferenceEquals(d.Role, z)) as ITerminalCurrent;
            _zenerTest = z.TestCurrent;
        }
        if (section.Relays.Count > 0)
        {
            RelayCoilRole r = section.Relays[0];
            _coil = circuit.IndexOf(r.CoilCurrent);
            _coilResistance = r.CoilResistance;
            _driven = SupplyThresholds.Driven * r.DropOut;
        }
        else
        {
            _coil = -1;
        }
        if (section.Timer is { } t)
        {
            _trigger = Ix(t.Trigger);
            _timerGround = Ix(t.Ground);
            _triggerFraction = t.TriggerFraction;
        }
        else
        {
            _trigger = int.MinValue;
        }
        _period = 1.0 / section.Source.Frequency;
        _origin = section.Source.Start;
    }

    /// <summary>A watch for <paramref name="circuit"/>, or null when it has no mains-fed supply with a rail.</summary>
    public static SupplyWatch? Create(Circuit circuit)
    {
        SupplySection? section = SupplySection.Find(circuit.Devices);
        return section?.Rail is null ? null : new SupplyWatch(circuit, section);
    }

    private static double V(ReadOnlySpan<double> x, int i) => i >= 0 ? x[i] : 0.0;

    /// <summary>Takes the accepted point (<paramref name="t"/>, <paramref name="x"/>). Allocation-free.</summary>
    public void Observe(double t, ReadOnlySpan<double> x)
    {
        double rail = V(x, _plus) - V(x, _minus);
        double zener = _zener is null ? double.NaN : -_zener.TerminalCurrent(x);
        double line = _line >= 0 ? x[_line] : 0.0;
        double coil = _coil >= 0 ? Math.Abs(x[_coil]) * _coilResistance : 0.0;
        bool driven = _coil >= 0 && coil >= _driven;
        double dt = double.IsNaN(_lastTime) ? 0.0 : t - _lastTime;

        // Relay drives. A drive that lapses for less than a mains cycle (the rail collapsing under the coil in a
        // trough) goes on; the end is where it lapsed.
        if (!driven && _driving && double.IsNaN(_lapse)) _lapse = t;
        if (driven) _lapse = double.NaN;
        if (_driving && !double.IsNaN(_lapse) && t - _lapse > _period)
        {
            _driving = false;
            _lastChange = _lapse;
            if (_attempts <= MaxAttempts) _aEnd[_attempts - 1] = _lapse;
            _lapse = double.NaN;
        }
        if (driven && !_driving)
        {
            _driving = true;
            _lastChange = t;
            if (_attempts < MaxAttempts)
            {
                _aStart[_attempts] = t;
                _aEnd[_attempts] = double.NaN;
                _aBefore[_attempts] = _lastCycleRail;
                _aRailMin[_attempts] = rail;
                _aCoilPeak[_attempts] = coil;
            }
            _attempts++;
        }
        if (_driving && _attempts <= MaxAttempts)
        {
            int a = _attempts - 1;
            if (rail < _aRailMin[a]) _aRailMin[a] = rail;
            if (coil > _aCoilPeak[a]) _aCoilPeak[a] = coil;
        }

        int state = _driving ? 1 : 0;

        // Regulation, once the Zener has first carried half its test current (the rail has come up).
        if (_zener is not null)
        {
            if (!_established && zener >= 0.5 * _zenerTest) _established = true;
            if (_established)
            {
                bool lost = zener < SupplyThresholds.RegulationLost * _zenerTest;
                if (dt > 0)
                {
                    _stateTime[_lastState] += dt;
                    if (lost && _lastLost) _lost[_lastState] += dt;
                }
                if (zener < _zenerMin[state]) _zenerMin[state] = zener;
                if (lost)
                {
                    if (double.IsNaN(_first[state])) _first[state] = t;
                    if (rail < _railMinLost[state]) _railMinLost[state] = rail;
                }
                _lastLost = lost;
            }
        }
        _lastState = state;
        _lastTime = t;

        // Mains cycles.
        long cycle = (long)Math.Floor((t - _origin) / _period);
        if (cycle != _cycle)
        {
            CloseCycle(cycle);
            _cycle = cycle;
            _steps = 0;
            _cStart = t;
            _cRailSum = _cZenerSum = _cLineSq = 0;
            _cRailMin = _cRailMax = rail;
            _cMarginMin = double.PositiveInfinity;
            _cMarginMax = double.NegativeInfinity;
            // Standby cycles count once the supply has come up: its Zener regulating, or after the power-up window.
            _cStandby = !_driving && t - _lastChange >= Quiet && (_zener is null ? t >= PowerUp : _established);
        }
        else
        {
            double h = t - _cPrevT;
            _cRailSum += 0.5 * (rail + _cPrevRail) * h;
            _cZenerSum += 0.5 * (zener + _cPrevZener) * h;
            _cLineSq += 0.5 * (line * line + _cPrevLine * _cPrevLine) * h;
        }
        _steps++;
        if (rail < _cRailMin) _cRailMin = rail;
        if (rail > _cRailMax) _cRailMax = rail;
        if (_trigger != int.MinValue)
        {
            double margin = V(x, _trigger) - V(x, _timerGround) - _triggerFraction * rail;
            if (margin < _cMarginMin) _cMarginMin = margin;
            if (margin > _cMarginMax) _cMarginMax = margin;
        }
        if (_driving || t - _lastChange < Quiet) _cStandby = false;
        _cPrevT = t;
        _cPrevRail = rail;
        _cPrevZener = zener;
        _cPrevLine = line;
    }

    /// <summary>Closes the cycle in progress: a whole cycle in full detail updates the last cycle's rail, and a quiet
    /// standby one the standby means and the ripple at the trigger.</summary>
    private void CloseCycle(long next)
    {
        if (_cycle == long.MinValue || next != _cycle + 1 || _steps < FullDetailSteps) return;
        double span = _cPrevT - _cStart;
        if (!(span > 0.8 * _period)) return;
        double mean = _cRailSum / span;
        _lastCycleRail = mean;
        if (!_cStandby) return;
        _standbyCycles++;
        _standbyRail += mean;
        _standbyZener += _zener is null ? 0.0 : _cZenerSum / span;
        _standbyLine += Math.Sqrt(_cLineSq / span);
        if (_trigger == int.MinValue || !(_cMarginMin > 0)) return;
        double swing = _cMarginMax - _cMarginMin;
        double score = swing / _cMarginMin;
        if (score > _rScore)
        {
            _rScore = score;
            _rTime = _cStart;
            _rRipple = _cRailMax - _cRailMin;
            _rSwing = swing;
            _rMargin = _cMarginMin;
        }
    }

    /// <summary>The facts of the run watched; <paramref name="railAt"/> gives the rail at a run time from the recorded
    /// rows.</summary>
    public SupplyFacts Facts(Func<double, double>? railAt)
    {
        SupplySection s = _section;
        var losses = new List<RegulationLoss>();
        for (int k = 0; k < 2; k++)
        {
            if (double.IsNaN(_first[k])) continue;
            losses.Add(new RegulationLoss(k == 1, _first[k], _lost[k], Math.Max(0, _zenerMin[k]), _railMinLost[k]) { StateSeconds = _stateTime[k] });
        }
        var attempts = new List<CoilAttempt>();
        for (int a = 0; a < Math.Min(_attempts, MaxAttempts); a++)
        {
            double end = !double.IsNaN(_aEnd[a]) ? _aEnd[a] : !double.IsNaN(_lapse) ? _lapse : _lastTime;
            attempts.Add(new CoilAttempt(s.Relays[0].PartId, _aStart[a], end, _aBefore[a], _aRailMin[a], _aCoilPeak[a]));
        }
        string dropper = s.Droppers.Count > 0
            ? $"the {EngineeringValue.Format(s.DropperCapacitance, "F", 3)} dropper {string.Join("+", s.Droppers.Select(d => d.PartId))} from {EngineeringValue.Format(s.Source.Rms, "V", 3)} {s.Source.Frequency:0.##} Hz"
            : $"the {EngineeringValue.Format(s.Source.Rms, "V", 3)} {s.Source.Frequency:0.##} Hz source {s.Source.PartId}";
        return new SupplyFacts
        {
            Description = dropper,
            MainsRms = s.Source.Rms,
            Frequency = s.Source.Frequency,
            DropperCapacitance = s.DropperCapacitance,
            Droppers = [.. s.Droppers.Select(d => d.PartId)],
            RailPlus = s.Rail!.Plus,
            RailMinus = s.Rail.Minus,
            ZenerId = s.RailZener?.PartId,
            ZenerVoltage = s.RailZener?.BreakdownVoltage ?? double.NaN,
            ZenerTestCurrent = s.RailZener?.TestCurrent ?? double.NaN,
            ReservoirId = s.Reservoir?.PartId,
            ReservoirCapacitance = s.Reservoir?.Capacitance ?? 0,
            StandbyRail = _standbyCycles > 0 ? _standbyRail / _standbyCycles : double.NaN,
            StandbyZenerCurrent = _standbyCycles > 0 && _zener is not null ? _standbyZener / _standbyCycles : double.NaN,
            StandbyMainsCurrent = _standbyCycles > 0 ? _standbyLine / _standbyCycles : double.NaN,
            CoilResistance = s.Relays.ToDictionary(r => r.PartId, r => r.CoilResistance),
            Losses = losses,
            Attempts = attempts,
            Ripple = double.IsNaN(_rTime) || s.Timer is null ? null : new RippleAtTrigger(_rTime, _rRipple, _rSwing, _rMargin, s.Timer.PartId),
            RailAt = railAt,
        };
    }

    /// <summary>The rail at a run time from the recorded node traces of <paramref name="sim"/>, or null when either node
    /// was not recorded.</summary>
    public Func<double, double>? RailFrom(SimulationResult sim)
    {
        SupplyRail rail = _section.Rail!;
        Trace? plus = Netlist.Ground.Is(rail.Plus) ? null : sim.Trace(rail.Plus);
        Trace? minus = Netlist.Ground.Is(rail.Minus) ? null : sim.Trace(rail.Minus);
        if (plus is null && !Netlist.Ground.Is(rail.Plus) || minus is null && !Netlist.Ground.Is(rail.Minus)) return null;
        return t => (plus?.At(t) ?? 0.0) - (minus?.At(t) ?? 0.0);
    }
}
