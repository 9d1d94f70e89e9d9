using System.Runtime.InteropServices;

namespace PlaneLateral.Solvers;

/// <summary>Which code does the dense arithmetic of the supernodal factorisation.</summary>
public enum DenseKernelBackend
{
    /// <summary>The project's own managed kernels (always available; the default).</summary>
    Managed,
    /// <summary>An OpenBLAS shared library found on the machine (LAPACK dpotrf, BLAS dtrsm and dsyrk), when it loads.</summary>
    OpenBlas,
}

/// <summary>
/// Optional native BLAS for the dense kernels of the supernodal factorisation: OpenBLAS (for example Debian's
/// libopenblas0 package) loaded at run time, never required. The managed kernels are the reference and the default;
/// the native path is asked for with the environment variable <see cref="EnvironmentVariable"/> = "openblas" (or
/// through <see cref="SupernodalCholeskySolver"/>'s constructor), and the solver's description says which path ran.
/// </summary>
/// <remarks>
/// Only three routines are used: dpotrf (Cholesky of the pivot block), dtrsm (the rows below it) and dsyrk (the
/// Schur-complement update), in column-major storage with the front's leading dimension. Loading happens once; a
/// library that is missing or lacks a routine leaves <see cref="IsAvailable"/> false with the reason in
/// <see cref="Status"/>. Delegates with <c>ref double</c> arguments pin the arrays for the duration of each call.
/// </remarks>
public static class NativeBlas
{
    /// <summary>Environment variable that selects the dense kernels of the default solver: "openblas" or "managed".</summary>
    public const string EnvironmentVariable = "PLANELATERAL_DENSE_KERNELS";

    private const int ColMajor = 102, NoTrans = 111, Trans = 112, Lower = 122, NonUnit = 131, Right = 142;

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate void DpotrfFn(ref byte uplo, ref int n, ref double a, ref int lda, ref int info, nint uploLength);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate void DtrsmFn(int order, int side, int uplo, int transA, int diag, int m, int n, double alpha,
        ref double a, int lda, ref double b, int ldb);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate void DsyrkFn(int order, int uplo, int trans, int n, int k, double alpha, ref double a, int lda,
        double beta, ref double c, int ldc);

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate nint ConfigFn();

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate int ThreadsFn();

    private static readonly Lazy<Loaded?> Library = new(Load, LazyThreadSafetyMode.ExecutionAndPublication);
    private static string _status = "not loaded yet";

    private sealed record Loaded(DpotrfFn Potrf, DtrsmFn Trsm, DsyrkFn Syrk, string Config, int Threads, string Path);

    /// <summary>Library names tried, in order.</summary>
    private static readonly string[] Candidates = OperatingSystem.IsWindows()
        ? ["libopenblas.dll", "openblas.dll"]
        : OperatingSystem.IsMacOS() ? ["libopenblas.dylib", "libopenblas.0.dylib"] : ["libopenblas.so.0", "libopenblas.so"];

    /// <summary>True when OpenBLAS loaded with every routine the kernels need.</summary>
    public static bool IsAvailable => Library.Value is not null;

    /// <summary>What was loaded ("OpenBLAS 0.3.21 ... , 2 threads, libopenblas.so.0"), or why nothing was.</summary>
    public static string Status
    {
        get
        {
            var l = Library.Value;
            return l is null ? _status : $"{l.Config.Trim()}, {l.Threads} thread{(l.Threads == 1 ? "" : "s")} ({l.Path})";
        }
    }

    /// <summary>The dense-kernel choice the environment asks for (<see cref="EnvironmentVariable"/>); managed when unset.</summary>
    public static DenseKernelBackend Requested()
    {
        var v = Environment.GetEnvironmentVariable(EnvironmentVariable);
        return string.Equals(v?.Trim(), "openblas", StringComparison.OrdinalIgnoreCase) ? DenseKernelBackend.OpenBlas : DenseKernelBackend.Managed;
    }

