namespace NightSim.Analysis;

/// <summary>The analysers every night run applies, in order. Adding one: one file, one line here, one test file.</summary>
public static class AnalyzerCatalog
{
    public static IReadOnlyList<IResultAnalyzer> All { get; } =
    [
        new NightOutcomeAnalyzer(),
        new FalseTriggerAnalyzer(),
        new ChatterAnalyzer(),
        new TimerAnalyzer(),
        new LeakageLimitAnalyzer(),
        new StageAnalyzer(),
        new DischargeCurrentAnalyzer(),
        new ContactAnalyzer(),
        new SupplyRegulationAnalyzer(),
        new SupplyPullInAnalyzer(),
        new SupplyDropOutAnalyzer(),
        new SupplyRippleAnalyzer(),
    ];
}
