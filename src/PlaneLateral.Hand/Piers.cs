namespace PlaneLateral.Hand;

/// <summary>
/// Lateral deflection of one member (pier, column or wall) under a force at its top, split into its
/// flexural and shear terms. Units: any consistent set (force F, length L); deflections in L, stiffness in F/L.
/// </summary>
/// <param name="Load">The lateral force P at the top (F).</param>
/// <param name="Height">The member's height h (L).</param>
/// <param name="Ends">How the ends are held.</param>
/// <param name="FlexuralDeflection">The bending term (L).</param>
/// <param name="ShearDeflection">The shear term (L); zero when shear is not included.</param>
/// <param name="IncludesShear">Whether shear deformation is in the total.</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record MemberDeflection(
    double Load, double Height, EndFixity Ends,
    double FlexuralDeflection, double ShearDeflection, bool IncludesShear, HandMethod Method)
{
    /// <summary>Total top deflection, flexure plus shear (L).</summary>
    public double TotalDeflection => FlexuralDeflection + ShearDeflection;

    /// <summary>Lateral stiffness (rigidity) P / Δ (F/L).</summary>
    public double Stiffness => Load / TotalDeflection;

    /// <summary>Flexural term's share of the total, 0..1.</summary>
    public double FlexuralShare => FlexuralDeflection / TotalDeflection;

    /// <summary>Shear term's share of the total, 0..1.</summary>
    public double ShearShare => ShearDeflection / TotalDeflection;
}

/// <summary>
/// Shear-deformable piers: flexural term Ph³/(3EI) (cantilever) or Ph³/(12EI) (fixed-fixed),
/// plus shear term f·Ph/(A·G). Units: any consistent set (force F, length L).
/// </summary>
public static class Piers
{
    /// <summary>
    /// Cantilever pier (base fixed, top free): Δ = Ph³/(3EI) + f·Ph/(AG).
    /// Source: elementary beam theory with Timoshenko's shear term; Gere &amp; Timoshenko, Mechanics of Materials
    /// (cantilever tip deflection, shear deflection of beams); Taly, Design of Reinforced Masonry Structures, ch. 7.
    /// </summary>
    /// <param name="load">Lateral force P at the top (F), positive.</param>
    /// <param name="height">Height h (L), positive.</param>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="i">Second moment of area I about the bending axis (L⁴), positive.</param>
    /// <param name="area">Cross-section area A (L²), positive.</param>
    /// <param name="g">Shear modulus G (F/L²), positive.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1 (1.2 for a rectangle).</param>
    public static MemberDeflection Cantilever(double load, double height, double e, double i, double area, double g,
        double formFactor = ShearForm.RectangleDefault)
        => General(EndFixity.Cantilever, load, height, e, i, area, g, formFactor);

    /// <summary>
    /// Fixed-fixed (fixed-guided) pier (base fixed, top held against rotation): Δ = Ph³/(12EI) + f·Ph/(AG).
    /// Source: elementary beam theory with Timoshenko's shear term; Taly, Design of Reinforced Masonry Structures, ch. 7.
    /// </summary>
    /// <inheritdoc cref="Cantilever" path="/param"/>
    public static MemberDeflection FixedFixed(double load, double height, double e, double i, double area, double g,
        double formFactor = ShearForm.RectangleDefault)
        => General(EndFixity.FixedFixed, load, height, e, i, area, g, formFactor);

    /// <summary>Either end condition; see <see cref="Cantilever"/> and <see cref="FixedFixed"/>.</summary>
    /// <param name="ends">How the pier's ends are held.</param>
    /// <param name="load">Lateral force P at the top (F), positive.</param>
    /// <param name="height">Height h (L), positive.</param>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="i">Second moment of area I about the bending axis (L⁴), positive.</param>
    /// <param name="area">Cross-section area A (L²), positive.</param>
    /// <param name="g">Shear modulus G (F/L²), positive.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1 (1.2 for a rectangle).</param>
    public static MemberDeflection General(EndFixity ends, double load, double height, double e, double i, double area,
        double g, double formFactor = ShearForm.RectangleDefault)
    {
        Guard.Positive(load, "The lateral force P");
        Guard.Positive(height, "The pier height h");
        Guard.Positive(e, "Young's modulus E");
        Guard.Positive(i, "The second moment of area I");
        Guard.Positive(area, "The cross-section area A");
        Guard.Positive(g, "The shear modulus G");
        Guard.FormFactor(formFactor);
        double c = FlexureCoefficient(ends);
        double flex = load * height * height * height / (c * e * i);
        double shear = formFactor * load * height / (area * g);
        return new MemberDeflection(load, height, ends, flex, shear, true, Describe(ends, formFactor));
    }

