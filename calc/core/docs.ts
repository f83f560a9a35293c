/**
 * Reference documentation derived from calculation definitions: one Markdown section per
 * calculation with its formula, inputs (units, valid and validated ranges), outputs, sources and
 * cautions.
 *
 * @module
 */
import { cautionsOf, formatRange, isCalculation } from "./define.ts";
import type { Calculation, Reference } from "./types.ts";

/** Formats a reference as "Authors (year). Title. Publication, locator. doi:…". *
 * @example
 * ```ts
 * import { formatReference } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(
 *   formatReference({ authors: "Hatle L, Angelsen B", year: 1985, title: "Doppler Ultrasound in Cardiology", publication: "Lea & Febiger" }),
 *   "Hatle L, Angelsen B (1985). Doppler Ultrasound in Cardiology. Lea & Febiger.",
 * );
 * ```
 */
export function formatReference(ref: Reference): string {
  const locator = ref.locator ? `, ${ref.locator}` : "";
  const doi = ref.doi ? ` doi:${ref.doi}` : "";
  const year = ref.year > 0 ? String(ref.year) : "n.d.";
  return `${ref.authors} (${year}). ${ref.title}. ${ref.publication}${locator}.${doi}`;
}

const cell = (s: string) => s.replace(/\|/g, "\\|");

/**
 * The Markdown reference section of one calculation.
 *
 * @example
 * ```ts
 * import { expressionModel, referenceMarkdown } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * assert.match(referenceMarkdown(model), /\| v \| m\/s \| \[0, 10\] m\/s \|/);
 * ```
 */
export function referenceMarkdown(calc: Calculation): string {
  const lines = [
    `### ${calc.title} (\`${calc.id}\`)`,
    "",
    calc.description,
    "",
    `Formula: \`${calc.formulaText}\``,
    "",
    "| input | unit | valid range | validated range | description |",
    "| --- | --- | --- | --- | --- |",
    ...calc.inputNames.map((n) => {
      const d = calc.inputs[n]!;
      return `| ${n} | ${cell(d.unit)} | ${formatRange(d.range, d.unit)} | ${
        d.typical ? formatRange(d.typical, d.unit) : "—"
      } | ${cell(d.description)}${d.default !== undefined ? ` (default ${d.default})` : ""} |`;
    }),
    "",
    "| output | unit | description |",
    "| --- | --- | --- |",
    ...calc.outputNames.map((n) =>
      `| ${n} | ${cell(calc.outputs[n]!.unit)} | ${cell(calc.outputs[n]!.description)} |`
    ),
    "",
    "Sources:",
    ...calc.citations.map((s) => `- ${formatReference(s)}`),
  ];
  const cautions = cautionsOf(calc);
  if (cautions.length > 0) lines.push("", "Cautions:", ...cautions.map((c) => `- ${c}`));
  return lines.join("\n") + "\n";
}

/**
 * Collects the calculations exported by a module namespace, sorted by id.
 *
 * @example
 * ```ts
 * import * as sonorigor from "@sonorigor/sonorigor";
 * import { calculationsOf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Array.isArray(calculationsOf(sonorigor)));
 * ```
 */
export function calculationsOf(namespace: Record<string, unknown>): Calculation[] {
  return Object.values(namespace).filter(isCalculation).sort((a, b) => a.id.localeCompare(b.id));
}
