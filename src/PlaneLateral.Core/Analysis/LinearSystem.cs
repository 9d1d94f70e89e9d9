using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>
/// The assembled linear system K u = f of an analysis, kept so that it can be exported and checked with another tool
/// (Output/MatrixExportFiles, docs/export.md). SI units: rows and columns of translations in N and m, of rotations in
/// N·m and rad. Equations are numbered as in the analysis' <see cref="Assembly.DofMap"/>.
/// </summary>
public sealed class LinearSystem
{
    /// <summary>The assembled stiffness over the unknowns (lower triangle stored).</summary>
    public required SymmetricSparseMatrix Stiffness { get; init; }

    /// <summary>Id of each right-hand side, in order: the model's load cases (combinations are not included).</summary>
    public required IReadOnlyList<string> CaseIds { get; init; }

    /// <summary>The load vector over the unknowns of each case in <see cref="CaseIds"/> (N, N·m).</summary>
    public required IReadOnlyList<double[]> LoadVectors { get; init; }
}
