/**
 * Guideline severity tables as data, one table per graded quantity, each row with its source.
 *
 * Printed guideline thresholds have gaps at the rounding step (e.g. "2.6–2.9" then "3.0–3.9"); the
 * bands here close those gaps at the next printed value so that every measurement falls in exactly
 * one class (e.g. mild AS is 2.5 < Vmax < 3.0). All thresholds were recalled by the authors and
 * checked against each other, not against a fresh copy of the printed tables: they are marked
 * "from memory" row by row, and every grade says so. The aortic stenosis (2017), mitral
 * regurgitation (2017), pulmonary hypertension (2015) and mitral stenosis staging (2014, 2020)
 * bands were also compared with reproductions of those tables in secondary literature and agree.
 *
 * @module
 */
import type { Citation, Quantity } from "../core/types.ts";
import {
  AORTIC_MEAN_GRADIENT,
  AORTIC_PEAK_VELOCITY,
  AORTIC_VALVE_AREA,
  AORTIC_VALVE_AREA_INDEX,
  DIMENSIONLESS_INDEX,
  EFFECTIVE_REGURGITANT_ORIFICE_AREA,
  MITRAL_MEAN_GRADIENT,
  MITRAL_VALVE_AREA,
  REGURGITANT_FRACTION,
  REGURGITANT_VOLUME,
  TR_PEAK_VELOCITY,
} from "../quantities/flow.ts";
import { choiceError, issueError } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import { defineSeverityTable } from "../grading/grade.ts";
import type { SeverityBand, SeverityTable } from "../grading/types.ts";
import {
  BAUMGARTNER_2009,
  BAUMGARTNER_2017,
  GALIE_2015,
  HUMBERT_2022,
  NISHIMURA_2014,
  OTTO_2020,
  ZOGHBI_2017,
} from "./citations.ts";

/** The error for a name that is not one of the choices (a RangeError by the one message format). */
function at(citation: Citation, locator: string): Citation {
  return { ...citation, locator };
}

/** A band from printed text, recalled from memory; `lower`/`upper` null means unbounded. */
function band(
  grade: string,
  printed: string,
  lower: number | null,
  lowerInclusive: boolean,
  upper: number | null,
  upperInclusive: boolean,
  citation: Citation,
): SeverityBand {
  return {
    grade,
    printed,
    range: {
      min: lower ?? -Infinity,
      max: upper ?? Infinity,
      ...(lowerInclusive && lower !== null ? {} : { minExclusive: true }),
      ...(upperInclusive && upper !== null ? {} : { maxExclusive: true }),
    },
    citation,
    fromMemory: true,
  };
}

// ---------------------------------------------------------------- aortic stenosis

const AS_2009 = at(BAUMGARTNER_2009, "Table 4, classification of AS severity (from memory)");
const AS_2017 = at(BAUMGARTNER_2017, "Table 3, classification of AS severity (from memory)");

function asValveAreaTables(src: Citation, year: number): {
  valveArea: SeverityTable;
  indexedValveArea: SeverityTable;
  velocityRatio: SeverityTable;
} {
  return {
    valveArea: defineSeverityTable({
      id: `aorticStenosisValveArea${year}`,
      title: `Aortic stenosis by valve area (${year})`,
      quantity: AORTIC_VALVE_AREA,
      bands: [
        band("severe", "< 1.0", 0, false, 1.0, false, src),
        band("moderate", "1.0–1.5", 1.0, true, 1.5, true, src),
        band("mild", "> 1.5", 1.5, false, null, false, src),
      ],
      notes: ["The table does not separate normal valves from mild stenosis by area"],
    }),
    indexedValveArea: defineSeverityTable({
      id: `aorticStenosisIndexedValveArea${year}`,
      title: `Aortic stenosis by indexed valve area (${year})`,
      quantity: AORTIC_VALVE_AREA_INDEX,
      bands: [
        band("severe", "< 0.6", 0, false, 0.6, false, src),
        band("moderate", "0.60–0.85", 0.6, true, 0.85, true, src),
        band("mild", "> 0.85", 0.85, false, null, false, src),
      ],
      notes: ["Indexing over-corrects in obesity"],
    }),
    velocityRatio: defineSeverityTable({
      id: `aorticStenosisVelocityRatio${year}`,
      title: `Aortic stenosis by velocity ratio / dimensionless index (${year})`,
      quantity: DIMENSIONLESS_INDEX,
      bands: [
        band("severe", "< 0.25", 0, false, 0.25, false, src),
        band("moderate", "0.25–0.50", 0.25, true, 0.5, true, src),
        band("mild", "> 0.50", 0.5, false, null, false, src),
      ],
      notes: [],
    }),
  };
}

