using NightSim.Analysis;
using NightSim.Reporting;
using NightSim.Results;
using NightSim.Sky;

namespace NightSim.Runs;

/// <summary>Everything a night run produced: the raw simulation, the facts the analysis read, the report, the trace
/// table for trace.csv and the plot data. Immutable.</summary>
public sealed record NightRunResult(
    SimulationResult Simulation,
    LightProfile? Profile,
    RunFacts Facts,
    AnalysisResult Analysis,
    NightReport Report,
    TraceTable Traces,
    IReadOnlyList<PlotData> Plots);
