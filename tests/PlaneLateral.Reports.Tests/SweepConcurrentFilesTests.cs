using PlaneLateral.Hand;
using PlaneLateral.Output;
using PlaneLateral.Units;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>
/// The sweep's files made each on its own task and written as each is ready (what the sweep command does): the same
/// bytes as the files made one after the other on one thread, with the points on 1 or 2 threads (common practice: a
/// results file depends on the input only, DEVELOPERS.md "Outputs").
/// </summary>
public class SweepConcurrentFilesTests
{
    // An invented concrete wall in kip and inch: l = 240 in, t = 8 in, E = 3600 ksi, G = 1500 ksi; 4 h/l values × both ends.
    private static SweepSpec Spec() =>
        new(0.5, 3, 4, SweepSpacing.Geometric, UnitSystem.KipInch, 240, 8, 3600, 1500, "test concrete", 1.2,
            [EndFixity.Cantilever, EndFixity.FixedFixed], 0.10);

    [Fact]
    public void Files_made_on_their_own_tasks_and_written_as_ready_equal_the_serial_ones_on_one_and_two_threads()
    {
        var spec = Spec();
        // The reference: points on one thread, each file made on this thread, one after the other.
        var serial = AspectSweep.Run(spec, AspectSweep.DefaultModels(true), threads: 1);
        byte[][] expected =
        [
            OutputSet.Text(SweepFiles.CsvFileName, SweepFiles.Csv(serial, "test")).Bytes,
            SweepFiles.RatioFigure(serial).Png,
            SweepFiles.ShearShareFigure(serial).Png,
        ];
        foreach (int threads in new[] { 1, 2 })
        {
            var r = AspectSweep.Run(spec, AspectSweep.DefaultModels(true), threads: threads);
            string dir = TempDir($"sweep-tasks-{threads}");
            try
            {
                var started = SweepFiles.Start(r, "test");
                Assert.Equal([SweepFiles.CsvFileName, SweepFiles.RatioFigureFileName, SweepFiles.ShearShareFigureFileName], started.Select(f => f.Name));
                var written = AtomicFiles.WriteAll(dir, started.Select(f => OutputFile.Bytes(f.Name, f.Bytes)).ToArray());
                Assert.Equal(3, written.Count);
                for (int i = 0; i < 3; i++)
                    Assert.True(File.ReadAllBytes(written[i]).AsSpan().SequenceEqual(expected[i]), $"{started[i].Name} differs from the serial file ({threads} thread(s))");
            }
            finally { if (Directory.Exists(dir)) Directory.Delete(dir, true); }
        }
    }

    [Fact]
    public void A_file_whose_task_fails_replaces_nothing_and_leaves_no_partial_file()
    {
        // All-or-nothing (DEVELOPERS.md "Outputs"): the first file's bytes are ready, the second's task faults.
        string dir = TempDir("sweep-task-fault");
        Directory.CreateDirectory(dir);
        try
        {
            File.WriteAllText(Path.Combine(dir, "a.txt"), "old");
            var failing = Task.FromException<byte[]>(new InvalidOperationException("drawing failed"));
            var e = Assert.Throws<InvalidOperationException>(() => AtomicFiles.WriteAll(dir,
                [OutputFile.Bytes("a.txt", Task.FromResult("new"u8.ToArray())), OutputFile.Bytes("b.png", failing)]));
            Assert.Equal("drawing failed", e.Message);
            Assert.Equal("old", File.ReadAllText(Path.Combine(dir, "a.txt")));
            Assert.Equal(["a.txt"], Directory.GetFiles(dir).Select(Path.GetFileName));
        }
        finally { Directory.Delete(dir, true); }
    }
}
