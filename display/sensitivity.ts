/**
 * Notebook displays of sensitivity curves and of the GUM-versus-Monte-Carlo check: labels and
 * units from the quantities, the reference point named, numbers rounded for reading, the
 * cautions below. Computation never depends on them.
 *
 * @module
 */
import type { MimeBundle, SensitivityCurve } from "../calc/core/types.ts";
import type { GumValidation } from "../calc/uncertainty/types.ts";
import { withUnit } from "../calc/core/text.ts";
import { tableBundle } from "./mime.ts";
import { formatNumber, NOT_MEASURED, roundLike } from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";

/** Rows shown at most: the ends and evenly spaced points between them. */
const MAX_ROWS = 21;

/** Indices of at most `max` evenly spaced points of `n`, both ends included. */
function shownIndices(n: number, max: number): number[] {
  if (n <= max) return Array.from({ length: n }, (_, i) => i);
  return Array.from({ length: max }, (_, i) => Math.round((i * (n - 1)) / (max - 1)));
}

/**
 * The MIME bundle of a sensitivity curve: the swept input, the output and its change relative to
 * its value at the reference inputs (the reference point named in the title), at most 21 evenly
 * spaced points with both ends, numbers to four significant digits, the calculation's cautions
 * below.
 *
 * @param curve A result of `sensitivityCurve`.
 * @param cautions Cautions shown below (the calculation's, with the clinical caution).
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { JUPYTER_DISPLAY, sensitivityCurve, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = sensitivityCurve(simplifiedBernoulli, { peakVelocity: 4 }, { vary: "peakVelocity", from: 4, to: 4.4, steps: 2 });
 * const text = String(c[JUPYTER_DISPLAY]()["text/plain"]);
 * // 4·4.4² = 77.44 mmHg, +21 % over 64 mmHg (hand computation)
 * assert.match(text, /reference Peak velocity = 4 m\/s, Peak gradient = 64 mmHg/);
 * assert.match(text, /4\.4\s+77\.44\s+21\.0/);
 * ```
 */
export function displaySensitivityCurve(
  curve: SensitivityCurve,
  cautions: readonly string[] = [],
): MimeBundle {
  const title = `Sensitivity of ${curve.outputLabel} to ${curve.inputLabel} (${curve.title}; ` +
    `reference ${curve.inputLabel} = ${
      withUnit(formatNumber(curve.reference.x), curve.inputUnit)
    }, ` +
    `${curve.outputLabel} = ${withUnit(formatNumber(curve.reference.y), curve.outputUnit)})`;
  const header = [
    labelWithUnit(curve.inputLabel, curve.inputUnit),
    labelWithUnit(curve.outputLabel, curve.outputUnit),
    "Change relative to the reference value (%)",
  ];
  const rows = shownIndices(curve.points.length, MAX_ROWS).map((i) => {
    const p = curve.points[i]!;
    return [
      formatNumber(p.x),
      formatNumber(p.y),
      Number.isFinite(p.relativeChangePercent)
        ? p.relativeChangePercent.toFixed(1).replace("-", "−")
        : NOT_MEASURED,
    ];
  });
  const notes = curve.points.length > MAX_ROWS
    ? [`${MAX_ROWS} of ${curve.points.length} points shown, evenly spaced`]
    : [];
  return tableBundle(title, header, rows, { Notes: notes, Cautions: cautions });
}

/**
 * The MIME bundle of the GUM-versus-Monte-Carlo check (JCGM 101:2008 §8): a row per output with
 * whether the GUM interval is validated, the differences of its ends from the Monte Carlo ones and
 * the numerical tolerance δ, each rounded like δ; the verdicts below.
 *
 * @param checks A result of `validateGumWithMonteCarlo`.
 * @param context Each output's label with its unit (by output name).
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { expressionModel, JUPYTER_DISPLAY, normal, propagate, validateGumWithMonteCarlo } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "a + b",
 *   inputs: { a: { unit: "mm", description: "a", range: { min: -9, max: 9 } }, b: { unit: "mm", description: "b", range: { min: -9, max: 9 } } },
 *   output: { name: "y", unit: "mm", description: "Sum" },
 * });
 * const inputs = { a: normal(0, 1), b: normal(0, 1) };
 * const checks = validateGumWithMonteCarlo(propagate(model, inputs),
 *   propagate(model, inputs, { method: "monteCarlo", seed: 2 }), 1);
 * // a linear model: the GUM interval is exact, so Monte Carlo validates it (JCGM 101 §8)
 * assert.match(String(checks[JUPYTER_DISPLAY]()["text/plain"]), /Sum \(mm\)\s+yes/);
 * ```
 */
export function displayGumValidation(
  checks: readonly GumValidation[],
  context: { readonly labels: Readonly<Record<string, string>> },
): MimeBundle {
  const header = [
    "Output",
    "GUM interval validated",
    "Lower end difference",
    "Upper end difference",
    "Tolerance δ",
  ];
  const rows = checks.map((c) => [
    context.labels[c.output] ?? c.output,
    c.validated ? "yes" : "no",
    roundLike(c.lowDifference, c.tolerance),
    roundLike(c.highDifference, c.tolerance),
    roundLike(c.tolerance, c.tolerance),
  ]);
  return tableBundle(
    "GUM law checked against Monte Carlo (JCGM 101:2008 §8)",
    header,
    rows,
    { Verdicts: checks.map((c) => c.verdict) },
  );
}
