/**
 * Notebook display of uncertainty results: value ± U with k and coverage (rounded per
 * JCGM 100:2008 §7.2.6), an HTML budget table and a text/plain fallback.
 *
 * @module
 */
import {
  escapeHtml,
  formatNumber,
  formatUnit,
  htmlNotes,
  htmlTable,
  type MimeBundle,
  textTable,
} from "../core/display.ts";
import { roundForReport } from "./rounding.ts";
import type { GumOutput, GumResult } from "./gum.ts";
import type { MonteCarloResult } from "./montecarlo.ts";

/** "y ± U unit (k = 2.00, p = 95 %)" for a GUM output, rounded per JCGM 100 §7.2.6. *
 * @example
 * ```ts
 * import { formatGumOutput, gum, normal, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = gum(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) });
 * // u = 8·4·0.1 = 3.2 mmHg, U = 1.96·3.2 = 6.3 mmHg (JCGM 100 eq. (10), hand-checkable)
 * assert.equal(formatGumOutput(r.outputs.gradient, r.coverage), "gradient = 64.0 ± 6.3 mmHg (k = 1.96, p = 95 %)");
 * ```
 */
export function formatGumOutput(o: GumOutput, coverage: number): string {
  const r = roundForReport(o.value, o.expandedUncertainty);
  const unit = o.unit === "1" ? "" : ` ${formatUnit(o.unit)}`;
  return `${o.output} = ${r.value} ± ${r.uncertainty}${unit} (k = ${
    o.coverageFactor.toFixed(2)
  }, p = ${formatNumber(coverage * 100, 4)} %)`;
}

const budgetHeader = [
  "input",
  "distribution",
  "estimate xᵢ",
  "u(xᵢ)",
  "νᵢ",
  "cᵢ",
  "cᵢ·u(xᵢ)",
  "share",
];

function budgetRows(o: GumOutput): string[][] {
  return o.budget.map((b) => [
    b.unit === "1" ? b.input : `${b.input} [${formatUnit(b.unit)}]`,
    b.distribution,
    formatNumber(b.estimate, 6),
    formatNumber(b.standardUncertainty, 3),
    Number.isFinite(b.dof) ? formatNumber(b.dof, 3) : "∞",
    formatNumber(b.sensitivity, 4),
    formatNumber(b.contribution, 3),
    `${(b.share * 100).toFixed(1)} %`,
  ]);
}

/** The MIME bundle of a GUM result. */
export function displayGum(result: GumResult): MimeBundle {
  const text: string[] = [`${result.title} (GUM law of propagation)`];
  const html: string[] = [`<div><b>${escapeHtml(result.title)}</b> (GUM law of propagation)`];
  for (const name of result.outputNames) {
    const o = result.outputs[name]!;
    const line = formatGumOutput(o, result.coverage) +
      (o.firstOrderAdequate
        ? ""
        : " — NOT ADEQUATE: first-order result, see warnings; use monteCarlo()");
    const extra = `u_c = ${formatNumber(o.standardUncertainty, 3)}, ν_eff = ${
      Number.isFinite(o.effectiveDof) ? o.effectiveDof.toFixed(1) : "∞"
    }`;
    text.push(line, extra, textTable(budgetHeader, budgetRows(o)));
    html.push(
      `<p><b>${escapeHtml(line)}</b><br>${escapeHtml(extra)}</p>`,
      htmlTable(budgetHeader, budgetRows(o)),
    );
  }
  text.push(
    ...result.warnings.map((w) => `Warning: ${w}`),
    ...result.cautions.map((c) => `Caution: ${c}`),
  );
  html.push(
    htmlNotes("Warnings", result.warnings),
    htmlNotes("Cautions", result.cautions),
    "</div>",
  );
  return { "text/plain": text.join("\n"), "text/html": html.join("") };
}

/** The MIME bundle of a Monte Carlo result. */
export function displayMonteCarlo(result: MonteCarloResult): MimeBundle {
  const header = ["output", "estimate", "u", "symmetric interval", "shortest interval"];
  const rows = result.outputNames.map((name) => {
    const o = result.outputs[name]!;
    const r = roundForReport(o.estimate, o.standardUncertainty);
    const lo = roundForReport(o.symmetricInterval[0], o.standardUncertainty).value;
    const hi = roundForReport(o.symmetricInterval[1], o.standardUncertainty).value;
    const slo = roundForReport(o.shortestInterval[0], o.standardUncertainty).value;
    const shi = roundForReport(o.shortestInterval[1], o.standardUncertainty).value;
    const unit = o.unit === "1" ? "" : ` ${formatUnit(o.unit)}`;
    return [name, `${r.value}${unit}`, r.uncertainty, `[${lo}, ${hi}]`, `[${slo}, ${shi}]`];
  });
  const head = `${result.title} (Monte Carlo, ${result.trials} trials, seed ${result.seed}, p = ${
    formatNumber(result.coverage * 100, 4)
  } %)`;
  return {
    "text/plain": [
      head,
      textTable(header, rows),
      ...result.warnings.map((w) => `Warning: ${w}`),
      ...result.cautions.map((c) => `Caution: ${c}`),
    ].join("\n"),
    "text/html": `<div><b>${escapeHtml(head)}</b>${htmlTable(header, rows)}${
      htmlNotes("Warnings", result.warnings)
    }${htmlNotes("Cautions", result.cautions)}</div>`,
  };
}
