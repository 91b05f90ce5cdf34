namespace NightSim.Tests.Sky;

internal static class SkyTestFiles
{
    public static string Scenario(string name) => Path.Combine(AppContext.BaseDirectory, "data", "scenarios", name);

    public static string RepoFile(string relative) => Path.Combine(RepoPaths.Root, relative);
}
