using NightSim.Devices;

namespace NightSim.Transient;

/// <summary>Bounds on the step from what the error estimate cannot see (docs/numerics.md §2): devices' own states
/// (<see cref="IInternalState"/>) and the approach of event functions to their thresholds.</summary>
public sealed partial class TransientSolver
{
    private IInternalState[] _internal = [];
    private int _internalSize;

    private void SetUpInternalStates()
    {
        _eventRate = new double[_eventSource.Length];
        _internal = [.. _devices.OfType<IInternalState>()];
        _internalSize = 0;
        foreach (IInternalState d in _internal) _internalSize += d.InternalStateCount;
    }

    private double[] _eventRate = [];   // d g/dt of each event function over the last accepted step (0: unknown)

    /// <summary>Per event function, its rate of change over the step just accepted (g at the new point in _gNew, at the
    /// old one in _gOld). A step that fired events changes the functions' definitions: rates restart unknown.</summary>
    private void NoteEventRates(double h, bool restart)
    {
        for (int e = 0; e < _eventRate.Length; e++)
            _eventRate[e] = restart || !(h > 0) || Flipped(_gOld[e], _gNew[e]) ? 0.0 : (_gNew[e] - _gOld[e]) / h;
    }

    /// <summary>
    /// No step longer than EventApproachFactor times the time an event function needs to reach zero at its present
    /// rate. Events are found from the signs at the ends of a step: a function that crosses and turns back within one
    /// step (a sensor relaxing towards its threshold while the sky moves the threshold's light level) would be stepped
    /// over. With the bound, a function heading for zero is sampled near its crossing; one moving away bounds nothing.
    /// </summary>
    private double EventApproachLimit()
    {
        double limit = double.PositiveInfinity;
        for (int e = 0; e < _eventRate.Length; e++)
        {
            double g = _gOld[e], rate = _eventRate[e];
            if (rate == 0.0 || (g < 0) == (rate < 0)) continue; // not heading for zero
            limit = Math.Min(limit, EventApproachFactor * Math.Abs(g / rate));
        }
        return limit;
    }

    private const double EventApproachFactor = 2.0;

    /// <summary>The longest step over which no device's own state changes by more than <see cref="TransientOptions.LightChange"/>
    /// in ln at its present rate, seconds.</summary>
    private double InternalStepLimit()
    {
        double limit = double.PositiveInfinity;
        foreach (IInternalState d in _internal) limit = Math.Min(limit, d.InternalStepLimit(_options.LightChange));
        return limit;
    }
}