/** Aortic stenosis severity tables of a guideline edition, one per graded quantity. */
export interface AorticStenosisTables {
  /** Peak aortic jet velocity, m/s. */
  readonly peakVelocity: SeverityTable;
  /** Mean transaortic gradient, mmHg. */
  readonly meanGradient: SeverityTable;
  /** Continuity valve area, cm². */
  readonly valveArea: SeverityTable;
  /** Valve area indexed to BSA, cm²/m². */
  readonly indexedValveArea: SeverityTable;
  /** Velocity ratio (dimensionless index). */
  readonly velocityRatio: SeverityTable;
}

/**
 * Aortic stenosis severity, EAE/ASE 2009 (Baumgartner et al., J Am Soc Echocardiogr
 * 2009;22:1-23, table of AS classification, from memory): Vmax ≤ 2.5 sclerosis, 2.6–2.9 mild,
 * 3.0–4.0 moderate, > 4.0 m/s severe; mean gradient < 20, 20–40, > 40 mmHg; AVA > 1.5, 1.0–1.5,
 * < 1.0 cm²; AVAi > 0.85, 0.60–0.85, < 0.6 cm²/m²; velocity ratio > 0.50, 0.25–0.50, < 0.25.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2009, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // In 2009 exactly 4.0 m/s was still moderate ("3.0–4.0"); severe was "> 4.0"
 * assert.equal(gradeSeverity(AORTIC_STENOSIS_2009.peakVelocity, 4.0).grade, "moderate");
 * ```
 */
export const AORTIC_STENOSIS_2009: AorticStenosisTables = Object.freeze({
  peakVelocity: defineSeverityTable({
    id: "aorticStenosisPeakVelocity2009",
    title: "Aortic stenosis by peak velocity (2009)",
    quantity: AORTIC_PEAK_VELOCITY,
    bands: [
      band("aortic sclerosis", "≤ 2.5", 0, true, 2.5, true, AS_2009),
      band("mild", "2.6–2.9", 2.5, false, 3.0, false, AS_2009),
      band("moderate", "3.0–4.0", 3.0, true, 4.0, true, AS_2009),
      band("severe", "> 4.0", 4.0, false, null, false, AS_2009),
    ],
    notes: ["Printed 2.6–2.9 is taken as 2.5 < Vmax < 3.0"],
  }),
  meanGradient: defineSeverityTable({
    id: "aorticStenosisMeanGradient2009",
    title: "Aortic stenosis by mean gradient (2009)",
    quantity: AORTIC_MEAN_GRADIENT,
    bands: [
      band("mild", "< 20", 0, true, 20, false, AS_2009),
      band("moderate", "20–40", 20, true, 40, true, AS_2009),
      band("severe", "> 40", 40, false, null, false, AS_2009),
    ],
    notes: ["The ESC guideline of the time used < 30, 30–50 and > 50 mmHg (from memory)"],
  }),
  ...asValveAreaTables(AS_2009, 2009),
});

