using NightSim.Devices;
using NightSim.Mna;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>Landing on the corners of a trapezoidal pulse late in a run (docs/numerics.md §4): a corner is no jump, so
/// no restart follows it, and each of the pulse's three segments is one step when the error test allows it.</summary>
public sealed class CornerLandingTests
{
    private const double Amplitude = 0.4, Edge = 0.2e-6, Top = 1.6e-6, Coupling = 100e-12, NodeCap = 10e-9, Pull = 10e3, Supply = 12;
    private static readonly double[] Starts = [6030, 6090, 6150];

    // A 0.4 V, 2 µs pulse (0.2 µs edges) every minute, coupled through 100 pF onto a node held at 12 V through 10 kΩ
    // with 10 nF to ground: the busy bench night's noise pulse on the timer's trigger input.
    private static Circuit Coupled() => Circuit.FromDevices("corners",
    [
        new VoltageSource("V1", "V1", "vcc", "gnd", Waveform.Dc(Supply)),
        new VoltageSource("VN", "VN", "src", "gnd", Waveform.Pulse(0, Amplitude, Starts[0], Edge, Edge, Top, 60)),
        new Capacitor("CC", "CC", "src", "trig", Coupling),
        new Capacitor("CN", "CN", "trig", "gnd", NodeCap),
        new Resistor("RP", "RP", "vcc", "trig", Pull),
    ]);

    /// <summary>The bump on the node at the end of the pulse, from the closed form of a first-order RC driven piecewise by
    /// a ramp (common practice): u' = −u/τ + β·s' with τ = R·(Cc + Cn), β = Cc/(Cc + Cn), solved segment by segment as
    /// u(t) = u∞ + (u0 − u∞)·e^(−t/τ), u∞ = τ·β·s'.</summary>
    private static double BumpAtEnd()
    {
        double tau = Pull * (Coupling + NodeCap), beta = Coupling / (Coupling + NodeCap);
        double u = 0;
        foreach ((double length, double slope) in new[] { (Edge, Amplitude / Edge), (Top, 0.0), (Edge, -Amplitude / Edge) })
        {
            double uInf = tau * beta * slope;
            u = uInf + (u - uInf) * Math.Exp(-length / tau);
        }
        return u;
    }

    [Fact]
    public void Pulse_Corners_Cost_One_Step_Per_Segment_And_No_Restart()
    {
        Circuit circuit = Coupled();
        var solver = new TransientSolver(circuit);
        var times = new List<double>();
        var values = new List<double>();
        int trig = circuit.IndexOf("trig");
        solver.Accepted = s =>
        {
            times.Add(s.Time);
            values.Add(s.Solution[trig]);
        };
        var result = solver.Run(6200);
        Assert.Null(result.Failure);

        foreach (double start in Starts)
        {
            double end = start + 2 * Edge + Top;
            int first = times.FindIndex(t => t > start);
            int last = times.FindLastIndex(t => t <= end * (1 + 1e-15));
            // Three segments, three steps (six with a tenth of the distance after each landing).
            Assert.True(last - first + 1 <= 3, $"pulse at {start} s: {last - first + 1} steps inside the 2 µs pulse");
            // No 1 ns restart step at or after a corner: a ramp's corner is no jump.
            for (int i = Math.Max(1, first); i <= last + 1 && i < times.Count; i++)
                Assert.True(times[i] - times[i - 1] > 1e-8, $"step of {times[i] - times[i - 1]:E2} s at {times[i]} s");
            // The bump at the end of the pulse within the tolerance (rtol·|v| + atol) of the closed form.
            Assert.Equal(end, times[last], 9);
            double bump = values[last] - Supply;
            Assert.True(Math.Abs(bump - BumpAtEnd()) <= 1e-4 * Supply + 1e-6,
                $"bump {bump * 1e3:F4} mV, closed form {BumpAtEnd() * 1e3:F4} mV");
        }
    }
}
