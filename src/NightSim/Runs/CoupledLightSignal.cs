using NightSim.Sky;

namespace NightSim.Runs;

/// <summary>
/// The scenario's light plus the circuit's own lamp: while a coupled load is on, it adds its lux at the sensor.
/// The load state is discrete and changes only at located events, so within any step the added light is constant
/// and the engine still sees a piecewise-smooth signal.
/// </summary>
public sealed class CoupledLightSignal : ILightSignal
{
    private readonly ILightSignal _inner;
    private readonly (int Channel, Func<bool> IsOn, double Lux)[] _couplings;

    /// <param name="inner">The scenario's light.</param>
    /// <param name="couplings">Per coupling: channel index, a query for the load's present state, lux added when on.</param>
    public CoupledLightSignal(ILightSignal inner, IEnumerable<(int Channel, Func<bool> IsOn, double Lux)> couplings)
    {
        _inner = inner;
        _couplings = couplings.ToArray();
    }

    public DateTimeOffset Origin => _inner.Origin;

    public int ChannelIndex(string name) => _inner.ChannelIndex(name);

    public double Lux(int channel, double time)
    {
        double lux = _inner.Lux(channel, time);
        foreach ((int ch, Func<bool> isOn, double add) in _couplings)
        {
            if (ch == channel && isOn()) lux += add;
        }
        return lux;
    }

    public double NextBreakpoint(double time) => _inner.NextBreakpoint(time);

    /// <summary>The lamp's own light changes only at events; the smooth part is the scenario's.</summary>
    public double StepLimit(double time, double change) => _inner.StepLimit(time, change);
}