/**
 * Aortic stenosis severity, EACVI/ASE 2017 focused update (Baumgartner et al., J Am Soc
 * Echocardiogr 2017;30:372-392, table of AS classification, from memory): Vmax ≤ 2.5 sclerosis,
 * 2.6–2.9 mild, 3.0–3.9 moderate, ≥ 4.0 m/s severe; mean gradient < 20, 20–39, ≥ 40 mmHg; AVA,
 * AVAi and velocity ratio as in 2009.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(AORTIC_STENOSIS_2017.meanGradient, 40).grade, "severe");
 * assert.equal(gradeSeverity(AORTIC_STENOSIS_2017.velocityRatio, 0.24).grade, "severe");
 * ```
 */
export const AORTIC_STENOSIS_2017: AorticStenosisTables = Object.freeze({
  peakVelocity: defineSeverityTable({
    id: "aorticStenosisPeakVelocity2017",
    title: "Aortic stenosis by peak velocity (2017)",
    quantity: AORTIC_PEAK_VELOCITY,
    bands: [
      band("aortic sclerosis", "≤ 2.5", 0, true, 2.5, true, AS_2017),
      band("mild", "2.6–2.9", 2.5, false, 3.0, false, AS_2017),
      band("moderate", "3.0–3.9", 3.0, true, 4.0, false, AS_2017),
      band("severe", "≥ 4.0", 4.0, true, null, false, AS_2017),
    ],
    notes: ["Printed 2.6–2.9 is taken as 2.5 < Vmax < 3.0 and 3.0–3.9 as 3.0 ≤ Vmax < 4.0"],
  }),
  meanGradient: defineSeverityTable({
    id: "aorticStenosisMeanGradient2017",
    title: "Aortic stenosis by mean gradient (2017)",
    quantity: AORTIC_MEAN_GRADIENT,
    bands: [
      band("mild", "< 20", 0, true, 20, false, AS_2017),
      band("moderate", "20–39", 20, true, 40, false, AS_2017),
      band("severe", "≥ 40", 40, true, null, false, AS_2017),
    ],
    notes: ["Printed 20–39 is taken as 20 ≤ ΔP < 40"],
  }),
  ...asValveAreaTables(AS_2017, 2017),
});

// ---------------------------------------------------------------- mitral stenosis

const MS_2009 = at(BAUMGARTNER_2009, "Table 8, classification of MS severity (from memory)");

/**
 * Mitral stenosis by valve area, EAE/ASE 2009 (Baumgartner et al. 2009, from memory): mild
 * > 1.5 cm², moderate 1.0–1.5 cm², severe < 1.0 cm².
 *
 * @example
 * ```ts
 * import { gradeSeverity, MITRAL_STENOSIS_AREA_2009 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(MITRAL_STENOSIS_AREA_2009, 1.0).grade, "moderate");
 * ```
 */
export const MITRAL_STENOSIS_AREA_2009: SeverityTable = defineSeverityTable({
  id: "mitralStenosisArea2009",
  title: "Mitral stenosis by valve area (EAE/ASE 2009)",
  quantity: MITRAL_VALVE_AREA,
  bands: [
    band("severe", "< 1.0", 0, false, 1.0, false, MS_2009),
    band("moderate", "1.0–1.5", 1.0, true, 1.5, true, MS_2009),
    band("mild", "> 1.5", 1.5, false, null, false, MS_2009),
  ],
  notes: ["Mean gradient and pulmonary pressure are supportive, heart-rate dependent findings"],
});

/**
 * Mitral stenosis by mean gradient, EAE/ASE 2009 (Baumgartner et al. 2009, from memory): mild
 * < 5 mmHg, moderate 5–10 mmHg, severe > 10 mmHg (supportive; depends on heart rate and flow).
 *
 * @example
 * ```ts
 * import { gradeSeverity, MITRAL_STENOSIS_MEAN_GRADIENT_2009 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(MITRAL_STENOSIS_MEAN_GRADIENT_2009, 12).grade, "severe");
 * ```
 */
