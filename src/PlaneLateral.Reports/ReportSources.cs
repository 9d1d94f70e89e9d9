using System.Text.RegularExpressions;

namespace PlaneLateral.Reports;

/// <summary>A published source a report cites: the words that name it in a source cell, and its full citation.</summary>
public sealed record ReportSource(IReadOnlyList<string> NamedBy, string Citation);

/// <summary>
/// The references list of a report. Each source cell of a table ("Taly, ch. 7", "ASCE 7-16 §12.8.3, from memory") keeps
/// its clause and gains the number of the full citation in the list ([3]); a pointer into the project's own documentation
/// is dropped from it (a checker has the published source, not our files). Numbers follow the order of first citation,
/// so the list depends only on the document.
/// </summary>
public sealed partial class ReportReferences
{
    /// <summary>
    /// Every source the tool's formulas, checks and hand methods name, with its full citation. Where a detail (an
    /// edition, a title) is recalled rather than read, the citation says so.
    /// </summary>
    public static IReadOnlyList<ReportSource> Known { get; } =
    [
        new(["Przemieniecki"], "J. S. Przemieniecki, Theory of Matrix Structural Analysis, McGraw-Hill, New York, 1968 (§5.6: the beam element with shear deformation)."),
        new(["Friedman", "Kosmatka"], "Z. Friedman and J. B. Kosmatka, \"An improved two-node Timoshenko beam finite element\", Computers & Structures 47(3):473–481, 1993 (eq. 19: the interdependent shape functions)."),
        new(["Cowper"], "G. R. Cowper, \"The shear coefficient in Timoshenko's beam theory\", Journal of Applied Mechanics 33(2):335–340, 1966."),
        new(["Gere & Timoshenko", "Timoshenko's shear term", "after Timoshenko"], "J. M. Gere and S. P. Timoshenko, Mechanics of Materials, 4th ed., PWS Publishing, Boston, 1997 (deflections of beams, shear deformation; edition from memory)."),
        new(["McGuire"], "W. McGuire, R. H. Gallagher and R. D. Ziemian, Matrix Structural Analysis, 2nd ed., Wiley, New York, 2000."),
        new(["Guyan"], "R. J. Guyan, \"Reduction of stiffness and mass matrices\", AIAA Journal 3(2):380, 1965."),
        new(["Higham"], "N. J. Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM, Philadelphia, 2002 (Theorem 7.1, the normwise backward error of Rigal and Gaches)."),
        new(["ASCE 7-16", "Table 12.12-1", "Table 12.3-2"], "ASCE/SEI 7-16, Minimum Design Loads and Associated Criteria for Buildings and Other Structures, American Society of Civil Engineers, Reston, VA, 2017."),
        new(["ACI 318"], "ACI Committee 318, Building Code Requirements for Structural Concrete (ACI 318-19) and Commentary, American Concrete Institute, Farmington Hills, MI, 2019 (Table 6.6.3.1.1(a))."),
        new(["TMS 402"], "TMS 402/602-16, Building Code Requirements and Specification for Masonry Structures, The Masonry Society, Longmont, CO, 2016."),
        new(["Taly"], "N. Taly, Design of Reinforced Masonry Structures, 2nd ed., McGraw-Hill, New York, 2010 (ch. 7: rigidities of piers and walls, distribution of lateral forces)."),
        new(["Stafford Smith", "Rosman"], "B. Stafford Smith and A. Coull, Tall Building Structures: Analysis and Design, Wiley, New York, 1991 (ch. 7: coupled shear walls, the continuous-connection method after Rosman)."),
        new(["Hoenderkamp"], "J. C. D. Hoenderkamp, Sādhanā 37(4):481–492, 2012 (the degree of coupling of shear walls; title not checked)."),
        new(["Muto"], "K. Muto, Aseismic Design Analysis of Buildings, Maruzen, Tokyo, 1974 (the D-value method; year from memory)."),
        new(["Kramer"], "S. L. Kramer, Geotechnical Earthquake Engineering, Prentice Hall, Upper Saddle River, NJ, 1996 (ch. 5: wave propagation, Vs = √(G/ρ))."),
        new(["Pais & Kausel"], "A. Pais and E. Kausel, \"Approximate formulas for dynamic stiffnesses of rigid foundations\", Soil Dynamics and Earthquake Engineering 7(4):213–227, 1988."),
        new(["NIST GCR 12-917-21"], "NIST, Soil-Structure Interaction for Building Structures, NIST GCR 12-917-21, National Institute of Standards and Technology, Gaithersburg, MD, 2012 (Table 2-2a)."),
        new(["Gazetas"], "G. Gazetas, \"Formulas and charts for impedances of surface and embedded foundations\", Journal of Geotechnical Engineering 117(9):1363–1381, 1991."),
        new(["Zienkiewicz"], "O. C. Zienkiewicz and R. L. Taylor, The Finite Element Method, vol. 1: The Basis, 5th ed., Butterworth-Heinemann, Oxford, 2000."),
        new(["Wilson, Taylor, Doherty"], "E. L. Wilson, R. L. Taylor, W. P. Doherty and J. Ghaboussi, \"Incompatible displacement models\", in Numerical and Computer Methods in Structural Mechanics, Academic Press, New York, 1973, pp. 43–57."),
        new(["Taylor, Beresford"], "R. L. Taylor, P. J. Beresford and E. L. Wilson, \"A non-conforming element for stress analysis\", International Journal for Numerical Methods in Engineering 10(6):1211–1219, 1976."),
        new(["Hinton & Campbell"], "E. Hinton and J. S. Campbell, \"Local and global smoothing of discontinuous finite element functions using a least squares method\", International Journal for Numerical Methods in Engineering 8(3):461–480, 1974."),
        new(["Richardson"], "L. F. Richardson, \"The approximate arithmetical solution by finite differences of physical problems involving differential equations\", Philosophical Transactions of the Royal Society A 210:307–357, 1911."),
        new(["Roache"], "P. J. Roache, Verification and Validation in Computational Science and Engineering, Hermosa Publishers, Albuquerque, 1998 (ch. 5: the grid convergence index)."),
        new(["Golub"], "G. H. Golub and C. F. Van Loan, Matrix Computations, 3rd ed., Johns Hopkins University Press, Baltimore, 1996 (§8.5: Jacobi methods for the symmetric eigenproblem)."),
        new(["Rayleigh"], "R. W. Clough and J. Penzien, Dynamics of Structures, 2nd ed., McGraw-Hill, New York, 1993 (Rayleigh's method for the fundamental period; chapter 8, from memory)."),
    ];

