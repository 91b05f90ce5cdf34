using NightSim.Inputs;

namespace NightSim.Devices;

/// <summary>A light sensor reads a channel the run's light does not define (exit code 2 in the CLI).</summary>
public sealed class LightChannelException : InputFileException
{
    public LightChannelException(string partId, string channel)
        : base($"part '{partId}': reads light channel '{channel}', which the run's light does not define. hint: name a channel of the scenario (\"sensor\" is the default) in the part's \"channel\"")
    {
        Lines = [Message];
    }

    public override IReadOnlyList<string> Lines { get; }
}