export const MITRAL_STENOSIS_MEAN_GRADIENT_2009: SeverityTable = defineSeverityTable({
  id: "mitralStenosisMeanGradient2009",
  title: "Mitral stenosis by mean gradient (EAE/ASE 2009)",
  quantity: MITRAL_MEAN_GRADIENT,
  bands: [
    band("mild", "< 5", 0, true, 5, false, MS_2009),
    band("moderate", "5–10", 5, true, 10, true, MS_2009),
    band("severe", "> 10", 10, false, null, false, MS_2009),
  ],
  notes: ["Supportive only: the gradient rises with heart rate and transvalvular flow"],
});

const MS_2014 = at(
  NISHIMURA_2014,
  "table of the stages of mitral stenosis (table number not checked; thresholds from memory, agreeing with secondary reproductions of the table)",
);

/** Why a valve area above 1.5 cm² is "progressive" only when mitral stenosis is present. */
const MS_STAGE_B_NOTE =
  "Graded by area alone for a valve with mitral stenosis: an area > 1.5 cm² is stage B (progressive) when the rheumatic changes are present; an at-risk (stage A) or normal valve also has an area > 1.5 cm²";
const MS_SYMPTOMS_NOTE =
  "Stages C (asymptomatic) and D (symptomatic) share the area threshold; symptoms are not graded here";

/**
 * Mitral stenosis stages by valve area, AHA/ACC 2014 (Nishimura et al., the full guideline's
 * table of the stages of MS, from memory; secondary reproductions of the table agree):
 * progressive (stage B) > 1.5 cm²; severe (stage C/D) ≤ 1.5 cm²; very severe ≤ 1.0 cm². Kept
 * selectable beside the 2020 staging because its very severe class (≤ 1.0 cm², pressure
 * half-time ≥ 220 ms) carried its own intervention recommendations, which reports made under the
 * 2014 guideline used.
 *
 * @example
 * ```ts
 * import { gradeSeverity, MITRAL_STENOSIS_STAGES_2014 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 1.5 cm² is moderate in the 2009 scheme but severe in the 2014 staging
 * assert.equal(gradeSeverity(MITRAL_STENOSIS_STAGES_2014, 1.5).grade, "severe (stage C/D)");
 * ```
 */
export const MITRAL_STENOSIS_STAGES_2014: SeverityTable = defineSeverityTable({
  id: "mitralStenosisStages2014",
  title: "Mitral stenosis stages by valve area (AHA/ACC 2014)",
  quantity: MITRAL_VALVE_AREA,
  bands: [
    band("very severe (stage C/D)", "≤ 1.0", 0, false, 1.0, true, MS_2014),
    band("severe (stage C/D)", "≤ 1.5", 1.0, false, 1.5, true, MS_2014),
    band("progressive (stage B)", "> 1.5", 1.5, false, null, false, MS_2014),
  ],
  notes: [
    MS_SYMPTOMS_NOTE,
    MS_STAGE_B_NOTE,
    "The very severe class (≤ 1.0 cm²; pressure half-time ≥ 220 ms) is this edition's; the 2020 guideline dropped it",
    "Companion thresholds (PHT ≥ 150 ms severe, ≥ 220 ms very severe) are not graded here",
  ],
});

const MS_2020 = at(
  OTTO_2020,
  "Table 16, stages of MS (from memory; the table number and thresholds agree with a secondary reproduction of the table)",
);

/**
 * Mitral stenosis stages by valve area, ACC/AHA 2020 (Otto et al., Circulation 2021;143:e72–e227,
 * Table 16, from memory; a secondary reproduction of Table 16 agrees): progressive (stage B)
 * > 1.5 cm²; severe (stage C/D) ≤ 1.5 cm² (diastolic pressure half-time ≥ 150 ms). There is no
 * very severe class. The default of {@linkcode mitralStenosisAreaTable}.
 *
 * @example
 * ```ts
 * import { gradeSeverity, MITRAL_STENOSIS_STAGES_2020 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0.9 cm² was "very severe" in 2014; the 2020 table calls it severe
 * assert.equal(gradeSeverity(MITRAL_STENOSIS_STAGES_2020, 0.9).grade, "severe (stage C/D)");
 * ```
 */
