/**
 * Shared boundaries and shared tracings: measurements that share a caliper or a traced envelope
 * share its error, so their uncertainties are correlated. Septal thickness, LV internal diameter
 * and posterior wall thickness measured on one line share two boundaries; a peak velocity, a VTI
 * and a mean gradient traced on one Doppler envelope share the tracing's relative error. Each
 * model returns `{ inputs, correlations }` ready for `propagate`.
 *
 * @module
 */
import { defineArguments } from "../core/calculation.ts";
import { choiceError, issueError, renderIssue } from "../core/issues.ts";
import type { Calculation, ValidationIssue } from "../core/types.ts";
import { checkValue, quantityField, validateInputs } from "../core/validate.ts";
import {
  BOUNDARY_PLACEMENT_UNCERTAINTY,
  RELATIVE_STANDARD_UNCERTAINTY,
} from "../quantities/uncertainty.ts";
import { lvMassLinear } from "../chamber/linear.ts";
import { LANG_2015 } from "../citations.ts";
import type { CorrelationPair } from "../uncertainty/correlation.ts";
import { normal, type NormalInput } from "../uncertainty/distributions.ts";
import { JCGM_100 } from "./citations.ts";
import { type ModelProvenance, notAnObject, withModelDisplay } from "./shared.ts";

/** The names of the three linear dimensions, as {@linkcode lvMassLinear} and the other linear
 * LV calculations name them. */
export type LinearDimensionName =
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm";

/** The result of {@linkcode sharedBoundaryInputs}. */
export interface SharedBoundaryInputs extends ModelProvenance {
  /** The three dimensions as normal inputs, named as the linear LV calculations name them. */
  readonly inputs: { readonly [K in LinearDimensionName]: NormalInput };
  /** Their correlations (septum–LVID and LVID–posterior wall; septum–posterior wall is zero). */
  readonly correlations: readonly CorrelationPair[];
  /** The covariance matrix of the three dimensions, cm², in the order of `names`. */
  readonly covariance: readonly (readonly number[])[];
  /** The order of the covariance matrix. */
  readonly names: readonly LinearDimensionName[];
}

const WHERE = "Shared boundaries";

const boundary = (label: string, description: string) => ({
  quantity: BOUNDARY_PLACEMENT_UNCERTAINTY,
  label,
  description,
});

const BOUNDARY_ARGUMENTS = defineArguments(WHERE, {
  septalThicknessDiastoleCm: lvMassLinear.inputs.septalThicknessDiastoleCm,
  lvInternalDiameterDiastoleCm: lvMassLinear.inputs.lvInternalDiameterDiastoleCm,
  posteriorWallThicknessDiastoleCm: lvMassLinear.inputs.posteriorWallThicknessDiastoleCm,
  septumRightSideMm: boundary(
    "Septum, right-ventricular side (u₁)",
    "Placement uncertainty of the boundary between RV cavity and septum",
  ),
  septumLeftSideMm: boundary(
    "Septum, left-ventricular side (u₂)",
    "Placement uncertainty of the boundary between septum and LV cavity",
  ),
  posteriorEndocardiumMm: boundary(
    "Posterior wall endocardium (u₃)",
    "Placement uncertainty of the boundary between LV cavity and posterior wall",
  ),
  posteriorEpicardiumMm: boundary(
    "Posterior wall epicardium (u₄)",
    "Placement uncertainty of the outer boundary of the posterior wall",
  ),
});

/** What {@linkcode sharedBoundaryInputs} takes: the three dimensions (cm) and the four boundary
 * placement uncertainties (mm), e.g. each `caliperPlacement(…).boundaryUncertaintyMm`. */
export interface SharedBoundaryArguments {
  /** Septal thickness at end-diastole, cm. */
  readonly septalThicknessDiastoleCm: number | string;
  /** LV internal diameter at end-diastole, cm. */
  readonly lvInternalDiameterDiastoleCm: number | string;
  /** Posterior wall thickness at end-diastole, cm. */
  readonly posteriorWallThicknessDiastoleCm: number | string;
  /** u₁, septum right side, mm. */
  readonly septumRightSideMm: number | string;
  /** u₂, septum left side, mm. */
  readonly septumLeftSideMm: number | string;
  /** u₃, posterior wall endocardium, mm. */
  readonly posteriorEndocardiumMm: number | string;
  /** u₄, posterior wall epicardium, mm. */
  readonly posteriorEpicardiumMm: number | string;
}

