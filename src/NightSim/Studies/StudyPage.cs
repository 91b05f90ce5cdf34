using System.Globalization;
using System.Text;
using NightSim.Reporting;

namespace NightSim.Studies;

/// <summary>
/// A self-contained HTML page for a study (inline CSS and inline SVG figures, no scripts, no external files), built
/// from headed sections of paragraphs, tables and figures. Well-formed XML like the night report.
/// </summary>
public sealed class StudyPage
{
    private readonly StringBuilder _h = new(64 * 1024);

    public StudyPage(string title, string subtitle, IReadOnlyList<string> cautions)
    {
        _h.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n")
          .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n<title>").Append(Esc(title)).Append("</title>\n")
          .Append("<style>").Append(Css).Append("</style>\n</head>\n<body>\n<main>\n<header>\n<h1>").Append(Esc(title)).Append("</h1>\n<p class=\"summary\">")
          .Append(Esc(subtitle)).Append("</p>\n</header>\n");
        if (cautions.Count > 0)
        {
            _h.Append("<section class=\"caution\">\n<h2>Caution: mains voltage</h2>\n<ul>\n");
            foreach (string c in cautions) _h.Append("<li>").Append(Esc(c)).Append("</li>\n");
            _h.Append("</ul>\n</section>\n");
        }
    }

    public StudyPage Section(string heading)
    {
        _h.Append("<h2>").Append(Esc(heading)).Append("</h2>\n");
        return this;
    }

    public StudyPage Paragraph(string text, string? cls = null)
    {
        _h.Append(cls is null ? "<p>" : "<p class=\"" + cls + "\">").Append(Esc(text)).Append("</p>\n");
        return this;
    }

    public StudyPage List(IEnumerable<string> items)
    {
        _h.Append("<ul>\n");
        foreach (string i in items) _h.Append("<li>").Append(Esc(i)).Append("</li>\n");
        _h.Append("</ul>\n");
        return this;
    }

    /// <summary>A table; a row whose first cell starts with "!" is marked as a problem (the "!" is dropped).</summary>
    public StudyPage Table(IReadOnlyList<string> heads, IEnumerable<IReadOnlyList<string>> rows)
    {
        _h.Append("<div class=\"scroll\">\n<table>\n<thead>\n<tr>");
        foreach (string head in heads) _h.Append("<th scope=\"col\">").Append(Esc(head)).Append("</th>");
        _h.Append("</tr>\n</thead>\n<tbody>\n");
        foreach (IReadOnlyList<string> row in rows)
        {
            bool bad = row.Count > 0 && row[0].StartsWith('!');
            _h.Append(bad ? "<tr class=\"fail\">" : "<tr>");
            for (int i = 0; i < row.Count; i++)
            {
                string cell = i == 0 && bad ? row[0][1..] : row[i];
                bool num = cell.Length > 0 && (char.IsDigit(cell[0]) || cell[0] is '−' or '-' or '+') && !cell.Contains(' ', StringComparison.Ordinal);
                _h.Append(num ? "<td class=\"num\">" : "<td>").Append(Esc(cell)).Append("</td>");
            }
            _h.Append("</tr>\n");
        }
        _h.Append("</tbody>\n</table>\n</div>\n");
        return this;
    }

    public StudyPage Figures(IReadOnlyList<HtmlFigure> figures)
    {
        foreach (HtmlFigure f in figures)
        {
            _h.Append("<figure>\n").Append(f.Svg).Append("\n<figcaption>").Append(Esc(f.Title)).Append("</figcaption>\n</figure>\n");
        }
        return this;
    }

    public string Render(string footer) =>
        _h.ToString() + "<footer>" + Esc(footer) + "</footer>\n</main>\n</body>\n</html>\n";

    public static string Esc(string s) => s.Replace("&", "&amp;", StringComparison.Ordinal).Replace("<", "&lt;", StringComparison.Ordinal)
        .Replace(">", "&gt;", StringComparison.Ordinal).Replace("\"", "&quot;", StringComparison.Ordinal);

    /// <summary>A number for a table: invariant, at most <paramref name="decimals"/> decimals, "—" for null.</summary>
    public static string N(double? v, int decimals = 3) => v is double x && double.IsFinite(x)
        ? x.ToString("0." + new string('#', decimals), CultureInfo.InvariantCulture) : "—";

    private const string Css = """
body { font-family: "DejaVu Sans", Verdana, sans-serif; margin: 0; color: #1d1d1d; background: #fafafa; }
main { max-width: 1100px; margin: 0 auto; padding: 1rem 1.5rem 3rem; }
h1 { font-size: 1.6rem; margin-bottom: 0.2rem; }
h2 { font-size: 1.2rem; margin-top: 2rem; border-bottom: 1px solid #ccc; }
p.summary { color: #555; margin-top: 0; }
p.verdict { font-size: 1.1rem; font-weight: bold; }
section.caution { border: 2px solid #b8860b; background: #fff8e1; padding: 0.2rem 1rem; margin: 1rem 0; }
div.scroll { overflow-x: auto; }
table { border-collapse: collapse; font-size: 0.85rem; margin: 0.5rem 0; }
th, td { border: 1px solid #ddd; padding: 0.2rem 0.5rem; text-align: left; vertical-align: top; }
th { background: #eee; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
tr.fail td { background: #fdecea; }
figure { margin: 1rem 0; }
figure svg { width: 100%; height: auto; }
figcaption { color: #555; font-size: 0.9rem; }
code { font-size: 0.9em; }
footer { margin-top: 2rem; color: #777; font-size: 0.8rem; }
""";
}
