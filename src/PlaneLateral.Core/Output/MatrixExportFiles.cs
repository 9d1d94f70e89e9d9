using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Assembly;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Output;

/// <summary>
/// The assembled systems of an analysis as files another tool can read (docs/export.md): for the frame model and for
/// each wall panel, the stiffness K over the unknowns (Matrix Market "coordinate real symmetric", lower triangle),
/// the load vectors (Matrix Market "array real general", one column per load case) and an index (CSV) from each
/// equation to its node and DOF, shared equations of diaphragm and floor ties listed. SI units, stated in each file's
/// header. The text depends only on the input.
/// </summary>
public static class MatrixExportFiles
{
    /// <summary>File names of the frame model's system.</summary>
    public const string FrameStiffness = "frame-K.mtx", FrameLoads = "frame-f.mtx", FrameIndex = "frame-index.csv";

    /// <summary>Base of a panel's file names: "panel-{n}-{id}" (n counts panels from 1; characters unsafe in a file name become '_').</summary>
    public static string PanelBase(int index, string id) =>
        $"panel-{index + 1}-{new string(id.Select(ch => char.IsAsciiLetterOrDigit(ch) || ch is '-' or '_' or '.' ? ch : '_').ToArray())}";

    /// <summary>The files (name → text). A frame with no unknowns, or a panel-only model, writes no frame files.</summary>
    /// <exception cref="InvalidOperationException">The analysis kept no assembled system.</exception>
    public static IReadOnlyList<(string Name, string Text)> Render(AnalysisResult r)
    {
        var files = new List<(string, string)>();
        var model = r.Model;
        string who = $"PlaneLateral {ResultFiles.Version}";
        if (r.Dofs.FreeCount > 0)
        {
            var sys = r.System ?? throw new InvalidOperationException("the analysis kept no assembled system");
            string what = $"frame model \"{model.Title}\"";
            files.Add((FrameStiffness, Stiffness(sys, what, FrameIndex, who)));
            files.Add((FrameLoads, Loads(sys, what, FrameIndex, who, "")));
            files.Add(FrameIndexTable(r).Text());
        }
        for (int p = 0; p < r.Panels.Count; p++)
        {
            var pr = r.Panels[p];
            var sys = pr.Analysis.System ?? throw new InvalidOperationException("the panel analysis kept no assembled system");
            string b = PanelBase(p, pr.Panel.Id), index = b + "-index.csv";
            string what = $"wall panel \"{pr.Panel.Id}\" of \"{model.Title}\", base mesh ({pr.Mesh.Mesh.NodeCount} nodes, 2 DOFs ux, uy per node; node coordinates in the model's plane)";
            string extra = pr.Panel.FloorTies ? "" : "\nThe last column, \"unit top force\", is a unit horizontal force spread along the top edge (the panel has no floor ties).";
            files.Add((b + "-K.mtx", Stiffness(sys, what, index, who)));
            files.Add((b + "-f.mtx", Loads(sys, what, index, who, extra)));
            files.Add(PanelIndexTable(r, p).Text());
        }
        return files;
    }

    /// <summary>The CSV files of <see cref="Render"/>, each from its table: the frame's equation index, then each panel's.</summary>
    public static IReadOnlyList<CsvTableFile> Tables(AnalysisResult r) =>
        [.. r.Dofs.FreeCount > 0 ? [FrameIndexTable(r)] : Array.Empty<CsvTableFile>(), .. Enumerable.Range(0, r.Panels.Count).Select(p => PanelIndexTable(r, p))];

    private static CsvTableFile FrameIndexTable(AnalysisResult r) =>
        new(FrameIndex, IndexTable(r.Dofs, i => r.Model.Nodes[i].Id, i => (r.Model.Nodes[i].X, r.Model.Nodes[i].Y), "diaphragm tie"));

    private static CsvTableFile PanelIndexTable(AnalysisResult r, int p)
    {
        var pr = r.Panels[p];
        var m = pr.Mesh.Mesh;
        return new(PanelBase(p, pr.Panel.Id) + "-index.csv", IndexTable(pr.Analysis.Dofs, i => $"{pr.Panel.Id}:{i}", i => (m.X[i], m.Y[i]), "floor tie"));
    }

    private const string Units = "Units: SI. Force N, length m, rotation rad: K in N/m between translations, N/rad and N·m/m between a rotation and a translation, N·m/rad between rotations; f in N (forces) and N·m (moments).";

    private static string Caution => ResultFiles.Caution;

    private static string Stiffness(LinearSystem s, string what, string index, string who)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        s.Stiffness.WriteMatrixMarket(sw,
            $"{who}: assembled stiffness K of the {what}.\n" +
            $"{s.Stiffness.Size} unknowns; equation i is row and column i (from 1), named in {index}. Lower triangle of the symmetric matrix.\n" +
            $"{Units}\n{Caution}");
        return sw.ToString();
    }

    private static string Loads(LinearSystem s, string what, string index, string who, string extra)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        string cols = s.CaseIds.Count == 0 ? "none (the model has no load cases)" : string.Join(", ", s.CaseIds.Select((c, i) => $"{i + 1} = \"{c}\""));
        MatrixMarket.WriteColumns(sw, s.Stiffness.Size, s.LoadVectors,
            $"{who}: load vectors f of the {what}, one column per load case: {cols}.{extra}\n" +
            $"Row i is equation i (from 1), named in {index}; K u = f gives the displacements of the unknowns.\n" +
            $"{Units}\n{Caution}");
        return sw.ToString();
    }

    /// <summary>
    /// The equation index: one row per nodal DOF that is an unknown, by equation then node: the equation's own DOF first,
    /// then the DOFs a tie makes share it (with the owner named in "shared with"). Coordinates in m, written round-trip
    /// (<see cref="RoundTrip"/>) so another tool reads back the very numbers the matrices were assembled from.
    /// </summary>
    public static ResultTable IndexTable(DofMap dofs, Func<int, string> nodeId, Func<int, (double X, double Y)> at, string tie)
    {
        var rows = new List<(int Eq, bool Shared, int Node, Dof Dof)>();
        for (int n = 0; n < dofs.NodeCount; n++)
            for (int d = 0; d < 3; d++)
            {
                int eq = dofs.Equation(n, (Dof)d);
                if (eq < 0) continue;
                var own = dofs.DofOf(eq);
                rows.Add((eq, own.Node != n || own.Dof != (Dof)d, n, (Dof)d));
            }
        return new ResultTable
        {
            Title = "Equation index",
            Columns =
            [
                new("equation"), new("node", Kind: CellKind.Text), new("dof", Kind: CellKind.Text), new("x", "m"), new("y", "m"), new("shared with", Kind: CellKind.Text),
            ],
            Rows = rows.OrderBy(r => r.Eq).ThenBy(r => r.Shared).ThenBy(r => r.Node).Select(r =>
            {
                var (x, y) = at(r.Node);
                string note = r.Shared ? $"{tie}: {DofNames.Name(r.Dof)} of node {nodeId(dofs.DofOf(r.Eq).Node)}" : "";
                return (IReadOnlyList<object>)[r.Eq + 1, nodeId(r.Node), DofNames.Name(r.Dof), new RoundTrip(x), new RoundTrip(y), note];
            }).ToList(),
        };
    }

    /// <summary>A number a table writes round-trip ("R": the shortest text that reads back to the same double), not to 12 figures.</summary>
    public readonly record struct RoundTrip(double Value)
    {
        public override string ToString() => Value.ToString("R", CultureInfo.InvariantCulture);
    }
}
