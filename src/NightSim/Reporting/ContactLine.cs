namespace NightSim.Reporting;

/// <summary>One line of a relay's contact summary: a label, the text and whether it shows a problem.</summary>
public sealed record ContactLine(string Label, string Text, bool Problem = false);