/** The correlation of two inputs from their covariance, omitted where either is exact. */
function pair(a: string, b: string, cov: number, ua: number, ub: number): CorrelationPair[] {
  return cov !== 0 && ua > 0 && ub > 0 ? [[a, b, cov / (ua * ub)]] : [];
}

/**
 * Septal thickness, LV internal diameter and posterior wall thickness measured on one M-mode or
 * 2D line, from the placement uncertainty of their four boundaries B₁ (septum, RV side), B₂
 * (septum, LV side), B₃ (posterior wall endocardium) and B₄ (epicardium): IVS = B₂ − B₁,
 * LVID = B₃ − B₂, PW = B₄ − B₃, so neighbours share a boundary and their errors are negatively
 * correlated.
 *
 * Formulas (boundaries placed independently, u₁…u₄):
 * var(IVS) = u₁² + u₂²; var(LVID) = u₂² + u₃²; var(PW) = u₃² + u₄²;
 * cov(IVS, LVID) = −u₂²; cov(LVID, PW) = −u₃²; cov(IVS, PW) = 0.
 * Check: IVS + LVID + PW = B₄ − B₁, so u(IVS + LVID + PW) = √(u₁² + u₄²).
 *
 * Source: JCGM 100:2008 eq. (13) and §5.2 (covariance of quantities computed from common
 * inputs); the linear measurements, Lang et al. 2015.
 *
 * @param dimensions The three dimensions (cm) and four boundary uncertainties (mm).
 * @returns `{ inputs, correlations }` for `propagate(lvMassLinear, inputs, { correlations })`
 * (or {@linkcode lvGeometryProbabilities}, whose Monte Carlo accepts correlated normal inputs),
 * with the covariance matrix; it displays itself.
 * @throws {TypeError} For a missing or mistyped value.
 * @throws {RangeError} For a dimension or uncertainty outside its valid range.
 *
 * @example The sum IVS + LVID + PW keeps only the outer boundaries
 * ```ts
 * import { sharedBoundaryInputs } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const s = sharedBoundaryInputs({
 *   septalThicknessDiastoleCm: 1.1, lvInternalDiameterDiastoleCm: 5, posteriorWallThicknessDiastoleCm: 1,
 *   septumRightSideMm: 0.3, septumLeftSideMm: 0.4, posteriorEndocardiumMm: 0.4, posteriorEpicardiumMm: 0.3,
 * });
 * const sum = s.covariance.flat().reduce((a, b) => a + b, 0); // var of the sum, cm²
 * assert.ok(Math.abs(Math.sqrt(sum) - Math.hypot(0.03, 0.03)) < 1e-12);
 * ```
 */