export const MITRAL_STENOSIS_STAGES_2020: SeverityTable = defineSeverityTable({
  id: "mitralStenosisStages2020",
  title: "Mitral stenosis stages by valve area (ACC/AHA 2020)",
  quantity: MITRAL_VALVE_AREA,
  bands: [
    band("severe (stage C/D)", "≤ 1.5", 0, false, 1.5, true, MS_2020),
    band("progressive (stage B)", "> 1.5", 1.5, false, null, false, MS_2020),
  ],
  notes: [
    MS_SYMPTOMS_NOTE,
    MS_STAGE_B_NOTE,
    "Companion thresholds (PHT ≥ 150 ms; PASP > 50 mmHg in stage C) are not graded here",
  ],
});

/** The selectable mitral stenosis schemes by valve area, newest first. */
export type MitralStenosisScheme = "ACC/AHA 2020" | "AHA/ACC 2014" | "EAE/ASE 2009";

const MS_SCHEMES: Readonly<Record<MitralStenosisScheme, SeverityTable>> = {
  "ACC/AHA 2020": MITRAL_STENOSIS_STAGES_2020,
  "AHA/ACC 2014": MITRAL_STENOSIS_STAGES_2014,
  "EAE/ASE 2009": MITRAL_STENOSIS_AREA_2009,
};

/**
 * The mitral stenosis valve-area table of a scheme: the current staging (ACC/AHA 2020, the
 * default), the 2014 staging with its very severe class (AHA/ACC 2014), or the older three-class
 * grading (EAE/ASE 2009).
 *
 * @param scheme "ACC/AHA 2020" (default), "AHA/ACC 2014" or "EAE/ASE 2009".
 * @returns The severity table.
 * @throws {RangeError} For an unknown scheme.
 *
 * @example
 * ```ts
 * import { gradeSeverity, mitralStenosisAreaTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(mitralStenosisAreaTable(), 1.0).grade, "severe (stage C/D)");
 * assert.equal(gradeSeverity(mitralStenosisAreaTable("AHA/ACC 2014"), 1.0).grade, "very severe (stage C/D)");
 * assert.equal(gradeSeverity(mitralStenosisAreaTable("EAE/ASE 2009"), 1.2).grade, "moderate");
 * ```
 */
export function mitralStenosisAreaTable(
  scheme: MitralStenosisScheme = "ACC/AHA 2020",
): SeverityTable {
  if (Object.hasOwn(MS_SCHEMES, scheme)) return MS_SCHEMES[scheme];
  throw choiceError("Mitral stenosis grading", "scheme", Object.keys(MS_SCHEMES), scheme);
}

// ---------------------------------------------------------------- regurgitation

const REGURG_GRADES = [
  "mild",
  "moderate (mild-to-moderate)",
  "moderate (moderate-to-severe)",
  "severe",
] as const;

function fourClassTable(
  id: string,
  title: string,
  quantity: Quantity,
  cuts: readonly [number, number, number],
  printed: readonly [string, string, string, string],
  src: Citation,
  notes: readonly string[],
): SeverityTable {
  const [a, b, c] = cuts;
  return defineSeverityTable({
    id,
    title,
    quantity,
    bands: [
      band(REGURG_GRADES[0], printed[0], 0, true, a, false, src),
      band(REGURG_GRADES[1], printed[1], a, true, b, false, src),
      band(REGURG_GRADES[2], printed[2], b, true, c, false, src),
      band(REGURG_GRADES[3], printed[3], c, true, null, false, src),
    ],
    notes,
  });
}

/** Regurgitation severity tables by quantitative parameter. */
export interface RegurgitationTables {
  /** Effective regurgitant orifice area, cm². */
  readonly eroa: SeverityTable;
  /** Regurgitant volume, mL/beat. */
  readonly regurgitantVolume: SeverityTable;
  /** Regurgitant fraction, %. */
  readonly regurgitantFraction: SeverityTable;
}

