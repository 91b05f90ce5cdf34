using System.CommandLine;
using NightSim.Cli.Commands;

namespace NightSim.Cli;

internal static class Program
{
    private static int Main(string[] args)
    {
        var root = new RootCommand("nightsim: dusk-activated, time-limited lighting controllers through synthetic nights");
        root.Subcommands.Add(SkyCommand.Create());
        return root.Parse(args).Invoke();
    }
}
