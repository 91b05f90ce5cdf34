namespace NightSim.Tests.Sky;

internal static class SkyTestFiles
{
    public static string Scenario(string name) => Path.Combine(AppContext.BaseDirectory, "data", "scenarios", name);

    public static string RepoFile(string relative)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "NightSim.sln"))) dir = dir.Parent;
        Assert.NotNull(dir);
        return Path.Combine(dir!.FullName, relative);
    }
}
