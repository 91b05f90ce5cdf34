using System.Runtime.ExceptionServices;

namespace NightSim.Studies;

/// <summary>How far a study has come.</summary>
/// <param name="Done">Items finished.</param>
/// <param name="Total">Items to run.</param>
public readonly record struct StudyProgress(int Done, int Total);

/// <summary>
/// Runs the items of a study on several worker threads. Each item's result depends only on its index (every random
/// draw is seeded from it), and results are stored by index, so the outcome does not depend on the number of workers
/// or on which worker ran what. Cancellation stops handing out new items; items already started finish.
/// </summary>
public static class StudyRunner
{
    /// <summary>Results aligned with <paramref name="indices"/>; null where an item did not run (cancelled).</summary>
    /// <exception cref="Exception">The first exception an item threw (the others stop after their current item).</exception>
    public static T?[] Run<T>(IReadOnlyList<int> indices, Func<int, T> work, int workers, CancellationToken cancel,
        IProgress<StudyProgress>? progress = null) where T : class
    {
        var results = new T?[indices.Count];
        int next = -1, done = 0;
        ExceptionDispatchInfo? error = null;
        void Worker()
        {
            while (!cancel.IsCancellationRequested && Volatile.Read(ref error) is null)
            {
                int k = Interlocked.Increment(ref next);
                if (k >= indices.Count) return;
                try
                {
                    results[k] = work(indices[k]);
                }
                catch (Exception ex)
                {
                    Interlocked.CompareExchange(ref error, ExceptionDispatchInfo.Capture(ex), null);
                    return;
                }
                progress?.Report(new StudyProgress(Interlocked.Increment(ref done), indices.Count));
            }
        }
        int n = Math.Clamp(workers, 1, Math.Max(1, indices.Count));
        var threads = new Thread[n];
        for (int i = 0; i < n; i++)
        {
            threads[i] = new Thread(Worker, 16 * 1024 * 1024) { IsBackground = true, Name = $"study worker {i + 1}" };
            threads[i].Start();
        }
        foreach (Thread t in threads) t.Join();
        error?.Throw();
        return results;
    }
}
