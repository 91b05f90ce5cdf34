using NightSim.Devices;

namespace NightSim.Tests.Devices;

public sealed class WaveformTests
{
    [Fact]
    public void Pulse_Ramps_Holds_And_Repeats()
    {
        var w = Waveform.Pulse(0, 5, delay: 1, rise: 0.1, fall: 0.2, width: 0.5, period: 2);
        Assert.Equal(0, w.Value(0.5));
        Assert.Equal(2.5, w.Value(1.05), 12);
        Assert.Equal(5, w.Value(1.3));
        Assert.Equal(2.5, w.Value(1.7), 12);
        Assert.Equal(0, w.Value(1.9));
        Assert.Equal(2.5, w.Value(3.05), 12);     // second period
        Assert.Equal(1.0, w.NextBreakpoint(0));
        Assert.Equal(1.1, w.NextBreakpoint(1.0), 12);
        Assert.Equal(1.6, w.NextBreakpoint(1.1), 12);
        Assert.Equal(1.8, w.NextBreakpoint(1.6), 12);
        Assert.Equal(3.0, w.NextBreakpoint(1.8), 12);
    }

    [Fact]
    public void Single_Step_Stays_At_V2()
    {
        var w = Waveform.Pulse(0, 12, delay: 0.1, rise: 1e-6, fall: 1e-6, width: double.PositiveInfinity, period: double.PositiveInfinity);
        Assert.Equal(12, w.Value(1e6));
        Assert.Equal(0.1 + 1e-6, w.NextBreakpoint(0.1), 15);
        Assert.Equal(double.PositiveInfinity, w.NextBreakpoint(0.2));
    }

    [Fact]
    public void Sine_Uses_Degrees_For_Phase()
    {
        // sin(90°) = 1: a 230 V rms mains wave has peak 230·√2 ≈ 325.3 V (IEC 60038 nominal voltage, common practice).
        var w = Waveform.Sine(0, 230 * Math.Sqrt(2), 50, 0, 90);
        Assert.Equal(325.269, w.Value(0), 3);
        Assert.Equal(-325.269, w.Value(0.01), 3);
    }

    [Fact]
    public void Piecewise_Linear_Interpolates_And_Holds_The_Ends()
    {
        var w = Waveform.PiecewiseLinear([(1, 0), (3, 10)]);
        Assert.Equal(0, w.Value(0));
        Assert.Equal(5, w.Value(2), 12);
        Assert.Equal(10, w.Value(99));
        Assert.Throws<ArgumentException>(() => Waveform.PiecewiseLinear([(1, 0), (1, 10)]));
    }
}
