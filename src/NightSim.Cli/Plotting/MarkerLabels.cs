using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace NightSim.Cli.Plotting;

/// <summary>One label of a vertical marker line.</summary>
/// <param name="X">Position on the x axis (axis coordinate).</param>
/// <param name="Text">The label.</param>
/// <param name="Color">Text colour.</param>
/// <param name="Bold">Bold text (markers about problems).</param>
public sealed record MarkerLabel(double X, string Text, OxyColor Color, bool Bold);

/// <summary>
/// Draws the labels of a plot's vertical markers, written upwards beside their lines, where they cover no curve:
/// the places are chosen when the plot is drawn (the layout, and so where every curve lands on screen, is known only
/// then) by <see cref="LabelPlacer"/>, over every panel, the top panel first. The SVG file, the PNG and the page's
/// figure are drawn from the same model at the same size, so they put every label in the same place.
/// </summary>
public sealed class MarkerLabels : Annotation
{
    /// <summary>Font size of the labels.</summary>
    public const double LabelFontSize = 10.5;

    private readonly IReadOnlyList<MarkerLabel> _labels;
    private readonly IReadOnlyList<string> _panelKeys;

    /// <param name="labels">The labels, one per marker.</param>
    /// <param name="xAxisKey">Key of the shared time axis.</param>
    /// <param name="panelKeys">Keys of the panels' y axes, in the order the labels should try them.</param>
    public MarkerLabels(IReadOnlyList<MarkerLabel> labels, string xAxisKey, IReadOnlyList<string> panelKeys)
    {
        _labels = labels;
        _panelKeys = panelKeys;
        XAxisKey = xAxisKey;
        YAxisKey = panelKeys[0];
        Layer = AnnotationLayer.AboveSeries;
        ClipByXAxis = false;
        ClipByYAxis = false;
    }

    /// <summary>The labels, in the order given.</summary>
    public IReadOnlyList<MarkerLabel> Labels => _labels;

    /// <summary>Where each label was drawn the last time the plot was rendered (screen units), in the order given.</summary>
    public IReadOnlyList<ScreenBox> Placed { get; private set; } = [];

    /// <summary>The panels as the last rendering laid them out, with their curves in screen units (for tests).</summary>
    public IReadOnlyList<LabelPanel> Panels { get; private set; } = [];

    public override void Render(IRenderContext rc)
    {
        base.Render(rc);
        PlotModel model = PlotModel;
        string font = ActualFont ?? model.DefaultFont;
        var requests = new List<LabelRequest>(_labels.Count);
        foreach (MarkerLabel l in _labels)
        {
            OxySize size = rc.MeasureText(l.Text, font, LabelFontSize, l.Bold ? FontWeights.Bold : FontWeights.Normal);
            // Written upwards: the text's length runs up the screen, its height across.
            requests.Add(new LabelRequest(XAxis!.Transform(l.X), size.Height, size.Width));
        }
        Panels = [.. _panelKeys.Select(k => model.Axes.FirstOrDefault(a => a.Key == k)).OfType<Axis>().Select(a => Panel(model, a, rc, font))];
        ScreenBox[] boxes = LabelPlacer.Place(requests, Panels);
        Placed = boxes;
        for (int i = 0; i < _labels.Count; i++)
        {
            MarkerLabel l = _labels[i];
            ScreenBox b = boxes[i];
            // Rotated −90°: the text starts at the box's bottom and its top faces left.
            rc.DrawText(new ScreenPoint(b.Left, b.Bottom), l.Text, l.Color, font, LabelFontSize, l.Bold ? FontWeights.Bold : FontWeights.Normal,
                -90, HorizontalAlignment.Left, VerticalAlignment.Top);
        }
    }

    /// <summary>A panel's area and what is drawn in it: every series on its y axis and every text annotation.</summary>
    private static LabelPanel Panel(PlotModel model, Axis y, IRenderContext rc, string font)
    {
        double top = Math.Min(y.ScreenMin.Y, y.ScreenMax.Y), bottom = Math.Max(y.ScreenMin.Y, y.ScreenMax.Y);
        var area = new ScreenBox(model.PlotArea.Left, top, model.PlotArea.Right, bottom);
        var curves = new List<ScreenCurve>();
        foreach (Series s in model.Series)
        {
            if (s is not DataPointSeries d || !s.IsVisible || d.YAxis != y) continue;
            bool steps = s is StairStepSeries;
            double weight = s is LineSeries { LineStyle: not LineStyle.Solid } ? LabelPlacer.ReferenceWeight : LabelPlacer.TraceWeight;
            var xs = new List<double>(d.Points.Count * (steps ? 2 : 1));
            var ys = new List<double>(xs.Capacity);
            double lastY = double.NaN;
            foreach (DataPoint p in d.Points)
            {
                double sx = d.XAxis.Transform(p.X), sy = p.IsDefined() ? y.Transform(p.Y) : double.NaN;
                if (steps && xs.Count > 0)
                {
                    // A stair step holds its value to the next point, then rises or falls there.
                    xs.Add(sx);
                    ys.Add(lastY);
                }
                xs.Add(sx);
                ys.Add(sy);
                lastY = sy;
            }
            curves.Add(new ScreenCurve([.. xs], [.. ys], weight));
        }
        var boxes = new List<(ScreenBox, double)>();
        foreach (Annotation a in model.Annotations)
        {
            if (a is not TextAnnotation t || t.YAxis != y || string.IsNullOrEmpty(t.Text)) continue;
            OxySize size = rc.MeasureText(t.Text, t.Font ?? font, double.IsNaN(t.FontSize) ? model.DefaultFontSize : t.FontSize, t.FontWeight);
            ScreenPoint at = t.Transform(t.TextPosition) + t.Offset;
            double left = t.TextHorizontalAlignment switch
            {
                HorizontalAlignment.Left => at.X,
                HorizontalAlignment.Right => at.X - size.Width,
                _ => at.X - size.Width / 2,
            };
            double upper = t.TextVerticalAlignment switch
            {
                VerticalAlignment.Top => at.Y,
                VerticalAlignment.Bottom => at.Y - size.Height,
                _ => at.Y - size.Height / 2,
            };
            boxes.Add((new ScreenBox(left, upper, left + size.Width, upper + size.Height), LabelPlacer.LabelWeight));
        }
        return new LabelPanel(area, curves, boxes);
    }
}
