namespace NightSim.Devices.Behavioural;

/// <summary>
/// A logic level 0…1 that moves linearly from its old value to a new one over a fixed transition time after a
/// discrete state change, so the circuit never sees a step it cannot integrate. Per-run mutable state of the device
/// that owns it; changed only from that device's <see cref="IEventSource.OnEvent"/>.
/// </summary>
public struct LevelRamp
{
    private double _from;
    private double _to;
    private double _start;
    private double _duration;

    /// <summary>A level resting at <paramref name="value"/> (0…1) with ramps of <paramref name="duration"/> seconds.</summary>
    public LevelRamp(double value, double duration)
    {
        _from = value;
        _to = value;
        _start = double.NegativeInfinity;
        _duration = duration;
    }

    /// <summary>The level the ramp is heading for (0…1).</summary>
    public readonly double Target => _to;

    /// <summary>End of the running ramp, seconds (−∞ when none was started).</summary>
    public readonly double End => _start + _duration;

    /// <summary>Level at run time <paramref name="time"/> (seconds), 0…1.</summary>
    public readonly double At(double time)
    {
        if (_from == _to || time >= _start + _duration) return _to;
        if (time <= _start) return _from;
        return _from + (_to - _from) * ((time - _start) / _duration);
    }

    /// <summary>Start a ramp at <paramref name="time"/> (s) from the present level towards <paramref name="target"/>.
    /// A ramp reversed halfway starts from where it stands, so the level stays continuous.</summary>
    public void Begin(double time, double target)
    {
        _from = At(time);
        _to = target;
        _start = time;
    }

    /// <summary>The ramp end if it lies strictly after <paramref name="time"/>, else +∞ (for NextBreakpoint).</summary>
    public readonly double NextEdge(double time)
    {
        double end = _start + _duration;
        return end > time && _from != _to ? end : double.PositiveInfinity;
    }
}
