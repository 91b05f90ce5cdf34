using NightSim.Cli.Rendering;
using Spectre.Console.Testing;

namespace NightSim.Tests.Cli.Rendering;

/// <summary>Progress for redirected output: plain lines, none in the first second, at most one a second.
/// Time comes from a fake clock the test advances (no real waiting, no timed assertions).</summary>
public sealed class ProgressReporterTests
{
    private sealed class FakeClock
    {
        public TimeSpan Now;
        public TimeSpan Read() => Now;
    }

    private static string[] Lines(TestConsole c) => c.Output.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);

    [Fact]
    public void RedirectedRunPrintsPlainLinesAtMostOncePerSecond()
    {
        var console = new TestConsole();
        console.Profile.Capabilities.Interactive = false;
        var clock = new FakeClock();
        var reporter = new ProgressReporter(console, enabled: true, clock.Read);
        int result = reporter.Run(p =>
        {
            // 3 nights, a report every 0.25 s of (fake) time, 10 reports per night.
            for (int night = 1; night <= 3; night++)
            {
                for (int k = 0; k < 10; k++)
                {
                    p.Report(new NightProgress(night, 3, k / 10.0));
                    clock.Now += TimeSpan.FromSeconds(0.25);
                }
            }
            return 42;
        });
        Assert.Equal(42, result);
        string[] lines = Lines(console);
        // 30 reports over 7.5 s: the first at t = 1 s, then every 1 s → 7 lines.
        Assert.Equal(7, lines.Length);
        Assert.Equal("simulating night 1/3: 40%", lines[0]);
        Assert.All(lines, l => Assert.Matches("^simulating night [1-3]/3: [0-9]+%$", l));
        Assert.DoesNotContain("\u001b", console.Output, StringComparison.Ordinal); // no escape codes
    }

    [Fact]
    public void ShortRunPrintsNothing()
    {
        var console = new TestConsole();
        var clock = new FakeClock();
        new ProgressReporter(console, true, clock.Read).Run(p =>
        {
            for (int k = 0; k < 100; k++) { p.Report(new NightProgress(1, 1, k / 100.0)); clock.Now += TimeSpan.FromMilliseconds(9); }
            return 0;
        });
        Assert.Empty(Lines(console));
    }

    [Fact]
    public void NoProgressOptionSilencesEverything()
    {
        var console = new TestConsole();
        var clock = new FakeClock();
        new ProgressReporter(console, enabled: false, clock.Read).Run(p =>
        {
            for (int k = 0; k < 10; k++) { p.Report(new NightProgress(1, 1, k / 10.0)); clock.Now += TimeSpan.FromSeconds(2); }
            return 0;
        });
        Assert.Empty(Lines(console));
    }

    [Fact]
    public void WorkExceptionsPropagateUnwrapped()
    {
        var console = new TestConsole();
        var reporter = new ProgressReporter(console, true);
        Assert.Throws<InvalidOperationException>(() => reporter.Run<int>(_ => throw new InvalidOperationException("solver gave up")));
    }

    [Fact]
    public void OverallFractionAndText()
    {
        var p = new NightProgress(2, 4, 0.5);
        Assert.Equal(0.375, p.Overall, 12);
        Assert.Equal("simulating night 2/4: 50%", p.ToString());
        Assert.Equal(1.0, new NightProgress(4, 4, 1.7).Overall, 12);
    }
}
