using PlaneLateral.Units;

namespace PlaneLateral.Model;

// Reading of the spectral values (planar and plan seismic blocks), the "responseSpectrum" block, and the seismic block of
// a building in plan. See docs/seismic.md and docs/plan.md.
public static partial class ModelReader
{
    private sealed partial class Builder
    {
        /// <summary>The "spectrum" object: S_DS, S_D1, R, I_e, T_L and the optional S_1.</summary>
        private SpectralValues ReadSpectralValues(JsonMap spectrumObj)
        {
            var pf = new JsonFields(spectrumObj, sink);
            double InRange(string key, double lo, double hi, bool loOpen, string what, double fallback = double.NaN)
            {
                string fix = $"give {what} {(loOpen ? ">" : "≥")} {Num(lo)} and ≤ {Num(hi)}";
                double x = double.IsNaN(fallback) ? pf.RequiredNumber(key, fix) : pf.OptionalNumber(key, fallback, fix);
                if (double.IsFinite(x) && (x > hi || x < lo || (loOpen && x == lo)))
                    sink.Add(pf.Token(key), $"'{key}' = {Num(x)} is out of range", fix);
                return x;
            }
            double sds = InRange("SDS", 0, 3, true, "S_DS in g");
            double sd1 = InRange("SD1", 0, 2, true, "S_D1 in g");
            double r = InRange("R", 1, 8, false, "the response modification coefficient R (ASCE 7-16 Table 12.2-1 lists 1.25 to 8, from memory)");
            double ie = InRange("Ie", 1, 1.5, false, "the importance factor I_e", 1.0);
            double tl = InRange("TL", 0, 20, true, "the long-period transition period T_L in s");
            double s1 = pf.Has("S1") ? InRange("S1", 0, 3, false, "the mapped S_1 in g") : double.NaN;
            pf.RejectUnknownKeys();
            return new SpectralValues(sds, sd1, r, ie, tl, s1);
        }

        /// <summary>The "period" key of a seismic block.</summary>
        private (PeriodUse Use, double Given) ReadPeriodChoice(JsonFields sf)
        {
            var period = PeriodUse.Capped;
            double givenPeriod = double.NaN;
            const string periodFix = "give \"period\": \"capped\" (the eigen period, not above Cu·Ta; the default), \"computed\", \"approximate\", or a period in s";
            if (sf.Token("period") is { } pt)
            {
                if (pt.Type is JsonKind.Integer or JsonKind.Float)
                {
                    period = PeriodUse.Given;
                    givenPeriod = sf.RequiredNumber("period", periodFix);
                    if (double.IsFinite(givenPeriod) && (givenPeriod <= 0 || givenPeriod > 20)) sink.Add(pt, $"the period {Num(givenPeriod)} s is out of range", "give a period > 0 and ≤ 20 s");
                }
                else
                {
                    var ps = sf.OptionalString("period", periodFix);
                    period = ps switch { "capped" => PeriodUse.Capped, "computed" => PeriodUse.Computed, "approximate" => PeriodUse.Approximate, _ => (PeriodUse)(-1) };
                    if ((int)period < 0) { if (ps is not null) sink.Add(pt, $"unknown period choice \"{ps}\"", periodFix); period = PeriodUse.Capped; }
                }
            }
            return (period, givenPeriod);
        }