    /// <summary>
    /// Solid rectangular pier of plan length l (in the direction of the force) and thickness t:
    /// I = t·l³/12, A = t·l, then as <see cref="General"/>.
    /// </summary>
    /// <param name="ends">How the pier's ends are held.</param>
    /// <param name="load">Lateral force P (F), positive.</param>
    /// <param name="height">Height h (L), positive.</param>
    /// <param name="length">Plan length l, the dimension parallel to the force (L), positive.</param>
    /// <param name="thickness">Thickness t (L), positive.</param>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="g">Shear modulus G (F/L²), positive.</param>
    /// <param name="formFactor">Shear form factor f ≥ 1 (1.2 for a rectangle).</param>
    public static MemberDeflection Rectangular(EndFixity ends, double load, double height, double length, double thickness,
        double e, double g, double formFactor = ShearForm.RectangleDefault)
    {
        Guard.Positive(length, "The pier length l");
        Guard.Positive(thickness, "The pier thickness t");
        double i = thickness * length * length * length / 12.0;
        double a = thickness * length;
        var r = General(ends, load, height, e, i, a, g, formFactor);
        return r with { Method = r.Method.With("the section is a solid rectangle, I = t·l³/12 and A = t·l") };
    }

    internal static double FlexureCoefficient(EndFixity ends) => ends switch
    {
        EndFixity.Cantilever => 3.0,
        EndFixity.FixedFixed => 12.0,
        _ => throw new ArgumentException($"Unknown end condition {ends}."),
    };

    internal static string[] EndSentences(EndFixity ends) => ends switch
    {
        EndFixity.Cantilever => ["base fully fixed", "top free to rotate"],
        EndFixity.FixedFixed => ["base fully fixed", "top held against rotation"],
        _ => throw new ArgumentException($"Unknown end condition {ends}."),
    };

    private static HandMethod Describe(EndFixity ends, double f)
    {
        string name = ends == EndFixity.Cantilever
            ? "Cantilever pier, flexure Ph³/(3EI) plus shear f·Ph/(AG)"
            : "Fixed-fixed pier, flexure Ph³/(12EI) plus shear f·Ph/(AG)";
        return new HandMethod(name,
            "Elementary beam theory with Timoshenko's shear term; Gere & Timoshenko, Mechanics of Materials; Taly, Design of Reinforced Masonry Structures, ch. 7",
            ["plane sections remain plane", .. EndSentences(ends),
             $"shear deformation with form factor {f.ToString("0.####", System.Globalization.CultureInfo.InvariantCulture)}",
             "linear elastic, uncracked, small displacements", "the force acts at the top of the member"]);
    }
}

/// <summary>
/// Columns: flexure only by default, shear deformation optional. The result's <see cref="MemberDeflection.IncludesShear"/>
/// and assumptions say which. Units: any consistent set (force F, length L).
/// </summary>
public static class Columns
{
    /// <summary>
    /// Column top deflection under a lateral force P: Ph³/(cEI), c = 3 cantilever or 12 fixed-fixed,
    /// plus, only when <paramref name="shear"/> is given, P·h/(G·A_s).
    /// Source: elementary beam theory (Gere &amp; Timoshenko, Mechanics of Materials); shear term after Timoshenko.
    /// </summary>
    /// <param name="ends">How the column's ends are held.</param>
    /// <param name="load">Lateral force P (F), positive.</param>
    /// <param name="height">Column height h (L), positive.</param>
    /// <param name="e">Young's modulus E (F/L²), positive.</param>
    /// <param name="i">Second moment of area I (L⁴), positive.</param>
    /// <param name="shear">Null for flexure only (the default), else G and the shear area A_s = A/f.</param>
    public static MemberDeflection Deflection(EndFixity ends, double load, double height, double e, double i,
        ColumnShear? shear = null)
    {
        Guard.Positive(load, "The lateral force P");
        Guard.Positive(height, "The column height h");
        Guard.Positive(e, "Young's modulus E");
        Guard.Positive(i, "The second moment of area I");
        double flex = load * height * height * height / (Piers.FlexureCoefficient(ends) * e * i);
        double sh = 0;
        if (shear is not null)
        {
            Guard.Positive(shear.G, "The shear modulus G");
            Guard.Positive(shear.ShearArea, "The shear area A_s");
            sh = load * height / (shear.G * shear.ShearArea);
        }
        var method = new HandMethod(
            ends == EndFixity.Cantilever ? "Cantilever column" : "Fixed-fixed column",
            "Elementary beam theory; Gere & Timoshenko, Mechanics of Materials",
            ["plane sections remain plane", .. Piers.EndSentences(ends),
             shear is null ? "shear deformation neglected (flexure only)" : "shear deformation included through the shear area A_s",
             "linear elastic, small displacements, axial load effects (P-delta) neglected"]);
        return new MemberDeflection(load, height, ends, flex, sh, shear is not null, method);
    }
}

