using System.CommandLine;
using System.Globalization;
using NightSim.Cli;

namespace NightSim.Tests.Cli;

public sealed class SimulateCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private static string TempDir()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-sim-" + Guid.NewGuid().ToString("N"));
        return dir;
    }

    [Fact]
    public void Rc_Demo_Writes_A_Trace_That_Matches_The_Closed_Form()
    {
        // netlists/rc-step.json: 12 V step at 0.1 s (1 µs edge) into 10 kΩ / 100 µF, τ = 1 s:
        // v_out = 12(1 − e^(−(t − 0.1 s)/τ)) after the step (RC closed form; the 1 µs edge shifts it by 0.5 µs).
        string dir = TempDir();
        try
        {
            (int exit, string output, string error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "5s", "--out", dir);
            Assert.True(exit == 0, error);
            Assert.Contains("rc-step: simulated", output, StringComparison.Ordinal);
            string[] lines = File.ReadAllLines(Path.Combine(dir, "trace.csv"));
            Assert.Equal("time_s,in_volts,out_volts", lines[0]);
            Assert.True(lines.Length > 30);
            double worst = 0;
            foreach (string line in lines.Skip(1))
            {
                string[] f = line.Split(',');
                double t = double.Parse(f[0], CultureInfo.InvariantCulture);
                double v = double.Parse(f[2], CultureInfo.InvariantCulture);
                double exact = t <= 0.1 ? 0 : 12 * (1 - Math.Exp(-(t - 0.1 - 0.5e-6)));
                worst = Math.Max(worst, Math.Abs(v - exact) / 12);
            }
            Assert.True(worst <= 1e-4, $"max relative error {worst:E3}");
            string stats = File.ReadAllText(Path.Combine(dir, "statistics.json"));
            Assert.Contains("\"acceptedSteps\"", stats, StringComparison.Ordinal);
            Assert.Contains("\"cpuSeconds\"", stats, StringComparison.Ordinal);
            Assert.False(File.Exists(Path.Combine(dir, "trace.csv.tmp")));
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Lux_Warns_For_Sensors_With_Their_Own_Light_And_Without_Sensors()
    {
        string dir = TempDir();
        try
        {
            // dusk-timer-ramp.json: LDR1 has its own luxPoints, so --lux cannot reach it.
            (int exit, _, string error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "dusk-timer-ramp.json"), "--for", "10ms", "--lux", "50", "--out", dir);
            Assert.True(exit == 0, error);
            Assert.Contains("warning: --lux does not apply to LDR1", error, StringComparison.Ordinal);
            (exit, _, error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "10ms", "--lux", "50", "--out", dir);
            Assert.True(exit == 0, error);
            Assert.Contains("--lux has no effect", error, StringComparison.Ordinal);
            (exit, _, error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "10ms", "--out", dir);
            Assert.DoesNotContain("--lux", error, StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Bad_Duration_Exits_1_And_Writes_Nothing()
    {
        string dir = TempDir();
        (int exit, _, string error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "5m", "--out", dir);
        Assert.Equal(1, exit);
        Assert.Contains("ambiguous", error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void Invalid_Netlist_Exits_2_With_The_Loader_Messages()
    {
        string dir = TempDir();
        (int exit, _, string error) = Run("simulate", RepoPaths.BadNetlist("bad-many.json"), "--for", "1s", "--out", dir);
        Assert.Equal(2, exit);
        Assert.Contains("(part R1)", error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void Unknown_Node_Exits_1_Naming_The_Known_Nodes()
    {
        (int exit, _, string error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "1s", "--nodes", "out,nowhere", "--out", TempDir());
        Assert.Equal(1, exit);
        Assert.Contains("'nowhere'", error, StringComparison.Ordinal);
        Assert.Contains("in, out", error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("10s", 10.0)]
    [InlineData("90min", 5400.0)]
    [InlineData("24h", 86400.0)]
    [InlineData("500ms", 0.5)]
    [InlineData("2d", 172800.0)]
    [InlineData("3600", 3600.0)]
    public void Durations_Parse_With_Units(string text, double seconds)
    {
        Assert.True(NightSim.Units.Duration.TryParse(text, out double s, out _));
        Assert.Equal(seconds, s, 9);
    }
}
