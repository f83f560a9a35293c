/**
 * The method-validation report as a document: blocks of plain text (headings, paragraphs, lists,
 * tables, figures) rendered to a self-contained HTML page and to Markdown, and its notebook
 * display. Every text that comes from the data (names, identifiers, headers, file names) is
 * escaped for HTML and for Markdown.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type { MissingReading } from "../calc/agreement/types.ts";
import type {
  FigurePlan,
  MethodComparison,
  MethodValidationReport,
  Outcome,
} from "../calc/agreement/report_types.ts";
import { renderIssue } from "../calc/core/issues.ts";
import { formatUnit } from "../calc/core/text.ts";
import { escapeHtml } from "./mime.ts";
import { formatCount, formatNumber, roundLike } from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";
import {
  blandAltmanRows,
  concordanceRows,
  differenceUnit,
  fleissRows,
  halfWidth,
  iccRows,
  kappaCells,
  kappaHeader,
  kappaStatistic,
  level,
  regressionRows,
  repeatabilityCells,
  repeatabilityHeader,
  repeatedRows,
  type Rows,
} from "./agreement_rows.ts";

// ---------------------------------------------------------------------------------------------
// The report as a document (blocks of plain text), rendered to HTML and Markdown

type Block =
  | { readonly kind: "heading"; readonly level: 1 | 2 | 3; readonly text: string }
  | { readonly kind: "paragraph"; readonly text: string }
  | { readonly kind: "list"; readonly items: readonly string[] }
  | {
    readonly kind: "table";
    readonly header: readonly string[];
    readonly rows: readonly (readonly string[])[];
  }
  | { readonly kind: "figure"; readonly figure: FigurePlan; readonly caption: string };

/**
 * A missing reading as a sentence: "line 6: subject 'P03', observer 'A', replicate 1".
 *
 * @example
 * ```ts
 * import { missingReadingText } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(missingReadingText({ subject: "P03", observer: "A", replicate: 1, line: 6 }),
 *   "line 6: subject 'P03', observer 'A', replicate 1");
 * ```
 */
export function missingReadingText(m: MissingReading): string {
  return `line ${m.line}: subject '${m.subject}', observer '${m.observer}', replicate ${m.replicate}`;
}

/**
 * The caption of a figure of the report (under the figure in HTML, its alternative text in
 * Markdown).
 *
 * @example
 * ```ts
 * import { figureCaption, methodValidation, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,lvef percent\nP1,A,55\nP1,B,54\nP2,A,40\nP2,B,43\nP3,A,62\nP3,B,61\n";
 * const report = methodValidation(readTable(csv));
 * assert.equal(figureCaption(report, report.figures[1]!),
 *   "B against A: the line of identity (grey, dashed) and the fitted Deming (solid) and Passing–Bablok (dash-dotted) lines.");
 * ```
 */
export function figureCaption(report: MethodValidationReport, figure: FigurePlan): string {
  const c = figure.comparison === null ? null : report.comparisons[figure.comparison]!;
  if (figure.kind === "blandAltman") {
    return `Bland–Altman plot, ${c!.test} − ${
      c!.reference
    }: bias (solid line) and limits of agreement (dashed lines), each with its value written on it, and their exact confidence intervals (shaded bands).`;
  }
  if (figure.kind === "comparison") {
    return `${c!.test} against ${
      c!.reference
    }: the line of identity (grey, dashed) and the fitted Deming (solid) and Passing–Bablok (dash-dotted) lines.`;
  }
  return "Every reading by subject, coloured by observer or method (all replicates).";
}

/** A statistic of the report as blocks: its table and a note, or why it was not computed. */
function statistic<T>(
  o: Outcome<T>,
  what: string,
  table: (r: T) => Rows,
  note: string,
  after: readonly Block[] = [],
): Block[] {
  if (o.status !== "computed") {
    return [{ kind: "paragraph", text: `${what} not computed: ${o.reason}` }];
  }
  const t = table(o.result);
  return [
    { kind: "table", header: t.header, rows: t.rows },
    { kind: "paragraph", text: note },
    ...after,
  ];
}

