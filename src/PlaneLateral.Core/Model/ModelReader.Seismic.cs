using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of the "seismic" block: story weights, period estimate, base shear or spectral values, the generated load
// case and the second-order settings. See docs/seismic.md.
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        private const string SeismicFix = "write \"seismic\": {\"loadCase\": \"EQ\", \"weights\": [{\"level\": \"L1\", \"weight\": ...}], \"structureType\": \"other\", \"baseShear\": ...} (docs/seismic.md)";

        /// <summary>
        /// Called right after the load cases are read: lists the generated story-force case (no loads yet; the analysis
        /// fills them in) so that combinations and drift checks can name it.
        /// </summary>
        private void ReadSeismicCase(JsonFields f, List<LoadCase> cases)
        {
            if (f.OptionalObject("seismic", SeismicFix) is not { } o) return;
            var sf = new JsonFields(o, sink);
            var id = sf.RequiredString("loadCase", "give the id of the load case the story forces are written to, e.g. \"loadCase\": \"EQ\"");
            if (id is null) return;
            if (_cases.ContainsKey(id))
            {
                sink.Add(sf.Token("loadCase"), $"the story-force case \"{id}\" has the id of a load case listed under \"loadCases\"", "give the generated case an id of its own");
                return;
            }
            _cases[id] = cases.Count;
            cases.Add(new LoadCase(id, "story forces from the base shear (generated)", [], []));
        }

        private SeismicData? ReadSeismic(JsonFields f, BuildingData building, List<Node> nodes, List<Support> supports, List<LoadCase> cases, List<Combination> combos)
        {
            if (f.OptionalObject("seismic", SeismicFix) is not { } o) return null;
            var sf = new JsonFields(o, sink);
            var caseToken = sf.Token("loadCase");
            string? caseId = caseToken is JsonScalar { Type: JsonKind.String } cv ? (string)cv! : null;
            var levels = building.Levels;
            if (levels.Count < 2)
                sink.Add(o, "the seismic block needs stories, and the model has fewer than two levels", "add \"levels\" with the base (\"diaphragm\": \"none\") and every floor above it");
            string fu = _units.ForceSymbol;

            // Weights: every level above the lowest, once, ≥ 0, some > 0.
            var weights = new List<LevelWeight>();
            var weightItems = sf.Objects("weights", true, $"give \"weights\": [{{\"level\": \"<level id>\", \"weight\": ...}}] in {fu}, one per level above the base");
            var given = new Dictionary<int, double>();
            foreach (var wo in weightItems)
            {
                var wf = new JsonFields(wo, sink);
                var lid = wf.RequiredString("level", "give the id of a level listed under \"levels\"");
                double w = wf.RequiredNumber("weight", $"give the level's seismic weight in {fu} (≥ 0)");
                wf.RejectUnknownKeys();
                if (lid is null) continue;
                int li = -1;
                for (int i = 0; i < levels.Count; i++) if (levels[i].Id == lid) li = i;
                if (li < 0) { sink.Add(wf.Token("level"), $"unknown level \"{lid}\"", $"use the id of a level listed under \"levels\"{Suggest(lid, levels.Select(l => l.Id))}"); continue; }
                if (li == 0) { sink.Add(wf.Token("level"), $"level \"{lid}\" is the base (the lowest level); its weight takes no part in the story forces", "list the weights of the levels above the base only"); continue; }
                if (given.ContainsKey(li)) { sink.Add(wo, $"level \"{lid}\" has two weights", "give each level one weight"); continue; }
                if (double.IsFinite(w) && w < 0) { sink.Add(wf.Token("weight"), $"the weight of level \"{lid}\" is negative ({Num(w)} {fu})", "give a weight ≥ 0 (the dead load and the part of other loads the governing code counts)"); continue; }
                if (!double.IsFinite(w)) continue;
                if (levels[li].Nodes.All(n => supports.Any(s => s.Node == n && s.RestrainX)))
                    sink.Add(wf.Token("level"), $"level \"{lid}\" cannot move sideways (every node of it is held in x by a support), so its weight has no mass to move", "remove that weight, or free the level's nodes in x");
                given[li] = SI(w, Quantity.Force);
            }
            if (levels.Count >= 2 && weightItems.Count > 0)
            {
                for (int i = 1; i < levels.Count; i++)
                    if (!given.ContainsKey(i) && !weightItems.Any(wo => wo["level"] is JsonScalar { Type: JsonKind.String } v && (string)v! == levels[i].Id))
                        sink.Add(sf.Token("weights"), $"level \"{levels[i].Id}\" (story {i}) has no weight", $"add {{\"level\": \"{levels[i].Id}\", \"weight\": ...}} in {fu} (0 when the level carries none)");
                if (given.Count == levels.Count - 1 && given.Values.Sum() <= 0)
                    sink.Add(sf.Token("weights"), "every story weight is zero, so there is no mass", "give the seismic weight of each level");
            }
            weights.AddRange(given.OrderBy(kv => kv.Key).Select(kv => new LevelWeight(kv.Key, kv.Value)));

            var type = sf.OptionalString("structureType", "give \"structureType\" as a string") ?? "other";
            if (!SeismicPresets.PeriodCoefficients.ContainsKey(type))
                sink.Add(sf.Token("structureType"), $"unknown structure type \"{type}\"", $"use one of: {string.Join(", ", SeismicPresets.PeriodCoefficients.Keys)}{Suggest(type, SeismicPresets.PeriodCoefficients.Keys)}");

            // Base shear, or the spectral values it comes from (exactly one).
            double v = double.NaN;
            SpectralValues? spectrum = null;
            var spectrumObj = sf.OptionalObject("spectrum", "write \"spectrum\": {\"SDS\": ..., \"SD1\": ..., \"R\": ..., \"Ie\": ..., \"TL\": ...}");
            if (sf.Has("baseShear"))
            {
                v = sf.RequiredNumber("baseShear", $"give the base shear V in {fu} (> 0)");
                if (double.IsFinite(v) && v <= 0) sink.Add(sf.Token("baseShear"), $"the base shear must be greater than zero, found {Num(v)} {fu}", $"give V > 0 in {fu}");
                v = SI(v, Quantity.Force);
                if (spectrumObj is not null) sink.Add(o, "both 'baseShear' and 'spectrum' are given", "give the base shear, or the spectral values it is worked out from, not both");
            }
            else if (spectrumObj is null)
                sink.Add(o, "the seismic block has neither 'baseShear' nor 'spectrum'", $"give \"baseShear\" in {fu}, or \"spectrum\": {{\"SDS\": ..., \"SD1\": ..., \"R\": ..., \"Ie\": ..., \"TL\": ...}}");
            if (spectrumObj is not null) spectrum = ReadSpectralValues(spectrumObj);
            var (period, givenPeriod) = ReadPeriodChoice(sf);

            int modes = 3;
            if (sf.Has("modes"))
            {
                double m = sf.RequiredNumber("modes", "give the number of modes to report, a whole number ≥ 1");
                if (double.IsFinite(m) && (m < 1 || m != Math.Floor(m) || m > 100)) sink.Add(sf.Token("modes"), $"'modes' must be a whole number from 1 to 100, found {Num(m)}", "give the number of modes to report");
                else if (double.IsFinite(m)) modes = (int)m;
            }
            if (levels.Count >= 2) modes = Math.Min(modes, levels.Count - 1);

            SecondOrderSettings? second = null;
            if (sf.OptionalObject("secondOrder", "write \"secondOrder\": {\"gravity\": \"<load case or combination>\", \"Cd\": ...}") is { } so)
            {
                var gf = new JsonFields(so, sink);
                var g = gf.RequiredString("gravity", "give the gravity load case or combination whose axial forces stiffen or soften the members");
                if (g is not null && !cases.Any(c => c.Id == g) && !combos.Any(c => c.Id == g))
                    sink.Add(gf.Token("gravity"), $"unknown load case or combination \"{g}\"", $"use the id of a gravity load case or combination{Suggest(g, cases.Select(c => c.Id).Concat(combos.Select(c => c.Id)))}");
                if (g is not null && g == caseId)
                    sink.Add(gf.Token("gravity"), "the gravity case is the generated story-force case", "name the gravity load case or combination (e.g. the dead load)");
                double cd = gf.RequiredNumber("Cd", "give the deflection amplification factor C_d, 1 to 6.5");
                if (double.IsFinite(cd) && (cd < 1 || cd > 6.5)) sink.Add(gf.Token("Cd"), $"'Cd' = {Num(cd)} is out of range", "give C_d from 1 to 6.5 (ASCE 7-16 Table 12.2-1, from memory)");
                double ie = gf.OptionalNumber("Ie", spectrum?.Ie ?? 1.0, "give the importance factor I_e, 1.0 to 1.5");
                if (gf.Has("Ie") && double.IsFinite(ie) && (ie < 1 || ie > 1.5)) sink.Add(gf.Token("Ie"), $"'Ie' = {Num(ie)} is out of range", "give I_e from 1.0 to 1.5");
                double beta = gf.OptionalNumber("beta", 1.0, "give β, the ratio of shear demand to shear capacity, > 0 and ≤ 1");
                if (double.IsFinite(beta) && (beta <= 0 || beta > 1)) sink.Add(gf.Token("beta"), $"'beta' = {Num(beta)} is out of range", "give β > 0 and ≤ 1 (1 when not worked out)");
                gf.RejectUnknownKeys();
                if (g is not null) second = new SecondOrderSettings(g, cd, ie, beta);
            }
            var responseSpectrum = ReadResponseSpectrum(sf, Math.Max(levels.Count - 1, 0));
            if (responseSpectrum is not null && spectrumObj is null)
                sink.Add(sf.Token("responseSpectrum"), "'responseSpectrum' needs 'spectrum' (R, I_e and the ELF base shear it is scaled to come from it)",
                    "give \"spectrum\": {\"SDS\": ..., \"SD1\": ..., \"R\": ..., \"Ie\": ..., \"TL\": ...} instead of \"baseShear\"");
            sf.RejectUnknownKeys();
            if (caseId is null) return null;
            return new SeismicData
            {
                CaseId = caseId,
                Weights = weights,
                StructureType = type,
                BaseShear = v,
                Spectrum = spectrum,
                Period = period,
                GivenPeriod = givenPeriod,
                Modes = modes,
                SecondOrder = second,
                ResponseSpectrum = responseSpectrum,
            };
        }
    }
}
