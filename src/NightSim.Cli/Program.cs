using System.CommandLine;
using NightSim.Cli.Commands;

namespace NightSim.Cli;

internal static class Program
{
    private static int Main(string[] args) => CreateRoot().Parse(args).Invoke();

    /// <summary>The `nightsim` root command with every verb (tests invoke it in-process).</summary>
    internal static RootCommand CreateRoot()
    {
        var root = new RootCommand(
            "NightSim: simulate dusk-activated, time-limited lighting controllers through synthetic nights before you solder and mount them.");

        // Verbs: one `root.Subcommands.Add(XCommand.Create());` line each, in help order (check, sky, simulate, …).
        root.Subcommands.Add(InitCommand.Create());
        root.Subcommands.Add(CheckCommand.Create());
        root.Subcommands.Add(SimulateCommand.Create());
        root.Subcommands.Add(SkyCommand.Create());
        root.Subcommands.Add(SupplyCommand.Create());
        root.Subcommands.Add(SweepCommand.Create());
        root.Subcommands.Add(SpreadCommand.Create());
        root.Subcommands.Add(YearCommand.Create());
        root.Subcommands.Add(TuneCommand.Create());
        root.Subcommands.Add(MergeCommand.Create());
        root.Subcommands.Add(BenchCommand.Create());
        root.Subcommands.Add(CompareCommand.Create());

        return root;
    }
}
