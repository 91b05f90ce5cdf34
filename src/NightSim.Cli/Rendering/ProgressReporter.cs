using System.Diagnostics;
using Spectre.Console;

namespace NightSim.Cli.Rendering;

/// <summary>
/// Shows the progress of a run: a Spectre progress bar on an interactive terminal, plain lines
/// ("simulating night 1/3: 35%", at most one a second) when output is redirected, nothing with --no-progress
/// and nothing for runs that finish within about a second.
/// </summary>
public sealed class ProgressReporter
{
    /// <summary>Runs shorter than this show no progress at all.</summary>
    public static readonly TimeSpan QuietPeriod = TimeSpan.FromSeconds(1);

    /// <summary>Plain lines are at least this far apart.</summary>
    public static readonly TimeSpan LineInterval = TimeSpan.FromSeconds(1);

    private readonly IAnsiConsole _console;
    private readonly bool _enabled;
    private readonly Func<TimeSpan> _clock;

    /// <param name="console">Where progress goes.</param>
    /// <param name="enabled">False for --no-progress.</param>
    /// <param name="clock">Monotonic elapsed time source (tests pass a fake one); default a stopwatch.</param>
    public ProgressReporter(IAnsiConsole console, bool enabled, Func<TimeSpan>? clock = null)
    {
        _console = console;
        _enabled = enabled;
        if (clock is null)
        {
            var sw = Stopwatch.StartNew();
            clock = () => sw.Elapsed;
        }
        _clock = clock;
    }

    /// <summary>Run <paramref name="work"/>, which reports through the given <see cref="IProgress{T}"/>, and return its result.
    /// Exceptions from the work propagate unchanged.</summary>
    public T Run<T>(Func<IProgress<NightProgress>, T> work)
    {
        if (!_enabled) return work(new Silent());
        if (!_console.Profile.Capabilities.Interactive) return work(new PlainLines(_console, _clock));
        return RunWithBar(work);
    }

    /// <summary>The work runs on a worker thread; the bar appears only if it is still running after <see cref="QuietPeriod"/>.</summary>
    private T RunWithBar<T>(Func<IProgress<NightProgress>, T> work)
    {
        var latest = new Latest();
        Task<T> task = Task.Run(() => work(latest));
        if (!WaitQuietly(task, QuietPeriod))
        {
            _console.Progress()
                .AutoClear(true)
                .HideCompleted(true)
                .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new ElapsedTimeColumn(), new RemainingTimeColumn())
                .Start(ctx =>
                {
                    ProgressTask bar = ctx.AddTask("simulating", maxValue: 100);
                    do
                    {
                        NightProgress p = latest.Value;
                        if (p.Nights > 0) bar.Description = $"simulating night {p.Night}/{p.Nights}";
                        bar.Value = 100 * p.Overall;
                        ctx.Refresh();
                    }
                    while (!WaitQuietly(task, TimeSpan.FromMilliseconds(100)));
                    bar.Value = 100;
                });
        }
        return task.GetAwaiter().GetResult();
    }

    private static bool WaitQuietly(Task task, TimeSpan timeout)
    {
        try { return task.Wait(timeout); }
        catch (AggregateException) { return true; } // rethrown unwrapped by GetResult
    }

    private sealed class Silent : IProgress<NightProgress>
    {
        public void Report(NightProgress value) { }
    }

    private sealed class Latest : IProgress<NightProgress>
    {
        private NightProgress _value;
        private readonly Lock _gate = new();

        public NightProgress Value { get { lock (_gate) return _value; } }

        public void Report(NightProgress value) { lock (_gate) _value = value; }
    }

    /// <summary>Plain lines for redirected output: none in the first second, then at most one a second.</summary>
    private sealed class PlainLines(IAnsiConsole console, Func<TimeSpan> clock) : IProgress<NightProgress>
    {
        private readonly TimeSpan _start = clock();
        private TimeSpan? _last;
        private string? _lastText;

        public void Report(NightProgress value)
        {
            TimeSpan now = clock() - _start;
            if (now < QuietPeriod) return;
            if (_last is TimeSpan last && now - last < LineInterval) return;
            string text = value.ToString();
            if (text == _lastText) return;
            console.WriteLine(text);
            _last = now;
            _lastText = text;
        }
    }
}