function studyBlocks(r: MethodValidationReport): Block[] {
  const s = r.study;
  const c = s.columns;
  const what = s.design === "graded"
    ? "the graded finding (categories)"
    : `the reading of ${labelWithUnit(s.measured.label, s.measured.unit)}${
      s.quantityId === "statedQuantity" ? ", a quantity stated by the user" : ""
    }`;
  return [
    { kind: "heading", level: 2, text: "Study" },
    {
      kind: "paragraph",
      text:
        `Long-format table ${s.source}: column '${c.subject}' identifies subjects, '${c.observer}' the observer or method, ${
          c.replicate
            ? `'${c.replicate}' the replicate, `
            : "no replicate column (one reading each), "
        }'${c.value}' ${what}.${
          s.reference !== null
            ? ` Reference for the method comparisons: ${s.reference}; every other pair of observers or methods is compared as well.`
            : ""
        } Intervals are ${formatNumber(100 * s.confidence, 3)} % confidence intervals${
          s.design === "continuous"
            ? `; limits of agreement are bias ± ${formatNumber(s.multiplier, 3)} SD`
            : ""
        }.`,
    },
  ];
}

function dataBlocks(r: MethodValidationReport): Block[] {
  const d = r.data;
  return [
    { kind: "heading", level: 2, text: "Data summary" },
    {
      kind: "table",
      header: ["Observer / method", "Readings", "Subjects", "Replicates per subject"],
      rows: d.byObserver.map((o) => [
        o.observer,
        formatCount(o.readings),
        formatCount(o.subjects),
        o.fewestReplicates === o.mostReplicates
          ? formatCount(o.mostReplicates)
          : `${formatCount(o.fewestReplicates)} to ${formatCount(o.mostReplicates)}`,
      ]),
    },
    {
      kind: "list",
      items: [
        `Data rows: ${formatCount(d.dataRows)}; readings used: ${
          formatCount(d.readingsUsed)
        }; subjects: ${formatCount(d.subjects)}; missing value cells: ${
          formatCount(d.missing.length)
        }; blank lines: ${formatCount(d.blankLines.length)}.`,
        "Missing-cell policy: a reading with an empty value cell is left out (listed below); each statistic states the subjects it used, and balanced methods use only subjects with complete readings.",
        ...d.missing.map((m) => `Missing value, left out: ${missingReadingText(m)}`),
        ...d.blankLines.map((l) => `Blank line ${l} ignored`),
        ...d.flags.map((f) => `Flag: ${renderIssue(f)}`),
      ],
    },
  ];
}

function figureBlocks(r: MethodValidationReport, kind: FigurePlan["kind"], i: number | null) {
  return r.figures.filter((f) => f.kind === kind && f.comparison === i).map((f): Block => ({
    kind: "figure",
    figure: f,
    caption: figureCaption(r, f),
  }));
}

function repeatabilityBlocks(r: MethodValidationReport): Block[] {
  if (r.repeatability === null) return [];
  const q = r.study.measured;
  return [
    { kind: "heading", level: 2, text: "Repeatability (within observer)" },
    {
      kind: "table",
      header: [
        "Observer / method",
        "Subjects",
        ...repeatabilityHeader(q, r.study.multiplier, r.study.confidence),
      ],
      rows: r.repeatability.map((x) => [
        x.observer,
        `${formatCount(x.subjectsUsed)}${
          x.subjectsLeftOut ? ` (${formatCount(x.subjectsLeftOut)} with < 2 readings left out)` : ""
        }`,
        ...(x.outcome.status === "computed"
          ? repeatabilityCells(x.outcome.result)
          : [`not computed: ${x.outcome.reason}`, "–", "–"]),
      ]),
    },
    {
      kind: "paragraph",
      text:
        "Within-subject SD from the one-way ANOVA residual; repeatability coefficient = z·√2·s_w (Bland & Altman 1986, 1996); CV by the root-mean-square method (Bland 2006). Intervals: χ² on Σ(m − 1) degrees of freedom.",
    },
  ];
}

