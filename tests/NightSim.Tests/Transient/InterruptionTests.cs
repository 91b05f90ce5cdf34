using System.Diagnostics;
using NightSim.Devices;
using NightSim.Mna;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>A run stopped from outside ends at its last accepted point, marked interrupted, with what it computed.</summary>
public sealed class InterruptionTests
{
    [Fact]
    public void A_Cancelled_Run_Stops_At_Its_Next_Step_And_Keeps_Its_Traces()
    {
        // RC charging from 5 V switched on at t = 0 (τ = 1 ms) for 10 s; cancelled after 50 accepted steps.
        var circuit = Circuit.FromDevices("rc",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.Dc(5)),
            new Resistor("R1", "R1", "in", "out", 1e3),
            new Capacitor("C1", "C1", "out", "gnd", 1e-6),
        ]);
        using var cts = new CancellationTokenSource();
        var solver = new TransientSolver(circuit, TransientOptions.Default with { SupplyRamp = 0 }) { Cancellation = cts.Token };
        long accepted = 0;
        solver.Accepted = _ =>
        {
            if (++accepted == 50) cts.Cancel();
        };
        SimulationResult result = solver.Run(10.0);
        Assert.True(result.Interrupted);
        Assert.False(result.Succeeded);
        Assert.Null(result.Failure);
        Assert.Equal(50, result.Statistics.AcceptedSteps);
        Assert.True(result.StopTime < 10.0);
        NightSim.Results.Trace v = result.Trace("out")!;
        Assert.Equal(result.StopTime, v.Times[^1]);
        // What was computed is right: v(t) = 5·(1 − e^(−t/RC)) (first-order RC charge, any circuits textbook).
        double t = v.Times[^1];
        // Within 1 mV: the default relative tolerance 1e-4 on 5 V, accumulated over 50 steps.
        double expected = 5.0 * (1 - Math.Exp(-t / 1e-3));
        Assert.True(Math.Abs(v.Values[^1] - expected) < 1e-3, $"v({t} s) = {v.Values[^1]} V, closed form {expected} V");
    }

    /// <summary>SIGTERM to a running `nightsim simulate` of many nights: it exits with 130, keeps report-partial.json
    /// and trace-partial.csv, and leaves no temporary files.</summary>
    [Fact]
    public async Task Sigterm_Stops_A_Night_Run_And_Keeps_A_Partial_Report()
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return; // SIGTERM is a POSIX signal
        string dir = Path.Combine(Path.GetTempPath(), $"nightsim-sigterm-{Environment.ProcessId}");
        if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        try
        {
            var start = new ProcessStartInfo("dotnet")
            {
                RedirectStandardError = true,
                RedirectStandardOutput = true,
            };
            foreach (string a in (string[])[Path.Combine(AppContext.BaseDirectory, "nightsim.dll"), "simulate",
                Path.Combine(RepoPaths.Netlists, "garden-path-driveway.json"), "--nights", "400", "--out", dir, "--no-plots"])
                start.ArgumentList.Add(a);
            using Process p = Process.Start(start)!;
            var stdout = p.StandardOutput.ReadToEndAsync();
            // Wait until the run is stepping: its first progress line on standard error.
            var err = new System.Text.StringBuilder();
            string? first = await p.StandardError.ReadLineAsync();
            err.AppendLine(first);
            Assert.False(p.HasExited, "the run ended before it could be interrupted");
            using (Process kill = Process.Start("kill", ["-TERM", p.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)])!) kill.WaitForExit();
            using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(60));
            await p.WaitForExitAsync(timeout.Token);
            err.Append(await p.StandardError.ReadToEndAsync());
            _ = await stdout;
            Assert.Equal(130, p.ExitCode);
            Assert.Contains("interrupted at", err.ToString(), StringComparison.Ordinal);
            string report = File.ReadAllText(Path.Combine(dir, "report-partial.json"));
            Assert.Contains("\"partial\": true", report, StringComparison.Ordinal);
            Assert.Contains("\"stoppedBy\": \"interruption\"", report, StringComparison.Ordinal);
            Assert.True(File.Exists(Path.Combine(dir, "trace-partial.csv")));
            Assert.False(File.Exists(Path.Combine(dir, "report.json")));
            // No temporary file, inside the folder or beside it; the one hidden file is the list of what NightSim wrote.
            Assert.DoesNotContain(Directory.GetFiles(dir), f => f.EndsWith(".tmp", StringComparison.Ordinal)
                || (Path.GetFileName(f).StartsWith('.') && Path.GetFileName(f) != NightSim.Reporting.OutputManifest.FileName));
            Assert.DoesNotContain(Directory.GetDirectories(Path.GetDirectoryName(dir)!), d => Path.GetFileName(d).StartsWith("." + Path.GetFileName(dir) + ".", StringComparison.Ordinal));
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }
}
