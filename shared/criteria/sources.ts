/**
 * Source strings and cautions shared by the design-wind, criteria and screening routines, so that the UI,
 * the API and the reports quote one wording. A source says how it was checked: "verified" (read in a
 * published text or a worked example), "from memory" (recalled, not checked against the text: verify before
 * relying on it), "common practice" or "derived" (from the equations of motion in the code beside it).
 */

export const EN_1991_1_4 = "EN 1991-1-4:2005 (+A1:2010), recommended values; National Annexes may differ";

export const SOURCES = {
  terrainFactor: `${EN_1991_1_4}, §4.3.2, Expr. (4.5): k_r = 0.19 (z0/z0,II)^0.07, z0,II = 0.05 m`,
  roughnessFactor: `${EN_1991_1_4}, §4.3.2, Expr. (4.4): c_r = k_r ln(z/z0) for z_min ≤ z ≤ z_max = 200 m, c_r(z_min) below z_min`,
  terrainTable: `${EN_1991_1_4}, Table 4.1: terrain categories 0, I, II, III, IV with z0 and z_min`,
  meanWind: `${EN_1991_1_4}, §4.3.1, Expr. (4.3): v_m(z) = c_r(z) c_o(z) v_b`,
  orography: `${EN_1991_1_4}, §4.3.3: orography factor c_o (1.0 unless the site's orography raises the wind by more than 5 %)`,
  probabilityFactor: `${EN_1991_1_4}, §4.2(2) Note 4, Expr. (4.2): c_prob = [(1 − K ln(−ln(1−p)))/(1 − K ln(−ln 0.98))]^n, recommended K = 0.2, n = 0.5`,
  vortexOnset:
    `${EN_1991_1_4}, Annex E.1.3.1, Expr. (E.2): v_crit,i = b n_i,y / St (formula recalled; form agrees with ` +
    "the Strouhal relation f = St U / b)",
  strouhalTable:
    `${EN_1991_1_4}, Annex E.1.3.2, Table E.1 / Figure E.2 (rectangular sections with sharp corners against ` +
    "d/b) — values from memory, not checked against the standard: verify before use, or enter the deck's measured St",
  scruton:
    `${EN_1991_1_4}, Annex E.1.3.3, Expr. (E.4): Sc = 2 δ_s m_i,e / (ρ b²) (expression number from memory; the ` +
    "same definition is quoted from S.O. Hansen, “Vortex-induced vibrations of structures”, Structural Engineers " +
    "World Congress 2007, in the encyclopaedia article “Scruton number”)",
  torsionalScruton:
    "Torsional (inertia) form Sc_θ = 2 δ_s I / (ρ B⁴), B = deck width — common practice in bridge aerodynamics " +
    "(EN 1991-1-4 gives only the translational form); not a code formula",
  vortexCriterion:
    `${EN_1991_1_4}, Annex E.1.2(2), Expr. (E.1): vortex-shedding effects need not be investigated when ` +
    "v_crit,i > 1.25 v_m (clause number and wording from memory: verify)",
  gallopingOnset:
    `${EN_1991_1_4}, Annex E.2.2(1), Expr. (E.18): v_CG = 2 Sc n_1,y b / a_G (formula recalled; clause numbering from memory)`,
  gallopingTable:
    `${EN_1991_1_4}, Annex E.2.2, Table E.7: factor of galloping instability a_G — values from memory, not ` +
    "checked against the standard: verify before use. Only sharp-cornered rectangles with 1/3 ≤ d/b ≤ 1 are used; " +
    "no factor is assumed outside that range",
  gallopingCriterion:
    `${EN_1991_1_4}, Annex E.2.2(2), Expr. (E.19): v_CG > 1.25 v_m (from memory: verify)`,
  denHartog:
    "J.P. Den Hartog, Mechanical Vibrations (4th ed., McGraw-Hill 1956), galloping criterion dC_L/dα + C_D < 0; " +
    "onset speed U = 4 m ζ ω / (−ρ B (dC_L/dα + C_D)), derived from the quasi-steady aerodynamic heave damping " +
    "ratio ρ U B (dC_L/dα + C_D) / (4 m ω)",
  vortexAmplitude:
    `${EN_1991_1_4}, Annex E.1.5: vortex-induced cross-wind amplitudes (and, for a deck, the accelerations that ` +
    "follow from them) where lock-in is possible (clause from memory: verify)",
  gallopingBySweep:
    "Flutter sweep with the heave derivative H1* (measured, or quasi-steady H1* = −(dC_L/dα + C_D)/K): the heave " +
    "branch's damping includes the aerodynamic heave damping whose loss is galloping",
  divergence:
    `${EN_1991_1_4}, Annex E.4.3, Expr. (E.24): v_div = [2 k_Θ / (ρ b² dc_M/dΘ)]^0.5, with k_Θ = I ω_α² and b = B`,
  divergenceCriterion: `${EN_1991_1_4}, Annex E.4.3(3): v_div > 2 v_m(z_s) (from memory: verify)`,
  flutterFactor:
    "A factor of about 1.2 on the design mean wind at deck level for flutter is widespread in bridge " +
    "specifications (from memory; no single clause cited) — set it to the governing specification",
  logDecrement: "Logarithmic decrement δ_s = 2π ζ (small-damping relation between decrement and damping ratio)",
} as const;

/** Cautions that belong on every screening and criteria result (docs/conventions.md §Cautions). */
export const CAUTIONS: readonly string[] = [
  "Results are indicative.",
  "Screening formulas (EN 1991-1-4 Annex E) are simplified single-mode checks; bridge decks with unusual " +
    "shapes, parapets or details can behave differently: section-model wind-tunnel tests govern.",
  "Critical designs need wind-tunnel verification and review by a licensed engineer under the governing local " +
    "codes and their national annexes.",
];
