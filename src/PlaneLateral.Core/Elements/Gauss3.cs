namespace PlaneLateral.Elements;

/// <summary>Three-point Gauss–Legendre rule on [0, 1]: exact for polynomials up to degree 5.</summary>
public static class Gauss3
{
    public static readonly double[] Points = [0.5 - 0.5 * Math.Sqrt(0.6), 0.5, 0.5 + 0.5 * Math.Sqrt(0.6)];
    public static readonly double[] Weights = [5.0 / 18.0, 8.0 / 18.0, 5.0 / 18.0];
}
