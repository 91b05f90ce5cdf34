using System.Text.Json;

namespace NightSim.Studies;

/// <summary>One finished item of a study (a spread run, a sweep point, a night of the year), identified by its index.</summary>
public interface IStudyItem
{
    /// <summary>Position in the whole study, 0-based.</summary>
    int Index { get; }

    /// <summary>Writes the item as one JSON object.</summary>
    void Write(Utf8JsonWriter w);
}
