using PlaneLateral.Elements.Plane;

namespace PlaneLateral.Meshing;

/// <summary>
/// A plane-stress mesh: node coordinates (m) and element connectivity in the element's own node order.
/// Built once, then read only.
/// </summary>
public sealed class PlaneMesh
{
    public required IPlaneElement Element { get; init; }

    /// <summary>Node x coordinates (m).</summary>
    public required double[] X { get; init; }

    /// <summary>Node y coordinates (m).</summary>
    public required double[] Y { get; init; }

    /// <summary>Element connectivity: node indices, <see cref="IPlaneElement.NodeCount"/> per element.</summary>
    public required int[][] Elements { get; init; }

    public int NodeCount => X.Length;

    /// <summary>The node at (x, y) within <paramref name="tol"/> (m), or −1.</summary>
    public int FindNode(double x, double y, double tol = 1e-9)
    {
        for (int i = 0; i < X.Length; i++)
            if (Math.Abs(X[i] - x) <= tol && Math.Abs(Y[i] - y) <= tol) return i;
        return -1;
    }

    /// <summary>Nodes with y within <paramref name="tol"/> of <paramref name="y"/>, in index order.</summary>
    public int[] NodesAtY(double y, double tol = 1e-9) => Enumerable.Range(0, X.Length).Where(i => Math.Abs(Y[i] - y) <= tol).ToArray();

    /// <summary>Nodes with x within <paramref name="tol"/> of <paramref name="x"/>, in index order.</summary>
    public int[] NodesAtX(double x, double tol = 1e-9) => Enumerable.Range(0, X.Length).Where(i => Math.Abs(X[i] - x) <= tol).ToArray();

    /// <summary>Coordinates of one element's nodes.</summary>
    public (double[] X, double[] Y) ElementCoordinates(int e)
    {
        var c = Elements[e];
        return (c.Select(n => X[n]).ToArray(), c.Select(n => Y[n]).ToArray());
    }

    /// <summary>
    /// (element, edge) pairs of the element edges whose nodes all satisfy <paramref name="onLine"/>, in element order:
    /// the edges along a boundary line, for edge loads.
    /// </summary>
    public List<(int Element, int Edge)> EdgesWhere(Func<double, double, bool> onLine)
    {
        var list = new List<(int, int)>();
        for (int e = 0; e < Elements.Length; e++)
            for (int k = 0; k < 4; k++)
                if (Element.EdgeNodes(k).All(a => onLine(X[Elements[e][a]], Y[Elements[e][a]]))) list.Add((e, k));
        return list;
    }
}

