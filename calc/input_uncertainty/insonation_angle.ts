/**
 * The insonation angle as an uncertain input, by two models of where the flow may point: within a
 * cone around the beam in three dimensions (the default), or within an interval in the image
 * plane; and the two side by side, with the average shortfall each predicts for a Doppler
 * velocity and the Bernoulli gradient.
 *
 * @module
 */
import { cautionsOf, defineArguments } from "../core/calculation.ts";
import { choiceError } from "../core/issues.ts";
import { validateInputs } from "../core/validate.ts";
import { INSONATION_ANGLE } from "../quantities/ultrasound.ts";
import { angleCorrectedVelocity } from "../physics/doppler.ts";
import { insonationAngleEffect } from "../doppler/angle.ts";
import { HATLE_ANGELSEN_1985, QUINONES_2002 } from "../citations.ts";
import {
  type ConeInput,
  insonationCone,
  rectangular,
  type RectangularInput,
} from "../uncertainty/distributions.ts";
import { type ModelProvenance, notAnObject, withModelDisplay } from "./shared.ts";
import { formatNumber } from "../../display/format.ts";

/** How the flow direction may vary around the beam: "cone", any direction within a cone of
 * half-angle θmax in three dimensions, equally likely over solid angle; "inPlane", any angle in
 * [−θmax, θmax] within the image plane, equally likely. */
export type InsonationAngleModelName = "cone" | "inPlane";

const MODELS: readonly InsonationAngleModelName[] = ["cone", "inPlane"];

const MODEL_LABELS: Readonly<Record<InsonationAngleModelName, string>> = {
  cone: "3-D cone (flow direction unknown in three dimensions)",
  inPlane: "In the image plane (angle known to lie in the plane)",
};

const MAX_ANGLE = {
  quantity: INSONATION_ANGLE,
  label: "Largest insonation angle",
  description: "Half-angle θmax of the cone or interval of flow directions around the beam",
  valid: { min: 0, max: 90, minExclusive: true, maxExclusive: true },
  typical: { min: 0, max: 20, minExclusive: true },
  reason: "a spread of directions needs a positive half-angle; at 90° the display reads zero",
};

const MODEL_ARGUMENTS = defineArguments("Insonation angle model", { maxDeg: MAX_ANGLE });
const COMPARISON_ARGUMENTS = defineArguments("Insonation angle models compared", {
  maxDeg: MAX_ANGLE,
  displayedVelocity: insonationAngleEffect.inputs.measuredVelocity,
});

function checkModel(where: string, model: unknown): InsonationAngleModelName {
  if (!MODELS.includes(model as InsonationAngleModelName)) {
    throw choiceError(where, "model", MODELS, model);
  }
  return model as InsonationAngleModelName;
}

/** Options of {@linkcode insonationAngleModel} and {@linkcode angleCosineMoments}. */
export interface InsonationAngleModelOptions {
  /** Half-angle θmax, degrees (or an angle string), in (0, 90). */
  readonly maxDeg: number | string;
  /** The model of the flow direction. @default "cone" */
  readonly model?: InsonationAngleModelName;
}

/**
 * The insonation angle as an uncertain input for `propagate`.
 *
 * The DEFAULT is the cone: in cardiac Doppler the direction of a jet is unknown in three
 * dimensions (the image shows one plane; the jet may leave it), so every direction within θmax of
 * the beam is taken as equally likely over solid angle, θ having density sin θ/(1 − cos θmax) on
 * [0, θmax] ({@linkcode insonationCone}). Use "inPlane" (θ uniform on [−θmax, θmax], a
 * rectangular distribution) only when the flow is known to lie in the image plane, e.g. a vessel
 * imaged along its length; it is signed, for a signed angle input such as
 * {@linkcode insonationAngleEffect}'s `angleDeg`. The cone puts less weight near 0° than the
 * in-plane model, so it predicts a larger shortfall for the same θmax.
 *
 * Source: the cone is elementary solid geometry (uniform over solid angle); the angle dependence
 * of the Doppler velocity, Hatle & Angelsen 1985 and Quiñones et al. 2002.
 *
 * @param options θmax and the model.
 * @returns `insonationCone(θmax)` or `rectangular(−θmax, θmax)`, in degrees.
 * @throws {TypeError} For a missing or mistyped θmax, or an unknown model.
 * @throws {RangeError} For θmax outside (0°, 90°).
 *
 * @example A displayed 4 m/s jet and a ±15° cone of directions, by Monte Carlo
 * ```ts
 * import { insonationAngleEffect, insonationAngleModel, propagate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(insonationAngleEffect,
 *   { measuredVelocity: 4, angleDeg: insonationAngleModel({ maxDeg: 15 }) },
 *   { method: "monteCarlo", trials: 50_000, seed: 3 });
 * // E[1 − cos θ] over the cone = (1 − cos 15°)/2 = 1.70 % (closed form)
 * assert.ok(Math.abs(r.outputs.velocityUnderestimationPercent.value - 1.704) < 0.02);
 * ```
 */