function comparisonBlocks(r: MethodValidationReport, c: MethodComparison, i: number): Block[] {
  const conf = level(r.study.confidence);
  const out: Block[] = [
    {
      kind: "heading",
      level: 2,
      text: c.against === "reference"
        ? `Method comparison: ${c.test} against the reference ${c.reference}`
        : `Observer comparison: ${c.test} against ${c.reference}`,
    },
    {
      kind: "paragraph",
      text: `${
        formatCount(c.subjects.length)
      } subjects with a first reading by both (subjects lacking either are left out: ${
        formatCount(c.subjectsLeftOut)
      }).`,
    },
    { kind: "heading", level: 3, text: "Bland–Altman analysis (first readings)" },
    ...statistic(
      c.blandAltman,
      "Bland–Altman analysis",
      blandAltmanRows,
      `Differences are ${c.test} − ${c.reference}${
        formatUnit(r.study.measured.unit)
          ? ` in ${formatUnit(differenceUnit(r.study.measured.unit))}`
          : ""
      }.`,
      figureBlocks(r, "blandAltman", i),
    ),
  ];
  const more: Block[][] = [];
  if (c.blandAltmanRepeated !== null) {
    more.push(
      [{
        kind: "heading",
        level: 3,
        text: "Bland–Altman with all replicates (Bland & Altman 2007)",
      }],
      statistic(
        c.blandAltmanRepeated,
        "Repeated-measures Bland–Altman analysis",
        repeatedRows,
        "Replicates are paired by replicate number; no confidence intervals (the 2007 method gives none).",
      ),
    );
  }
  const rows: string[][] = [];
  const failed = (name: string, o: Outcome<unknown>) => [
    name,
    "not computed",
    "–",
    o.status === "not computed" ? o.reason : "",
  ];
  if (c.concordance.status === "computed") {
    const cc = c.concordance.result;
    const first = concordanceRows(cc)[0]!;
    const u = halfWidth(cc.ci);
    rows.push([
      first[0]!,
      first[1]!,
      first[2]!,
      `Pearson r ${roundLike(cc.pearson, u)}, C_b ${roundLike(cc.biasCorrectionFactor, u)}`,
    ]);
  } else rows.push(failed("Lin's concordance correlation", c.concordance));
  const lambdaNote = c.errorVarianceRatio.from === "replicates"
    ? `error variance ratio ${
      formatNumber(c.errorVarianceRatio.value, 2)
    } = (s_w ${c.test} / s_w ${c.reference})² from the replicates`
    : "error variance ratio 1 (no replicates to estimate it)";
  if (c.deming.status === "computed") {
    const d = regressionRows(c.deming.result);
    d[0]![3] = `jackknife; ${lambdaNote}`;
    d[1]![3] = "jackknife";
    for (const row of d) rows.push(row);
  } else rows.push(failed("Deming regression", c.deming));
  if (c.passingBablok.status === "computed") {
    for (const row of regressionRows(c.passingBablok.result)) rows.push(row);
  } else rows.push(failed("Passing–Bablok regression", c.passingBablok));
  more.push(
    [
      { kind: "heading", level: 3, text: "Concordance and regression (first readings)" },
      { kind: "table", header: ["Statistic", "Estimate", conf, "Notes"], rows },
    ],
    figureBlocks(r, "comparison", i),
  );
  for (const blocks of more) for (const b of blocks) out.push(b);
  return out;
}

function iccBlocks(r: MethodValidationReport): Block[] {
  const icc = r.icc;
  if (icc === null) return [];
  const out: Block[] = [
    {
      kind: "heading",
      level: 2,
      text: "Agreement among all observers/methods: intraclass correlation (first readings)",
    },
    {
      kind: "paragraph",
      text: `${
        formatCount(icc.completeSubjects)
      } subjects with a first reading by every observer/method (${
        icc.observers.join(", ")
      }); left out as incomplete: ${icc.leftOut.length ? icc.leftOut.join(", ") : "none"}.`,
    },
    ...statistic(
      icc.outcome,
      "Intraclass correlation",
      iccRows,
      "Choose the form that matches the question before looking at the values: ICC(2,1)/ICC(A,1) for interchangeable observers drawn from a larger pool, ICC(3,1)/ICC(C,1) for these observers only; average-measure forms apply when the mean of all observers is what will be reported.",
    ),
  ];
  return out;
}

function kappaBlocks(r: MethodValidationReport): Block[] {
  const k = r.kappa;
  if (k === null) return [];
  const rows = k.pairs.flatMap((p) =>
    p.kappas.map(({ weights, outcome }) => [
      `${p.raterA} vs ${p.raterB}`,
      kappaStatistic(weights),
      ...(outcome.status === "computed"
        ? kappaCells(outcome.result)
        : [formatCount(p.subjects), "–", "–", "not computed", "–", outcome.reason]),
    ])
  );
  const out: Block[] = [
    { kind: "heading", level: 2, text: "Agreement on graded findings (first readings)" },
    {
      kind: "paragraph",
      text: `Categories in order: ${k.categories.join(" < ")}${
        r.study.categoriesFrom === "option"
          ? " (as given)"
          : " (order of first appearance; give the categories to set the clinical order for weighted kappa)"
      }.`,
    },
    { kind: "table", header: ["Pair", "Statistic", ...kappaHeader(r.study.confidence)], rows },
    {
      kind: "paragraph",
      text:
        "Standard errors per Fleiss, Cohen & Everitt (1969); weights: linear 1 − |i−j|/(c−1), quadratic 1 − (i−j)²/(c−1)².",
    },
  ];
  if (k.fleiss) {
    return out.concat(
      [{ kind: "heading", level: 3, text: "Fleiss' kappa (all observers)" }],
      statistic(
        k.fleiss.outcome,
        "Fleiss' kappa",
        fleissRows,
        `Subjects left out as incomplete: ${formatCount(k.fleiss.leftOut)}.`,
      ),
    );
  }
  return out;
}