export function sharedBoundaryInputs(dimensions: SharedBoundaryArguments): SharedBoundaryInputs {
  if (typeof dimensions !== "object" || dimensions === null) {
    throw notAnObject(WHERE, "dimensions", dimensions, "as an object of dimensions and boundaries");
  }
  const { values: x, flags } = validateInputs(BOUNDARY_ARGUMENTS, dimensions);
  const [u1, u2, u3, u4] = [
    x.septumRightSideMm,
    x.septumLeftSideMm,
    x.posteriorEndocardiumMm,
    x.posteriorEpicardiumMm,
  ].map((u) => u / 10) as [number, number, number, number];
  const names: LinearDimensionName[] = [
    "septalThicknessDiastoleCm",
    "lvInternalDiameterDiastoleCm",
    "posteriorWallThicknessDiastoleCm",
  ];
  const covariance = [
    [u1 ** 2 + u2 ** 2, -(u2 ** 2), 0],
    [-(u2 ** 2), u2 ** 2 + u3 ** 2, -(u3 ** 2)],
    [0, -(u3 ** 2), u3 ** 2 + u4 ** 2],
  ];
  const sd = covariance.map((row, i) => Math.sqrt(row[i]!)) as [number, number, number];
  const result: SharedBoundaryInputs = {
    inputs: {
      septalThicknessDiastoleCm: normal(x.septalThicknessDiastoleCm, sd[0]),
      lvInternalDiameterDiastoleCm: normal(x.lvInternalDiameterDiastoleCm, sd[1]),
      posteriorWallThicknessDiastoleCm: normal(x.posteriorWallThicknessDiastoleCm, sd[2]),
    },
    correlations: [
      ...pair(names[0]!, names[1]!, covariance[0]![1]!, sd[0], sd[1]),
      ...pair(names[1]!, names[2]!, covariance[1]![2]!, sd[1], sd[2]),
    ],
    covariance,
    names,
    notes: [
      "IVS = B₂ − B₁, LVID = B₃ − B₂, PW = B₄ − B₃ on one line; the four boundaries placed independently (JCGM 100:2008 eq. (13))",
      "Neighbouring dimensions share a boundary: an error that thickens the septum thins the cavity, so cov(IVS, LVID) = −u₂² and cov(LVID, PW) = −u₃²",
    ],
    warnings: flags,
    cautions: [],
    citations: [JCGM_100, LANG_2015],
  };
  const labels = ["IVSd", "LVIDd", "LVPWd"];
  return withModelDisplay(
    result,
    `${WHERE}: covariance of the linear dimensions (cm²)`,
    ["", ...labels.map((l) => `${l} (cm²)`), "u (cm)"],
    covariance.map((row, i) => [labels[i]!, ...row.map((c) => ({ u: c })), { u: sd[i]! }]),
  );
}

/** One measurement traced on a shared envelope. */
export interface TracedMeasurement {
  /** The measured value, in the unit of the calculation's input (or a quantity string). */
  readonly value: number | string;
  /** Its own relative standard uncertainty u_i, %, independent of the others'. */
  readonly independentPercent: number;
  /** The power k with which it follows the traced velocity (1 for a peak velocity or a VTI, 2
   * for a gradient). @default 1 */
  readonly power?: 1 | 2;
}

/** The result of {@linkcode sharedTracingInputs}. */
export interface SharedTracingInputs extends ModelProvenance {
  /** The measurements as normal inputs, by the calculation's input names. */
  readonly inputs: Readonly<Record<string, NormalInput>>;
  /** Their correlations, one pair per two measurements. */
  readonly correlations: readonly CorrelationPair[];
  /** The relative standard uncertainty of each, %. */
  readonly relativePercent: Readonly<Record<string, number>>;
}

const TRACING_WHERE = "Shared tracing";
const POWERS = ["1", "2"];

/**
 * Measurements traced from one Doppler envelope (peak velocity, VTI, mean gradient): a common
 * relative tracing error (the envelope traced a little outside or inside its true edge) shared
 * by all, plus an independent part for each.
 *
 * Model: the traced velocity is v·(1 + ε_c), ε_c of standard uncertainty u_c, so a measurement
 * proportional to vᵏ has the common relative error k·ε_c; measurement i adds its own u_i. Then
 * u_r,i = √((kᵢ·u_c)² + u_i²) and r_ij = kᵢ·kⱼ·u_c² / (u_r,i·u_r,j); for kᵢ = kⱼ = 1,
 * r = u_c²/√((u_c² + u_i²)(u_c² + u_j²)).
 *
 * Source: JCGM 100:2008 §5.2 and F.1.2.3 (correlation from a common systematic effect); the
 * split into a common and an independent part is common practice, no source.
 *
 * @param calc The calculation the inputs are for (names and ranges are checked against it).
 * @param tracing The common relative uncertainty u_c (%) and, by input name, each measurement.
 * @returns `{ inputs, correlations }` for `propagate(calc, inputs, { correlations })`; it
 * displays itself.
 * @throws {TypeError} For a name that is not an input of `calc`, fewer than two measurements, a
 * mistyped value or a power other than 1 or 2.
 * @throws {RangeError} For a value or a percentage outside its valid range.
 *
 * @example A peak velocity and a VTI from one CW envelope: r = 9/√(13·18)
 * ```ts
 * import { chain, continuityValveArea, sharedTracingInputs, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const calc = chain([simplifiedBernoulli, continuityValveArea]);
 * const t = sharedTracingInputs(calc, { commonPercent: 3, measurements: {
 *   peakVelocity: { value: 4.2, independentPercent: 2 },
 *   avVtiCm: { value: 100, independentPercent: 3 },
 * } });
 * assert.ok(Math.abs(t.correlations[0]![2] - 9 / Math.sqrt(13 * 18)) < 1e-12);
 * ```
 */
