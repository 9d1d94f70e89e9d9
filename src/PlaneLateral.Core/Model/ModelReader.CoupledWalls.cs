using PlaneLateral.Units;

namespace PlaneLateral.Model;

/// <summary>One pier of a coupled wall: its left edge from the wall's left end and its length in the plane (m).</summary>
public sealed record CoupledPierSpec(string Label, double X, double Length)
{
    /// <summary>Centroid position from the wall's left end (m).</summary>
    public double Centroid => X + Length / 2;
}

/// <summary>Which length a coupling beam bends over.</summary>
public enum BeamSpanRule
{
    /// <summary>The clear opening between the pier faces (the classic continuous-connection form).</summary>
    ClearOpening,

    /// <summary>The clear opening plus half the beam depth (a quarter depth into each pier; some texts, from memory).</summary>
    ClearPlusHalfDepth,
}

/// <summary>
/// Two or more wall piers joined by coupling beams at every floor, described by its dimensions (SI): piers left to right,
/// a regular story height, one beam depth, one thickness, one material. Checked against the continuous-connection
/// closed form and the two hand bounds (docs/coupled-walls.md).
/// </summary>
/// <param name="Piers">The piers, left to right, not overlapping.</param>
/// <param name="Stories">Number of stories (one coupling beam at each floor above the base, the roof included).</param>
/// <param name="StoryHeight">Story height h (m).</param>
/// <param name="Thickness">Wall thickness (m).</param>
/// <param name="BeamDepth">Coupling-beam depth (m), less than the story height.</param>
/// <param name="BeamThickness">Coupling-beam thickness (m); the wall's when not given.</param>
/// <param name="BeamInertiaFactor">Multiplier on the beams' I (e.g. cracked concrete); 1 = gross.</param>
/// <param name="FormFactor">Shear form factor f of walls and beams (shear area A/f).</param>
/// <param name="UniformLoad">Uniform lateral load w (N/m of height), or null.</param>
/// <param name="TopLoad">Point load P at the top (N), or null.</param>
public sealed record CoupledWallCheck(string Id, string Description, double? Tolerance, CheckLocation At,
    IReadOnlyList<CoupledPierSpec> Piers, int Stories, double StoryHeight, double Thickness, Material Material,
    double BeamDepth, double BeamThickness, double BeamInertiaFactor, double FormFactor, BeamSpanRule BeamSpan,
    double? UniformLoad, double? TopLoad)
    : ComparisonCheck(Id, Description, Tolerance, At)
{
    /// <summary>Total height (m).</summary>
    public double Height => Stories * StoryHeight;
}