        /// <summary>The "responseSpectrum" block; <paramref name="availableModes"/> is how many modes the model has.</summary>
        private ResponseSpectrumSettings? ReadResponseSpectrum(JsonFields sf, int availableModes, bool inPlan = false)
        {
            if (sf.OptionalObject("responseSpectrum", "write \"responseSpectrum\": {\"Cd\": ..., \"combination\": \"CQC\"} (docs/seismic.md)") is not { } o) return null;
            var f = new JsonFields(o, sink);
            var ruleText = f.OptionalString("combination", "give \"combination\": \"CQC\" (the default) or \"SRSS\"") ?? "CQC";
            ModalRule rule = ModalRule.Cqc;
            if (ruleText == "SRSS") rule = ModalRule.Srss;
            else if (ruleText != "CQC") sink.Add(f.Token("combination"), $"unknown combination \"{ruleText}\"", "give \"CQC\" (complete quadratic combination, the default) or \"SRSS\"");
            double zeta = f.OptionalNumber("damping", 0.05, "give the damping ratio, e.g. 0.05");
            if (double.IsFinite(zeta) && !(zeta > 0 && zeta < 0.5)) sink.Add(f.Token("damping"), $"'damping' = {Num(zeta)} is outside (0, 0.5)", "give the damping ratio as a fraction, e.g. 0.05 for 5 %");
            double cd = f.RequiredNumber("Cd", "give the deflection amplification factor C_d, 1 to 6.5 (design drift δ = C_d·δ_e/I_e)");
            if (double.IsFinite(cd) && (cd < 1 || cd > 6.5)) sink.Add(f.Token("Cd"), $"'Cd' = {Num(cd)} is out of range", "give C_d from 1 to 6.5 (ASCE 7-16 Table 12.2-1, from memory)");
            int modes = 0;
            if (f.Has("modes"))
            {
                double m = f.RequiredNumber("modes", "give the least number of modes to combine, a whole number ≥ 1");
                if (double.IsFinite(m) && (m < 1 || m != Math.Floor(m))) sink.Add(f.Token("modes"), $"'modes' must be a whole number ≥ 1, found {Num(m)}", "give the least number of modes to combine");
                else if (double.IsFinite(m) && availableModes > 0 && m > availableModes)
                    sink.Add(f.Token("modes"), $"'modes' asks for {Num(m)} modes and the model has {availableModes}", $"give at most {availableModes} (or leave 'modes' out: enough for 90 % of the mass)");
                else if (double.IsFinite(m)) modes = (int)m;
            }
            var table = new List<(double, double)>();
            if (f.Token("points") is { } pt)
            {
                const string fix = "give \"points\": [[T, Sa], ...] with T in s strictly increasing from ≥ 0 and S_a in g ≥ 0";
                if (pt is not JsonList a || a.Count < 2) sink.Add(pt, "'points' must be an array of at least two [T, Sa] pairs", fix);
                else
                {
                    foreach (var p in a)
                    {
                        if (p is JsonList { Count: 2 } q && q.All(v => v.Type is JsonKind.Integer or JsonKind.Float) && double.IsFinite((double)q[0]) && double.IsFinite((double)q[1]))
                        {
                            double t = (double)q[0], sa = (double)q[1];
                            if (t < 0 || sa < 0) { sink.Add(p, $"the spectrum point [{Num(t)}, {Num(sa)}] has a negative value", fix); continue; }
                            if (table.Count > 0 && t <= table[^1].Item1) { sink.Add(p, $"the spectrum's periods are not increasing at T = {Num(t)} s", fix); continue; }
                            if (t > 20 || sa > 10) { sink.Add(p, $"the spectrum point [{Num(t)}, {Num(sa)}] is out of range (T ≤ 20 s, S_a ≤ 10 g)", fix); continue; }
                            table.Add((t, sa));
                        }
                        else sink.Add(p, $"a spectrum point must be [T, Sa], two numbers, found {JsonFields.Describe(p)}", fix);
                    }
                }
            }
            var torsion = AccidentalTorsion.Static;
            if (f.Token("accidentalTorsion") is { } at)
            {
                const string tfix = "give \"accidentalTorsion\": \"static\" (torques from the equivalent lateral forces, the default) or \"shifted-masses\" (the floor masses moved ±e, the modes solved again, enveloped)";
                var text = f.OptionalString("accidentalTorsion", tfix);
                if (!inPlan) sink.Add(at, "'accidentalTorsion' applies to a building in plan; a planar model has no accidental torsion", "remove the key, or give it under \"plan\": {\"seismic\": {\"responseSpectrum\": ...}}");
                else if (text == "shifted-masses") torsion = AccidentalTorsion.ShiftedMasses;
                else if (text is not null && text != "static") sink.Add(at, $"unknown accidental torsion method \"{text}\"", tfix);
            }
            f.RejectUnknownKeys();
            return new ResponseSpectrumSettings(rule, zeta, table, cd, modes) { Torsion = torsion };
        }

        /// <summary>The "seismic" block of a building in plan.</summary>
        private PlanSeismicData? ReadPlanSeismic(JsonFields pf, List<PlanLevel>? levels)
        {
            if (pf.OptionalObject("seismic", "write \"seismic\": {\"loadCase\": \"E\", \"structureType\": \"other\", \"spectrum\": {...}} (docs/plan.md)") is not { } o) return null;
            var sf = new JsonFields(o, sink);
            var id = sf.RequiredString("loadCase", "give the prefix of the generated cases, e.g. \"loadCase\": \"E\" (cases E-x, E-y and their ±ecc twins)");
            var type = sf.OptionalString("structureType", "give \"structureType\" as a string") ?? "other";
            if (!SeismicPresets.PeriodCoefficients.ContainsKey(type))
                sink.Add(sf.Token("structureType"), $"unknown structure type \"{type}\"", $"use one of: {string.Join(", ", SeismicPresets.PeriodCoefficients.Keys)}{Suggest(type, SeismicPresets.PeriodCoefficients.Keys)}");
            var so = sf.OptionalObject("spectrum", "write \"spectrum\": {\"SDS\": ..., \"SD1\": ..., \"R\": ..., \"Ie\": ..., \"TL\": ...}");
            if (so is null) sink.Add(o, "the building's seismic block has no 'spectrum'", "give \"spectrum\": {\"SDS\": ..., \"SD1\": ..., \"R\": ..., \"Ie\": ..., \"TL\": ...} (C_s and the design spectrum come from it)");
            var spectrum = so is null ? null : ReadSpectralValues(so);
            var (period, given) = ReadPeriodChoice(sf);
            int floors = levels is null ? 0 : levels.Count - 1;
            var rs = ReadResponseSpectrum(sf, 3 * floors, inPlan: true);
            sf.RejectUnknownKeys();
            if (levels is not null)
                foreach (var l in levels.Skip(1).Where(l => !double.IsFinite(l.Weight)))
                    sink.Add(o, $"level \"{l.Id}\" has no \"weight\", and the seismic block needs every floor's mass",
                        $"give level \"{l.Id}\" its seismic weight in {_units.ForceSymbol} (\"weight\": ...)");
            if (id is null || spectrum is null) return null;
            return new PlanSeismicData { CaseId = id, StructureType = type, Spectrum = spectrum, Period = period, GivenPeriod = given, ResponseSpectrum = rs };
        }
    }
}
