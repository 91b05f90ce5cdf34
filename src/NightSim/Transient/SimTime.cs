namespace NightSim.Transient;

/// <summary>
/// Run time as a compensated sum (Kahan–Babuška, via Knuth's TwoSum): a high part and the rounding error of every
/// addition kept in a low part, so that a year of steps (≈ 10⁶ additions at t ≈ 3e7 s, where one ulp is 3.7 ns)
/// does not drift. Breakpoints and events are landed on by assignment, never by adding up steps; step sizes are
/// carried, never recomputed as differences of absolute times (docs/numerics.md §3).
/// </summary>
public struct SimTime
{
    private double _hi;
    private double _lo;

    /// <summary>The time, seconds.</summary>
    public readonly double Value => _hi + _lo;

    /// <summary>Set the time exactly (landing on a breakpoint or event), seconds.</summary>
    public void Set(double time)
    {
        _hi = time;
        _lo = 0;
    }

    /// <summary>Advance by <paramref name="h"/> seconds keeping the rounding error.</summary>
    public void Advance(double h)
    {
        double y = h + _lo;
        double s = _hi + y;
        double bp = s - _hi;
        double err = (_hi - (s - bp)) + (y - bp);
        _hi = s;
        _lo = err;
    }
}