/// <summary>Structured quadrilateral meshes of mapped regions (for benchmarks and wall panels).</summary>
public static class StructuredMesh
{
    /// <summary>
    /// An nx × ny mesh of a region given by <paramref name="map"/> from grid coordinates (u, v) ∈ [0, nx] × [0, ny] to
    /// (x, y) in metres; element (i, j) spans u ∈ [i, i+1], v ∈ [j, j+1]. Nine-node elements place their mid-side and
    /// centre nodes at half-integer grid coordinates. Only cells with <paramref name="solid"/>(i, j) true are kept;
    /// nodes are numbered row by row from v = 0 (then by u), only those used.
    /// </summary>
    public static PlaneMesh Mapped(IPlaneElement element, int nx, int ny, Func<double, double, (double X, double Y)> map, Func<int, int, bool>? solid = null)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(nx, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(ny, 1);
        int r = element.NodeCount == 9 ? 2 : 1;   // fine-grid points per element side
        int gx = r * nx + 1, gy = r * ny + 1;
        var used = new bool[gx * gy];
        solid ??= (_, _) => true;
        var cells = new List<(int I, int J)>();
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                if (!solid(i, j)) continue;
                cells.Add((i, j));
                for (int b = 0; b <= r; b++)
                    for (int a = 0; a <= r; a++) used[(r * j + b) * gx + r * i + a] = true;
            }
        var number = new int[gx * gy];
        var xs = new List<double>();
        var ys = new List<double>();
        for (int q = 0; q < gx * gy; q++)
        {
            if (!used[q]) { number[q] = -1; continue; }
            number[q] = xs.Count;
            var (x, y) = map((double)(q % gx) / r, (double)(q / gx) / r);
            xs.Add(x); ys.Add(y);
        }
        int At(int a, int b) => number[b * gx + a];
        var elements = new int[cells.Count][];
        for (int k = 0; k < cells.Count; k++)
        {
            var (i, j) = cells[k];
            int a = r * i, b = r * j;
            elements[k] = r == 1
                ? [At(a, b), At(a + 1, b), At(a + 1, b + 1), At(a, b + 1)]
                : [At(a, b), At(a + 2, b), At(a + 2, b + 2), At(a, b + 2), At(a + 1, b), At(a + 2, b + 1), At(a + 1, b + 2), At(a, b + 1), At(a + 1, b + 1)];
        }
        return new PlaneMesh { Element = element, X = xs.ToArray(), Y = ys.ToArray(), Elements = elements };
    }

    /// <summary>
    /// An nx × ny mesh of the quadrilateral with corners c0..c3 counter-clockwise, by bilinear blending of the corners
    /// (straight element edges, spacing uniform along each side).
    /// </summary>
    public static PlaneMesh Quadrilateral(IPlaneElement element, (double X, double Y)[] c, int nx, int ny) =>
        Mapped(element, nx, ny, (u, v) =>
        {
            double s = u / nx, t = v / ny;
            double x = (1 - s) * (1 - t) * c[0].X + s * (1 - t) * c[1].X + s * t * c[2].X + (1 - s) * t * c[3].X;
            double y = (1 - s) * (1 - t) * c[0].Y + s * (1 - t) * c[1].Y + s * t * c[2].Y + (1 - s) * t * c[3].Y;
            return (x, y);
        });

    /// <summary>
    /// A mesh on the tensor grid of element boundary lines <paramref name="xLines"/> × <paramref name="yLines"/> (m,
    /// ascending); nine-node elements put their extra nodes at the mid-lines.
    /// </summary>
    public static PlaneMesh Grid(IPlaneElement element, double[] xLines, double[] yLines, Func<int, int, bool>? solid = null)
    {
        static double Lerp(double[] lines, double u)
        {
            int i = Math.Min((int)Math.Floor(u), lines.Length - 2);
            double f = u - i;
            return f == 0 ? lines[i] : lines[i] + f * (lines[i + 1] - lines[i]);
        }
        return Mapped(element, xLines.Length - 1, yLines.Length - 1, (u, v) => (Lerp(xLines, u), Lerp(yLines, v)), solid);
    }

    /// <summary>
    /// A mesh from straight-sided quadrilaterals given by their four corner nodes (counter-clockwise). Nine-node
    /// elements get mid-side nodes at the edge mid-points (shared between neighbours) and a centre node at the
    /// bilinear centre; they are numbered after the corner nodes, in element order.
    /// </summary>
    public static PlaneMesh FromCorners(IPlaneElement element, double[] x, double[] y, int[][] quads)
    {
        if (element.NodeCount == 4)
            return new PlaneMesh { Element = element, X = (double[])x.Clone(), Y = (double[])y.Clone(), Elements = quads.Select(q => (int[])q.Clone()).ToArray() };
        var xs = x.ToList();
        var ys = y.ToList();
        var mid = new Dictionary<(int, int), int>();
        int Mid(int a, int b)
        {
            var key = (Math.Min(a, b), Math.Max(a, b));
            if (!mid.TryGetValue(key, out int m)) { m = xs.Count; xs.Add(0.5 * (x[a] + x[b])); ys.Add(0.5 * (y[a] + y[b])); mid[key] = m; }
            return m;
        }
        var elements = new int[quads.Length][];
        for (int e = 0; e < quads.Length; e++)
        {
            var q = quads[e];
            int m0 = Mid(q[0], q[1]), m1 = Mid(q[1], q[2]), m2 = Mid(q[2], q[3]), m3 = Mid(q[3], q[0]);
            int c = xs.Count;
            xs.Add(0.25 * (x[q[0]] + x[q[1]] + x[q[2]] + x[q[3]]));
            ys.Add(0.25 * (y[q[0]] + y[q[1]] + y[q[2]] + y[q[3]]));
            elements[e] = [q[0], q[1], q[2], q[3], m0, m1, m2, m3, c];
        }
        return new PlaneMesh { Element = element, X = xs.ToArray(), Y = ys.ToArray(), Elements = elements };
    }
}
