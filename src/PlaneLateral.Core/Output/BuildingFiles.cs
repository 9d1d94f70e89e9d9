using System.Globalization;
using System.Text;
using Newtonsoft.Json;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// The building layer's results files: story results, line shares, drift checks, the stiffness irregularity check,
/// the stiffness modifier of each member, and one JSON file with all of them. Nothing when the model has no building
/// keys. All in the model's units; the text depends only on the input.
/// </summary>
public static class BuildingFiles
{
    public static IReadOnlyList<(string Name, string Text)> Render(ModelResult run)
    {
        var r = run.Analysis;
        var b = r.Model.Building;
        if (ReferenceEquals(b, BuildingData.Empty)) return [];
        var br = run.Building;
        var files = new List<(string, string)>();
        if (br.HasStories)
        {
            files.Add(("stories.csv", BuildingTables.Stories(run).ToCsv()));
            files.Add(("story-lines.csv", StoryLines(r, br)));
            files.Add(("soft-story.csv", SoftStory(r, br)));
            var split = run.LineSplit;
            if (split.Count > 0) files.Add(("line-split.csv", Split(r, split)));
        }
        if (b.DriftChecks.Count > 0) files.Add(("drift-checks.csv", BuildingTables.DriftChecks(run).ToCsv()));
        files.Add(("member-stiffness.csv", MemberStiffness(r)));
        files.Add(("stories.json", Json(r, br)));
        return files;
    }

    private static string F(double v) => double.IsFinite(v) ? v.ToString("G12", CultureInfo.InvariantCulture) : "n/a";

    private static string Csv(string s) => PlaneLateral.Output.CsvText.Cell(s);   // the one escaper (quoting, formula neutralising)

    private static string LineName(string l) => l.Length == 0 ? "(no line)" : l;

