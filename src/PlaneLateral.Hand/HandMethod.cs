namespace PlaneLateral.Hand;

/// <summary>
/// The provenance every hand-method result carries: the method's published name, where it is
/// published, and the assumptions it rests on, each as a plain sentence.
/// </summary>
/// <param name="Name">The method's name as published or as commonly called.</param>
/// <param name="Source">Author, title, year, equation or page; or "common practice", "from memory", "derived by hand".</param>
/// <param name="Assumptions">Plain sentences, e.g. "plane sections remain plane".</param>
public sealed record HandMethod(string Name, string Source, IReadOnlyList<string> Assumptions)
{
    /// <summary>A copy with further assumptions appended.</summary>
    public HandMethod With(params string[] more) => this with { Assumptions = [.. Assumptions, .. more] };
}

/// <summary>
/// A single number from a hand method, with its provenance. Converts implicitly to <see cref="double"/>
/// so it can be chained into the next formula.
/// </summary>
/// <param name="Value">The number, in the consistent unit set of the inputs.</param>
/// <param name="Quantity">What the number is, e.g. "shear modulus G".</param>
/// <param name="Method">Name, source and assumptions.</param>
public sealed record HandValue(double Value, string Quantity, HandMethod Method)
{
    public static implicit operator double(HandValue v) => v.Value;
}

/// <summary>How the two ends of a pier, wall or column are held.</summary>
public enum EndFixity
{
    /// <summary>Base fully fixed, top free to translate and to rotate (cantilever).</summary>
    Cantilever,

    /// <summary>Base fully fixed, top free to translate but held against rotation (fixed-fixed, also called fixed-guided).</summary>
    FixedFixed,
}

internal static class Guard
{
    public static void Positive(double value, string what)
    {
        if (!(value > 0) || double.IsInfinity(value))
            throw new ArgumentException($"{what} must be a positive finite number; got {value}.");
    }

    public static void NonNegative(double value, string what)
    {
        if (!(value >= 0) || double.IsInfinity(value))
            throw new ArgumentException($"{what} must be zero or a positive finite number; got {value}.");
    }

    public static void Finite(double value, string what)
    {
        if (double.IsNaN(value) || double.IsInfinity(value))
            throw new ArgumentException($"{what} must be a finite number; got {value}.");
    }

    public static void Poisson(double nu)
    {
        if (!(nu > -1.0 && nu < 0.5))
            throw new ArgumentException($"Poisson's ratio must lie strictly between -1 and 0.5; got {nu}.");
    }

    public static void FormFactor(double f)
    {
        if (!(f >= 1.0) || double.IsInfinity(f))
            throw new ArgumentException($"The shear form factor must be a finite number of at least 1 (1.2 for a rectangle); got {f}.");
    }

    public static void NotEmpty<T>(IReadOnlyCollection<T>? items, string what)
    {
        if (items is null || items.Count == 0)
            throw new ArgumentException($"{what} must hold at least one entry.");
    }

    public static string Fixity(EndFixity ends) => ends switch
    {
        EndFixity.Cantilever => "cantilever",
        EndFixity.FixedFixed => "fixed-fixed",
        _ => throw new ArgumentException($"Unknown end condition {ends}."),
    };
}
