using NightSim.Devices;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Sky.Events;
using NightSim.Studies;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>
/// The step has no fixed upper limit: it is bounded by the error estimate, by breakpoints (source corners, light event
/// edges) landed on exactly, and by how fast the sky's light changes. Landing on every corner of a piecewise input is
/// common practice for transient integrators (a step across a corner integrates a kink it cannot see).
/// </summary>
public sealed class LightAwareStepTests
{
    private static (SimulationResult Result, List<double> Times, LightProfile Profile) RunNight(NightRunRequest request)
    {
        LightProfile profile = request.Scenario!.CreateProfile();
        var devices = new List<Device>();
        foreach (PartDefinition part in request.Netlist.Parts) devices.AddRange(PartCatalog.Find(part.Kind)!.Create(part));
        foreach (var g in profile.NoiseInjections.GroupBy(n => n.Node))
        {
            NoiseInjection[] pulses = [.. g.OrderBy(p => p.Time)];
            devices.Add(new NoiseInjector($"noise.{g.Key}.v", g.Key, [.. pulses.Select(p => p.Time)], [.. pulses.Select(p => p.Width)],
                [.. pulses.Select(p => p.Amplitude)], false));
        }
        Circuit circuit = Circuit.FromDevices(request.Netlist.Name, devices, profile);
        var solver = new TransientSolver(circuit, TransientOptions.Default, profile);
        var times = new List<double> { 0.0 };
        solver.Accepted = s => times.Add(s.Time);
        SimulationResult result = solver.Run(profile.Duration);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        return (result, times, profile);
    }

    private static bool Landed(List<double> sortedTimes, double t)
    {
        int i = sortedTimes.BinarySearch(t);
        if (i >= 0) return true;
        i = ~i;
        double tol = 1e-9 * Math.Max(1.0, Math.Abs(t));
        return (i < sortedTimes.Count && sortedTimes[i] - t <= tol) || (i > 0 && t - sortedTimes[i - 1] <= tol);
    }

    [Fact]
    public void No_Light_Event_Or_Noise_Edge_Is_Stepped_Over()
    {
        // The driveway demo plus 30 headlight passes, a 20-flash storm and 1 440 noise pulses: thousands of edges.
        var (result, times, profile) = RunNight(BenchWorkload.Busy(RepoPaths.Netlists));
        int checkedEdges = 0;
        foreach (double bp in profile.Breakpoints)
        {
            if (bp <= 0 || bp >= profile.Duration) continue;
            Assert.True(Landed(times, bp), $"edge at {bp:R} s was stepped over");
            checkedEdges++;
        }
        Assert.True(checkedEdges > 3000, $"{checkedEdges} edges");
        Assert.True(result.Statistics.Breakpoints >= checkedEdges);
    }

    [Fact]
    public void No_Source_Corner_Is_Stepped_Over()
    {
        // A trapezoid pulse (corners at delay, +rise, +width, +fall, repeating every period) into an RC: every corner
        // must be an accepted point although nothing else limits the step between pulses (the RC settles in 50 ms).
        var pulse = Waveform.Pulse(0.0, 5.0, 100.0, 1e-3, 2e-3, 5.0, 1000.0);
        var circuit = Circuit.FromDevices("pulse-rc",
        [
            new VoltageSource("V1", "V1", "in", "0", pulse),
            new Resistor("R1", "R1", "in", "out", 10e3),
            new Capacitor("C1", "C1", "out", "0", 1e-6),
        ]);
        var solver = new TransientSolver(circuit, TransientOptions.Default);
        var times = new List<double> { 0.0 };
        solver.Accepted = s => times.Add(s.Time);
        SimulationResult r = solver.Run(10_000.0);
        Assert.True(r.Succeeded);
        for (int k = 0; k < 10; k++)
        {
            double start = 100.0 + 1000.0 * k;
            foreach (double corner in new[] { start, start + 1e-3, start + 1e-3 + 5.0, start + 1e-3 + 5.0 + 2e-3 })
                Assert.True(Landed(times, corner), $"corner at {corner:R} s was stepped over");
        }
        Assert.True(r.Statistics.MaxStep > 60, $"longest step {r.Statistics.MaxStep} s");
    }

    [Fact]
    public void Twilight_Steps_Follow_The_Sky()
    {
        // Between two accepted points the sensor's light changes by at most the light-aware bound (10 % in ln lux)
        // unless a breakpoint (an event edge) lies between them.
        var (result, times, profile) = RunNight(BenchWorkload.Demo(RepoPaths.Netlists, "garden-path"));
        // The step is not held to a minute any more: the quiet hours of the night take far longer steps.
        Assert.True(result.Statistics.MaxStep > 600, $"longest step {result.Statistics.MaxStep} s");
        double bound = TransientOptions.Default.LightChange;
        int twilightSteps = 0;
        for (int k = 1; k < times.Count; k++)
        {
            double a = times[k - 1], b = times[k];
            double next = profile.NextBreakpoint(a - 1e-6);
            if (next <= b + 1e-6) continue;
            double change = Math.Abs(Math.Log(profile.Lux(0, b)) - Math.Log(profile.Lux(0, a)));
            Assert.True(change <= bound * 1.02, $"step {a:F1}…{b:F1} s: light changed by {change:F3} in ln lux");
            if (change > 0.5 * bound) twilightSteps++;
        }
        // Dusk and dawn each fall through about 11 in ln lux (thousands of lux to the night floor): dozens of steps.
        Assert.True(twilightSteps > 50, $"{twilightSteps} steps near the bound");
    }
}
