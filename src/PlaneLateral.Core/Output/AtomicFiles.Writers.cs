namespace PlaneLateral.Output;

public static partial class AtomicFiles
{
    /// <summary>
    /// How many threads write one set's temporary files at once by default: two on a machine with two or more
    /// processors (a set's largest file, e.g. results.json, is then serialised while the tables are written and each
    /// file's flush to disk overlaps the other's work: docs/benchmarks.md, "Where the frame's solve spends its time"),
    /// else one.
    /// </summary>
    internal static int DefaultWriters => Math.Min(2, Environment.ProcessorCount);

    /// <summary>
    /// <see cref="WriteAll(string, IReadOnlyList{OutputFile})"/> with the temporary files written by at most
    /// <paramref name="writers"/> threads (1: one after another on the calling thread). The bytes, the refusals and the
    /// all-or-nothing outcome are the same for any count.
    /// </summary>
    internal static IReadOnlyList<string> WriteAll(string directory, IReadOnlyList<OutputFile> files, int writers) =>
        WriteAllWith(directory, files, Math.Max(1, writers));

    /// <summary>
    /// Writes file i into temps[i] (created new, flushed to disk), up to <paramref name="writers"/> files at a time: the
    /// calling thread and writers − 1 helper threads take the files in the set's order, each file whole. A helper runs in
    /// the caller's execution context (culture, marked inputs), as the calling thread would. After a failure no further
    /// file is started.
    /// </summary>
    /// <returns>Null when every file was written; else the failure of the earliest file in the set's order that failed
    /// (the temporary files are left for the caller to remove).</returns>
    private static Exception? WriteTemporaries(IReadOnlyList<OutputFile> files, string[] temps, int writers)
    {
        var failures = new Exception?[files.Count];
        int next = -1, stop = 0;
        void Work()
        {
            int i;
            while (Volatile.Read(ref stop) == 0 && (i = Interlocked.Increment(ref next)) < files.Count)
            {
                try
                {
                    using var fs = new FileStream(temps[i], FileMode.CreateNew, FileAccess.Write, FileShare.None, bufferSize: 1 << 16);
                    files[i].WriteTo(fs);
                    fs.Flush(flushToDisk: true);
                }
                catch (Exception e)
                {
                    failures[i] = e;
                    Volatile.Write(ref stop, 1);
                }
            }
        }

        var helpers = new Thread[Math.Max(0, Math.Min(writers, files.Count) - 1)];
        for (int k = 0; k < helpers.Length; k++)
        {
            helpers[k] = new Thread(Work) { IsBackground = true, Name = "PlaneLateral file writer" };
            helpers[k].Start();
        }
        Work();
        foreach (var h in helpers) h.Join();
        return failures.FirstOrDefault(e => e is not null);
    }
}
