using System.Globalization;
using System.Text;
using Newtonsoft.Json;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Units;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// The results writers as they were before the files were streamed (results.json property by property into one string,
/// the CSV tables as one string each), kept in the tests only as the reference the streamed files must equal byte for
/// byte (<see cref="StreamedResultFilesTests"/>).
/// </summary>
internal static class PreviousResultWriters
{
    private static string F(double v) => v.ToString("G12", CultureInfo.InvariantCulture);

    private static string Csv(string s) => CsvText.Cell(s);

    public static string Displacements(AnalysisResult r)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,node,ux [{u.LengthSymbol}],uy [{u.LengthSymbol}],rz [rad]\n");
        foreach (var c in r.Cases)
            foreach (var n in r.Model.Nodes)
                sb.Append($"{Csv(c.Id)},{Csv(n.Id)},{F(u.FromSI(c.Displacement(n.Index, Dof.X), Quantity.Length))},{F(u.FromSI(c.Displacement(n.Index, Dof.Y), Quantity.Length))},{F(c.Displacement(n.Index, Dof.RZ))}\n");
        return sb.ToString();
    }

    public static string Reactions(AnalysisResult r)
    {
        var u = r.Model.Units;
        var sb = new StringBuilder($"case,node,Fx [{u.ForceSymbol}],Fy [{u.ForceSymbol}],Mz [{u.Label(Quantity.Moment)}]\n");
        for (int ci = 0; ci < r.Cases.Count; ci++)
        {
            var c = r.Cases[ci];
            foreach (var re in c.Reactions)
                sb.Append($"{Csv(c.Id)},{Csv(r.Model.Nodes[re.Node].Id)},{F(u.FromSI(re.Fx, Quantity.Force))},{F(u.FromSI(re.Fy, Quantity.Force))},{F(u.FromSI(re.Mz, Quantity.Moment))}\n");
            // Each wall panel's held base: the resultant of its base reactions, Mz about the middle of its base (docs/panels.md).
            foreach (var (_, name, fx, fy, mz) in PanelBases(r, ci))
                sb.Append($"{Csv(c.Id)},{Csv(name)},{F(u.FromSI(fx, Quantity.Force))},{F(u.FromSI(fy, Quantity.Force))},{F(u.FromSI(mz, Quantity.Moment))}\n");
        }
        return sb.ToString();
    }

    /// <summary>The label and base-reaction resultant (N, N, N·m about the middle of the base) of every wall panel in a case.</summary>
    private static IEnumerable<(WallPanel Panel, string Name, double Fx, double Fy, double Mz)> PanelBases(AnalysisResult r, int caseIndex)
    {
        for (int p = 0; p < r.Panels.Count && p < r.Model.Panels.Count; p++)
        {
            if (caseIndex >= r.Panels[p].Analysis.Cases.Count) continue;
            var (fx, fy, mz) = StoryPanels.BaseReaction(r, p, caseIndex);
            yield return (r.Model.Panels[p], ResultFiles.PanelBaseLabel(r.Model.Panels[p]), fx, fy, mz);
        }
    }

    public static string MemberForces(AnalysisResult r)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        var sb = new StringBuilder($"case,member,N1 [{fu}],V1 [{fu}],M1 [{mu}],N2 [{fu}],V2 [{fu}],M2 [{mu}]\n");
        foreach (var c in r.Cases)
            foreach (var m in c.MemberForces)
                sb.Append($"{Csv(c.Id)},{Csv(r.Model.Members[m.Member].Id)},{F(u.FromSI(m.N1, Quantity.Force))},{F(u.FromSI(m.V1, Quantity.Force))},{F(u.FromSI(m.M1, Quantity.Moment))},{F(u.FromSI(m.N2, Quantity.Force))},{F(u.FromSI(m.V2, Quantity.Force))},{F(u.FromSI(m.M2, Quantity.Moment))}\n");
        return sb.ToString();
    }

    public static string Json(AnalysisResult r)
    {
        var u = r.Model.Units;
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2, FloatFormatHandling = FloatFormatHandling.String })
        {
            w.WriteStartObject();
            w.WritePropertyName("producedBy"); w.WriteValue($"PlaneLateral {ResultFiles.Version}");
            w.WritePropertyName("caution"); w.WriteValue(ResultFiles.Caution);
            w.WritePropertyName("model");
            w.WriteStartObject();
            w.WritePropertyName("title"); w.WriteValue(r.Model.Title);
            w.WritePropertyName("file"); w.WriteValue(Path.GetFileName(r.Model.SourcePath));
            w.WritePropertyName("nodes"); w.WriteValue(r.Model.Nodes.Count);
            w.WritePropertyName("members"); w.WriteValue(r.Model.Members.Count);
            w.WriteEndObject();
            w.WritePropertyName("units");
            w.WriteStartObject();
            w.WritePropertyName("length"); w.WriteValue(u.LengthSymbol);
            w.WritePropertyName("force"); w.WriteValue(u.ForceSymbol);
            w.WritePropertyName("moment"); w.WriteValue(u.Label(Quantity.Moment));
            w.WritePropertyName("rotation"); w.WriteValue("rad");
            w.WritePropertyName("stiffness"); w.WriteValue(u.Label(Quantity.TranslationalStiffness));
            w.WriteEndObject();
            w.WritePropertyName("solver");
            w.WriteStartObject();
            w.WritePropertyName("method"); w.WriteValue(MachineFree.Solver(r.Solve.Solver));
            w.WritePropertyName("unknowns"); w.WriteValue(r.Solve.Unknowns);
            w.WritePropertyName("matrixNonZerosLower"); w.WriteValue(r.Solve.MatrixNonZerosLower);
            w.WritePropertyName("factorNonZeros"); w.WriteValue(r.Solve.FactorNonZeros);
            w.WritePropertyName("rightHandSides"); w.WriteValue(r.Solve.RightHandSides);
            w.WriteEndObject();
            if (r.Conditioning is { } cond)
            {
                w.WritePropertyName("conditioning");
                w.WriteStartObject();
                w.WritePropertyName("method"); w.WriteValue("1-norm condition estimate from solves with the factor (Hager; Higham 2002, Alg. 15.4); a lower bound, usually within a factor 3");
                w.WritePropertyName("kappa1"); w.WriteValue(cond.Kappa1);
                w.WritePropertyName("kappa1Scaled"); w.WriteValue(cond.ScaledKappa1);
                w.WritePropertyName("scaling"); w.WriteValue("kappa1 is of K in SI units (N, m, rad); kappa1Scaled of D^-1/2 K D^-1/2 with D = diag K, free of units");
                w.WritePropertyName("warningThreshold"); w.WriteValue(cond.Threshold);
                w.WritePropertyName("illConditioned"); w.WriteValue(cond.IllConditioned);
                w.WritePropertyName("likelyCause"); w.WriteValue(cond.LikelyCause);
                w.WriteEndObject();
            }
            w.WritePropertyName("notes");
            w.WriteStartArray(); foreach (var n in r.Notes) w.WriteValue(n); w.WriteEndArray();
            w.WritePropertyName("warnings");   // plausibility of the input (Model/Plausibility.cs); they do not change any number
            w.WriteStartArray();
            foreach (var x in r.Model.Warnings)
            {
                w.WriteStartObject();
                w.WritePropertyName("line"); w.WriteValue(x.Line); w.WritePropertyName("column"); w.WriteValue(x.Column);
                w.WritePropertyName("path"); w.WriteValue(x.JsonPath); w.WritePropertyName("problem"); w.WriteValue(x.Problem); w.WritePropertyName("fix"); w.WriteValue(x.Fix);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WritePropertyName("signConvention"); w.WriteValue("Global X right, Y up, rotations counter-clockwise. Member end forces act on the member's flexible segment at its end faces, in local axes (x from start to end node, y 90° counter-clockwise): N, V positive along local x, y; M counter-clockwise. Axial force, tension positive, is N2.");

            w.WritePropertyName("stiffness");
            w.WriteStartArray();
            foreach (var s in r.Stiffness)
            {
                w.WriteStartObject();
                w.WritePropertyName("label"); w.WriteValue(s.Point.Label);
                w.WritePropertyName("node"); w.WriteValue(r.Model.Nodes[s.Point.Node].Id);
                w.WritePropertyName("direction"); w.WriteValue(DofNames.Name(s.Point.Direction)[1..]);
                w.WritePropertyName("stiffness"); w.WriteValue(u.FromSI(s.Stiffness, Quantity.TranslationalStiffness));
                w.WritePropertyName("definition"); w.WriteValue("force per unit displacement at this node and direction when a single force acts there and every other load is absent");
                w.WriteEndObject();
            }
            w.WriteEndArray();

            w.WritePropertyName("cases");
            w.WriteStartArray();
            foreach (var c in r.Cases)
            {
                w.WriteStartObject();
                w.WritePropertyName("id"); w.WriteValue(c.Id);
                w.WritePropertyName("kind"); w.WriteValue(c.IsCombination ? "combination" : "load case");
                w.WritePropertyName("description"); w.WriteValue(c.Description);
                w.WritePropertyName("checks");
                w.WriteStartObject();
                w.WritePropertyName("relativeResidual"); w.WriteValue(c.RelativeResidual);
                w.WritePropertyName("backwardError"); w.WriteValue(c.BackwardError);
                w.WritePropertyName("relativeForceImbalance"); w.WriteValue(c.Equilibrium.RelativeForceError);
                w.WritePropertyName("relativeMomentImbalance"); w.WriteValue(c.Equilibrium.RelativeMomentError);
                w.WritePropertyName("appliedFx"); w.WriteValue(u.FromSI(c.Equilibrium.AppliedFx, Quantity.Force));
                w.WritePropertyName("appliedFy"); w.WriteValue(u.FromSI(c.Equilibrium.AppliedFy, Quantity.Force));
                w.WritePropertyName("reactionFx"); w.WriteValue(u.FromSI(c.Equilibrium.ReactionFx, Quantity.Force));
                w.WritePropertyName("reactionFy"); w.WriteValue(u.FromSI(c.Equilibrium.ReactionFy, Quantity.Force));
                w.WriteEndObject();
                w.WritePropertyName("displacements");
                w.WriteStartArray();
                foreach (var n in r.Model.Nodes)
                {
                    w.WriteStartObject();
                    w.WritePropertyName("node"); w.WriteValue(n.Id);
                    w.WritePropertyName("ux"); w.WriteValue(u.FromSI(c.Displacement(n.Index, Dof.X), Quantity.Length));
                    w.WritePropertyName("uy"); w.WriteValue(u.FromSI(c.Displacement(n.Index, Dof.Y), Quantity.Length));
                    w.WritePropertyName("rz"); w.WriteValue(c.Displacement(n.Index, Dof.RZ));
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WritePropertyName("reactions");
                w.WriteStartArray();
                foreach (var re in c.Reactions)
                {
                    w.WriteStartObject();
                    w.WritePropertyName("node"); w.WriteValue(r.Model.Nodes[re.Node].Id);
                    w.WritePropertyName("Fx"); w.WriteValue(u.FromSI(re.Fx, Quantity.Force));
                    w.WritePropertyName("Fy"); w.WriteValue(u.FromSI(re.Fy, Quantity.Force));
                    w.WritePropertyName("Mz"); w.WriteValue(u.FromSI(re.Mz, Quantity.Moment));
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                if (r.Panels.Count > 0)
                {
                    // Each wall panel's held base: the resultant of its base reactions, Mz about the middle of its base.
                    w.WritePropertyName("panelBaseReactions");
                    w.WriteStartArray();
                    foreach (var (p, _, fx, fy, mz) in PanelBases(r, r.Cases.ToList().IndexOf(c)))
                    {
                        w.WriteStartObject();
                        w.WritePropertyName("panel"); w.WriteValue(p.Id);
                        w.WritePropertyName("Fx"); w.WriteValue(u.FromSI(fx, Quantity.Force));
                        w.WritePropertyName("Fy"); w.WriteValue(u.FromSI(fy, Quantity.Force));
                        w.WritePropertyName("Mz"); w.WriteValue(u.FromSI(mz, Quantity.Moment));
                        w.WritePropertyName("momentAboutX"); w.WriteValue(u.FromSI(p.X0 + 0.5 * p.Length, Quantity.Length));
                        w.WritePropertyName("momentAboutY"); w.WriteValue(u.FromSI(p.Y0, Quantity.Length));
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                }
                w.WritePropertyName("memberForces");
                w.WriteStartArray();
                foreach (var m in c.MemberForces)
                {
                    w.WriteStartObject();
                    w.WritePropertyName("member"); w.WriteValue(r.Model.Members[m.Member].Id);
                    foreach (var (name, v, q) in new[] { ("N1", m.N1, Quantity.Force), ("V1", m.V1, Quantity.Force), ("M1", m.M1, Quantity.Moment), ("N2", m.N2, Quantity.Force), ("V2", m.V2, Quantity.Force), ("M2", m.M2, Quantity.Moment) })
                    {
                        w.WritePropertyName(name); w.WriteValue(u.FromSI(v, q));
                    }
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }

    public static string StoriesJson(AnalysisResult r, BuildingResult br)
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
                        P("line", l.Line.Length == 0 ? "(no line)" : l.Line); P("shear", u.FromSI(l.Shear, Quantity.Force)); P("share", l.Share);
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

    public static string SeismicJson(AnalysisResult r, SeismicResult sr)
    {
        var m = r.Model;
        var s = m.Seismic!;
        var u = m.Units;
        var fo = sr.Forces;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fc(double v) => u.FromSI(v, Quantity.Force);
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2 })
        {
            void P(string name, object? v) { w.WritePropertyName(name); if (v is double d && !double.IsFinite(d)) w.WriteNull(); else w.WriteValue(v); }
            w.WriteStartObject();
            P("producedBy", $"PlaneLateral {ResultFiles.Version}");
            P("caution", ResultFiles.Caution);
            P("source", SeismicFiles.Source);
            P("units", $"length {u.LengthSymbol}, force {u.ForceSymbol}, period s");
            P("loadCase", s.CaseId);
            w.WritePropertyName("modes");
            w.WriteStartArray();
            foreach (var md in fo.Modes)
            {
                w.WriteStartObject();
                P("mode", md.Number); P("period", md.Period); P("omega", md.Omega); P("massShare", md.MassShare);
                w.WritePropertyName("levelShape"); w.WriteStartArray(); foreach (var v in md.LevelShape) w.WriteValue(v); w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            P("rayleighPeriod", fo.RayleighPeriod);
            P("approximatePeriod", fo.Ta); P("Ct", fo.Ct); P("x", fo.X); P("structureRow", fo.TypeRow); P("hnFeet", fo.HeightFeet);
            P("Cu", fo.Cu); P("periodUsed", fo.PeriodUsed); P("periodNote", fo.PeriodNote);
            P("Cs", fo.Cs); P("CsGovernedBy", fo.CsNote); P("totalWeight", Fc(fo.TotalWeight)); P("baseShear", Fc(fo.BaseShear)); P("k", fo.Exponent);
            w.WritePropertyName("storyForces");
            w.WriteStartArray();
            for (int i = 1; i < m.Building.Levels.Count; i++)
            {
                w.WriteStartObject();
                P("level", m.Building.Levels[i].Id); P("Cvx", fo.Cvx[i]); P("Fx", Fc(fo.LevelForces[i])); P("storyShearBelow", Fc(sr.Stories.Stories[i - 1].Shear));
                w.WriteEndObject();
            }
            w.WriteEndArray();
            if (s.SecondOrder is { } so)
            {
                P("gravity", so.GravityCase); P("Cd", so.Cd); P("Ie", so.Ie); P("beta", so.Beta);
                P("gravityFactorToBuckling", sr.CriticalLoadFactor);
                w.WritePropertyName("stability");
                w.WriteStartArray();
                foreach (var x in sr.Stability)
                {
                    w.WriteStartObject();
                    P("story", x.Story.Index); P("Px", Fc(x.Px)); P("Vx", Fc(x.Vx)); P("firstOrderDrift", L(x.ElasticDrift)); P("designDrift", L(x.DesignDrift));
                    P("theta", x.Theta); P("thetaMax", x.ThetaMax); P("status", x.Status); P("secondOrderDrift", L(x.SecondOrderDrift));
                    P("secondOverFirst", x.Ratio); P("oneOverOneMinusTheta", x.Estimate);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WritePropertyName("secondOrderDriftChecks");
                w.WriteStartArray();
                foreach (var d in sr.SecondOrderDriftChecks)
                {
                    w.WriteStartObject();
                    P("check", d.Check.Id); P("story", d.Story.Index); P("drift", L(d.ElasticDrift)); P("amplifiedDrift", L(d.AmplifiedDrift));
                    P("ratio", d.Ratio); P("allowedRatio", d.Allowed); P("result", d.Passes ? "within" : "exceeds"); P("margin", d.Margin);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }

    public static string PanelsJson(AnalysisResult r)
    {
        var u = r.Model.Units;
        double Len(double v) => u.FromSI(v, Quantity.Length);
        double Stiff(double v) => u.FromSI(v, Quantity.TranslationalStiffness);
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2, FloatFormatHandling = FloatFormatHandling.String })
        {
            // A number that could not be determined (e.g. no observed order from a non-monotone mesh sequence) is written
            // as null, never as "NaN"; the note beside it says why.
            void P(string name, object? v) { w.WritePropertyName(name); w.WriteValue(v is double d && !double.IsFinite(d) ? null : v); }
            w.WriteStartObject();
            P("producedBy", $"PlaneLateral {ResultFiles.Version}");
            P("caution", ResultFiles.Caution);
            P("method", "Plane-stress continuum (see docs/panels.md): base held in x and y (a panel on a footing: its base nodes follow the rigid footing on its springs, docs/footings.md); with floor ties every node of a level shares one horizontal displacement (exact constraint). Top stiffness = 1 / top displacement under a unit horizontal force through the top tie (without ties: spread along the top edge, mean top displacement).");
            w.WritePropertyName("units");
            w.WriteStartObject();
            P("length", u.LengthSymbol); P("force", u.ForceSymbol); P("stress", u.Label(Quantity.Stress)); P("stiffness", u.Label(Quantity.TranslationalStiffness));
            w.WriteEndObject();
            w.WritePropertyName("panels");
            w.WriteStartArray();
            foreach (var p in r.Panels)
            {
                w.WriteStartObject();
                P("id", p.Panel.Id);
                P("element", p.Mesh.Mesh.Element.Name);
                w.WritePropertyName("mesh");
                w.WriteStartObject();
                P("elements", p.Mesh.Mesh.Elements.Length); P("nodes", p.Mesh.Mesh.NodeCount); P("unknowns", p.Analysis.Solve.Unknowns);
                P("elementSize", Len(p.Mesh.ElementSize)); P("narrowestStrip", Len(p.Mesh.NarrowestStrip)); P("largestAspect", p.Mesh.LargestAspect);
                P("solver", MachineFree.Solver(p.Analysis.Solve.Solver));
                w.WriteEndObject();
                P("floorTies", p.Panel.FloorTies);
                if (p.Panel.Top == Model.PanelTop.Guided) P("top", "guided: the top edge translates without rotating (fixed-guided stiffness)");
                var (kRep, kErr) = p.ReportedStiffness;
                P("topStiffness", Stiff(kRep));
                P("topStiffnessEstimatedError", kErr);
                P("topStiffnessOn", p.Convergence is null ? "the panel's one mesh (no error estimate)"
                    : double.IsFinite(kErr) ? "Richardson extrapolation over the convergence meshes (estimated relative error beside it)"
                    : "the finest convergence mesh, not extrapolated (no error estimate)");
                P("topStiffnessBaseMesh", Stiff(p.TopStiffness));
                if (p.Convergence is not null)
                    P("nodalResults", "the nodal displacements and stresses in panel-stresses.csv and the checks in panel-checks.csv are on the base (coarsest) mesh of the study and carry no error estimate; the level displacements here are extrapolated like the stiffness, each with its own estimated relative error");
                if (p.Convergence is { } cv)
                {
                    w.WritePropertyName("convergence");
                    w.WriteStartObject();
                    w.WritePropertyName("meshes");
                    w.WriteStartArray();
                    for (int i = 0; i < cv.Stiffness.Length; i++)
                    {
                        w.WriteStartObject();
                        P("elementSize", Len(cv.ElementSizes[i])); P("unknowns", cv.Unknowns[i]); P("topStiffness", Stiff(cv.Stiffness[i]));
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    P("observedOrder", cv.ObservedOrder);
                    P("extrapolatedStiffness", Stiff(cv.Extrapolated));
                    P("estimatedRelativeError", cv.EstimatedError);
                    P("note", cv.Note);
                    w.WriteEndObject();
                }
                w.WritePropertyName("cases");
                w.WriteStartArray();
                for (int c = 0; c < p.Analysis.Cases.Count; c++)
                {
                    var cr = p.Analysis.Cases[c];
                    w.WriteStartObject();
                    P("id", cr.Id);
                    P("topDisplacement", Len(p.TopDisplacement(c)));
                    if (p.LevelDisplacementErrors is { } te) P("topDisplacementEstimatedError", te[c][^1]);
                    w.WritePropertyName("levels");
                    w.WriteStartArray();
                    for (int l = 0; l < p.Mesh.Levels.Length; l++)
                    {
                        w.WriteStartObject();
                        P("height", Len(p.Mesh.Levels[l])); P("ux", Len(p.LevelDisplacements[c][l]));
                        if (p.LevelDisplacementErrors is { } le) P("uxEstimatedError", le[c][l]);
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    P("backwardError", cr.BackwardError);
                    P("relativeForceImbalance", cr.Equilibrium.RelativeForceError);
                    P("relativeMomentImbalance", cr.Equilibrium.RelativeMomentError);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }

    public static string SpectrumJson(AnalysisResult r, PlanarSpectrumResult s)
    {
        var u = r.Model.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        static Newtonsoft.Json.Linq.JToken Num(double v) => double.IsFinite(v) ? new Newtonsoft.Json.Linq.JValue(v) : Newtonsoft.Json.Linq.JValue.CreateNull();
        var json = new Newtonsoft.Json.Linq.JObject
        {
            ["program"] = $"PlaneLateral {ResultFiles.Version}",
            ["caution"] = ResultFiles.Caution,
            ["source"] = PlanSeismicFiles.Source,
            ["spectrum"] = s.Spectrum.Describe(), ["combination"] = s.Settings.Rule.ToString().ToUpperInvariant(), ["damping"] = s.Settings.Damping,
            ["R"] = s.R, ["Ie"] = s.Ie, ["Cd"] = s.Settings.Cd, ["modes"] = s.ModesUsed, ["massShare"] = s.CumulativeShare,
            ["Vt"] = Fo(s.Scaling.BaseShearModal), ["V"] = Fo(s.Scaling.BaseShearElf), ["forceFactor"] = s.Scaling.ForceFactor, ["driftFactor"] = s.Scaling.DriftFactor,
            ["scaling"] = s.Scaling.Why,
            ["stories"] = new Newtonsoft.Json.Linq.JArray(s.Stories.Select(st => new Newtonsoft.Json.Linq.JObject
            {
                ["story"] = st.Story, ["elfShear"] = Fo(st.ElfShear), ["modalShear"] = Fo(st.ModalShear), ["scaledShear"] = Fo(st.ScaledShear),
                ["drift"] = L(st.Drift), ["designDrift"] = L(st.DesignDrift), ["ratio"] = st.Ratio,
                ["overturning"] = Mo(st.Overturning), ["Px"] = Fo(st.Px), ["theta"] = Num(st.Theta), ["thetaElf"] = Num(st.ThetaElf), ["thetaMax"] = Num(st.ThetaMax),
            })),
            ["PxFrom"] = s.PxSource,
            ["combinedValues"] = SpectrumFiles.CombinedNote,
        };
        return json.ToString(Formatting.Indented) + "\n";
    }

    public static string ComparisonsJson(PlaneLateral.Studies.ComparisonReport r, string producedBy)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        using (var w = new JsonTextWriter(sw) { Formatting = Formatting.Indented, Indentation = 2, FloatFormatHandling = FloatFormatHandling.String })
        {
            w.WriteStartObject();
            w.WritePropertyName("producedBy"); w.WriteValue(producedBy);
            w.WritePropertyName("caution"); w.WriteValue(PlaneLateral.Studies.ComparisonReport.Caution);
            w.WritePropertyName("model");
            w.WriteStartObject();
            w.WritePropertyName("title"); w.WriteValue(r.ModelTitle);
            w.WritePropertyName("file"); w.WriteValue(r.ModelFile);
            w.WriteEndObject();
            w.WritePropertyName("units");
            w.WriteStartObject();
            w.WritePropertyName("force"); w.WriteValue(r.ForceUnit);
            w.WritePropertyName("length"); w.WriteValue(r.LengthUnit);
            w.WriteEndObject();
            w.WritePropertyName("defaultTolerance"); w.WriteValue(r.DefaultTolerance);
            w.WritePropertyName("verdicts"); w.WriteValue("ratio = FE/hand for the row's reference FE estimate (named in \"reference\", the first in \"fe\", with the reason in \"referenceBasis\": a converged plane-stress panel where the row has one, else the first line model); within tolerance when |ratio − 1| ≤ tolerance; below: the hand value is higher (hand stiffer), above: lower (hand softer)");
            w.WritePropertyName("rows");
            w.WriteStartArray();
            foreach (var row in r.Rows)
            {
                w.WriteStartObject();
                w.WritePropertyName("check"); w.WriteValue(row.CheckId);
                w.WritePropertyName("kind"); w.WriteValue(row.Kind);
                w.WritePropertyName("subject"); w.WriteValue(row.Subject);
                w.WritePropertyName("quantity"); w.WriteValue(ComparedQuantityWords(row.Quantity));
                w.WritePropertyName("unit"); w.WriteValue(row.Unit);
                w.WritePropertyName("hand");
                w.WriteStartObject();
                w.WritePropertyName("value"); w.WriteValue(row.Hand.Value);
                w.WritePropertyName("method"); w.WriteValue(row.Hand.Method.Name);
                w.WritePropertyName("source"); w.WriteValue(row.Hand.Method.Source);
                w.WritePropertyName("assumptions");
                w.WriteStartArray(); foreach (var a in row.Hand.Method.Assumptions) w.WriteValue(a); w.WriteEndArray();
                if (row.Hand.FlexuralShare is double hf) { w.WritePropertyName("flexuralShare"); w.WriteValue(hf); }
                if (row.Hand.ShearShare is double hs) { w.WritePropertyName("shearShare"); w.WriteValue(hs); }
                if (row.Hand.Detail.Length > 0)
                {
                    w.WritePropertyName("detail");
                    w.WriteStartArray(); foreach (var line in row.Hand.Detail.Split('\n')) w.WriteValue(line); w.WriteEndArray();
                }
                w.WriteEndObject();
                w.WritePropertyName("fe");
                w.WriteStartArray();
                foreach (var fe in row.Fe)
                {
                    w.WriteStartObject();
                    w.WritePropertyName("model"); w.WriteValue(fe.Model);
                    w.WritePropertyName("value"); w.WriteValue(fe.Value);
                    w.WritePropertyName("reference"); w.WriteValue(ReferenceEquals(fe, row.Reference));
                    w.WritePropertyName("ratioToHand"); w.WriteValue(fe.Value / row.Hand.Value);
                    if (fe.EstimatedError is double ee) { w.WritePropertyName("estimatedError"); w.WriteValue(ee); }
                    w.WritePropertyName("description"); w.WriteValue(fe.Description);
                    if (fe.FlexuralShare is double ff) { w.WritePropertyName("flexuralShare"); w.WriteValue(ff); }
                    if (fe.ShearShare is double fs) { w.WritePropertyName("shearShare"); w.WriteValue(fs); }
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WritePropertyName("reference"); w.WriteValue(row.Reference.Model);
                w.WritePropertyName("referenceBasis"); w.WriteValue(row.ReferenceBasis);
                w.WritePropertyName("ratio"); w.WriteValue(row.Ratio);
                if (row.AspectRatio is double ar) { w.WritePropertyName("aspectRatio"); w.WriteValue(ar); }
                w.WritePropertyName("tolerance"); w.WriteValue(row.Tolerance);
                w.WritePropertyName("verdict"); w.WriteValue(row.VerdictText);
                w.WritePropertyName("cause"); w.WriteValue(row.Cause);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return sw.ToString() + "\n";
    }

    private static string ComparedQuantityWords(PlaneLateral.Studies.ComparedQuantity q) => q switch
    {
        PlaneLateral.Studies.ComparedQuantity.Stiffness => "lateral stiffness", PlaneLateral.Studies.ComparedQuantity.Fraction => "fraction",
        PlaneLateral.Studies.ComparedQuantity.Force => "force", _ => "story shear",
    };

    public static string PlanJson(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        var u = r.Plan.Units;
        double? L(double v) => double.IsFinite(v) ? u.FromSI(v, Quantity.Length) : null;   // null where undefined, never "NaN"
        double? Fo(double v) => double.IsFinite(v) ? u.FromSI(v, Quantity.Force) : null;
        var root = new Newtonsoft.Json.Linq.JObject
        {
            ["program"] = $"PlaneLateral {ResultFiles.Version}",
            ["caution"] = ResultFiles.Caution,
            ["title"] = r.Plan.Title,
            ["units"] = new Newtonsoft.Json.Linq.JObject { ["force"] = u.ForceSymbol, ["length"] = u.LengthSymbol },
            ["method"] = "each line condensed exactly on its level lateral DOFs (one factorisation per line), mapped to the floors' (Ux, Uy, Rz) and assembled; lines recovered under the level forces",
            ["accidentalEccentricity"] = r.Plan.EccentricityRatio,
            // Plausibility of the input (Model/Plausibility.Plan.cs); they do not change any number.
            ["warnings"] = new Newtonsoft.Json.Linq.JArray(r.Plan.Warnings.Select(x => new Newtonsoft.Json.Linq.JObject
            {
                ["file"] = Path.GetFileName(x.File), ["line"] = x.Line, ["column"] = x.Column, ["path"] = x.JsonPath, ["problem"] = x.Problem, ["fix"] = x.Fix,
            })),
            ["levels"] = new Newtonsoft.Json.Linq.JArray(r.Plan.Levels.Select(l => new Newtonsoft.Json.Linq.JObject
            {
                ["id"] = l.Id, ["elevation"] = L(l.Elevation), ["weight"] = double.IsFinite(l.Weight) ? Fo(l.Weight) : null,
                ["massAt"] = new Newtonsoft.Json.Linq.JArray((Newtonsoft.Json.Linq.JToken)L(l.CentreOfMass.X), (Newtonsoft.Json.Linq.JToken)L(l.CentreOfMass.Y)),
            })),
            ["lines"] = new Newtonsoft.Json.Linq.JArray(r.Lines.Select(l => new Newtonsoft.Json.Linq.JObject
            {
                ["id"] = l.Line.Id, ["form"] = l.Line.Form.ToString(), ["at"] = new Newtonsoft.Json.Linq.JArray((Newtonsoft.Json.Linq.JToken)L(l.Line.X0), (Newtonsoft.Json.Linq.JToken)L(l.Line.Y0)),
                ["direction"] = l.Line.DirectionLabel, ["condensationBackwardError"] = l.CondensationBackwardError,
                ["flexibilitySymmetryError"] = l.SymmetryError, ["recoveryError"] = l.RecoveryError,
            })),
            ["cases"] = new Newtonsoft.Json.Linq.JArray(r.Cases.Select(c => new Newtonsoft.Json.Linq.JObject
            {
                ["id"] = c.Case.Id, ["description"] = c.Case.Description, ["backwardError"] = c.BackwardError,
                ["equilibriumError"] = c.Equilibrium.RelativeError,
                ["floors"] = new Newtonsoft.Json.Linq.JArray(c.Motion.Select(m => new Newtonsoft.Json.Linq.JObject { ["level"] = r.Plan.Levels[m.Level].Id, ["Ux"] = L(m.Ux), ["Uy"] = L(m.Uy), ["Rz"] = m.Rz })),
                ["lineStories"] = new Newtonsoft.Json.Linq.JArray(c.LineStories.Select(s => new Newtonsoft.Json.Linq.JObject
                {
                    ["story"] = s.Story, ["line"] = s.Line, ["shear"] = Fo(s.Shear), ["share"] = double.IsFinite(s.Share) ? s.Share : null,
                    ["direct"] = Fo(s.Direct), ["torsional"] = Fo(s.Torsional),
                })),
            })),
            ["rigidity"] = new Newtonsoft.Json.Linq.JArray(r.Rigidity.Select(g => new Newtonsoft.Json.Linq.JObject { ["loading"] = g.Direction, ["story"] = g.Story, ["xR"] = L(g.XR), ["yR"] = L(g.YR) })),
            ["torsionalIrregularity"] = new Newtonsoft.Json.Linq.JArray(r.Irregularity.Select(t => new Newtonsoft.Json.Linq.JObject
            {
                ["loading"] = t.Direction, ["story"] = t.Story, ["case"] = t.Case, ["ratio"] = double.IsFinite(t.Ratio) ? t.Ratio : null, ["type"] = t.Type,
                ["Ax"] = double.IsFinite(t.Ax) ? t.Ax : null, ["withAccidentalTorsion"] = t.WithAccidental,
            })),
        };
        if (PlanFloorsJson(r, tributary) is { } floors) root["floors"] = floors;
        if (r.Plan.Points.Count > 0)   // the user's named points: per case and level, displacement and drift
            root["points"] = new Newtonsoft.Json.Linq.JArray(r.Plan.Points.Select(q => new Newtonsoft.Json.Linq.JObject
            {
                ["id"] = q.Id, ["at"] = new Newtonsoft.Json.Linq.JArray((Newtonsoft.Json.Linq.JToken)L(q.At.X), (Newtonsoft.Json.Linq.JToken)L(q.At.Y)),
                ["cases"] = new Newtonsoft.Json.Linq.JArray(r.Cases.Select(c => new Newtonsoft.Json.Linq.JObject
                {
                    ["case"] = c.Case.Id,
                    ["levels"] = new Newtonsoft.Json.Linq.JArray(c.Points.Where(m => m.Point == q.Id).Select(m => new Newtonsoft.Json.Linq.JObject
                    {
                        ["level"] = r.Plan.Levels[m.Level].Id, ["ux"] = L(m.Ux), ["uy"] = L(m.Uy), ["driftX"] = L(m.DriftX), ["driftY"] = L(m.DriftY),
                    })),
                })),
            }));
        return root.ToString(Formatting.Indented) + "\n";
    }

    public static string PlanSeismicJson(PlanResult r, PlanSeismicResult s)
    {
        var u = r.Plan.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        var root = new Newtonsoft.Json.Linq.JObject
        {
            ["program"] = $"PlaneLateral {ResultFiles.Version}",
            ["caution"] = ResultFiles.Caution,
            ["source"] = PlanSeismicFiles.Source,
            ["units"] = new Newtonsoft.Json.Linq.JObject { ["force"] = u.ForceSymbol, ["length"] = u.LengthSymbol },
            ["modes"] = new Newtonsoft.Json.Linq.JArray(s.Modal.Modes.Select(m => new Newtonsoft.Json.Linq.JObject
            {
                ["mode"] = m.Number, ["period"] = m.Period, ["dominant"] = m.Dominant,
                ["share"] = new Newtonsoft.Json.Linq.JArray(m.Share), ["cumulative"] = new Newtonsoft.Json.Linq.JArray(m.Cumulative), ["gamma"] = new Newtonsoft.Json.Linq.JArray(m.Participation[0], m.Participation[1]),
            })),
            ["rotationPivot"] = new Newtonsoft.Json.Linq.JArray(L(s.Modal.Pivot.X), L(s.Modal.Pivot.Y)),
            ["equivalentLateralForces"] = new Newtonsoft.Json.Linq.JArray(s.Elf.Select(e => new Newtonsoft.Json.Linq.JObject
            {
                ["direction"] = e.Direction, ["mode"] = e.Mode, ["modalPeriod"] = e.ModalPeriod, ["Ta"] = e.Ta, ["Cu"] = e.Cu, ["periodUsed"] = e.PeriodUsed,
                ["periodNote"] = e.PeriodNote, ["Cs"] = e.Cs, ["CsGovernedBy"] = e.CsNote, ["W"] = Fo(e.Weight), ["V"] = Fo(e.BaseShear), ["k"] = e.Exponent,
                ["forces"] = new Newtonsoft.Json.Linq.JArray(e.LevelForces.Select(Fo)), ["cases"] = new Newtonsoft.Json.Linq.JArray(e.Cases),
            })),
            ["amplification"] = new Newtonsoft.Json.Linq.JArray(s.Amplification.Select(a => new Newtonsoft.Json.Linq.JObject { ["direction"] = a.Direction, ["level"] = r.Plan.Levels[a.Level].Id, ["Ax"] = a.Ax, ["applied"] = a.Applied })),
        };
        if (s.Spectrum is { } sp)
            root["responseSpectrum"] = new Newtonsoft.Json.Linq.JObject
            {
                ["spectrum"] = sp.Spectrum.Describe(), ["combination"] = sp.Settings.Rule.ToString().ToUpperInvariant(), ["damping"] = sp.Settings.Damping,
                ["R"] = sp.R, ["Ie"] = sp.Ie, ["Cd"] = sp.Settings.Cd,
                ["accidentalTorsion"] = sp.TorsionMethod, ["combinedValues"] = SpectrumFiles.CombinedNote,
                ["directions"] = new Newtonsoft.Json.Linq.JArray(sp.Directions.Select(d => new Newtonsoft.Json.Linq.JObject
                {
                    ["direction"] = d.Direction, ["modes"] = d.ModesUsed, ["massShare"] = d.CumulativeShare,
                    ["Vt"] = Fo(d.Scaling.BaseShearModal), ["V"] = Fo(d.Scaling.BaseShearElf), ["forceFactor"] = d.Scaling.ForceFactor, ["driftFactor"] = d.Scaling.DriftFactor,
                    ["scaling"] = d.Scaling.Why, ["modalEquilibriumError"] = d.EquilibriumError,
                    ["analyses"] = new Newtonsoft.Json.Linq.JArray(d.Variants.Select(v => new Newtonsoft.Json.Linq.JObject
                    {
                        ["label"] = v.Label, ["massShift"] = L(v.Shift), ["modes"] = v.ModesUsed, ["Vt"] = Fo(v.Scaling.BaseShearModal), ["forceFactor"] = v.Scaling.ForceFactor,
                        ["driftFactor"] = v.Scaling.DriftFactor, ["floorRotation"] = new Newtonsoft.Json.Linq.JArray(v.FloorRotation),
                    })),
                    ["stories"] = new Newtonsoft.Json.Linq.JArray(d.Stories.Select(st => new Newtonsoft.Json.Linq.JObject
                    {
                        ["story"] = st.Story, ["elfShear"] = Fo(st.ElfShear), ["modalShear"] = Fo(st.ModalShear), ["scaledShear"] = Fo(st.ScaledShear),
                        ["corner"] = st.Corner + 1, ["drift"] = L(st.Drift), ["designDrift"] = L(st.DesignDrift), ["ratio"] = st.Ratio,
                        ["allowedRatio"] = r.Plan.DriftLimit is { } lim ? lim.AllowedRatio : null,
                        ["within"] = r.Plan.DriftLimit is { } lim2 ? st.Ratio <= lim2.AllowedRatio : null,
                        ["Px"] = Fo(st.Px), ["theta"] = st.Theta, ["thetaElf"] = st.ThetaElf, ["thetaMax"] = st.ThetaMax,
                    })),
                })),
            };
        return root.ToString(Formatting.Indented) + "\n";
    }

    public static Newtonsoft.Json.Linq.JObject? PlanFloorsJson(PlanResult r, IReadOnlyList<TributaryShear>? tributary = null)
    {
        if (r.Diaphragms is not { } d) return null;
        var hand = (tributary ?? []).GroupBy(t => (t.Case, t.Story, t.Line)).ToDictionary(g => g.Key, g => g.First());
        var u = r.Plan.Units;
        double L(double v) => u.FromSI(v, Quantity.Length);
        Newtonsoft.Json.Linq.JToken N(double v) => double.IsFinite(v) ? v : Newtonsoft.Json.Linq.JValue.CreateNull();
        return new Newtonsoft.Json.Linq.JObject
        {
            ["caution"] = DiaphragmStudy.Caution,
            ["kinds"] = new Newtonsoft.Json.Linq.JArray(d.Kinds.Select((k, i) => new Newtonsoft.Json.Linq.JObject { ["level"] = r.Plan.Levels[i + 1].Id, ["kind"] = PlanFloor.Word(k) })),
            ["idealisations"] = new Newtonsoft.Json.Linq.JArray(d.Variants),
            ["notes"] = new Newtonsoft.Json.Linq.JArray(d.Notes),
            ["flexibility"] = new Newtonsoft.Json.Linq.JArray(d.Flexibility.Select(t => new Newtonsoft.Json.Linq.JObject
            {
                ["level"] = r.Plan.Levels[t.Level].Id, ["loading"] = t.Direction, ["case"] = t.Case, ["from"] = t.From, ["to"] = t.To,
                ["span"] = new Newtonsoft.Json.Linq.JArray(L(t.SpanFrom), L(t.SpanTo)), ["MDD"] = L(t.Mdd), ["ADVE"] = L(t.Adve), ["ratio"] = N(t.Ratio), ["flexible"] = t.Flexible,
            })),
            ["envelope"] = new Newtonsoft.Json.Linq.JArray(d.Envelope.Select(e =>
            {
                var o = new Newtonsoft.Json.Linq.JObject
                {
                    ["case"] = e.Case, ["story"] = e.Story, ["line"] = e.Line, ["rigid"] = N(u.FromSI(e.Rigid, Quantity.Force)),
                    ["semiRigid"] = N(u.FromSI(e.SemiRigid, Quantity.Force)), ["flexible"] = N(u.FromSI(e.Flexible, Quantity.Force)),
                    ["envelope"] = N(u.FromSI(e.Envelope, Quantity.Force)), ["governing"] = e.Governing,
                };
                if (hand.TryGetValue((e.Case, e.Story, e.Line), out var h))
                {
                    o["handTributary"] = N(u.FromSI(h.Hand, Quantity.Force));
                    o["flexibleOverHandMinusOne"] = N(h.Gap);
                    o["gapCause"] = h.Cause;
                }
                return o;
            })),
        };
    }
}
