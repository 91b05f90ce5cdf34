namespace NightSim.Text;

/// <summary>
/// Free text from an input file (a netlist or scenario name, a site name, a description) made safe to show in a
/// terminal, an HTML page or an SVG plot: control characters (an escape, a NUL, a bell) become U+FFFD "�", so they
/// can neither steer the terminal nor make an XML document invalid. Line breaks and tabs become spaces.
/// </summary>
public static class DisplayText
{
    /// <summary>The text with control characters replaced.</summary>
    public static string Clean(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!text.Any(char.IsControl)) return text;
        return string.Create(text.Length, text, static (span, t) =>
        {
            for (int i = 0; i < t.Length; i++)
            {
                char c = t[i];
                span[i] = c is '\n' or '\r' or '\t' ? ' ' : char.IsControl(c) ? '\uFFFD' : c;
            }
        });
    }
}
