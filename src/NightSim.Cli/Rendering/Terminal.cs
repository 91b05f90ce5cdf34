using Spectre.Console;

namespace NightSim.Cli.Rendering;

/// <summary>The Spectre console for a command's output writer: the real terminal when writing to the process's
/// standard output or standard error (capabilities detected), a plain (no colour, not interactive) console otherwise
/// (tests).</summary>
internal static class Terminal
{
    public static IAnsiConsole For(TextWriter output)
    {
        if (ReferenceEquals(output, Console.Out)) return AnsiConsole.Console;
        if (ReferenceEquals(output, Console.Error)) return AnsiConsole.Create(new AnsiConsoleSettings { Out = new AnsiConsoleOutput(Console.Error) });
        return AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(output),
            Ansi = AnsiSupport.No,
            ColorSystem = ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.No,
        });
    }
}