// Reading of the "coupled-wall" comparison check (docs/comparisons.md, docs/coupled-walls.md).
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        private CoupledWallCheck? ReadCoupledWall(JsonFields f, string? id, string desc, double? tol, CheckLocation at)
        {
            string len = _units.LengthSymbol;
            const string pfix = "give \"piers\": [ {\"x\": 0, \"length\": ...}, {\"x\": ..., \"length\": ...} ], at least two, x = the pier's left edge from the wall's left end";
            var pierObjects = f.Objects("piers", true, pfix);
            var piers = new List<(CoupledPierSpec Spec, JsonMap At)>();
            int n = 0;
            foreach (var po in pierObjects)
            {
                n++;
                var pf = new JsonFields(po, sink);
                var label = pf.OptionalString("label", "give the pier a label as a string") ?? $"pier {n}";
                double x = SI(pf.RequiredNumber("x", $"give x, the pier's left edge from the wall's left end, in {len}"), Quantity.Length);
                double l = Positive(pf, "length", Quantity.Length, "pier length", $"give the pier's length in the wall's plane > 0 in {len}");
                pf.RejectUnknownKeys();
                if (double.IsFinite(x) && l > 0) piers.Add((new CoupledPierSpec(label, x, l), po));
            }
            if (f.Token("piers") is JsonList pa && pa.Count < 2)
                sink.Add(pa, $"a coupled wall needs at least two piers; found {pa.Count}", pfix);

            const string sfix = "give \"stories\" as a whole number ≥ 1 (one coupling beam at each floor and the roof)";
            double storiesValue = f.RequiredNumber("stories", sfix);
            int stories = 0;
            if (double.IsFinite(storiesValue))
            {
                if (storiesValue < 1 || storiesValue != Math.Floor(storiesValue) || storiesValue > 1000)
                    sink.Add(f.Token("stories"), $"'stories' is {storiesValue}; it must be a whole number from 1 to 1000", sfix);
                else stories = (int)storiesValue;
            }
            double h = Positive(f, "storyHeight", Quantity.Length, "story height", $"give the story height > 0 in {len}");
            double t = Positive(f, "thickness", Quantity.Length, "wall thickness", $"give the wall's thickness > 0 in {len}");
            double d = Positive(f, "beamDepth", Quantity.Length, "coupling-beam depth", $"give the coupling beams' depth > 0 in {len}, less than the story height");
            double tb = f.Has("beamThickness")
                ? Positive(f, "beamThickness", Quantity.Length, "coupling-beam thickness", $"give the beams' thickness > 0 in {len}, or leave it out to take the wall's")
                : t;
            var mat = ReadMaterialRef(f);
            const string ifix = "give \"beamInertiaFactor\" as a number in (0, 1], e.g. 0.35 for cracked beams; leave it out for the gross section (1)";
            double iFactor = f.OptionalNumber("beamInertiaFactor", 1.0, ifix);
            if (double.IsFinite(iFactor) && !(iFactor > 0 && iFactor <= 1)) { sink.Add(f.Token("beamInertiaFactor"), $"'beamInertiaFactor' is {iFactor}, outside (0, 1]", ifix); iFactor = double.NaN; }
            double factor = ReadShearFactor(f);
            const string bfix = "give \"beamSpan\": \"clear\" (the clear opening, the default) or \"clear-plus-half-depth\"";
            var spanText = f.OptionalString("beamSpan", bfix) ?? "clear";
            var span = spanText switch { "clear" => BeamSpanRule.ClearOpening, "clear-plus-half-depth" => BeamSpanRule.ClearPlusHalfDepth, _ => (BeamSpanRule)(-1) };
            if ((int)span < 0) sink.Add(f.Token("beamSpan"), $"unknown beam span rule \"{spanText}\"", bfix);
            string fu = _units.ForceSymbol;
            double? w = f.Has("uniformLoad") ? Positive(f, "uniformLoad", Quantity.ForcePerLength, "uniform load", $"give the uniform lateral load > 0 in {fu}/{len} of height") : null;
            double? p = f.Has("topLoad") ? Positive(f, "topLoad", Quantity.Force, "top load", $"give the point load at the top > 0 in {fu}") : null;
            if (w is null && p is null) { w = SI(1.0, Quantity.ForcePerLength); p = SI(1.0, Quantity.Force); }

            if (id is null || mat is null || stories < 1 || !(h > 0 && t > 0 && d > 0 && tb > 0) || !(iFactor > 0) || !(factor >= 1) || (int)span < 0
                || w is double wv && !(wv > 0) || p is double pv && !(pv > 0) || piers.Count < 2 || piers.Count != pierObjects.Count)
                return null;

            bool ok = true;
            if (d >= h)
            {
                sink.Add(f.Token("beamDepth"), $"the coupling beams ({_units.FromSI(d, Quantity.Length):G6} {len} deep) are not shallower than the story ({_units.FromSI(h, Quantity.Length):G6} {len}), so no opening is left between them",
                    "give a beam depth less than the story height (the wall without openings is one solid wall: check it as a wall line)");
                ok = false;
            }
            var sorted = piers.OrderBy(q => q.Spec.X).ToList();
            double eps = 1e-9 * Math.Max(1.0, sorted[^1].Spec.X + sorted[^1].Spec.Length - sorted[0].Spec.X);
            for (int i = 0; i + 1 < sorted.Count; i++)
            {
                var (a, _) = sorted[i];
                var (b, tokB) = sorted[i + 1];
                double gap = b.X - (a.X + a.Length);
                if (gap < -eps)
                {
                    sink.Add(tokB, $"piers '{a.Label}' and '{b.Label}' overlap by {_units.FromSI(-gap, Quantity.Length):G6} {len}",
                        "move the piers apart so that an opening lies between each pier and the next (x is a pier's left edge)");
                    ok = false;
                }
                else if (gap <= eps)
                {
                    sink.Add(tokB, $"piers '{a.Label}' and '{b.Label}' touch, leaving no opening for a coupling beam between them",
                        "merge them into one pier, or leave an opening between them");
                    ok = false;
                }
            }
            if (!ok) return null;
            return new CoupledWallCheck(id, desc, tol, at, sorted.Select(q => q.Spec).ToArray(), stories, h, t, mat, d, tb, iFactor, factor, span, w, p);
        }
    }
}
