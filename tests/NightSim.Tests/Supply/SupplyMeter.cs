using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Supply;

/// <summary>
/// Runs a circuit and measures, over a closing window of whole mains cycles, a differential voltage (time average,
/// minimum, maximum: trapezoidal over every accepted step, not over the decimated trace) and the RMS and mean
/// absolute current through a named resistor.
/// </summary>
internal sealed class SupplyMeter
{
    public double Average { get; private set; }
    public double Min { get; private set; } = double.PositiveInfinity;
    public double Max { get; private set; } = double.NegativeInfinity;
    public double CurrentRms { get; private set; }
    public double CurrentMeanAbs { get; private set; }
    public SimulationResult Result { get; private set; } = null!;

    /// <summary>Run <paramref name="circuit"/> to <paramref name="stop"/> s and measure from <paramref name="from"/> s.</summary>
    /// <param name="plus">Positive rail node.</param>
    /// <param name="minus">Negative rail node ("gnd" for ground).</param>
    /// <param name="resistorA">First node of the resistor whose current is measured, or null.</param>
    /// <param name="resistorB">Second node of that resistor.</param>
    /// <param name="resistance">Its resistance, Ω.</param>
    public static SupplyMeter Run(Circuit circuit, double stop, double from, string plus, string minus,
        string? resistorA = null, string? resistorB = null, double resistance = 1, TransientOptions? options = null)
    {
        var meter = new SupplyMeter();
        int p = circuit.IndexOf(plus), m = circuit.IndexOf(minus);
        int ra = resistorA is null ? -1 : circuit.IndexOf(resistorA), rb = resistorB is null ? -1 : circuit.IndexOf(resistorB);
        var solver = new TransientSolver(circuit, options);
        double tPrev = double.NaN, vPrev = 0, iPrev = 0, sumV = 0, sumI2 = 0, sumAbsI = 0, span = 0;
        solver.Accepted = s =>
        {
            double t = s.Time;
            var x = s.Solution;
            double v = (p >= 0 ? x[p] : 0) - (m >= 0 ? x[m] : 0);
            double i = resistorA is null ? 0 : ((ra >= 0 ? x[ra] : 0) - (rb >= 0 ? x[rb] : 0)) / resistance;
            if (t > from && !double.IsNaN(tPrev))
            {
                double t0 = Math.Max(tPrev, from), dt = t - t0;
                sumV += 0.5 * (v + vPrev) * dt;
                sumI2 += 0.5 * (i * i + iPrev * iPrev) * dt;
                sumAbsI += 0.5 * (Math.Abs(i) + Math.Abs(iPrev)) * dt;
                span += dt;
                meter.Min = Math.Min(meter.Min, v);
                meter.Max = Math.Max(meter.Max, v);
            }
            tPrev = t;
            vPrev = v;
            iPrev = i;
        };
        meter.Result = solver.Run(stop);
        meter.Average = sumV / span;
        meter.CurrentRms = Math.Sqrt(sumI2 / span);
        meter.CurrentMeanAbs = sumAbsI / span;
        return meter;
    }
}
