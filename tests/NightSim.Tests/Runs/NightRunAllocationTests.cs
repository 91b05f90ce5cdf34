using NightSim.Results;
using NightSim.Runs;
using NightSim.Studies;

namespace NightSim.Tests.Runs;

/// <summary>A night run with its plot data (zoom and detail windows) allocates nothing on its steady steps: every
/// accepted point after the first 200, the zoom capture in the accepted-point callback and the events fired.</summary>
public class NightRunAllocationTests
{
    [Fact]
    public void Steady_Steps_Of_A_Night_With_Zoom_Windows_Allocate_Nothing()
    {
        // The garden-path demo night switches the lamp on at dusk and off by the timer, so zoom and detail windows open
        // and fill during the run. Up to three runs: the runtime's tiered recompilation of a hot method can allocate
        // once on this thread during a run; an allocation in the step or the capture shows in every run.
        var counts = new List<long>();
        NightRunResult? last = null;
        for (int run = 0; run < 3 && (counts.Count == 0 || counts[^1] != 0); run++)
        {
            last = NightRun.Run(BenchWorkload.Demo(RepoPaths.Netlists, "garden-path"));
            counts.Add(last.Simulation.Statistics.SteadyAllocatedBytes);
        }
        SolverStatistics st = last!.Simulation.Statistics;
        Assert.True(st.SteadySteps > 500, $"only {st.SteadySteps} steady steps");
        Assert.True(st.Events > 0);
        Assert.Contains(last.Plots, p => p.Title.Contains("(detail)", StringComparison.Ordinal));
        Assert.True(counts[^1] == 0, "bytes allocated on steady steps per run: " + string.Join(", ", counts));
    }
}
