/**
 * An uncertainty budget for a lab report: the budget of one output of a GUM propagation as
 * Markdown and LaTeX (and, through `writeBudgetCsv` in the table writer, as CSV), with every
 * source's label and unit, the numbers rounded as the notebook display rounds them (JCGM
 * 100:2008 §7.2.6: uncertainties to two significant digits, estimates to the same decimal place),
 * the combined and expanded uncertainty, and the cautions (the clinical caution of a clinical
 * calculation among them).
 *
 * @module
 */
import type { Propagation } from "../calc/uncertainty/types.ts";
import { formatUnit } from "../calc/core/text.ts";
import { BUDGET_HEADER, budgetRows, formatDof, formatUncertainValue } from "./uncertainty.ts";
import { roundLike } from "./format.ts";

/** Options of the budget exports. */
export interface BudgetExportOptions {
  /** The output whose budget is exported. @default the first output */
  readonly output?: string;
}

/** A budget as a report shows it: title, header, formatted rows, summary lines and cautions. */
export interface BudgetExport {
  /** "Uncertainty budget of <output> (<calculation>)". */
  readonly title: string;
  /** Column headers. */
  readonly header: readonly string[];
  /** One row of formatted cells per source. */
  readonly rows: readonly (readonly string[])[];
  /** The result line and the combined uncertainty with ν_eff. */
  readonly summary: readonly string[];
  /** The propagation's warnings and cautions, in that order. */
  readonly notes: readonly string[];
}

/**
 * The budget of one output of a GUM propagation as a report shows it (the rows of the notebook
 * display, the result line, the combined standard uncertainty and ν_eff, the warnings and the
 * cautions).
 *
 * @param result A GUM propagation.
 * @param options The output.
 * @returns The formatted budget.
 * @throws {TypeError} For a Monte Carlo result (it has no budget) or an unknown output.
 *
 * @example
 * ```ts
 * import { budgetExport, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const b = budgetExport(propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }));
 * // c = ∂(4v²)/∂v = 8v = 32 mmHg/(m/s); c·u = 3.2 mmHg (hand computation)
 * assert.deepEqual(b.rows[0]!.slice(5, 7), ["32 mmHg/(m/s)", "3.2 mmHg"]);
 * assert.equal(b.summary[0], "Peak gradient = 64.0 ± 6.3 mmHg (k = 1.96, p = 95 %)");
 * ```
 */
export function budgetExport(result: Propagation, options: BudgetExportOptions = {}): BudgetExport {
  const name = options.output ?? result.outputNames[0]!;
  const v = result.outputs[name];
  if (v === undefined) {
    throw new TypeError(
      `Uncertainty budget: unknown output '${name}'; expected one of ${
        result.outputNames.join(", ")
      }`,
    );
  }
  if (result.method !== "gum") {
    throw new TypeError(
      `Uncertainty budget: expected a GUM result (Monte Carlo has no budget), got ${result.method}`,
    );
  }
  const unit = formatUnit(v.unit);
  const u = v.standardUncertainty;
  const dof = formatDof(v.effectiveDof);
  return {
    title: `Uncertainty budget of ${v.label} (${result.calculation.title})`,
    header: BUDGET_HEADER,
    rows: budgetRows(v),
    summary: [
      formatUncertainValue(v),
      `Combined standard uncertainty u = ${roundLike(u, u)}${unit === "" ? "" : ` ${unit}`}, ` +
      `effective degrees of freedom ν_eff = ${dof}`,
    ],
    notes: [
      ...result.warnings.map((w) => `Warning: ${w}`),
      ...result.cautions.map((c) => `Caution: ${c}`),
    ],
  };
}

/** A Markdown table cell: pipes escaped, line breaks flattened. */
function markdownCell(text: string): string {
  return text.replace(/\\/g, "\\\\").replace(/\|/g, "\\|").replace(/[\r\n]+/g, " ");
}

/**
 * The budget of one output of a GUM propagation as a Markdown table (GitHub-flavoured), with the
 * title, the result line, the combined uncertainty and the cautions below.
 *
 * @param result A GUM propagation.
 * @param options The output.
 * @returns Markdown text.
 * @throws {TypeError} For a Monte Carlo result or an unknown output.
 *
 * @example
 * ```ts
 * import { budgetMarkdown, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const md = budgetMarkdown(propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }));
 * // u = 0.1 m/s, c·u = 8·4·0.1 = 3.2 mmHg, 100 % of the variance (hand computation)
 * assert.match(md, /\| Peak velocity \(m\/s\) \| normal \| 4\.00 \| 0\.10 \| ∞ \| 32 mmHg\/\(m\/s\) \| 3\.2 mmHg \| 100\.0 % \|/);
 * assert.match(md, /Not a diagnosis/);
 * ```
 */