const MR_2017 = at(ZOGHBI_2017, "table grading chronic MR severity (from memory)");
const AR_2017 = at(ZOGHBI_2017, "table grading chronic AR severity (from memory)");
const RVOL_PRINTED = ["< 30", "30–44", "45–59", "≥ 60"] as const;
const RF_PRINTED = ["< 30", "30–39", "40–49", "≥ 50"] as const;

/**
 * Mitral regurgitation severity, ASE 2017 (Zoghbi et al., J Am Soc Echocardiogr 2017;30:303-371,
 * from memory): EROA < 0.20, 0.20–0.29, 0.30–0.39, ≥ 0.40 cm²; regurgitant volume < 30, 30–44,
 * 45–59, ≥ 60 mL; regurgitant fraction < 30, 30–39, 40–49, ≥ 50 %.
 *
 * @example
 * ```ts
 * import { gradeSeverity, MITRAL_REGURGITATION_2017 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(MITRAL_REGURGITATION_2017.eroa, 0.4).grade, "severe");
 * ```
 */
export const MITRAL_REGURGITATION_2017: RegurgitationTables = Object.freeze({
  eroa: fourClassTable(
    "mitralRegurgitationEroa2017",
    "Mitral regurgitation by EROA (ASE 2017)",
    EFFECTIVE_REGURGITANT_ORIFICE_AREA,
    [0.2, 0.3, 0.4],
    ["< 0.20", "0.20–0.29", "0.30–0.39", "≥ 0.40"],
    MR_2017,
    ["Primary MR thresholds; in secondary MR a smaller EROA may already be severe (elliptical orifice)"],
  ),
  regurgitantVolume: fourClassTable(
    "mitralRegurgitationVolume2017",
    "Mitral regurgitation by regurgitant volume (ASE 2017)",
    REGURGITANT_VOLUME,
    [30, 45, 60],
    RVOL_PRINTED,
    MR_2017,
    ["Low-flow states lower the volume for a given orifice"],
  ),
  regurgitantFraction: fourClassTable(
    "mitralRegurgitationFraction2017",
    "Mitral regurgitation by regurgitant fraction (ASE 2017)",
    REGURGITANT_FRACTION,
    [30, 40, 50],
    RF_PRINTED,
    MR_2017,
    [],
  ),
});

/**
 * Aortic regurgitation severity, ASE 2017 (Zoghbi et al., J Am Soc Echocardiogr 2017;30:303-371,
 * from memory): EROA < 0.10, 0.10–0.19, 0.20–0.29, ≥ 0.30 cm²; regurgitant volume < 30, 30–44,
 * 45–59, ≥ 60 mL; regurgitant fraction < 30, 30–39, 40–49, ≥ 50 %.
 *
 * @example
 * ```ts
 * import { AORTIC_REGURGITATION_2017, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(AORTIC_REGURGITATION_2017.eroa, 0.3).grade, "severe");
 * ```
 */
export const AORTIC_REGURGITATION_2017: RegurgitationTables = Object.freeze({
  eroa: fourClassTable(
    "aorticRegurgitationEroa2017",
    "Aortic regurgitation by EROA (ASE 2017)",
    EFFECTIVE_REGURGITANT_ORIFICE_AREA,
    [0.1, 0.2, 0.3],
    ["< 0.10", "0.10–0.19", "0.20–0.29", "≥ 0.30"],
    AR_2017,
    [],
  ),
  regurgitantVolume: fourClassTable(
    "aorticRegurgitationVolume2017",
    "Aortic regurgitation by regurgitant volume (ASE 2017)",
    REGURGITANT_VOLUME,
    [30, 45, 60],
    RVOL_PRINTED,
    AR_2017,
    [],
  ),
  regurgitantFraction: fourClassTable(
    "aorticRegurgitationFraction2017",
    "Aortic regurgitation by regurgitant fraction (ASE 2017)",
    REGURGITANT_FRACTION,
    [30, 40, 50],
    RF_PRINTED,
    AR_2017,
    [],
  ),
});

