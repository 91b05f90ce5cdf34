using NightSim.Sky;

namespace NightSim.Cli.Commands;

/// <summary>The scenario's targets that plots draw as lines (read again from the scenario file the header names).</summary>
internal sealed record LightTargets(double? OnMin, double? OnMax, double? AfterSunset, double? LuxMin, double? LuxMax)
{
    public static LightTargets Of(string? scenarioPath)
    {
        DesignTargets? t = scenarioPath is not null && File.Exists(scenarioPath) ? ScenarioLoader.Load(scenarioPath, out _)?.Targets : null;
        return new LightTargets(t?.OnTimeMin, t?.OnTimeMax, t?.SwitchOnMinutesAfterSunset, t?.SwitchOnLuxMin, t?.SwitchOnLuxMax);
    }
}