/// <summary>Shear properties for a column when shear deformation is to be included.</summary>
/// <param name="G">Shear modulus (F/L²).</param>
/// <param name="ShearArea">Shear area A_s = A / f (L²).</param>
public sealed record ColumnShear(double G, double ShearArea);

/// <summary>
/// The masonry shortcut with G = 0.4E and f = 1.2 for a solid rectangular pier of height h, length l, thickness t:
/// cantilever Δ = (P/(E·t))·[4(h/l)³ + 3(h/l)]; fixed-fixed Δ = (P/(E·t))·[(h/l)³ + 3(h/l)].
/// Source: Taly, Design of Reinforced Masonry Structures, eqs. 7.1 and 7.12. Units: any consistent set.
/// </summary>
public static class MasonryShortcut
{
    /// <summary>Pier deflection by the shortcut; flexural and shear terms reported separately.</summary>
    /// <param name="ends">How the pier's ends are held.</param>
    /// <param name="load">Lateral force P (F), positive.</param>
    /// <param name="height">Pier height h (L), positive.</param>
    /// <param name="length">Pier plan length l (L), positive.</param>
    /// <param name="thickness">Thickness t (L), positive.</param>
    /// <param name="em">Masonry modulus E_m (F/L²), positive.</param>
    public static MemberDeflection Deflection(EndFixity ends, double load, double height, double length, double thickness, double em)
    {
        Guard.Positive(load, "The lateral force P");
        Guard.Positive(height, "The pier height h");
        Guard.Positive(length, "The pier length l");
        Guard.Positive(thickness, "The pier thickness t");
        Guard.Positive(em, "The masonry modulus E_m");
        double r = height / length;
        double scale = load / (em * thickness);
        double flex = scale * (ends == EndFixity.Cantilever ? 4.0 : 1.0) * r * r * r;
        double shear = scale * 3.0 * r;
        return new MemberDeflection(load, height, ends, flex, shear, true, Describe(ends));
    }

    /// <summary>
    /// Rigidity R = 1/Δ for a unit force, i.e. R = E_m·t / [4(h/l)³ + 3(h/l)] (cantilever) or
    /// E_m·t / [(h/l)³ + 3(h/l)] (fixed-fixed). Taly eqs. 7.1, 7.12; worked example p.455.
    /// </summary>
    /// <param name="ends">How the pier's ends are held.</param>
    /// <param name="aspectRatio">h/l, positive.</param>
    /// <param name="thickness">Thickness t (L), positive.</param>
    /// <param name="em">Masonry modulus E_m (F/L²), positive.</param>
    public static HandValue Rigidity(EndFixity ends, double aspectRatio, double thickness, double em)
    {
        Guard.Positive(aspectRatio, "The aspect ratio h/l");
        Guard.Positive(thickness, "The pier thickness t");
        Guard.Positive(em, "The masonry modulus E_m");
        double r = aspectRatio;
        double denom = (ends == EndFixity.Cantilever ? 4.0 : 1.0) * r * r * r + 3.0 * r;
        return new HandValue(em * thickness / denom, "pier rigidity R (F/L)", Describe(ends));
    }

    private static HandMethod Describe(EndFixity ends) => new(
        ends == EndFixity.Cantilever ? "Masonry shortcut, cantilever pier" : "Masonry shortcut, fixed-fixed pier",
        ends == EndFixity.Cantilever
            ? "Taly, Design of Reinforced Masonry Structures, eq. 7.1"
            : "Taly, Design of Reinforced Masonry Structures, eq. 7.12",
        ["plane sections remain plane", .. Piers.EndSentences(ends), "solid rectangular section",
         "shear modulus taken as 0.4E", "shear deformation with form factor 1.2", "linear elastic, uncracked"]);
}