function provenanceItems(r: MethodValidationReport): string[] {
  const p = r.provenance;
  return [
    `Input: ${p.source}${p.inputSha256 ? `, SHA-256 ${p.inputSha256}` : ""}`,
    `Rows: ${formatCount(p.dataRows)} data rows, ${formatCount(p.readingsUsed)} readings used, ${
      formatCount(p.missingValues)
    } missing value cells left out`,
    ...(p.tool ? [`Tool: ${p.tool}${p.runtime ? `; ${p.runtime}` : ""}`] : []),
    ...(p.dependencies?.length ? [`Dependencies: ${p.dependencies.join("; ")}`] : []),
    ...(p.date ? [`Date: ${p.date}`] : []),
    // a seed is stated only where something random is drawn; nothing in this report is
    "Every statistic in this report is deterministic: nothing random is drawn, so no seed is needed.",
    `Options: multiplier ${formatNumber(r.study.multiplier, 3)}, confidence ${
      formatNumber(r.study.confidence, 3)
    }${r.study.design === "graded" ? ", graded" : ""}`,
  ];
}

function reportBlocks(r: MethodValidationReport): Block[] {
  return [
    { kind: "heading", level: 1, text: r.title },
    ...studyBlocks(r),
    ...dataBlocks(r),
    ...repeatabilityBlocks(r),
    ...r.comparisons.flatMap((c, i) => comparisonBlocks(r, c, i)),
    ...iccBlocks(r),
    ...(r.study.design === "continuous"
      ? [
        { kind: "heading", level: 2, text: "Observer plot" } as const,
        ...figureBlocks(r, "observers", null),
      ]
      : []),
    ...kappaBlocks(r),
    { kind: "heading", level: 2, text: "Interpretation" },
    ...r.interpretation.map((text): Block => ({ kind: "paragraph", text })),
    { kind: "heading", level: 2, text: "Cautions" },
    { kind: "list", items: r.cautions },
    { kind: "heading", level: 2, text: "Provenance" },
    { kind: "list", items: provenanceItems(r) },
  ];
}

/**
 * Escapes text for Markdown (CommonMark and its table extension) so that it shows as written:
 * backslash, backtick, "*", "_", "[", "]", "|", "#" and "~" are backslash-escaped, "<" before a
 * letter or "/", "!", "?" (an HTML tag or autolink) and "&" before a letter or "#" (an entity);
 * line breaks become spaces, so a name cannot start a block of its own. With `atLineStart`, a
 * leading list, quote or heading-underline marker ("-", "+", "=", ">", "1.") is escaped too.
 *
 * @param text Any text from the data.
 * @param atLineStart True when the text starts a line (a paragraph or list item). @default false
 * @returns The escaped text.
 *
 * @example
 * ```ts
 * import { escapeMarkdown } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(escapeMarkdown("<b>*A*|B</b> < 0.001"), "\\<b>\\*A\\*\\|B\\</b> < 0.001");
 * assert.equal(escapeMarkdown("1. first\nline", true), "1\\. first line");
 * assert.equal(escapeMarkdown("-2.5"), "-2.5"); // a number inside a cell stays as it is
 * ```
 */
