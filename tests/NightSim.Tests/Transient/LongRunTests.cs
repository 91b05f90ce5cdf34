using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>Long runs: breakpoints hit over a day, step budget, allocation-free steady stepping.</summary>
public sealed class LongRunTests
{
    private static Circuit DayCircuit() => Circuit.FromDevices("day",
    [
        // 1 V baseline with a 1 µs, 5 V pulse every hour (first at 30 min), 10 ns edges.
        new VoltageSource("V1", "V1", "in", "gnd", Waveform.Pulse(1, 5, 1800, 10e-9, 10e-9, 1e-6, 3600)),
        // Slow RC, τ = 1 h.
        new Resistor("R1", "R1", "in", "slow", 1e6),
        new Capacitor("C1", "C1", "slow", "gnd", 3.6e-3),
        // Fast RC, τ = 1 µs: sees each pulse.
        new Resistor("R2", "R2", "in", "fast", 1e3),
        new Capacitor("C2", "C2", "fast", "gnd", 1e-9),
    ]);

    /// <summary>Peak of the fast RC (τ = 1 µs) driven by the trapezoid 1 → 5 V (10 ns edges, 1 µs top), from the closed
    /// form of an RC driven by a ramp u0 + s·t: v(t) = u0 + s(t − τ) + (v0 − u0 + sτ)e^(−t/τ), piece by piece.</summary>
    private static double FastPeak(double edge = 10e-9)
    {
        const double tau = 1e-6, top = 1e-6;
        static double Ramp(double u0, double slope, double v0, double t, double tau) =>
            u0 + slope * (t - tau) + (v0 - u0 + slope * tau) * Math.Exp(-t / tau);
        double v = Ramp(1, 4 / edge, 1, edge, tau);     // rising edge
        v = Ramp(5, 0, v, top, tau);                    // top
        double peak = v;
        for (int k = 1; k <= 10_000; k++) peak = Math.Max(peak, Ramp(5, -4 / edge, v, edge * k / 10_000, tau)); // falling edge
        return peak;
    }

    [Fact]
    public void A_Day_With_Hourly_1us_Pulses_Hits_Every_Pulse_In_Under_20000_Steps()
    {
        var result = TransientSolver.Run(DayCircuit(), 86400, TransientOptions.Default);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Assert.True(result.Statistics.AcceptedSteps < 20_000, $"{result.Statistics.AcceptedSteps} accepted steps");
        // Every corner landed on: 4 per pulse, plus the end of the supply ramp and the stop time.
        Assert.True(result.Statistics.Breakpoints >= 24 * 4 + 2, $"{result.Statistics.Breakpoints} breakpoints landed");
        var input = result.Trace("in")!;
        var fast = result.Trace("fast")!;
        var slow = result.Trace("slow")!;
        for (int hour = 0; hour < 24; hour++)
        {
            double t0 = hour * 3600.0, t1 = t0 + 3600.0;
            double maxIn = double.MinValue, maxFast = double.MinValue;
            for (int k = 0; k < input.Times.Count; k++)
                if (input.Times[k] >= t0 && input.Times[k] < t1) maxIn = Math.Max(maxIn, input.Values[k]);
            for (int k = 0; k < fast.Times.Count; k++)
                if (fast.Times[k] >= t0 && fast.Times[k] < t1) maxFast = Math.Max(maxFast, fast.Values[k]);
            Assert.True(maxIn >= 5 - 1e-9, $"hour {hour}: pulse top not reached ({maxIn} V)");
            // The peak falls inside the 10 ns falling edge; the trace holds accepted points, so allow 5 mV (0.15 %).
            Assert.True(Math.Abs(maxFast - FastPeak()) <= 5e-3, $"hour {hour}: fast RC peak {maxFast} V, exact {FastPeak()} V");
        }
        // Slow RC: 1 − e^(−t/τ) from power-up (the 1 ms supply ramp delays it by 0.5 ms; pulses add ≈ 1e-9 V each),
        // checked at every recorded point after the first minute (the trace is linear between accepted points, which
        // may lie hours apart, so it is compared where the solver computed it).
        int compared = 0;
        for (int k = 0; k < slow.Times.Count; k++)
        {
            double t = slow.Times[k];
            if (t < 60) continue;
            double exact = 1 - Math.Exp(-(t - 0.5e-3) / 3600);
            Assert.True(Math.Abs(slow.Values[k] - exact) <= 1e-4, $"slow RC at {t} s: {slow.Values[k]} V, exact {exact} V");
            compared++;
        }
        Assert.True(compared >= 24, $"{compared} points compared");
    }