    private static Loaded? Load()
    {
        foreach (var name in Candidates)
        {
            if (!NativeLibrary.TryLoad(name, out var handle)) continue;
            try
            {
                T Get<T>(string symbol) where T : Delegate =>
                    Marshal.GetDelegateForFunctionPointer<T>(NativeLibrary.GetExport(handle, symbol));
                var potrf = Get<DpotrfFn>("dpotrf_");
                var trsm = Get<DtrsmFn>("cblas_dtrsm");
                var syrk = Get<DsyrkFn>("cblas_dsyrk");
                string config = NativeLibrary.TryGetExport(handle, "openblas_get_config", out var cfg)
                    ? Marshal.PtrToStringAnsi(Marshal.GetDelegateForFunctionPointer<ConfigFn>(cfg)()) ?? "OpenBLAS"
                    : "OpenBLAS";
                int threads = NativeLibrary.TryGetExport(handle, "openblas_get_num_threads", out var th)
                    ? Marshal.GetDelegateForFunctionPointer<ThreadsFn>(th)()
                    : 1;
                return new Loaded(potrf, trsm, syrk, config, threads, name);
            }
            catch (EntryPointNotFoundException e)
            {
                _status = $"{name} loaded but lacks a routine the kernels need ({e.Message})";
                return null;
            }
        }
        _status = $"no OpenBLAS library found (tried {string.Join(", ", Candidates)}; on Debian: apt-get install libopenblas0)";
        return null;
    }

    /// <summary>
    /// The partial Cholesky factorisation of a front with OpenBLAS: F₁₁ = L₁₁L₁₁ᵀ (dpotrf), L₂₁ = F₂₁L₁₁⁻ᵀ (dtrsm),
    /// F₂₂ −= L₂₁L₂₁ᵀ (dsyrk). The front is held as in <see cref="FrontKernels.PartialCholesky"/>: its k pivot columns at
    /// <paramref name="off"/> in <paramref name="l"/> (leading dimension m), F₂₂ in <paramref name="upd"/> (leading dimension
    /// m−k). The pivots are then checked against the project's pivot rule (d = l_jj² must exceed tol·K_jj, both finite); if
    /// dpotrf stops or any pivot fails, the pivot block is restored from <paramref name="save"/> and false is returned,
    /// before F₂₁ and F₂₂ are touched, so the managed kernel can redo the front with the project's failure handling (unit
    /// column, mechanism shape).
    /// </summary>
    /// <param name="save">Scratch of at least k·k doubles.</param>
    internal static bool TryPartialCholesky(Span<double> l, int off, int m, int k, Span<double> upd, ReadOnlySpan<double> originalDiagonal,
        double tol, double[] save)
    {
        var lib = Library.Value ?? throw new InvalidOperationException("OpenBLAS is not loaded: " + _status);
        for (int c = 0; c < k; c++) l.Slice(off + c * m, k).CopyTo(save.AsSpan(c * k, k));
        byte uplo = (byte)'L';
        int n = k, lda = m, info = 0;
        lib.Potrf(ref uplo, ref n, ref l[off], ref lda, ref info, 1);
        bool ok = info == 0;
        for (int c = 0; ok && c < k; c++)
        {
            double d0 = l[off + c * m + c], d = d0 * d0, kjj = originalDiagonal[c];
            ok = kjj > 0.0 && d > tol * kjj && double.IsFinite(d) && double.IsFinite(kjj);
        }
        if (!ok)
        {
            for (int c = 0; c < k; c++) save.AsSpan(c * k, k).CopyTo(l.Slice(off + c * m, k));
            return false;
        }
        int below = m - k;
        if (below > 0)
        {
            lib.Trsm(ColMajor, Right, Lower, Trans, NonUnit, below, k, 1.0, ref l[off], m, ref l[off + k], m);
            lib.Syrk(ColMajor, Lower, NoTrans, below, k, -1.0, ref l[off + k], m, 1.0, ref upd[0], below);
        }
        return true;
    }
}