export function budgetMarkdown(result: Propagation, options: BudgetExportOptions = {}): string {
  const b = budgetExport(result, options);
  const line = (cells: readonly string[]) => `| ${cells.map(markdownCell).join(" | ")} |`;
  return [
    `**${markdownCell(b.title)}**`,
    "",
    line(b.header),
    line(b.header.map((_, i) => (i < 2 ? "---" : "---:"))),
    ...b.rows.map(line),
    "",
    ...b.summary.map((s) => `${markdownCell(s)}  `),
    "",
    ...b.notes.map((n) => `- ${markdownCell(n)}`),
    "",
  ].join("\n");
}

/** Characters LaTeX reads as commands, and the Unicode signs of the budget, for pdfLaTeX. */
const LATEX: Readonly<Record<string, string>> = {
  "\\": "\\textbackslash{}",
  "{": "\\{",
  "}": "\\}",
  "$": "\\$",
  "&": "\\&",
  "#": "\\#",
  "^": "\\^{}",
  "_": "\\_",
  "%": "\\%",
  "~": "\\~{}",
  "±": "$\\pm$",
  "·": "$\\cdot$",
  "−": "$-$",
  "–": "--",
  "—": "---",
  "²": "$^{2}$",
  "³": "$^{3}$",
  "°": "$^{\\circ}$",
  "∞": "$\\infty$",
  "ν": "$\\nu$",
  "ᵢ": "$_{i}$",
  "√": "$\\surd$",
  "θ": "$\\theta$",
  "Δ": "$\\Delta$",
  "μ": "$\\mu$",
  "≤": "$\\leq$",
  "≥": "$\\geq$",
  "∝": "$\\propto$",
};

/**
 * Text made safe for LaTeX (pdfLaTeX): special characters escaped, the budget's Unicode signs
 * (±, ·, −, ², °, ∞, ν, ᵢ, …) written as math.
 *
 * @example
 * ```ts
 * import { latexText } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(latexText("u(xᵢ) = 5 %"), "u(x$_{i}$) = 5 \\%");
 * ```
 */
export function latexText(text: string): string {
  return [...text].map((c) => LATEX[c] ?? c).join("");
}

/**
 * The budget of one output of a GUM propagation as a LaTeX table (a `table` float with a
 * `tabular` using the booktabs rules `\toprule`, `\midrule`, `\bottomrule`), the title as caption,
 * the result line, the combined uncertainty and the cautions as a note below. Needs
 * `\usepackage{booktabs}`; every special character is escaped and the Unicode signs are written
 * as math, so it compiles with pdfLaTeX.
 *
 * @param result A GUM propagation.
 * @param options The output.
 * @returns LaTeX source.
 * @throws {TypeError} For a Monte Carlo result or an unknown output.
 *
 * @example
 * ```ts
 * import { budgetLatex, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const tex = budgetLatex(propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }));
 * // c·u = 8·4·0.1 = 3.2 mmHg (hand computation); the % of the share is escaped
 * assert.match(tex, /Peak velocity \(m\/s\) & normal & 4\.00 & 0\.10 & \$\\infty\$ & 32 mmHg\/\(m\/s\) & 3\.2 mmHg & 100\.0 \\% \\\\/);
 * assert.match(tex, /\\toprule/);
 * assert.match(tex, /Not a diagnosis/);
 * ```
 */
export function budgetLatex(result: Propagation, options: BudgetExportOptions = {}): string {
  const b = budgetExport(result, options);
  const line = (cells: readonly string[]) => `${cells.map(latexText).join(" & ")} \\\\`;
  return [
    "\\begin{table}[htbp]",
    "\\centering",
    `\\caption{${latexText(b.title)}}`,
    `\\begin{tabular}{ll${"r".repeat(b.header.length - 2)}}`,
    "\\toprule",
    line(b.header),
    "\\midrule",
    ...b.rows.map(line),
    "\\bottomrule",
    "\\end{tabular}",
    "",
    "\\smallskip",
    `{\\footnotesize ${[...b.summary, ...b.notes].map(latexText).join(" \\\\\n")}\\par}`,
    "\\end{table}",
    "",
  ].join("\n");
}