// ---------------------------------------------------------------- pulmonary hypertension

function phTable(
  id: string,
  title: string,
  src: Citation,
  grades: readonly [string, string, string],
  notes: readonly string[],
): SeverityTable {
  return defineSeverityTable({
    id,
    title,
    quantity: TR_PEAK_VELOCITY,
    bands: [
      band(grades[0], "≤ 2.8 (or not measurable)", 0, true, 2.8, true, src),
      band(grades[1], "2.9–3.4", 2.8, false, 3.4, true, src),
      band(grades[2], "> 3.4", 3.4, false, null, false, src),
    ],
    notes: ["Printed 2.9–3.4 is taken as 2.8 < v ≤ 3.4", ...notes],
  });
}

/** Pulmonary hypertension probability tables by TR velocity, with and without other echo signs. */
export interface PulmonaryHypertensionTables {
  /** No other echocardiographic signs of pulmonary hypertension. */
  readonly withoutOtherSigns: SeverityTable;
  /** Other echocardiographic signs present (from at least two categories). */
  readonly withOtherSigns: SeverityTable;
}

const PH_2015 = at(GALIE_2015, "Table 8, echocardiographic probability (from memory)");
const PH_2022 = at(HUMBERT_2022, "echocardiographic probability figure (from memory)");

/**
 * Echocardiographic probability of pulmonary hypertension by peak TR velocity, 2015 ESC/ERS
 * (Galiè et al., Eur Heart J 2016;37:67-119, Table 8, from memory): ≤ 2.8 m/s low (intermediate
 * with other signs); 2.9–3.4 m/s intermediate (high with other signs); > 3.4 m/s high.
 *
 * @example
 * ```ts
 * import { gradeSeverity, PULMONARY_HYPERTENSION_2015 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(PULMONARY_HYPERTENSION_2015.withoutOtherSigns, 3.1).grade, "intermediate");
 * assert.equal(gradeSeverity(PULMONARY_HYPERTENSION_2015.withOtherSigns, 3.1).grade, "high");
 * ```
 */
export const PULMONARY_HYPERTENSION_2015: PulmonaryHypertensionTables = Object.freeze({
  withoutOtherSigns: phTable(
    "pulmonaryHypertension2015",
    "Pulmonary hypertension probability by TR velocity, no other signs (ESC/ERS 2015)",
    PH_2015,
    ["low", "intermediate", "high"],
    [],
  ),
  withOtherSigns: phTable(
    "pulmonaryHypertension2015OtherSigns",
    "Pulmonary hypertension probability by TR velocity, with other signs (ESC/ERS 2015)",
    PH_2015,
    ["intermediate", "high", "high"],
    ["Other signs: ventricles, pulmonary artery, IVC and right atrium categories of the guideline"],
  ),
});

/**
 * Echocardiographic probability of pulmonary hypertension by peak TR velocity, 2022 ESC/ERS
 * (Humbert et al., Eur Heart J 2022;43:3618-3731, from memory): the TR-velocity bands of 2015 were
 * kept (≤ 2.8, 2.9–3.4, > 3.4 m/s) although the haemodynamic definition changed to mPAP > 20 mmHg.
 *
 * @example
 * ```ts
 * import { gradeSeverity, PULMONARY_HYPERTENSION_2022 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(PULMONARY_HYPERTENSION_2022.withoutOtherSigns, 3.5).grade, "high");
 * ```
 */
