
namespace NightSim.Analysis;

/// <summary>Reads the facts of a finished run and the attributed night summaries, and states findings.
/// Analysers never see the solver. Register a new one in <see cref="AnalyzerCatalog"/>.</summary>
public interface IResultAnalyzer
{
    IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights);
}
