using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class CloudPassTests
{
    [Fact]
    public void SmoothDip_DeepestInTheMiddle()
    {
        var c = new CloudPass(0, 600, 0.8);
        Assert.Equal(1.0, c.Value(0));
        Assert.Equal(0.2, c.Value(300), 12);
        Assert.Equal(1 - 0.8 * 0.5, c.Value(150), 12); // sin²(π/4) = 1/2
        Assert.Equal(1.0, c.Value(600));
        Assert.Equal(LightEffect.ScaleSky, c.Effect);
        Assert.Throws<ArgumentException>(() => new CloudPass(0, 10, 1.5));
    }
}