export const PULMONARY_HYPERTENSION_2022: PulmonaryHypertensionTables = Object.freeze({
  withoutOtherSigns: phTable(
    "pulmonaryHypertension2022",
    "Pulmonary hypertension probability by TR velocity, no other signs (ESC/ERS 2022)",
    PH_2022,
    ["low", "intermediate", "high"],
    ["The 2022 definition of pulmonary hypertension is mPAP > 20 mmHg (was ≥ 25 in 2015)"],
  ),
  withOtherSigns: phTable(
    "pulmonaryHypertension2022OtherSigns",
    "Pulmonary hypertension probability by TR velocity, with other signs (ESC/ERS 2022)",
    PH_2022,
    ["intermediate", "high", "high"],
    ["The 2022 definition of pulmonary hypertension is mPAP > 20 mmHg (was ≥ 25 in 2015)"],
  ),
});

/**
 * The pulmonary hypertension probability table for a guideline edition and the presence of other
 * echocardiographic signs.
 *
 * @param guideline "ESC/ERS 2015" or "ESC/ERS 2022".
 * @param otherEchoSigns Whether other echocardiographic signs of pulmonary hypertension are present.
 * @returns The severity table to pass to {@linkcode gradeSeverity}.
 * @throws {RangeError} For an unknown guideline.
 * @throws {TypeError} When `otherEchoSigns` is not a boolean.
 *
 * @example
 * ```ts
 * import { gradeSeverity, pulmonaryHypertensionTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(pulmonaryHypertensionTable("ESC/ERS 2022", false), 2.5).grade, "low");
 * ```
 */
export function pulmonaryHypertensionTable(
  guideline: "ESC/ERS 2015" | "ESC/ERS 2022",
  otherEchoSigns: boolean,
): SeverityTable {
  const where = "Pulmonary hypertension probability";
  if (typeof otherEchoSigns !== "boolean") {
    throw issueError([{
      kind: "type",
      severity: "error",
      where,
      field: "otherEchoSigns",
      expected: "as true or false",
      received: describeValue(otherEchoSigns),
    }]);
  }
  const tables = guideline === "ESC/ERS 2015"
    ? PULMONARY_HYPERTENSION_2015
    : guideline === "ESC/ERS 2022"
    ? PULMONARY_HYPERTENSION_2022
    : null;
  if (tables === null) {
    throw choiceError(where, "guideline", ["ESC/ERS 2015", "ESC/ERS 2022"], guideline);
  }
  return otherEchoSigns ? tables.withOtherSigns : tables.withoutOtherSigns;
}

/**
 * Every guideline severity table of this module, in the order of the valves and editions: aortic
 * stenosis (2009, 2017), mitral stenosis (2009 area and gradient, 2014 and 2020 stages),
 * regurgitation (mitral, aortic 2017) and pulmonary hypertension (2015, 2022). The adult
 * reference limits make their own tables (`adultSeverityTable`).
 *
 * @example
 * ```ts
 * import { GUIDELINE_SEVERITY_TABLES, MITRAL_STENOSIS_STAGES_2020 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(GUIDELINE_SEVERITY_TABLES.includes(MITRAL_STENOSIS_STAGES_2020));
 * // 5 + 5 aortic stenosis, 4 mitral stenosis, 3 + 3 regurgitation, 2 + 2 pulmonary hypertension
 * assert.equal(GUIDELINE_SEVERITY_TABLES.length, 24);
 * ```
 */
export const GUIDELINE_SEVERITY_TABLES: readonly SeverityTable[] = Object.freeze([
  ...Object.values(AORTIC_STENOSIS_2009),
  ...Object.values(AORTIC_STENOSIS_2017),
  MITRAL_STENOSIS_AREA_2009,
  MITRAL_STENOSIS_MEAN_GRADIENT_2009,
  MITRAL_STENOSIS_STAGES_2014,
  MITRAL_STENOSIS_STAGES_2020,
  ...Object.values(MITRAL_REGURGITATION_2017),
  ...Object.values(AORTIC_REGURGITATION_2017),
  ...Object.values(PULMONARY_HYPERTENSION_2015),
  ...Object.values(PULMONARY_HYPERTENSION_2022),
]);
