using NightSim.Cli.Plotting;
using NightSim.Reporting;
using NightSim.Tests.Reporting;
using OxyPlot;

namespace NightSim.Tests.Cli.Plotting;

/// <summary>Marker labels go where they cover no curve, and labels of close markers do not print over each other.</summary>
public sealed class LabelPlacerTests
{
    private static readonly ScreenBox s_panel = new(100, 50, 1000, 300);

    [Fact]
    public void A_Label_Moves_Off_A_Curve_That_Fills_The_Top_Of_The_Panel()
    {
        // A trace runs along the top of the panel (daylight on the lux panel) and a dashed line across its middle:
        // the label of the marker at x = 400 goes below the trace, clear of both.
        var top = new ScreenCurve([100, 1000], [60, 60], LabelPlacer.TraceWeight);
        var level = new ScreenCurve([100, 1000], [175, 175], LabelPlacer.ReferenceWeight);
        var panel = new LabelPanel(s_panel, [top, level], []);
        ScreenBox box = Assert.Single(LabelPlacer.Place([new LabelRequest(400, 13, 80)], [panel]));
        Assert.False(LabelPlacer.Crosses(top, box));
        Assert.False(LabelPlacer.Crosses(level, box));
        Assert.True(box.Top >= s_panel.Top && box.Bottom <= s_panel.Bottom);
        Assert.True(box.Left > 400 || box.Right < 400); // beside its line, not on it
    }

    [Fact]
    public void A_Label_Takes_The_Free_Side_Of_Its_Line()
    {
        // A steep curve fills everything right of the marker (a dusk fall just after sunset); the left side is free.
        double[] xs = [.. Enumerable.Range(0, 200).Select(i => 404.0 + i * 3)];
        double[] ys = [.. Enumerable.Range(0, 200).Select(i => 50.0 + 250 * ((i * 7) % 11) / 10.0)];
        var wall = new ScreenCurve(xs, ys, LabelPlacer.TraceWeight);
        ScreenBox box = Assert.Single(LabelPlacer.Place([new LabelRequest(400, 13, 80)], [new LabelPanel(s_panel, [wall], [])]));
        Assert.True(box.Right < 400, $"label at {box}");
        Assert.False(LabelPlacer.Crosses(wall, box));
    }

    [Fact]
    public void Close_Markers_Stagger_Their_Labels()
    {
        // Five markers 8 px apart (a quarter of an hour on a 24-hour plot), each label 13 px wide: side by side at the
        // top they would print over each other, so they must stagger.
        LabelRequest[] labels = [.. Enumerable.Range(0, 5).Select(i => new LabelRequest(300 + 8 * i, 13, 70))];
        ScreenBox[] boxes = LabelPlacer.Place(labels, [new LabelPanel(s_panel, [], [])]);
        for (int i = 0; i < boxes.Length; i++)
        {
            for (int j = i + 1; j < boxes.Length; j++) Assert.False(boxes[i].Overlaps(boxes[j]), $"labels {i} and {j} overlap");
            Assert.True(boxes[i].Top >= s_panel.Top && boxes[i].Bottom <= s_panel.Bottom);
        }
    }

    [Fact]
    public void A_Label_Is_Not_Written_Across_Another_Markers_Line()
    {
        // Sunset and civil dusk 35 min apart on a 24-hour plot: 20 px. The first label would fit between the lines.
        LabelRequest[] labels = [new(300, 13, 70), new(320, 13, 70), new(330, 13, 70)];
        ScreenBox[] boxes = LabelPlacer.Place(labels, [new LabelPanel(s_panel, [], [])]);
        for (int i = 0; i < boxes.Length; i++)
        {
            foreach (LabelRequest other in labels)
                if (other.X != labels[i].X) Assert.False(other.X > boxes[i].Left && other.X < boxes[i].Right, $"label {i} at {boxes[i]} crosses the line at {other.X}");
        }
    }

    [Fact]
    public void Drawn_Labels_Cover_No_Curve_Of_A_Night_Plot()
    {
        // The demo night with its markers, plus a light curve that stays in the top of the light panel all day
        // long (so the first place tried, beside each line at the top, is taken) and a marker inside that daylight.
        PlotData night = DemoReportData.NightPlot();
        double[] t = [.. Enumerable.Range(0, 2001).Select(i => night.From + (night.To - night.From) * i / 2000)];
        PlotData data = night with
        {
            Series = [.. night.Series, new PlotSeries("daylight", "lx", PlotPanel.Light, t, [.. t.Select(x => 50.0 + 40 * Math.Sin(x / 500))])],
            Markers = [.. night.Markers, new PlotMarker(night.From + 3600, "noon check")],
        };
        PlotModel model = NightPlotBuilder.Build(data);
        PlotWriter.ToInlineSvg(model, "t-"); // draws the plot, which places the labels
        MarkerLabels labels = Assert.Single(model.Annotations.OfType<MarkerLabels>());
        Assert.Equal(data.Markers.Count, labels.Placed.Count);
        for (int i = 0; i < labels.Placed.Count; i++)
        {
            ScreenBox box = labels.Placed[i];
            LabelPanel? panel = labels.Panels.FirstOrDefault(p => box.Top >= p.Area.Top && box.Bottom <= p.Area.Bottom);
            Assert.True(panel is not null, $"label '{labels.Labels[i].Text}' at {box} is not inside a panel");
            foreach (ScreenCurve c in panel!.Curves.Where(c => c.Weight >= LabelPlacer.TraceWeight))
                Assert.False(LabelPlacer.Crosses(c, box), $"label '{labels.Labels[i].Text}' covers a trace");
        }
    }
}
