namespace NightSim.Tests.Reporting;

/// <summary>Locates the repository root (the folder holding NightSim.sln) from the test's output folder.</summary>
internal static class RepoPaths
{
    public static string Root { get; } = Find();

    private static string Find()
    {
        for (DirectoryInfo? d = new(AppContext.BaseDirectory); d is not null; d = d.Parent)
            if (File.Exists(Path.Combine(d.FullName, "NightSim.sln"))) return d.FullName;
        throw new DirectoryNotFoundException("NightSim.sln not found above " + AppContext.BaseDirectory);
    }
}
