/**
 * Notebook displays of uncertain values and propagations: value ± U with k and coverage, rounded
 * by the metrology rule (JCGM 100:2008 §7.2.6), the budget with every source's label and unit,
 * warnings and cautions; HTML with a plain-text twin.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type { BudgetRow, Propagation, UncertainValue } from "../calc/uncertainty/types.ts";
import { formatUnit } from "../calc/core/text.ts";
import { escapeHtml, htmlNotes, htmlTable, textTable } from "./mime.ts";
import {
  formatInterval,
  formatNumber,
  formatPlusMinus,
  formatResolution,
  formatShare,
  roundLike,
} from "./format.ts";

import { JUPYTER_DISPLAY } from "./mime.ts";

export { JUPYTER_DISPLAY };

/** Freezes an uncertain value with its notebook display attached (a getter-safe copy: lazy
 * intervals of Monte Carlo values stay lazy). */
export function withValueDisplay(value: UncertainValue): UncertainValue {
  Object.defineProperty(value, JUPYTER_DISPLAY, {
    value: () => displayValue(value),
    enumerable: false,
  });
  return Object.freeze(value);
}

/**
 * A label with its unit for a table header or an axis: "LVOT diameter (cm)", "EF (%)", or the
 * label alone for a dimensionless quantity.
 *
 * @example
 * ```ts
 * import { labelWithUnit } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(labelWithUnit("Aortic valve area", "cm^2"), "Aortic valve area (cm²)");
 * assert.equal(labelWithUnit("Z-score", "1"), "Z-score");
 * ```
 */
export function labelWithUnit(label: string, unit: string): string {
  const u = formatUnit(unit);
  return u === "" ? label : `${label} (${u})`;
}

/**
 * One line for an uncertain value: "Aortic valve area = 0.79 ± 0.12 cm² (k = 2.05, p = 95 %)"
 * for the GUM law; for Monte Carlo "… = 0.79 cm², u = 0.06 cm², 95 % interval [0.68, 0.91] cm²".
 *
 * @example
 * ```ts
 * import { formatUncertainValue, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) });
 * // u = 8·4·0.1 = 3.2 mmHg, U = 1.96·3.2 = 6.3 mmHg (JCGM 100 eq. (10), hand-checkable)
 * assert.equal(formatUncertainValue(r.outputs.gradient),
 *   "Peak gradient = 64.0 ± 6.3 mmHg (k = 1.96, p = 95 %)");
 * ```
 */
export function formatUncertainValue(v: UncertainValue): string {
  const p = formatNumber(v.coverage * 100, 4);
  if (v.method === "gum" && v.expandedUncertainty !== null) {
    if (v.standardUncertainty === 0) return `${v.label} = ${exactText(v)}`;
    return `${v.label} = ${formatPlusMinus(v.value, v.expandedUncertainty, v.unit)} (k = ${
      v.coverageFactor!.toFixed(2)
    }, p = ${p} %)`;
  }
  const u = v.standardUncertainty;
  return `${v.label} = ${roundLike(v.value, u)}${unitSuffix(v.unit)}, u = ${roundLike(u, u)}${
    unitSuffix(v.unit)
  }, ${p} % interval ${formatInterval(v.interval, u, v.unit)}`;
}

function unitSuffix(unit: string): string {
  const u = formatUnit(unit);
  return u === "" ? "" : u === "°" ? "°" : ` ${u}`;
}

/** An exact value (no uncertainty) to its quantity's display resolution, like any value shown
 * without an uncertainty ("0.9989", never "0.998889"). */
function exactText(v: UncertainValue): string {
  return `${formatResolution(v.value, v.quantity.resolution)}${unitSuffix(v.unit)} (exact)`;
}

/**
 * Effective degrees of freedom as shown: one decimal below 100, whole above (ν_eff only sets the
 * coverage factor, which no longer changes in the reported digits there), "∞" for an infinite
 * and "not defined" for an undefined one.
 *
 * @example
 * ```ts
 * import { formatDof } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatDof(3.41), "3.4");
 * assert.equal(formatDof(20993.14), "20993");
 * assert.equal(formatDof(6.5e45), "∞"); // a Type A share that vanishes against Type B ones
 * assert.equal(formatDof(null), "not defined");
 * ```
 */
export function formatDof(dof: number | null): string {
  if (dof === null || Number.isNaN(dof)) return "not defined";
  // beyond a million degrees of freedom the t distribution is the normal one to 1e-6 in k
  if (!Number.isFinite(dof) || dof >= 1e6) return "∞";
  return dof < 100 ? dof.toFixed(1) : String(Math.round(dof));
}

