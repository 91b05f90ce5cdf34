using Spectre.Console;

namespace NightSim.Cli.Rendering;

/// <summary>The Spectre console for a command's output writer: the real terminal when writing to the process's
/// standard output, a plain (no colour, not interactive) console otherwise (tests, redirection).</summary>
internal static class Terminal
{
    public static IAnsiConsole For(TextWriter output)
    {
        if (ReferenceEquals(output, Console.Out)) return AnsiConsole.Console;
        return AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(output),
            Ansi = AnsiSupport.No,
            ColorSystem = ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.No,
        });
    }
}