    private static string StoryLines(AnalysisResult r, BuildingResult br)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,story,line,shear [{u.ForceSymbol}],share of story shear,line drift [{u.LengthSymbol}],line story stiffness in the structure [{u.Label(Quantity.TranslationalStiffness)}]\n");
        foreach (var c in br.Cases)
            foreach (var s in c.Stories)
                foreach (var l in s.Lines)
                    sb.Append($"{Csv(c.CaseId)},{s.Index},{Csv(LineName(l.Line))},{F(u.FromSI(l.Shear, Quantity.Force))},{F(l.Share)},{F(u.FromSI(l.Drift, Quantity.Length))},{F(u.FromSI(l.Stiffness, Quantity.TranslationalStiffness))}\n");
        return sb.ToString();
    }

    private static string Split(AnalysisResult r, IReadOnlyList<(string CaseId, IReadOnlyList<LineSplitRow> Rows)> split)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,story,line,stiffness of the line alone [{u.Label(Quantity.TranslationalStiffness)}],share by stiffness alone,share in the structure\n");
        foreach (var (id, rows) in split)
            foreach (var x in rows)
                sb.Append($"{Csv(id)},{x.Story},{Csv(x.Line)},{F(u.FromSI(x.AloneStiffness, Quantity.TranslationalStiffness))},{F(x.AloneShare)},{F(x.InStructureShare)}\n");
        return sb.ToString();
    }

    private static string SoftStory(AnalysisResult r, BuildingResult br)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,story,stiffness [{u.Label(Quantity.TranslationalStiffness)}],ratio to story above,ratio to mean of three above,type 1a soft (<0.70 or <0.80),type 1b extreme (<0.60 or <0.70)\n");
        foreach (var i in br.Irregularity)
            sb.Append($"{Csv(i.CaseId)},{i.Story.Index},{F(u.FromSI(i.Stiffness, Quantity.TranslationalStiffness))},{F(i.RatioToAbove)},{F(i.RatioToAverageAbove)},{(i.WindCase ? "not applied (wind case)" : i.Soft ? "yes" : "no")},{(i.WindCase ? "not applied (wind case)" : i.ExtremelySoft ? "yes" : "no")}\n");
        return sb.ToString();
    }

    private static string MemberStiffness(AnalysisResult r)
    {
        var m = r.Model;
        var b = m.Building;
        var sb = new StringBuilder("member,role,line,I modifier,A modifier,shear area modifier,source\n");
        for (int i = 0; i < m.Members.Count; i++)
        {
            var mem = m.Members[i];
            var a = i < b.Modifiers.Count ? b.Modifiers[i] : new ModifierAssignment(i, mem.Modifiers, "");
            string line = i < b.MemberLines.Count ? b.MemberLines[i] : "";
            sb.Append($"{Csv(mem.Id)},{Csv(mem.Role)},{Csv(line)},{F(a.Modifiers.I)},{F(a.Modifiers.A)},{F(a.Modifiers.ShearArea)},{Csv(a.Source)}\n");
        }
        return sb.ToString();
    }

    private static string Json(AnalysisResult r, BuildingResult br)
    {
        var m = r.Model;
        var u = m.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2, FloatFormatHandling = FloatFormatHandling.Symbol })
        {
            void P(string name, object? v) { w.WritePropertyName(name); if (v is double d && !double.IsFinite(d)) w.WriteNull(); else w.WriteValue(v); }
            w.WriteStartObject();
            P("producedBy", $"PlaneLateral {ResultFiles.Version}");
            P("caution", ResultFiles.Caution);
            P("units", $"length {u.LengthSymbol}, force {u.ForceSymbol}, stiffness {u.Label(Quantity.TranslationalStiffness)}");
            P("definitions", "Story i runs from its bottom level to its top level. Level displacement: mean ux of the level's nodes. Drift: top minus bottom. Story shear: horizontal force carried across a horizontal cut in the story by the members crossing it (from their end forces and loads), positive in +x. Story stiffness: shear / drift, null where the story carries no shear or does not drift.");
            w.WritePropertyName("levels");
            w.WriteStartArray();
            foreach (var l in m.Building.Levels)
            {
                w.WriteStartObject();
                P("id", l.Id); P("name", l.Name); P("elevation", L(l.Elevation)); P("diaphragm", l.Rigid ? "rigid" : "none");
                P("nodesChosen", l.Selection);
                w.WritePropertyName("nodes"); w.WriteStartArray(); foreach (int n in l.Nodes) w.WriteValue(m.Nodes[n].Id); w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WritePropertyName("cases");
            w.WriteStartArray();
            foreach (var c in br.Cases)
            {
                w.WriteStartObject();
                P("id", c.CaseId); P("kind", c.IsCombination ? "combination" : "load case"); P("lateral", c.Lateral);
                w.WritePropertyName("levels");
                w.WriteStartArray();
                foreach (var ld in c.Levels) { w.WriteStartObject(); P("level", ld.Level.Id); P("ux", L(ld.Ux)); P("spread", L(ld.Spread)); w.WriteEndObject(); }
                w.WriteEndArray();
                w.WritePropertyName("stories");
                w.WriteStartArray();
                foreach (var s in c.Stories)
                {
                    w.WriteStartObject();
                    P("story", s.Index); P("bottom", s.Bottom.Id); P("top", s.Top.Id); P("height", L(s.Height));
                    P("topDisplacement", L(s.TopDisplacement)); P("drift", L(s.Drift)); P("driftRatio", s.DriftRatio);
                    P("cutAt", L(s.CutElevation)); P("shear", u.FromSI(s.Shear, Quantity.Force)); P("stiffness", u.FromSI(s.Stiffness, Quantity.TranslationalStiffness));
                    w.WritePropertyName("lines");
                    w.WriteStartArray();
                    foreach (var l in s.Lines)
                    {
                        w.WriteStartObject();
                        P("line", LineName(l.Line)); P("shear", u.FromSI(l.Shear, Quantity.Force)); P("share", l.Share);
                        P("drift", L(l.Drift)); P("stiffnessInStructure", u.FromSI(l.Stiffness, Quantity.TranslationalStiffness));
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WritePropertyName("driftChecks");
            w.WriteStartArray();
            foreach (var d in br.DriftChecks)
            {
                w.WriteStartObject();
                P("check", d.Check.Id); P("case", d.CaseId); P("story", d.Story.Index); P("Cd", d.Check.Cd); P("Ie", d.Check.Ie);
                P("elasticDrift", L(d.ElasticDrift)); P("amplifiedDrift", L(d.AmplifiedDrift)); P("ratio", d.Ratio); P("allowedRatio", d.Allowed);
                P("result", d.Passes ? "within" : "exceeds"); P("margin", d.Margin); P("limitSource", d.Check.LimitSource);
                P("method", "amplified drift = Cd·elastic drift / Ie (ASCE 7-16 eq. 12.8-15)");
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WritePropertyName("stiffnessIrregularity");
            w.WriteStartArray();
            foreach (var i in br.Irregularity)
            {
                w.WriteStartObject();
                P("case", i.CaseId); P("story", i.Story.Index); P("stiffness", u.FromSI(i.Stiffness, Quantity.TranslationalStiffness));
                P("ratioToAbove", i.RatioToAbove); P("ratioToMeanOfThreeAbove", i.RatioToAverageAbove);
                P("type1aSoft", i.Soft); P("type1bExtremelySoft", i.ExtremelySoft); P("windCaseRatiosOnly", i.WindCase);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            P("irregularitySource", "ASCE 7-16 Table 12.3-2, Types 1a (below 70 % of the story above or 80 % of the mean of the three above) and 1b (60 % and 70 %); the governing code decides");
            w.WritePropertyName("memberStiffness");
            w.WriteStartArray();
            for (int i = 0; i < m.Members.Count && i < m.Building.Modifiers.Count; i++)
            {
                var a = m.Building.Modifiers[i];
                w.WriteStartObject();
                P("member", m.Members[i].Id); P("I", a.Modifiers.I); P("A", a.Modifiers.A); P("shearArea", a.Modifiers.ShearArea); P("source", a.Source);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }
}
