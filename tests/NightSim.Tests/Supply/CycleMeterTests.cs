using NightSim.Supply;

namespace NightSim.Tests.Supply;

/// <summary>The cycle meter against a sampled sine whose mean (its offset), RMS (√(offset² + A²/2)) and extremes are
/// known in closed form (any signals textbook), sampled at uneven steps that never land on a cycle boundary.</summary>
public sealed class CycleMeterTests
{
    private static void Feed(CycleMeter meter, Func<double, double> f, double from, double to, double step)
    {
        Span<double> v = stackalloc double[1];
        double t = from;
        int k = 0;
        while (t <= to)
        {
            v[0] = f(t);
            meter.Add(t, v);
            t += step * (k++ % 3 == 0 ? 0.7 : 1.15);
        }
    }

    [Fact]
    public void Mean_Rms_And_Extremes_Of_A_Sine_Over_Whole_Cycles()
    {
        const double f = 50, a = 2.0, offset = 1.0;
        var meter = new CycleMeter(1, 1 / f, 0.0);
        Feed(meter, t => offset + a * Math.Sin(2 * Math.PI * f * t), 0, 0.2, 1e-5);
        Assert.True(meter.Cycles >= 9);
        CycleStats s = meter.Window(5);
        Assert.Equal(offset, s.Mean[0], 1e-4);
        Assert.Equal(Math.Sqrt(offset * offset + a * a / 2), s.Rms[0], 1e-4);
        Assert.Equal(offset - a, s.Min[0], 1e-3);
        Assert.Equal(offset + a, s.Max[0], 1e-3);
        Assert.Equal(5 / f, s.To - s.From, 1e-9);
    }

    [Fact]
    public void Settles_Only_When_The_Decay_Left_Is_Within_Tolerance()
    {
        // A rail rising as 12·(1 − e^(−t/τ)) with ripple: per cycle its mean changes by a geometric series of ratio
        // e^(−T/τ), so what is left after cycle k is Δ_k·ρ/(1 − ρ) (geometric series).
        const double f = 50, tau = 0.2;
        var meter = new CycleMeter(1, 1 / f, 0.0);
        double settledAt = double.NaN;
        Span<double> v = stackalloc double[1];
        for (double t = 0; t < 3; t += 1e-4)
        {
            v[0] = 12 * (1 - Math.Exp(-t / tau)) + 0.05 * Math.Sin(2 * Math.PI * f * t);
            meter.Add(t, v);
            if (double.IsNaN(settledAt) && meter.Settled(10, 1e-3, 1e-3, 5)) settledAt = t;
        }
        // Settled once what is left, 12·e^(−t/τ), is within 1e-3·12 + 1 mV = 13 mV: t ≥ τ·ln(12/0.013) = 1.37 s.
        Assert.InRange(settledAt, 1.3, 1.6);
        meter.Forget();
        Assert.False(meter.Settled(10, 1e-3, 1e-3, 5));
        Assert.Equal(0, meter.Cycles);
    }
}
