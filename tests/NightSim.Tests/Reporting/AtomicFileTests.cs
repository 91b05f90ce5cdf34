using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>Atomic writes: a reader sees the old file or the new one, never half a file, and no temporary file stays.</summary>
public sealed class AtomicFileTests
{
    [Fact]
    public void WriteLeavesOnlyTheTarget()
    {
        string dir = Directory.CreateTempSubdirectory("nightsim-atomic-").FullName;
        try
        {
            string path = Path.Combine(dir, "report.json");
            AtomicFile.WriteText(path, "first");
            AtomicFile.WriteText(path, "second");
            Assert.Equal("second", File.ReadAllText(path));
            Assert.Equal([path], Directory.GetFiles(dir));
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void FailingWriterKeepsOldFileAndRemovesTemporary()
    {
        string dir = Directory.CreateTempSubdirectory("nightsim-atomic-").FullName;
        try
        {
            string path = Path.Combine(dir, "report.html");
            AtomicFile.WriteText(path, "old page");
            Assert.Throws<InvalidOperationException>(() => AtomicFile.Write(path, s =>
            {
                s.Write("half a new pa"u8);
                throw new InvalidOperationException("writer failed midway");
            }));
            Assert.Equal("old page", File.ReadAllText(path));
            Assert.Equal([path], Directory.GetFiles(dir)); // hidden temporary files included
        }
        finally { Directory.Delete(dir, true); }
    }
}
