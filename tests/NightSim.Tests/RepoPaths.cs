namespace NightSim.Tests;

/// <summary>Paths into the repository and the copied test data.</summary>
internal static class RepoPaths
{
    /// <summary>The repository root (the folder holding NightSim.sln), found upwards from the test binaries.</summary>
    public static string Root
    {
        get
        {
            string? dir = AppContext.BaseDirectory;
            while (dir is not null && !File.Exists(Path.Combine(dir, "NightSim.sln"))) dir = Path.GetDirectoryName(dir);
            return dir ?? throw new InvalidOperationException("NightSim.sln not found above " + AppContext.BaseDirectory);
        }
    }

    /// <summary>netlists/ in the repository.</summary>
    public static string Netlists => Path.Combine(Root, "netlists");

    /// <summary>The malformed netlists copied beside the test binaries.</summary>
    public static string BadNetlist(string name) => Path.Combine(AppContext.BaseDirectory, "data", "netlists", name);

    /// <summary>Every example netlist (not scenarios, not schemas).</summary>
    public static IEnumerable<string> ExampleNetlists => Directory.GetFiles(Netlists, "*.json")
        .Where(f => !f.EndsWith(".scenario.json", StringComparison.Ordinal) && !f.EndsWith(".schema.json", StringComparison.Ordinal))
        .Order(StringComparer.Ordinal);
}