    private readonly List<ReportSource> used = [];

    /// <summary>The sources cited so far, in the order of their numbers (1, 2, ...).</summary>
    public IReadOnlyList<ReportSource> Used => used;

    [GeneratedRegex(@"\s*[(;,]?\s*(see\s+)?docs/[A-Za-z0-9_.\-/]+(#[A-Za-z0-9_\-]+)?\)?")]
    private static partial Regex DocsPointer();

    /// <summary>
    /// The source text with the reference numbers of every known source it names appended ("…, ch. 7 [4]") and any pointer
    /// into the project's documentation dropped; a text naming no published source (input, derived, common practice) is
    /// returned as it is.
    /// </summary>
    public string Cite(string source)
    {
        string text = DocsPointer().Replace(source, "").Trim().TrimEnd(';', ',').Trim();
        if (text.Length == 0) text = "derived (the method above)";
        var numbers = new List<int>();
        foreach (var s in Known)
        {
            if (!s.NamedBy.Any(k => text.Contains(k, StringComparison.Ordinal))) continue;
            int i = used.IndexOf(s);
            if (i < 0) { used.Add(s); i = used.Count - 1; }
            numbers.Add(i + 1);
        }
        return numbers.Count == 0 ? text : $"{text} [{string.Join(", ", numbers.Order())}]";
    }

    [GeneratedRegex(@"docs/([A-Za-z0-9_\-]+)\.md(#[A-Za-z0-9_\-]+)?")]
    private static partial Regex DocsPath();

    /// <summary>"docs/seismic.md" in prose becomes "PlaneLateral's documentation (seismic)".</summary>
    public static string NoDocsPath(string text) => text.Contains("docs/", StringComparison.Ordinal) ? DocsPath().Replace(text, x => $"PlaneLateral's documentation ({x.Groups[1].Value.Replace('-', ' ')})") : text;

    /// <summary>The numbered list, "[n] citation", in order.</summary>
    public IReadOnlyList<string> List() => used.Select((s, i) => $"[{i + 1}] {s.Citation}").ToList();
}