/** The header of a budget table (the columns of {@linkcode budgetRows}). */
export const BUDGET_HEADER: readonly string[] = [
  "Source",
  "Distribution",
  "Estimate xᵢ",
  "u(xᵢ)",
  "νᵢ",
  "Sensitivity cᵢ",
  "cᵢ·u(xᵢ)",
  "Share of u²",
];

const DISTRIBUTION_NAMES: Record<string, string> = {
  normal: "normal",
  rectangular: "rectangular",
  triangular: "triangular",
  arcsine: "arcsine (U-shaped)",
  studentT: "t (Type A)",
  cone: "3-D cone (∝ sin θ)",
  exact: "exact",
};

/** The budget of a value as table rows, rounded for reading. */
export function budgetRows(v: UncertainValue): string[][] {
  return v.budget.map((b: BudgetRow) => [
    labelWithUnit(b.label, b.unit),
    DISTRIBUTION_NAMES[b.distribution] ?? b.distribution,
    roundLike(b.estimate, b.standardUncertainty),
    // u to two significant digits and the estimate to its decimal place (JCGM 100:2008 §7.2.6)
    roundLike(b.standardUncertainty, b.standardUncertainty),
    Number.isFinite(b.dof) ? formatNumber(b.dof, 3) : "∞",
    `${formatNumber(b.sensitivity, 3)}${sensitivityUnit(v.unit, b.unit)}`,
    // contributions to the decimal place of the combined u (GUM 7.2.6): a contribution that is
    // zero but for rounding error reads 0.00, not 0.0000000000045
    `${roundLike(b.contribution, v.standardUncertainty)}${unitSuffix(v.unit)}`,
    formatShare(b.share),
  ]);
}

function sensitivityUnit(output: string, input: string): string {
  const o = formatUnit(output), i = formatUnit(input);
  if (o === "" && i === "") return "";
  if (i === "") return ` ${o}`;
  // a compound input unit is a denominator in parentheses: mmHg/(m/s), never mmHg/m/s
  return ` ${o === "" ? "1" : o}/${/[/·]/.test(i) ? `(${i})` : i}`;
}

/** The MIME bundle of one uncertain value (its line, and its budget for the GUM law). */
export function displayValue(v: UncertainValue): MimeBundle {
  const line = formatUncertainValue(v);
  const rows = budgetRows(v);
  return {
    "text/plain": rows.length > 0 ? `${line}\n${textTable(BUDGET_HEADER, rows)}` : line,
    "text/html": `<div><p><b>${escapeHtml(line)}</b></p>${
      rows.length > 0 ? htmlTable(BUDGET_HEADER, rows) : ""
    }</div>`,
  };
}

/** The MIME bundle of a propagation: a line per output, its budget, warnings and cautions. */
export function displayPropagation(result: Propagation): MimeBundle {
  const mc = result.monteCarlo;
  const method = result.method === "gum"
    ? "GUM law of propagation (JCGM 100:2008)"
    : `Monte Carlo (JCGM 101:2008), ${mc!.trials} trials${
      mc!.adaptive ? ` in ${mc!.adaptive.sequences} adaptive sequences` : ""
    }, seed ${mc!.seed}`;
  const title = `${result.calculation.title}: ${method}`;
  const text: string[] = [title];
  const html: string[] = [`<div><p style="margin:4px 0"><b>${escapeHtml(title)}</b></p>`];
  for (const name of result.outputNames) {
    const v = result.outputs[name]!;
    const adequate = v.firstOrderAdequate
      ? ""
      : " — NOT ADEQUATE: first-order result, see the warnings; use Monte Carlo";
    const line = formatUncertainValue(v) + adequate;
    const extra = v.method === "gum" && v.standardUncertainty > 0
      ? `u = ${roundLike(v.standardUncertainty, v.standardUncertainty)}${
        unitSuffix(v.unit)
      }, ν_eff = ${formatDof(v.effectiveDof)}`
      : "";
    const rows = budgetRows(v);
    text.push(
      line,
      ...(extra ? [extra] : []),
      ...(rows.length ? [textTable(BUDGET_HEADER, rows)] : []),
    );
    html.push(
      `<p style="margin:6px 0 2px"><b>${escapeHtml(line)}</b>${
        extra ? `<br>${escapeHtml(extra)}` : ""
      }</p>`,
      rows.length ? htmlTable(BUDGET_HEADER, rows) : "",
    );
  }
  for (const w of result.warnings) text.push(`Warning: ${w}`);
  for (const c of result.cautions) text.push(`Caution: ${c}`);
  html.push(
    htmlNotes("Warnings", result.warnings),
    htmlNotes("Cautions", result.cautions),
    "</div>",
  );
  return { "text/plain": text.join("\n"), "text/html": html.join("") };
}