export function insonationAngleModel(
  options: InsonationAngleModelOptions,
): ConeInput | RectangularInput {
  const where = MODEL_ARGUMENTS.title;
  if (typeof options !== "object" || options === null) {
    throw notAnObject(where, "options", options, "as an object { maxDeg, model? }");
  }
  const model = checkModel(where, options.model ?? "cone");
  const { maxDeg } = validateInputs(MODEL_ARGUMENTS, { maxDeg: options.maxDeg }).values;
  return model === "cone" ? insonationCone(maxDeg) : rectangular(-maxDeg, maxDeg);
}

/** The averages over an angle model that set the mean Doppler shortfall. */
export interface AngleCosineMoments {
  /** The model. */
  readonly model: InsonationAngleModelName;
  /** θmax, degrees. */
  readonly maxDeg: number;
  /** E[cos θ]: the mean displayed velocity over the true velocity. */
  readonly meanCos: number;
  /** E[cos² θ]: the mean displayed gradient over the true gradient. */
  readonly meanCosSquared: number;
}

/**
 * E[cos θ] and E[cos² θ] over an angle model, in closed form.
 *
 * Formulas (m = θmax, c = cos m):
 * - in-plane, θ uniform on [−m, m]: E[cos θ] = sin m/m; E[cos² θ] = ½ + sin 2m/(4m);
 * - cone, density sin θ/(1 − c) on [0, m]: E[cos θ] = (1 + c)/2; E[cos² θ] = (1 + c + c²)/3.
 *
 * Source: integrals of the densities (elementary calculus; checked against numerical
 * integration in the tests).
 *
 * @param options θmax and the model.
 * @returns The two averages.
 * @throws {TypeError | RangeError} As {@linkcode insonationAngleModel}.
 *
 * @example θmax = 60°: the cone gives E[cos θ] = 3/4 exactly
 * ```ts
 * import { angleCosineMoments } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const m = angleCosineMoments({ maxDeg: 60, model: "cone" });
 * assert.ok(Math.abs(m.meanCos - 0.75) < 1e-12); // (1 + ½)/2
 * assert.ok(Math.abs(m.meanCosSquared - 7 / 12) < 1e-12); // (1 + ½ + ¼)/3
 * ```
 */
export function angleCosineMoments(options: InsonationAngleModelOptions): AngleCosineMoments {
  const where = MODEL_ARGUMENTS.title;
  if (typeof options !== "object" || options === null) {
    throw notAnObject(where, "options", options, "as an object { maxDeg, model? }");
  }
  const model = checkModel(where, options.model ?? "cone");
  const { maxDeg } = validateInputs(MODEL_ARGUMENTS, { maxDeg: options.maxDeg }).values;
  const m = (maxDeg * Math.PI) / 180;
  const c = Math.cos(m);
  return model === "cone"
    ? { model, maxDeg, meanCos: (1 + c) / 2, meanCosSquared: (1 + c + c * c) / 3 }
    : { model, maxDeg, meanCos: Math.sin(m) / m, meanCosSquared: 0.5 + Math.sin(2 * m) / (4 * m) };
}

/** One model's row of {@linkcode insonationAngleComparison}. */
export interface InsonationAngleModelRow extends AngleCosineMoments {
  /** What a reader sees. */
  readonly label: string;
  /** Mean shortfall of the displayed velocity, 100·(1 − E[cos θ]) %. */
  readonly velocityUnderestimationPercent: number;
  /** Mean shortfall of the displayed gradient, 100·(1 − E[cos² θ]) %. */
  readonly gradientUnderestimationPercent: number;
  /** The true velocity whose display averages the displayed velocity: v/E[cos θ], m/s. */
  readonly trueVelocity: number;
  /** The true gradient whose display averages 4v²: 4v²/E[cos² θ], mmHg. */
  readonly trueGradient: number;
}

/** The result of {@linkcode insonationAngleComparison}. */
export interface InsonationAngleComparison extends ModelProvenance {
  /** θmax, degrees. */
  readonly maxDeg: number;
  /** The displayed velocity, m/s. */
  readonly displayedVelocity: number;
  /** The cone (default) first, then the in-plane model. */
  readonly rows: readonly InsonationAngleModelRow[];
}