export function sharedTracingInputs(
  calc: Calculation,
  tracing: {
    readonly commonPercent: number | string;
    readonly measurements: Readonly<Record<string, TracedMeasurement>>;
  },
): SharedTracingInputs {
  if (
    typeof tracing !== "object" || tracing === null || typeof tracing.measurements !== "object" ||
    tracing.measurements === null
  ) {
    throw notAnObject(
      TRACING_WHERE,
      "tracing",
      tracing,
      "as an object { commonPercent, measurements: { inputName: { value, independentPercent, power? } } }",
    );
  }
  const names = Object.keys(tracing.measurements);
  const issues: ValidationIssue[] = [];
  const context = { where: TRACING_WHERE };
  const relative = quantityField(RELATIVE_STANDARD_UNCERTAINTY);
  const common = checkValue("commonPercent", relative, tracing.commonPercent, context);
  for (const issue of common.issues) issues.push(issue);
  if (names.length < 2) {
    issues.push({
      kind: "type",
      severity: "error",
      where: TRACING_WHERE,
      field: "measurements",
      received: `${names.length} measurement${names.length === 1 ? "" : "s"}`,
      expected: "at least 2 measurements traced on one envelope",
    });
  }
  const read = names.map((name) => {
    const def = calc.inputs[name];
    const m = tracing.measurements[name]!;
    if (def === undefined) {
      issues.push({
        kind: "unknown",
        severity: "error",
        where: TRACING_WHERE,
        field: name,
        received: `an input of no such name in '${calc.id}'`,
        expected: `one of ${calc.inputNames.join(", ")}`,
      });
      return null;
    }
    if (m.power !== undefined && !POWERS.includes(String(m.power))) {
      throw choiceError(TRACING_WHERE, `${name}.power`, POWERS, m.power);
    }
    const value = checkValue(name, def, m.value, context);
    const own = checkValue(`${name}.independentPercent`, relative, m.independentPercent, context);
    for (const issue of [...value.issues, ...own.issues]) issues.push(issue);
    return { name, value: value.value, own: own.value, power: m.power ?? 1 };
  });
  if (issues.some((i) => i.severity === "error")) throw issueError(issues);
  const uc = common.value!;
  const rows = read.map((r) => {
    const rel = Math.hypot(r!.power * uc, r!.own!);
    return { ...r!, value: r!.value!, relative: rel };
  });
  const inputs: Record<string, NormalInput> = {};
  const relativePercent: Record<string, number> = {};
  for (const r of rows) {
    inputs[r.name] = normal(r.value, (Math.abs(r.value) * r.relative) / 100);
    relativePercent[r.name] = r.relative;
  }
  const correlations: CorrelationPair[] = [];
  for (let i = 0; i < rows.length; i++) {
    for (let j = i + 1; j < rows.length; j++) {
      const a = rows[i]!, b = rows[j]!;
      if (uc > 0 && a.relative > 0 && b.relative > 0) {
        correlations.push([
          a.name,
          b.name,
          (a.power * b.power * uc * uc) / (a.relative * b.relative),
        ]);
      }
    }
  }
  const result: SharedTracingInputs = {
    inputs,
    correlations,
    relativePercent,
    notes: [
      "One common relative tracing error u_c shared by every measurement of the envelope (k·u_c for a measurement ∝ vᵏ) plus an independent part u_i each: r_ij = kᵢkⱼu_c²/(u_r,i·u_r,j) (JCGM 100:2008 §5.2; the split is common practice, no source)",
      "The percentages are the user's: the model says how they combine, not how large they are",
    ],
    warnings: issues.map(renderIssue),
    cautions: [],
    citations: [JCGM_100],
  };
  return withModelDisplay(
    result,
    `${TRACING_WHERE}: measurements from one envelope, common u_c = ${uc} %`,
    ["Input", "Value", "Power k", "Own u_i (%)", "Total u_r (%)"],
    rows.map((r) => [r.name, r.value, String(r.power), { u: r.own! }, { u: r.relative }]),
  );
}
