using PlaneLateral.Model;

namespace PlaneLateral.Reports;

public static partial class BuildingReport
{
    /// <summary>The method in words and the formulas with their published sources (author, title, year, section or equation).</summary>
    private static void Method(Doc d)
    {
        var p = d.P;
        d.Heading("Method and sources");
        d.Text($"Each line of resistance is a planar model of its own (Timoshenko beam-columns, braces, springs, wall panels). Its stiffness is condensed " +
            $"exactly onto its {p.FloorCount} level degree{(p.FloorCount == 1 ? "" : "s")} of freedom, one factorisation per line: K̂ = K_ll − K_li·K_ii⁻¹·K_il, the " +
            "static condensation that loses nothing for loads applied at the kept freedoms. Each floor above the base carries three degrees of freedom about the plan " +
            "origin: Ux, Uy and the turn Rz (counter-clockwise seen from above). A line at (x₀, y₀) along the direction α moves at its floor by " +
            "u = cos α·Ux + sin α·Uy + r·Rz, r = x₀·sin α − y₀·cos α, so the building's floor stiffness is K = Σ Aᵀ·K̂·A with A = [cos α·I | sin α·I | r·I]. " +
            "The floors are solved for each load case; each line's level displacements give its level forces, under which its planar model is solved again " +
            "(every member force of every line is recovered; the recovery error is in the checks). The same solve with every Rz held at zero gives the direct part " +
            "of each line's shear; the rest is the torsional part.");
        if (p.Floors.Count > 0)
            d.Text("Floors given as semi-rigid are deep beams in their plane (Timoshenko members between the lines, net section through the openings), condensed " +
                "onto the floors' (Ux, Uy, Rz); flexible floors pass their loads to the lines by tributary spans (statics).");
        var rows = new List<IReadOnlyList<string>>
        {
            new[] { "Timoshenko beam-column (lines' members and floors as deep beams)", "k = EI/(L³(1+Φ))·[12, 6L, (4+Φ)L², (2−Φ)L²], Φ = 12EI/(G·A_s·L²)", "Przemieniecki, Theory of Matrix Structural Analysis, 1968, §5.6" },
            new[] { "Static condensation of each line onto its levels", "K̂ = K_ll − K_li·K_ii⁻¹·K_il (exact for loads at the kept freedoms)", "Guyan, Reduction of stiffness and mass matrices, AIAA Journal 3(2):380, 1965" },
            new[] { "Floors with three freedoms, lines mapped by their direction and lever", "u = cos α·Ux + sin α·Uy + r·Rz, r = x₀ sin α − y₀ cos α; K = Σ Aᵀ K̂ A", "Chopra, Dynamics of Structures, 4th ed., 2012, ch. 9 (unsymmetric-plan buildings, from memory for the section); Weaver & Nelson, J. Struct. Div. ASCE 92(ST6), 1966" },
            new[] { "Centre of rigidity of a story (hand definition)", "x_R = Σk_y·x / Σk_y, y_R = Σk_x·y / Σk_x (orthogonal lines), k each line's story stiffness alone", "Taly, Design of Reinforced Masonry Structures, 2nd ed., 2010, §7.9, eqs. 7.72–7.73" },
            new[] { "Relative rigidity with torsion (the hand split)", "V_i = V·k_i/Σk_∥ + k_i·d_i·T/J, J = Σk_x(y − y_R)² + Σk_y(x − x_R)²; design: a torsional part that lowers a line's shear is not taken", "Taly, 2010, §7.9, eqs. 7.72–7.75 and Example 7.12" },
            new[] { "Why the hand split and the FE building differ", "the centre of rigidity depends on the story and the load pattern; the line alone is not the line in the building", "Goel & Chopra, J. Struct. Eng. 119(10):3039–3055, 1993" },
            new[] { "Accidental torsion", "centre of mass shifted ± the eccentricity ratio × the plan dimension across the forces", "ASCE 7-16 §12.8.4.2" },
            new[] { "Torsional irregularity", "δ_max / δ_avg of the story drifts at the extreme corners along the loading, with accidental torsion: Type 1a above 1.2, Type 1b above 1.4", "ASCE 7-16 Table 12.3-1" },
            new[] { "Amplification of accidental torsion", "A_x = (δ_max / 1.2·δ_avg)², 1 ≤ A_x ≤ 3, on the displacements of level x", "ASCE 7-16 §12.8.4.3, eq. 12.8-14" },
        };
        if (p.DriftLimit is not null)
            rows.Add(["Amplified drift at the outline corners", "δ = C_d·δ_e/I_e, checked as |δ|/h ≤ allowable", "ASCE 7-16 §12.8.6, eq. 12.8-15; allowable from Table 12.12-1 or the file"]);
        if (p.Seismic is { } s)
        {
            rows.Add(["Floor masses and modes", "m = W/g at the centre of mass, J about it; K·φ = ω²·M·φ on (Ux, Uy, Rz); Γ = φᵀMι/φᵀMφ, effective mass (φᵀMι)²/φᵀMφ", "Chopra, Dynamics of Structures, 4th ed., 2012, ch. 13 (modal analysis of multistory buildings, from memory for the chapter)"]);
            rows.Add(["Equivalent lateral forces", "V = C_s·W; C_s = S_DS/(R/I_e) ≤ S_D1/(T·R/I_e) (T ≤ T_L) or S_D1·T_L/(T²·R/I_e), ≥ 0.044·S_DS·I_e ≥ 0.01, ≥ 0.5·S_1/(R/I_e) where S_1 ≥ 0.6 g", "ASCE 7-16 §12.8.1, eqs. 12.8-1 to 12.8-6"]);
            rows.Add(["Period", "T_a = C_t·h_n^x (Table 12.8-2); modal period capped at C_u·T_a (Table 12.8-1)", "ASCE 7-16 §12.8.2, eq. 12.8-7"]);
            rows.Add(["Vertical distribution", "F_x = C_vx·V, C_vx = w_x·h_x^k / Σ w_i·h_i^k, k = 1 (T ≤ 0.5 s) to 2 (T ≥ 2.5 s)", "ASCE 7-16 §12.8.3, eqs. 12.8-11 and 12.8-12"]);
            if (s.ResponseSpectrum is { } rs)
            {
                rows.Add(["Design response spectrum", rs.Table.Count == 0 ? "S_a from S_DS, S_D1, T_0 = 0.2·S_D1/S_DS, T_S = S_D1/S_DS, T_L" : "the file's table, linear between points, flat beyond its ends (our choice)", "ASCE 7-16 §11.4.6"]);
                rows.Add(["Modal response spectrum analysis", "modes to 90 % of the mass per direction; forces ÷ R/I_e, drifts × C_d/I_e; story drift per mode, then combined", "ASCE 7-16 §12.9.1.1 to §12.9.1.3; Chopra, 2012, ch. 13"]);
                rows.Add(["Modal combination", rs.Rule == ModalRule.Cqc ? "CQC: r = √(ΣΣ ρ_in r_i r_n), ρ for equal damping ζ" : "SRSS: r = √(Σ r_n²)", "Der Kiureghian, Earthquake Eng. Struct. Dyn. 9:419–435, 1981; Wilson, Der Kiureghian & Bayo, EESD 9:187–194, 1981"]);
                rows.Add(["Scaling of the modal results", "forces × V/V_t where V_t < V; drifts × C_s·W/V_t only where C_s is set by eq. 12.8-6 and V_t < C_s·W", "ASCE 7-16 §12.9.1.4.1 and §12.9.1.4.2"]);
                rows.Add(["Accidental torsion with the spectrum", "the static torsion of the ELF forces shifted ± the eccentricity, added to the scaled modal line shears and drifts", "ASCE 7-16 §12.9.1.5"]);
            }
        }
        if (p.Floors.Count > 0)
            rows.Add(["Floor flexibility test", "MDD / ADVE > 2 permits the flexible idealisation", "ASCE 7-16 §12.3.1.3, eq. 12.3-1"]);
        d.Table("Methods, formulas and their published sources", ["method", "formula", "source"], rows);
        if (p.Seismic is not null) d.Text($"ASCE 7-16 section and equation numbers: {SeismicPresets.Status}.");
    }
}