/**
 * The cone and in-plane models side by side for one θmax and one displayed velocity: E[cos θ],
 * E[cos² θ], the mean velocity and gradient shortfalls, and the true velocity and gradient whose
 * displays average the displayed values.
 *
 * Formulas: moments from {@linkcode angleCosineMoments}; the velocity through
 * {@linkcode angleCorrectedVelocity}'s formula at the angle θ_v = arccos E[cos θ] (v_true =
 * v/E[cos θ], shortfall 100·(1 − E[cos θ]) %); the gradient through
 * {@linkcode insonationAngleEffect}'s formula at θ_g = arccos √E[cos² θ] (ΔP_true =
 * 4v²/E[cos² θ], shortfall 100·(1 − E[cos² θ]) %).
 *
 * Source: Hatle & Angelsen 1985 (angle dependence); the averages, elementary calculus.
 *
 * @param options θmax (degrees) and the displayed velocity (m/s, > 0).
 * @returns Both models' rows; it displays itself in a notebook.
 * @throws {TypeError} For a missing or mistyped argument.
 * @throws {RangeError} For θmax outside (0°, 90°) or a velocity outside (0, 10] m/s.
 *
 * @example θmax = 20°, 4 m/s displayed
 * ```ts
 * import { insonationAngleComparison } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const [cone, inPlane] = insonationAngleComparison({ maxDeg: 20, displayedVelocity: 4 }).rows;
 * // cone: 100·(1 − (1 + cos 20°)/2) = 3.015 %; in plane: 100·(1 − sin 20°/(π/9)) = 2.018 %
 * assert.ok(Math.abs(cone!.velocityUnderestimationPercent - 3.015) < 1e-3);
 * assert.ok(Math.abs(inPlane!.velocityUnderestimationPercent - 2.018) < 1e-3);
 * ```
 */
export function insonationAngleComparison(options: {
  readonly maxDeg: number | string;
  readonly displayedVelocity: number | string;
}): InsonationAngleComparison {
  const where = COMPARISON_ARGUMENTS.title;
  if (typeof options !== "object" || options === null) {
    throw notAnObject(where, "options", options, "as an object { maxDeg, displayedVelocity }");
  }
  const { values: x, flags } = validateInputs(COMPARISON_ARGUMENTS, options);
  const rows = MODELS.map((model): InsonationAngleModelRow => {
    const moments = angleCosineMoments({ maxDeg: x.maxDeg, model });
    const velocity = angleCorrectedVelocity.formula({
      measuredVelocity: x.displayedVelocity,
      angleDeg: (Math.acos(moments.meanCos) * 180) / Math.PI,
    });
    const gradient = insonationAngleEffect.formula({
      measuredVelocity: x.displayedVelocity,
      angleDeg: (Math.acos(Math.sqrt(moments.meanCosSquared)) * 180) / Math.PI,
    });
    return {
      ...moments,
      label: MODEL_LABELS[model],
      velocityUnderestimationPercent: velocity.underestimationPercent,
      gradientUnderestimationPercent: gradient.gradientUnderestimationPercent,
      trueVelocity: velocity.trueVelocity,
      trueGradient: gradient.trueGradient,
    };
  });
  const result: InsonationAngleComparison = {
    maxDeg: x.maxDeg,
    displayedVelocity: x.displayedVelocity,
    rows,
    notes: [
      "Default model: the cone, because in cardiac Doppler the flow direction in three dimensions is unknown; the in-plane model only when the angle is known to lie in the image plane",
      "Averages over the models by elementary calculus (cone uniform over solid angle; in-plane uniform in angle)",
      "The true values are those whose displays average the displayed values; a single beat's angle may be anywhere in the model",
    ],
    warnings: flags,
    cautions: cautionsOf(insonationAngleEffect),
    citations: [HATLE_ANGELSEN_1985, QUINONES_2002],
  };
  return withModelDisplay(
    result,
    `Insonation angle within ${x.maxDeg}°: velocity ${
      formatNumber(x.displayedVelocity)
    } m/s displayed`,
    [
      "Model",
      "E[cos θ]",
      "E[cos² θ]",
      "Velocity shortfall (%)",
      "Gradient shortfall (%)",
      "True velocity (m/s)",
      "True gradient (mmHg)",
    ],
    rows.map((r) => [
      r.label,
      r.meanCos,
      r.meanCosSquared,
      r.velocityUnderestimationPercent,
      r.gradientUnderestimationPercent,
      r.trueVelocity,
      r.trueGradient,
    ]),
  );
}
