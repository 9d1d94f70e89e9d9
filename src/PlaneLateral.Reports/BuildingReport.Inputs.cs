using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Reports;

public static partial class BuildingReport
{
    private static string FormWord(PlanLineForm f) => f switch
    {
        PlanLineForm.Wall => "wall",
        PlanLineForm.StoryStiffness => "story stiffness",
        PlanLineForm.File => "model (file)",
        _ => "model (inline)",
    };

    /// <summary>The inputs as tables: units, levels, lines, load cases and their floor loads, drift check, seismic block, floors.</summary>
    private static void Inputs(Doc d)
    {
        var p = d.P;
        var u = d.U;
        d.Heading("Inputs");
        d.Text($"Units: force {d.Force}, length {d.Len}; moment {d.MomentUnit}, stiffness {d.StiffUnit}, stress {u.Label(Quantity.Stress)}; rotations in rad, counter-clockwise seen from above; periods in s. " +
            "Plan axes: X east, Y north. Every number in this report is in these units unless it says otherwise.");
        d.Table("Building size", ["item", "value"],
            [["floors (levels above the base)", I(p.FloorCount)], ["lines of resistance", I(p.Lines.Count)], ["load cases solved (twins and generated cases included)", I(p.Cases.Count)],
             ["accidental eccentricity (fraction of the plan dimension across the forces)", Ratio(p.EccentricityRatio, "0.###")], [$"plan size (largest outline extent) [{d.Len}]", d.L(p.Size)]], 1);

        // Levels: elevation, weight, centre of mass, polar inertia as a radius of gyration (J = m·r², unit-safe), outline.
        d.Table("Levels (base first)", ["level", "name", $"elevation [{d.Len}]", $"weight [{d.Force}]", $"centre of mass x [{d.Len}]", $"centre of mass y [{d.Len}]",
                $"radius of gyration √(J/m) [{d.Len}]", "floor", "outline corners"],
            p.Levels.Select(l => (IReadOnlyList<string>)[l.Id, l.Name, d.L(l.Elevation), l.Index == 0 ? "-" : d.Fo(l.Weight),
                l.Index == 0 ? "-" : d.L(l.CentreOfMass.X), l.Index == 0 ? "-" : d.L(l.CentreOfMass.Y),
                l.Index == 0 || !(l.Weight > 0) ? "-" : d.L(Math.Sqrt(l.PolarInertia * SeismicPresets.Gravity / l.Weight)),
                l.Index == 0 ? "-" : PlanFloor.Word(p.KindOf(l.Index)),
                l.Index == 0 ? "-" : string.Join(" ", l.Outline.Select(q => $"({d.L(q.X)}, {d.L(q.Y)})"))]), 2, 3, 4, 5, 6);
        d.Text("The polar mass inertia J about the centre of mass is the one the modes use: given in the file, or that of a uniform floor over its outline " +
            "(J = m·(I_x + I_y)/A, the polygon formulas — common practice); it is shown as the radius of gyration √(J/m), m = W/g.");

        // Lines: where, which way, and what they are made of.
        d.Table("Lines of resistance", ["line", "form", "source", $"x [{d.Len}]", $"y [{d.Len}]", "direction", $"lever r [{d.Len}]", "members", "key data"],
            p.Lines.Select(l => (IReadOnlyList<string>)[l.Id, FormWord(l.Form), Path.GetFileName(l.Source), d.L(l.X0), d.L(l.Y0), l.DirectionLabel, d.L(l.Lever),
                I(l.Model.Members.Count), KeyData(d, l)]), 3, 4, 6, 7);
        d.Text("Lever r = x₀·sin α − y₀·cos α about the plan origin; the line's displacement is u = cos α·Ux + sin α·Uy + r·Rz of the floor it stands on.");
        var stiffLines = p.Lines.Where(l => l.Form == PlanLineForm.StoryStiffness).ToList();
        if (stiffLines.Count > 0)
            d.Table("Story stiffnesses of the lines given by them (story 1 lowest)", ["line", .. Enumerable.Range(1, p.FloorCount).Select(s => $"story {s} [{d.StiffUnit}]")],
                stiffLines.Select(l => (IReadOnlyList<string>)[l.Id, .. StoryStiffness(l).Select(d.K)]), [.. Enumerable.Range(1, p.FloorCount)]);

        // Load cases, each with every floor load, grouped by the case the user named (its twins and generated cases with it).
        string generated = p.Seismic?.CaseId ?? "\u0000";
        d.Table("Load cases", ["case", "named in the file as", "along", "centre of mass", "description"],
            p.Cases.Select(c => (IReadOnlyList<string>)[c.Id, c.Family == generated ? $"{c.Family} (seismic block, generated)" : c.Family, c.Direction == "" ? "-" : c.Direction,
                c.Eccentricity == 0 ? (c.Direction == "" ? "-" : "at") : c.Eccentricity > 0 ? "shifted +" : "shifted −", c.Description]));
        d.Text($"Cases along X or Y get two twins with every centre of mass shifted ± {Ratio(p.EccentricityRatio, "0.###")} of the plan dimension across the forces " +
            "(ASCE 7-16 §12.8.4.2), unless the file turns them off; the seismic block adds its own (and, where A_x > 1 applies, twins shifted by A_x times as much).");
        foreach (var family in p.Cases.GroupBy(c => (c.Family, c.Direction)))
            d.Table($"Floor loads, {(family.Key.Direction == "" ? $"case {family.Key.Family}" : $"cases {family.Key.Family} along {family.Key.Direction}")} " +
                    "(forces and torque about the plan origin; a torque is counter-clockwise seen from above)",
                ["case", "level", $"Fx [{d.Force}]", $"Fy [{d.Force}]", $"Mz about origin [{d.MomentUnit}]", $"line of action x = [{d.Len}]", $"line of action y = [{d.Len}]"],
                family.SelectMany(c => c.Loads.Select(l => (IReadOnlyList<string>)[c.Id, d.Level(l.Level), d.Fo(l.Fx), d.Fo(l.Fy), d.M(l.Mz), .. ActsAt(d, l)])), 2, 3, 4, 5, 6);

        if (p.DriftLimit is { } lim)
            d.Table("Corner drift check asked for", ["C_d", "I_e", "allowable δ/h", "rule"],
                [[Ratio(lim.Cd, "0.###"), Ratio(lim.Ie, "0.###"), Ratio(lim.AllowedRatio, "0.####"), "δ = C_d·δ_e/I_e at every outline corner (vector drift in plan), ASCE 7-16 eq. 12.8-15; allowable as the file gives it (Table 12.12-1 lists the code's values)"]], 0, 1, 2);

        if (p.Seismic is { } s)
        {
            var sv = s.Spectrum;
            var rows = new List<IReadOnlyList<string>>
            {
                new[] { "generated cases", $"{s.CaseId}-x, {s.CaseId}-y and their ±ecc twins" },
                new[] { "structure type (for T_a)", s.StructureType },
                new[] { "S_DS, S_D1 [g]", $"{Ratio(sv.Sds, "0.###")}, {Ratio(sv.Sd1, "0.###")}" },
                new[] { "R, I_e", $"{Ratio(sv.R, "0.###")}, {Ratio(sv.Ie, "0.###")}" },
                new[] { "T_L [s]", Ratio(sv.TL, "0.##") },
                new[] { "S_1 [g]", double.IsFinite(sv.S1) ? Ratio(sv.S1, "0.###") : "not given" },
                new[] { "period used", s.Period switch { PeriodUse.Given => $"given, {Ratio(s.GivenPeriod, "0.###")} s", PeriodUse.Approximate => "approximate T_a", PeriodUse.Computed => "modal", _ => "modal, capped at C_u·T_a" } },
            };
            if (s.ResponseSpectrum is { } rs)
            {
                rows.Add(["response spectrum", $"{rs.Rule.ToString().ToUpperInvariant()}, ζ = {Ratio(rs.Damping, "0.###")}, C_d = {Ratio(rs.Cd, "0.###")}"]);
                rows.Add(["spectrum shape", rs.Table.Count == 0 ? "ASCE 7-16 §11.4.6 from S_DS, S_D1, T_L" : $"table of {rs.Table.Count} points: {string.Join(", ", rs.Table.Select(t => $"({Ratio(t.T, "0.###")} s, {Ratio(t.Sa, "0.###")} g)"))}"]);
                rows.Add(["modes", rs.Modes > 0 ? $"at least {rs.Modes}, and enough for {Pct(rs.MassShare, "0")} of the mass" : $"enough for {Pct(rs.MassShare, "0")} of the mass in each direction"]);
            }
            d.Table("Seismic block", ["item", "value"], rows);
        }

        if (p.Floors.Count > 0)
            d.Table("Floor blocks (floors not listed are rigid)", ["level", "kind", $"thickness [{d.Len}]", $"E [{u.Label(Quantity.Stress)}]", $"G [{u.Label(Quantity.Stress)}]", "shear factor", "openings"],
                p.Floors.Select(f => (IReadOnlyList<string>)[d.Level(f.Level), PlanFloor.Word(f.Kind), f.HasSection ? d.L(f.Thickness) : "-", f.HasSection ? d.S(f.E) : "-",
                    f.HasSection ? d.S(f.G) : "-", f.HasSection ? Ratio(f.ShearFactor, "0.###") : "-",
                    f.Openings.Count == 0 ? "none" : string.Join("; ", f.Openings.Select(o => $"({d.L(o.Min.X)}, {d.L(o.Min.Y)}) to ({d.L(o.Max.X)}, {d.L(o.Max.Y)})"))]), 2, 3, 4, 5);
    }

    /// <summary>Wall length, thickness and material; a story-stiffness line's stiffnesses; a model's member count and materials.</summary>
    private static string KeyData(Doc d, PlanLine l)
    {
        var m = l.Model;
        switch (l.Form)
        {
            case PlanLineForm.Wall when m.Sections.Count > 0 && m.Materials.Count > 0:
                var sec = m.Sections[0];
                var mat = m.Materials[0];
                return $"length {d.L(sec.Depth)}, thickness {d.L(sec.A / sec.Depth)} {d.Len}; {mat.Id}: E = {d.S(mat.E)}, G = {d.S(mat.G)} {d.U.Label(Quantity.Stress)}; " +
                    $"shear area A/{Ratio(sec.FormFactor, "0.###")}; one Timoshenko member per story, fixed at the base";
            case PlanLineForm.StoryStiffness:
                return $"k = {string.Join(", ", StoryStiffness(l).Select(d.K))} {d.StiffUnit} (story 1 first), exact story springs";
            default:
                return $"{m.Title}: {m.Nodes.Count} nodes, {m.Members.Count} members, materials {string.Join(", ", m.Materials.Select(x => x.Id))}" +
                    (m.Panels.Count > 0 ? $", {m.Panels.Count} wall panels" : "");
        }
    }

    /// <summary>
    /// The story stiffnesses of a line given by them, read back from its generated springs: a bar of axial stiffness EA/L
    /// inclined at θ resists EA·cos²θ/L horizontally when its ends do not move vertically (derived; PlanLineModels).
    /// </summary>
    private static IEnumerable<double> StoryStiffness(PlanLine l)
    {
        var m = l.Model;
        foreach (var mem in m.Members)
        {
            var a = m.Nodes[mem.Start]; var b = m.Nodes[mem.End];
            double dx = b.X - a.X, dy = b.Y - a.Y, len2 = dx * dx + dy * dy;
            yield return mem.E * mem.A * (dx * dx / len2) / Math.Sqrt(len2);
        }
    }

    /// <summary>Where a single force of the floor load acts (its line of action at the level, for a force along one axis); "-" when both or none.</summary>
    private static string[] ActsAt(Doc d, PlanFloorLoad l)
    {
        // Mz = x·Fy − y·Fx about the origin; a force along one axis fixes the coordinate across it.
        if (l.Fx == 0 && l.Fy != 0) return [d.L(l.Mz / l.Fy), "-"];
        if (l.Fy == 0 && l.Fx != 0) return ["-", d.L(-l.Mz / l.Fx)];
        return ["-", "-"];
    }
}
