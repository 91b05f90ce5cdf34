using NightSim.Devices;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Tests.Devices;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

public sealed class PowerUpRampTests
{
    // Series RLC, 5 V step at t = 0 (1 µs edge), R 10 Ω, L 10 mH, C 10 µF: α = R/2L = 500 /s, ω0 = 1/√(LC) = 3162 rad/s,
    // ωd = √(ω0² − α²) = 3122 rad/s. Capacitor voltage step response s(t) = V0·(1 − e^(−αt)(cos ωd·t + (α/ωd)·sin ωd·t))
    // (second-order series RLC, e.g. Nilsson & Riedel, Electric Circuits, chapter "Natural and step responses of RLC
    // circuits"); its integral follows from LC·v'' + RC·v' + v = V0: S(t) = V0·t − LC·s'(t) − RC·s(t), so a ramp of
    // duration T gives (S(t) − S(t − T))/T (S = 0 for t < 0). Peak of the ideal step: V0·(1 + e^(−απ/ωd)) = 8.02 V.
    private const double V0 = 5.0, R = 10.0, L = 10e-3, C = 10e-6;

    private static double Step(double t)
    {
        if (t <= 0) return 0;
        double a = R / (2 * L), w0 = 1 / Math.Sqrt(L * C), wd = Math.Sqrt(w0 * w0 - a * a);
        return V0 * (1 - Math.Exp(-a * t) * (Math.Cos(wd * t) + a / wd * Math.Sin(wd * t)));
    }

    private static double StepSlope(double t)
    {
        if (t <= 0) return 0;
        double a = R / (2 * L), w0 = 1 / Math.Sqrt(L * C), wd = Math.Sqrt(w0 * w0 - a * a);
        return V0 * w0 * w0 / wd * Math.Exp(-a * t) * Math.Sin(wd * t);
    }

    private static double StepIntegral(double t) => t <= 0 ? 0 : V0 * t - L * C * StepSlope(t) - R * C * Step(t);

    /// <summary>Capacitor voltage for an input ramping from 0 to V0 over <paramref name="ramp"/> seconds.</summary>
    private static double RampResponse(double t, double ramp) => (StepIntegral(t) - StepIntegral(t - ramp)) / ramp;

    private static double PeakOf(Func<double, double> v)
    {
        double peak = 0;
        for (double t = 0; t < 5e-3; t += 1e-7) peak = Math.Max(peak, v(t));
        return peak;
    }

    private static double SimulatedPeak(StartMode start)
    {
        Circuit circuit = Circuit.FromDevices("rlc",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Pulse(0, V0, 0, 1e-6, 1e-6, double.PositiveInfinity, double.PositiveInfinity)),
            new Resistor("R1", "R1", "in", "a", R),
            new Inductor("L1", "L1", "a", "out", L),
            new Capacitor("C1", "C1", "out", "gnd", C),
        ]);
        var options = TransientOptions.Verification with { Start = start, MaxStep = 1e-6 };
        if (start == StartMode.PowerUp)
        {
            // The source's step at 0 s lies inside the 1 ms ramp: the run says so.
            var inside = Assert.Single(PowerUpRamp.SourceCornersInside(circuit, options));
            Assert.Equal("V1", inside.PartId);
            Assert.Equal(0.0, inside.Corner);
        }
        else
        {
            Assert.Empty(PowerUpRamp.SourceCornersInside(circuit, options));
        }
        SimulationResult r = TransientSolver.Run(circuit, 5e-3, options);
        Assert.True(r.Succeeded, r.Failure?.ToString());
        return r.Trace("out")!.Max;
    }

    [Fact]
    public void Rlc_Step_Peak_From_The_Operating_Point_Matches_The_Step_Closed_Form()
    {
        double expected = PeakOf(t => RampResponse(t, 1e-6)); // the source's own 1 µs edge
        Assert.Equal(V0 * (1 + Math.Exp(-500 * Math.PI / Math.Sqrt(1e7 - 500 * 500))), PeakOf(Step), 1e-4);
        Assert.Equal(8.02, expected, 0.01);
        Assert.Equal(expected, SimulatedPeak(StartMode.OperatingPoint), expected * 1e-4);
    }

    [Fact]
    public void Rlc_Step_Peak_With_The_Power_Up_Ramp_Matches_The_Ramp_Closed_Form()
    {
        // The ramp multiplies the source: the input rises over 1 ms instead of 1 µs (the product differs from a pure 1 ms
        // ramp only during the first microsecond, by less than 5 mV·µs).
        double expected = PeakOf(t => RampResponse(t, 1e-3));
        Assert.InRange(expected, 6.8, 7.0);
        Assert.Equal(expected, SimulatedPeak(StartMode.PowerUp), expected * 1e-4);
    }

    [Fact]
    public void A_Mains_Sine_From_Its_Zero_Is_Not_Reported_But_A_Fast_Edge_Is()
    {
        // A sine from its zero changes slope at 0 s but moves only 2π·f·V_pk·10 µs = 0.3 % of its peak in the first
        // hundredth of the 1 ms ramp (calculus, common practice): the ramp does not reshape it. A 1 µs edge does.
        static Circuit With(double phase) => Circuit.FromDevices("mains",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Sine(0, 325, 50, 0, phase)),
            new Resistor("R1", "R1", "in", "gnd", 1e3),
        ]);
        var options = TransientOptions.Default with { Start = StartMode.PowerUp };
        Assert.Empty(PowerUpRamp.SourceCornersInside(With(0), options));
        var delayed = Circuit.FromDevices("mains-late",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Pulse(0, 12, 0.5e-3, 1e-6, 1e-6, double.PositiveInfinity, double.PositiveInfinity)),
            new Resistor("R1", "R1", "in", "gnd", 1e3),
        ]);
        Assert.Equal(0.5e-3, Assert.Single(PowerUpRamp.SourceCornersInside(delayed, options)).Corner, 9);
    }
}