    [Fact]
    public void A_Pulse_One_Year_In_Is_Resolved_As_Well_As_One_At_The_Start()
    {
        // At t ≈ 3.15e7 s one ulp of a double is 3.7 ns: the 100 ns edges and the 1 µs pulse must still come out as
        // at t = 0 (time is landed on by assignment and steps are carried, never differenced; docs/numerics.md §3).
        double year = 365.25 * 86400;
        double Peak(double delay)
        {
            var c = Circuit.FromDevices("late",
            [
                new VoltageSource("V1", "V1", "in", "gnd", Waveform.Pulse(1, 5, delay, 100e-9, 100e-9, 1e-6, double.PositiveInfinity)),
                new Resistor("R2", "R2", "in", "fast", 1e3),
                new Capacitor("C2", "C2", "fast", "gnd", 1e-9),
            ]);
            var r = TransientSolver.Run(c, delay + 5e-6, TransientOptions.Default with { MaxStep = 1e7 });
            Assert.True(r.Succeeded, r.Failure?.ToString());
            return r.Trace("fast")!.Max;
        }
        double early = Peak(1.0), late = Peak(year);
        Assert.True(Math.Abs(early - FastPeak(100e-9)) <= 5e-3, $"early peak {early} V, exact {FastPeak(100e-9)} V");
        Assert.True(Math.Abs(late - FastPeak(100e-9)) <= 5e-3, $"late peak {late} V, exact {FastPeak(100e-9)} V");
    }

    [Fact]
    public void Compensated_Time_Does_Not_Drift_Over_A_Year_Of_Steps()
    {
        // 1e6 steps of 31.5576 s from 0 reach exactly one year of 365.25 d (a plain double sum drifts by ≈ 1e-7 s).
        var time = new SimTime();
        double h = 365.25 * 86400 / 1e6, plain = 0;
        for (int k = 0; k < 1_000_000; k++)
        {
            time.Advance(h);
            plain += h;
        }
        double exact = 1e6 * h;
        Assert.True(Math.Abs(time.Value - exact) <= 4e-9, $"compensated error {time.Value - exact:E3} s");
        Assert.True(Math.Abs(time.Value - exact) <= Math.Abs(plain - exact));
    }

    [Fact]
    public void Steady_Steps_Allocate_Nothing()
    {
        // A nonlinear circuit with an event source, settled, stepping at h_max; 1 000 accepted steps must allocate 0 bytes
        // (GC.GetAllocatedBytesForCurrentThread; the hot loop uses preallocated arrays only).
        var circuit = Circuit.FromDevices("steady",
        [
            new VoltageSource("V1", "V1", "vcc", "gnd", Waveform.Dc(12)),
            new Resistor("R1", "R1", "vcc", "b", 100e3),
            new Capacitor("C1", "C1", "b", "gnd", 10e-6, leakageCurrent: 1e-9),
            new Bjt("Q1", "Q1", "c", "b", "gnd", earlyVoltage: 75, cje: 10e-12, cjc: 4e-12),
            new Resistor("R2", "R2", "vcc", "c", 4.7e3),
            new Diode("D1", "D1", "c", "vcc", junctionCapacitance: 2e-12),
            new Switch("S1", "S1", "c", "gnd", 0.1, 1e9, false),
        ]);
        var solver = new TransientSolver(circuit, TransientOptions.Default with { MaxStep = 60 });
        solver.Begin(1e9);
        for (int i = 0; i < 2000; i++) Assert.True(solver.Advance());
        // Measured over up to three windows of 1 000 steps: the runtime's tiered recompilation of a hot method can
        // allocate once on this thread; an allocation in the step itself shows in every window.
        var windows = new List<long>();
        for (int w = 0; w < 3 && (windows.Count == 0 || windows[^1] != 0); w++)
        {
            long before = GC.GetAllocatedBytesForCurrentThread();
            for (int i = 0; i < 1000; i++) solver.Advance();
            windows.Add(GC.GetAllocatedBytesForCurrentThread() - before);
        }
        Assert.True(windows[^1] == 0, "bytes allocated per 1 000 steps: " + string.Join(", ", windows));
        Assert.True(solver.Statistics.AcceptedSteps >= 3000);
    }
}
