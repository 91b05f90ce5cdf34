using System.Globalization;

namespace NightSim.Units;

/// <summary>
/// Runs a block under the invariant culture and restores the caller's culture afterwards, so that every number and
/// date interpolated into a finding or report reads the same on every machine ("1.4 lx", never "1,4 lx") and the same
/// inputs give byte-identical reports. Findings are free text built by many analysers; scoping the culture once is
/// simpler and safer than remembering a format provider in every interpolation.
/// </summary>
public readonly struct InvariantCultureScope : IDisposable
{
    private readonly CultureInfo _culture;
    private readonly CultureInfo _uiCulture;

    private InvariantCultureScope(CultureInfo culture, CultureInfo uiCulture)
    {
        _culture = culture;
        _uiCulture = uiCulture;
    }

    /// <summary>Switch the current thread to the invariant culture until the scope is disposed.</summary>
    public static InvariantCultureScope Enter()
    {
        var scope = new InvariantCultureScope(CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture);
        CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentUICulture = CultureInfo.InvariantCulture;
        return scope;
    }

    public void Dispose()
    {
        CultureInfo.CurrentCulture = _culture;
        CultureInfo.CurrentUICulture = _uiCulture;
    }
}
