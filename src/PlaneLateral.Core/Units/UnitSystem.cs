using System.Globalization;

namespace PlaneLateral.Units;

/// <summary>Force units a model may be written in.</summary>
public enum ForceUnit { Pound, Kip, Newton, Kilonewton, Meganewton }

/// <summary>Length units a model may be written in.</summary>
public enum LengthUnit { Inch, Foot, Millimetre, Centimetre, Metre }

/// <summary>
/// The force and length units of a model file. Internally every quantity is held in newtons and metres
/// (converted once, on load); results are reported back in the model's own units.
/// </summary>
public sealed record UnitSystem(ForceUnit Force, LengthUnit Length)
{
    /// <summary>Kip and inch, the default.</summary>
    public static UnitSystem KipInch { get; } = new(ForceUnit.Kip, LengthUnit.Inch);

    /// <summary>Kilonewton and metre.</summary>
    public static UnitSystem KilonewtonMetre { get; } = new(ForceUnit.Kilonewton, LengthUnit.Metre);

    /// <summary>Newton and millimetre.</summary>
    public static UnitSystem NewtonMillimetre { get; } = new(ForceUnit.Newton, LengthUnit.Millimetre);

    // 1 lbf = 4.4482216152605 N exactly (avoirdupois pound × standard gravity); 1 in = 0.0254 m exactly (NIST SP 811, 2008).
    private static readonly Dictionary<ForceUnit, (string Symbol, double Newtons)> ForceTable = new()
    {
        [ForceUnit.Pound] = ("lb", 4.4482216152605),
        [ForceUnit.Kip] = ("kip", 4448.2216152605),
        [ForceUnit.Newton] = ("N", 1.0),
        [ForceUnit.Kilonewton] = ("kN", 1.0e3),
        [ForceUnit.Meganewton] = ("MN", 1.0e6),
    };

    private static readonly Dictionary<LengthUnit, (string Symbol, double Metres)> LengthTable = new()
    {
        [LengthUnit.Inch] = ("in", 0.0254),
        [LengthUnit.Foot] = ("ft", 0.3048),
        [LengthUnit.Millimetre] = ("mm", 1.0e-3),
        [LengthUnit.Centimetre] = ("cm", 1.0e-2),
        [LengthUnit.Metre] = ("m", 1.0),
    };

    /// <summary>Symbols accepted in a model file for force units.</summary>
    public static IReadOnlyList<string> ForceSymbols { get; } = ForceTable.Values.Select(v => v.Symbol).ToArray();

    /// <summary>Symbols accepted in a model file for length units.</summary>
    public static IReadOnlyList<string> LengthSymbols { get; } = LengthTable.Values.Select(v => v.Symbol).ToArray();

    public static bool TryParseForce(string symbol, out ForceUnit unit)
    {
        foreach (var (u, (s, _)) in ForceTable)
            if (string.Equals(s, symbol, StringComparison.Ordinal)) { unit = u; return true; }
        unit = default;
        return false;
    }

    public static bool TryParseLength(string symbol, out LengthUnit unit)
    {
        foreach (var (u, (s, _)) in LengthTable)
            if (string.Equals(s, symbol, StringComparison.Ordinal)) { unit = u; return true; }
        unit = default;
        return false;
    }

    public string ForceSymbol => ForceTable[Force].Symbol;
    public string LengthSymbol => LengthTable[Length].Symbol;

    /// <summary>Newtons in one model force unit.</summary>
    public double ForceScale => ForceTable[Force].Newtons;

    /// <summary>Metres in one model length unit.</summary>
    public double LengthScale => LengthTable[Length].Metres;

    /// <summary>SI value of one model unit of the given kind of quantity.</summary>
    public double Scale(Quantity q) => q switch
    {
        Quantity.Dimensionless => 1.0,
        Quantity.Length => LengthScale,
        Quantity.Force => ForceScale,
        Quantity.Moment => ForceScale * LengthScale,
        Quantity.Stress => ForceScale / (LengthScale * LengthScale),
        Quantity.Area => LengthScale * LengthScale,
        Quantity.SecondMomentOfArea => Math.Pow(LengthScale, 4),
        Quantity.ForcePerLength => ForceScale / LengthScale,
        Quantity.TranslationalStiffness => ForceScale / LengthScale,
        Quantity.RotationalStiffness => ForceScale * LengthScale,
        Quantity.Rotation => 1.0,
        _ => throw new ArgumentOutOfRangeException(nameof(q)),
    };

    /// <summary>Converts a value written in model units to SI (N, m).</summary>
    public double ToSI(double value, Quantity q) => value * Scale(q);

    /// <summary>Converts an SI value (N, m) to model units.</summary>
    public double FromSI(double value, Quantity q) => value / Scale(q);

    /// <summary>Unit label for the given kind of quantity, e.g. "kip/in" or "kN·m".</summary>
    public string Label(Quantity q) => q switch
    {
        Quantity.Dimensionless => "",
        Quantity.Length => LengthSymbol,
        Quantity.Force => ForceSymbol,
        Quantity.Moment => $"{ForceSymbol}·{LengthSymbol}",
        Quantity.Stress => $"{ForceSymbol}/{LengthSymbol}²",
        Quantity.Area => $"{LengthSymbol}²",
        Quantity.SecondMomentOfArea => $"{LengthSymbol}⁴",
        Quantity.ForcePerLength => $"{ForceSymbol}/{LengthSymbol}",
        Quantity.TranslationalStiffness => $"{ForceSymbol}/{LengthSymbol}",
        Quantity.RotationalStiffness => $"{ForceSymbol}·{LengthSymbol}/rad",
        Quantity.Rotation => "rad",
        _ => throw new ArgumentOutOfRangeException(nameof(q)),
    };

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{ForceSymbol}, {LengthSymbol}");
}

/// <summary>Kinds of physical quantity, for unit conversion and labels.</summary>
public enum Quantity
{
    Dimensionless, Length, Force, Moment, Stress, Area, SecondMomentOfArea,
    ForcePerLength, TranslationalStiffness, RotationalStiffness, Rotation,
}