export function escapeMarkdown(text: string, atLineStart = false): string {
  const inline = text.replace(/\r\n|\r|\n/g, " ")
    .replace(/[\\`*_[\]|#~]/g, "\\$&")
    .replace(/<(?=[A-Za-z/!?])/g, "\\<")
    .replace(/&(?=[A-Za-z#])/g, "\\&");
  return atLineStart
    ? inline.replace(/^(\s*\d+)([.)])/, "$1\\$2").replace(/^(\s*)([-+=>])/, "$1\\$2")
    : inline;
}

function markdownBlock(b: Block): string {
  switch (b.kind) {
    case "heading":
      return `${"#".repeat(b.level)} ${escapeMarkdown(b.text)}\n`;
    case "paragraph":
      return `${escapeMarkdown(b.text, true)}\n`;
    case "list":
      return b.items.length
        ? `${b.items.map((i) => `- ${escapeMarkdown(i, true)}`).join("\n")}\n`
        : "";
    case "table": {
      const line = (cells: readonly string[]) =>
        `| ${cells.map((c) => escapeMarkdown(c)).join(" | ")} |`;
      return [line(b.header), `| ${b.header.map(() => "---").join(" | ")} |`, ...b.rows.map(line)]
        .join("\n") + "\n";
    }
    case "figure":
      return `![${escapeMarkdown(b.caption)}](${encodeURI(b.figure.file)})\n`;
  }
}

function htmlBlock(b: Block, svgs: Readonly<Record<string, string>>): string {
  switch (b.kind) {
    case "heading":
      return `<h${b.level}>${escapeHtml(b.text)}</h${b.level}>`;
    case "paragraph":
      return `<p>${escapeHtml(b.text)}</p>`;
    case "list":
      return b.items.length
        ? `<ul>${b.items.map((i) => `<li>${escapeHtml(i)}</li>`).join("")}</ul>`
        : "";
    case "table":
      return `<table><thead><tr>${
        b.header.map((c) => `<th>${escapeHtml(c)}</th>`).join("")
      }</tr></thead><tbody>${
        b.rows.map((r) => `<tr>${r.map((c) => `<td>${escapeHtml(c)}</td>`).join("")}</tr>`).join("")
      }</tbody></table>`;
    case "figure": {
      const svg = svgs[b.figure.file];
      return svg === undefined
        ? ""
        : `<figure>${svg}<figcaption>${escapeHtml(b.caption)}</figcaption></figure>`;
    }
  }
}

/**
 * The report as Markdown: headings, tables and lists, figures as links to their SVG files
 * (`report.figures[i].file`, written next to the Markdown file).
 *
 * @param report A report from `methodValidation`.
 * @returns The Markdown text.
 *
 * @example
 * ```ts
 * import { methodValidation, methodValidationMarkdown, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,lvef percent\nP1,A,55\nP1,B,54\nP2,A,40\nP2,B,43\nP3,A,62\nP3,B,61\n";
 * const md = methodValidationMarkdown(methodValidation(readTable(csv, { source: "demo.csv" })));
 * assert.match(md, /^# Method validation report: demo\.csv/);
 * // (−1 + 3 − 1)/3 = 1/3, a difference of percentages: percentage points
 * assert.match(md, /\| Bias \(mean of B − A\) \(percentage points\) \| 0\.3 \|/);
 * ```
 */
export function methodValidationMarkdown(report: MethodValidationReport): string {
  return reportBlocks(report).map(markdownBlock).filter((s) => s !== "").join("\n");
}

/** Options of {@linkcode methodValidationHtml}. */
export interface ReportHtmlOptions {
  /** SVG markup of the figures, by file name (`report.figures[i].file`); a figure without one is
   * left out. @default none */
  readonly svgs?: Readonly<Record<string, string>>;
}

/**
 * The report as a self-contained HTML page (no scripts, no network): headings, tables, lists,
 * and the figures inlined from the SVGs given.
 *
 * @param report A report from `methodValidation`.
 * @param options The SVGs of the figures.
 * @returns The HTML page.
 *
 * @example
 * ```ts
 * import { methodValidation, methodValidationHtml, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,ef\nP1,<b>A</b>,55\nP1,B,54\nP2,<b>A</b>,40\nP2,B,43\nP3,<b>A</b>,62\nP3,B,61\n";
 * const html = methodValidationHtml(methodValidation(readTable(csv, { source: "demo.csv" })));
 * assert.match(html, /^<!doctype html>/);
 * assert.doesNotMatch(html, /<b>A/); // the observer name is escaped
 * assert.match(html, /B against the reference &lt;b&gt;A&lt;\/b&gt;/);
 * ```
 */
export function methodValidationHtml(
  report: MethodValidationReport,
  options: ReportHtmlOptions = {},
): string {
  const svgs = options.svgs ?? {};
  const body = reportBlocks(report).map((b) => htmlBlock(b, svgs)).filter((s) => s !== "");
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(report.title)}</title>
<style>body{font-family:system-ui,sans-serif;max-width:1000px;margin:2em auto;padding:0 1em;color:#222}
table{border-collapse:collapse;margin:0.5em 0 1em}th,td{border:1px solid #ccc;padding:3px 8px;text-align:left;font-size:0.9em}
th{background:#f3f3f3}figure{margin:1em 0}figcaption{font-size:0.85em;color:#555}</style></head>
<body>
${body.join("\n")}
</body></html>
`;
}

/** The MIME bundle of a method-validation report: the report without its figures (HTML, and
 * Markdown as plain text). */
export function displayMethodValidation(report: MethodValidationReport): MimeBundle {
  const blocks = reportBlocks(report).filter((b) => b.kind !== "figure");
  return {
    "text/plain": blocks.map(markdownBlock).filter((s) => s !== "").join("\n"),
    "text/html": `<div>${blocks.map((b) => htmlBlock(b, {})).join("\n")}</div>`,
  };
}
