/**
 * The validation report command: reads a long-format measurement table (subject, observer or
 * method, replicate, value), validates it, computes the agreement and reproducibility statistics
 * that fit the design and writes a self-contained HTML report with a Markdown twin.
 *
 * Usage: `deno task validate <table.csv> [--subject col] [--rater col] [--replicate col]
 * [--value col] [--out dir] [--seed n] [--graded] [--categories a,b,c] [--reference name]
 * [--multiplier 1.96|2] [--confidence 0.95] [--unit text] [--title text]`
 *
 * Missing-cell policy: a row whose value cell is empty is reported by line number and left out;
 * every statistic then states how many subjects it used, and balanced methods (ICC, Fleiss'
 * kappa) use only subjects with a complete set of readings, listing the ones left out. Any
 * other defect (a non-numeric value, a missing subject or observer, a bad replicate number, a
 * duplicate reading, a wrong number of fields) stops the command with line-numbered errors and
 * exit code 1.
 *
 * @module
 */
import { parseArgs } from "node:util";
import { createHash } from "node:crypto";
import Papa from "papaparse";
import * as z from "zod";
import {
  blandAltman,
  blandAltmanRepeated,
  type BlandAltmanRepeatedResult,
  type BlandAltmanResult,
  cohenKappa,
  type CohenKappaResult,
  concordanceCorrelation,
  type ConcordanceResult,
  demingRegression,
  type DemingResult,
  fleissKappa,
  type FleissKappaResult,
  type IntraclassCorrelationResult,
  intraclassCorrelations,
  passingBablokRegression,
  type PassingBablokResult,
  repeatability,
  type RepeatabilityResult,
} from "../mod.ts";
import { blandAltmanChart, methodComparisonChart, observerChart } from "../plot/agreement.ts";
import { escapeHtml, formatNumber } from "../calc/core/display.ts";

const progress = (msg: string) => console.error(`[validate] ${msg}`);

/** The part of a papaparse result used here (the npm package ships no types). */
interface ParseResult {
  data: Record<string, string>[];
  errors: { row?: number; message: string }[];
  meta: { fields?: string[] };
}

/** One validated reading. */
interface Reading {
  line: number;
  subject: string;
  observer: string;
  replicate: number;
  value: string;
}

const HELP = `Usage: deno task validate <table.csv> [options]
  --subject col      subject column (default "subject"; falls back to "patient")
  --rater col        observer/method column (default "observer"; falls back to "rater", "reader", "method")
  --replicate col    replicate column (default "replicate"; optional: absent means one reading each)
  --value col        value column (default "value"; falls back to the single remaining column)
  --out dir          output folder (default "out/validation")
  --seed n           recorded in provenance (all statistics here are deterministic)
  --graded           values are ordered categories: kappa statistics
  --categories a,b   order of the categories for weighted kappa (default: order of first appearance)
  --reference name   reference observer/method for method comparison (default: first in the table)
  --multiplier m     limits-of-agreement multiplier, 1.96 (default) or 2
  --confidence c     confidence level of intervals (default 0.95)
  --unit text        unit of the values, for labels
  --title text       study title`;

function fail(messages: string[]): never {
  for (const m of messages) console.error(m);
  Deno.exit(1);
}

const fmt = (
  v: number | null | undefined,
  d = 4,
) => (v === null || v === undefined ? "–" : formatNumber(v, d));
const pval = (p: number) => (p < 0.001 ? "< 0.001" : formatNumber(p, 3));
const ci = (i: { lower: number; upper: number }, d = 4) =>
  `${fmt(i.lower, d)} to ${fmt(i.upper, d)}`;

/** A report section rendered both ways. */
class Report {
  md: string[] = [];
  html: string[] = [];
  h(level: number, text: string) {
    this.md.push(`${"#".repeat(level)} ${text}\n`);
    this.html.push(`<h${level}>${escapeHtml(text)}</h${level}>`);
  }
  p(text: string) {
    this.md.push(`${text}\n`);
    this.html.push(`<p>${escapeHtml(text)}</p>`);
  }
  list(items: string[]) {
    if (items.length === 0) return;
    this.md.push(items.map((i) => `- ${i}`).join("\n") + "\n");
    this.html.push(`<ul>${items.map((i) => `<li>${escapeHtml(i)}</li>`).join("")}</ul>`);
  }
  table(header: string[], rows: string[][]) {
    const esc = (c: string) => c.replace(/\|/g, "\\|");
    this.md.push(
      [
        `| ${header.map(esc).join(" | ")} |`,
        `| ${header.map(() => "---").join(" | ")} |`,
        ...rows.map((r) => `| ${r.map(esc).join(" | ")} |`),
      ].join("\n") + "\n",
    );
    this.html.push(
      `<table><thead><tr>${
        header.map((c) => `<th>${escapeHtml(c)}</th>`).join("")
      }</tr></thead><tbody>${
        rows.map((r) => `<tr>${r.map((c) => `<td>${escapeHtml(c)}</td>`).join("")}</tr>`).join("")
      }</tbody></table>`,
    );
  }
  figure(svg: string, file: string, caption: string) {
    this.md.push(`![${caption}](${file})\n`);
    this.html.push(`<figure>${svg}<figcaption>${escapeHtml(caption)}</figcaption></figure>`);
  }
}

function pickColumn(
  fields: string[],
  wanted: string | undefined,
  fallbacks: string[],
  what: string,
): string | null {
  if (wanted !== undefined) {
    if (!fields.includes(wanted)) {
      fail([`error: ${what} column '${wanted}' not found; the header has ${fields.join(", ")}`]);
    }
    return wanted;
  }
  return fallbacks.find((f) => fields.includes(f)) ?? null;
}

async function main(): Promise<void> {
  const { values: opt, positionals } = parseArgs({
    args: Deno.args,
    allowPositionals: true,
    options: {
      subject: { type: "string" },
      rater: { type: "string" },
      replicate: { type: "string" },
      value: { type: "string" },
      out: { type: "string", default: "out/validation" },
      seed: { type: "string", default: "1" },
      graded: { type: "boolean", default: false },
      categories: { type: "string" },
      reference: { type: "string" },
      multiplier: { type: "string", default: "1.96" },
      confidence: { type: "string", default: "0.95" },
      unit: { type: "string", default: "" },
      title: { type: "string" },
      help: { type: "boolean", default: false },
    },
  });
  if (opt.help) {
    console.log(HELP);
    return;
  }
  if (positionals.length !== 1) {
    fail([`error: expected one table file, got ${positionals.length}`, HELP]);
  }
  const path = positionals[0]!;
  const multiplier = Number(opt.multiplier);
  const confidence = Number(opt.confidence);
  const seed = Number(opt.seed);
  if (!(multiplier > 0 && multiplier <= 5)) {
    fail([`error: expected --multiplier in (0, 5], got ${opt.multiplier}`]);
  }
  if (!(confidence > 0 && confidence < 1)) {
    fail([`error: expected --confidence in (0, 1), got ${opt.confidence}`]);
  }
  if (!Number.isInteger(seed)) fail([`error: expected an integer --seed, got ${opt.seed}`]);

  progress(`reading ${path}`);
  let bytes: Uint8Array;
  try {
    bytes = await Deno.readFile(path);
  } catch (e) {
    fail([`error: cannot read '${path}': ${(e as Error).message}`]);
  }
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  const text = new TextDecoder().decode(bytes).replace(/^\uFEFF/, "");

  progress("parsing and validating");
  const parsed: ParseResult = Papa.parse(text, { header: true, skipEmptyLines: false });
  const fields = parsed.meta.fields ?? [];
  const errors: string[] = [];
  // papaparse rows are data lines: line number = row index + 2 (header is line 1)
  const isBlank = (row: Record<string, string> | undefined) =>
    row !== undefined && Object.values(row).every((v) => typeof v !== "string" || v.trim() === "");
  for (const e of parsed.errors) {
    // blank lines are reported (not errors); papaparse flags them as short rows
    if (e.row !== undefined && isBlank(parsed.data[e.row])) continue;
    errors.push(`line ${(e.row ?? 0) + 2}: ${e.message}`);
  }
  const subjectCol = pickColumn(
    fields,
    opt.subject,
    ["subject", "patient", "subject_id", "id"],
    "subject",
  );
  const raterCol = pickColumn(
    fields,
    opt.rater,
    ["observer", "rater", "reader", "method"],
    "observer",
  );
  const replicateCol = pickColumn(
    fields,
    opt.replicate,
    ["replicate", "repeat", "reading"],
    "replicate",
  );
  if (!subjectCol) {
    fail([`error: no subject column found (use --subject); the header has ${fields.join(", ")}`]);
  }
  if (!raterCol) {
    fail([`error: no observer column found (use --rater); the header has ${fields.join(", ")}`]);
  }
  const rest = fields.filter((f) => f !== subjectCol && f !== raterCol && f !== replicateCol);
  const valueCol = pickColumn(
    fields,
    opt.value,
    ["value", ...(rest.length === 1 ? rest : [])],
    "value",
  );
  if (!valueCol) {
    fail([`error: no value column found (use --value); the header has ${fields.join(", ")}`]);
  }

  const numberText = z.string().trim().regex(
    /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/,
    "expected a number",
  );
  const rowSchema = z.object({
    [subjectCol]: z.string().trim().min(1, "expected a subject identifier"),
    [raterCol]: z.string().trim().min(1, "expected an observer or method name"),
    ...(replicateCol
      ? {
        [replicateCol]: z.string().trim().regex(
          /^[1-9]\d*$/,
          "expected a replicate number 1, 2, …",
        ),
      }
      : {}),
    [valueCol]: opt.graded ? z.string().trim() : z.union([z.literal(""), numberText]),
  });
  const readings: Reading[] = [];
  const missing: string[] = [];
  const blank: number[] = [];
  const seen = new Map<string, number>();
  parsed.data.forEach((row, i) => {
    const line = i + 2;
    if (isBlank(row)) {
      blank.push(line);
      return;
    }
    const result = rowSchema.safeParse(row);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const col = String(issue.path[0] ?? "");
        const got = row[col];
        errors.push(
          `line ${line}: column '${col}': ${issue.message}, got ${
            got === undefined ? "a missing cell" : JSON.stringify(got)
          }`,
        );
      }
      return;
    }
    const r = result.data as Record<string, string>;
    const reading: Reading = {
      line,
      subject: r[subjectCol]!,
      observer: r[raterCol]!,
      replicate: replicateCol ? Number(r[replicateCol]) : 1,
      value: r[valueCol]!,
    };
    const key = `${reading.subject}\u0000${reading.observer}\u0000${reading.replicate}`;
    const first = seen.get(key);
    if (first !== undefined) {
      errors.push(
        `line ${line}: duplicate reading for subject '${reading.subject}', observer '${reading.observer}', replicate ${reading.replicate} (first on line ${first})`,
      );
      return;
    }
    seen.set(key, line);
    if (reading.value === "") {
      missing.push(
        `line ${line}: subject '${reading.subject}', observer '${reading.observer}', replicate ${reading.replicate}`,
      );
      return;
    }
    readings.push(reading);
  });
  // a trailing newline produces one empty final row: not a defect
  const trailing = blank.length > 0 && blank[blank.length - 1] === parsed.data.length + 1;
  if (trailing) blank.pop();
  if (errors.length > 0) {
    const lineOf = (e: string) => Number(/^line (\d+)/.exec(e)?.[1] ?? 0);
    errors.sort((p, q) => lineOf(p) - lineOf(q));
    errors.push(
      ...missing.map((m) =>
        `${m}: empty value cell (would be left out under the missing-cell policy)`
      ),
    );
    fail([
      `error: ${errors.length} problem(s) in ${path}; nothing was computed:`,
      ...errors.map((e) => `  ${e}`),
    ]);
  }
  const subjects = [...new Set(readings.map((r) => r.subject))];
  const observers = [...new Set(readings.map((r) => r.observer))];
  if (subjects.length < 2) {
    fail([`error: expected at least 2 subjects with readings, got ${subjects.length}`]);
  }
  if (observers.length < 1) fail([`error: expected at least 1 observer, got 0`]);
  progress(
    `${readings.length} readings, ${subjects.length} subjects, ${observers.length} observers/methods`,
  );

  const title = opt.title ?? `Method validation report: ${path.split("/").pop()}`;
  const unit = opt.unit;
  const report = new Report();
  const charts: { file: string; svg: string }[] = [];
  const cautions: string[] = [
    "Statistics describe this sample only; confidence intervals show how far the population values may lie from them.",
    "Limits of agreement assume differences roughly normal and unrelated to magnitude; check the Bland–Altman plot and the proportional-bias slope, and use the ratio analysis when the spread grows with the mean.",
    "Intraclass correlations depend on the spread of the subjects studied: a narrow case mix gives low ICCs even with small measurement error.",
    "Not a diagnosis: these numbers describe measurement agreement and do not by themselves decide any patient's care.",
  ];

  report.h(1, title);
  report.h(2, "Study");
  report.p(
    `Long-format table ${path}: column '${subjectCol}' identifies subjects, '${raterCol}' the observer or method, ` +
      `${
        replicateCol
          ? `'${replicateCol}' the replicate, `
          : "no replicate column (one reading each), "
      }` +
      `'${valueCol}' the ${
        opt.graded ? "graded finding (categories)" : `reading${unit ? ` in ${unit}` : ""}`
      }.`,
  );
  report.h(2, "Data summary");
  const byObserver = observers.map((o) => readings.filter((r) => r.observer === o));
  report.table(
    ["Observer / method", "Readings", "Subjects", "Replicates per subject"],
    byObserver.map((rs, i) => {
      const perSubject = new Map<string, number>();
      rs.forEach((r) => perSubject.set(r.subject, (perSubject.get(r.subject) ?? 0) + 1));
      const counts = [...perSubject.values()];
      return [
        observers[i]!,
        String(rs.length),
        String(perSubject.size),
        `${Math.min(...counts)}–${Math.max(...counts)}`,
      ];
    }),
  );
  report.list([
    `Data rows: ${
      parsed.data.length - (trailing ? 1 : 0)
    }; readings used: ${readings.length}; missing value cells: ${missing.length}; blank lines: ${blank.length}.`,
    "Missing-cell policy: a reading with an empty value cell is left out (listed below); each statistic states the subjects it used, and balanced methods use only subjects with complete readings.",
    ...missing.map((m) => `Missing value, left out: ${m}`),
    ...blank.map((l) => `Blank line ${l} ignored`),
  ]);

  const results: Record<string, unknown> = {};
  const byKey = new Map<string, Reading>();
  for (const r of readings) byKey.set(`${r.subject}\u0000${r.observer}\u0000${r.replicate}`, r);
  const get = (s: string, o: string, rep: number) => byKey.get(`${s}\u0000${o}\u0000${rep}`);
  const maxReplicate = Math.max(...readings.map((r) => r.replicate));

  if (opt.graded) {
    gradedAnalysis();
  } else {
    for (const r of readings) {
      const v = Number(r.value);
      if (!Number.isFinite(v)) {
        fail([
          `error: line ${r.line}: column '${valueCol}': expected a finite number, got ${r.value}`,
        ]);
      }
    }
    await continuousAnalysis();
  }

  async function continuousAnalysis() {
    const num = (r: Reading | undefined) => (r === undefined ? undefined : Number(r.value));
    const reference = opt.reference ?? observers[0]!;
    if (!observers.includes(reference)) {
      fail([
        `error: --reference '${reference}' is not an observer in the table (${
          observers.join(", ")
        })`,
      ]);
    }
    const others = observers.filter((o) => o !== reference);
    // repeatability per observer
    const reps: Record<string, RepeatabilityResult | string> = {};
    if (maxReplicate > 1) {
      progress("repeatability");
      report.h(2, "Repeatability (within observer)");
      const rows: string[][] = [];
      for (const o of observers) {
        const groups = subjects.map((s) =>
          readings.filter((r) => r.subject === s && r.observer === o).map((r) => Number(r.value))
        );
        const usable = groups.filter((g) => g.length >= 2);
        const left = groups.length - usable.length;
        try {
          const r = repeatability(usable, { multiplier, confidence });
          reps[o] = r;
          rows.push([
            o,
            String(r.subjects) + (left ? ` (${left} with <2 readings left out)` : ""),
            `${fmt(r.withinSubjectSd)} (${ci(r.withinSubjectSdCi)})`,
            `${fmt(r.repeatabilityCoefficient)} (${ci(r.repeatabilityCoefficientCi)})`,
            r.withinSubjectCv === null
              ? "undefined (a mean ≤ 0)"
              : `${fmt(100 * r.withinSubjectCv, 3)} %`,
          ]);
        } catch (e) {
          reps[o] = (e as Error).message;
          rows.push([o, String(usable.length), `not computed: ${(e as Error).message}`, "–", "–"]);
        }
      }
      report.table(
        [
          "Observer / method",
          "Subjects",
          "Within-subject SD (CI)",
          `Repeatability coefficient ${fmt(multiplier * Math.SQRT2, 3)}·s_w (CI)`,
          "Within-subject CV (RMS)",
        ],
        rows,
      );
      report.p(
        "Within-subject SD from the one-way ANOVA residual; repeatability coefficient = z·√2·s_w (Bland & Altman 1986, 1996); CV by the root-mean-square method (Bland 2006). Intervals: χ² on Σ(m−1) degrees of freedom.",
      );
      results.repeatability = reps;
    }
    // method comparison: reference against each other observer, replicate 1
    const comparisons: Record<string, unknown> = {};
    for (const o of others) {
      progress(`method comparison: ${o} vs ${reference}`);
      const paired = subjects.flatMap((s) => {
        const x = num(get(s, reference, 1));
        const y = num(get(s, o, 1));
        return x === undefined || y === undefined ? [] : [{ s, x, y }];
      });
      report.h(2, `Method comparison: ${o} against ${reference}`);
      report.p(
        `${paired.length} subjects with a first reading by both (subjects lacking either are left out: ${
          subjects.length - paired.length
        }).`,
      );
      if (paired.length < 3) {
        report.p("Too few paired subjects for a method comparison (need at least 3).");
        continue;
      }
      const x = paired.map((p) => p.x);
      const y = paired.map((p) => p.y);
      const entry: Record<string, unknown> = {};
      try {
        const ba: BlandAltmanResult = blandAltman(y, x, { multiplier, confidence });
        entry.blandAltman = ba;
        report.h(3, "Bland–Altman analysis (first readings)");
        report.table([
          "Quantity",
          "Estimate",
          `${Math.round(confidence * 100)} % CI (approximate)`,
          `${Math.round(confidence * 100)} % CI (exact, Carkeet 2015)`,
        ], [
          ["Bias (mean difference)", fmt(ba.bias), ci(ba.biasCi), "–"],
          ["SD of differences", fmt(ba.sdDifferences), "–", "–"],
          [
            `Lower limit (bias − ${multiplier} SD)`,
            fmt(ba.lowerLimit.value),
            ci(ba.lowerLimit.approximateCi),
            ci(ba.lowerLimit.exactCi),
          ],
          [
            `Upper limit (bias + ${multiplier} SD)`,
            fmt(ba.upperLimit.value),
            ci(ba.upperLimit.approximateCi),
            ci(ba.upperLimit.exactCi),
          ],
          ...(ba.proportionalBias
            ? [[
              "Proportional bias: slope of difference on mean",
              fmt(ba.proportionalBias.slope),
              ci(ba.proportionalBias.slopeCi),
              `p ${pval(ba.proportionalBias.pValue).startsWith("<") ? "" : "= "}${
                pval(ba.proportionalBias.pValue)
              }`,
            ]]
            : []),
        ]);
        report.p(`Differences are ${o} − ${reference}${unit ? ` in ${unit}` : ""}.`);
        const chart = blandAltmanChart(ba, {
          unit,
          methodA: o,
          methodB: reference,
          title: `Bland–Altman: ${o} − ${reference}`,
        });
        const svg = await chart.toSVG();
        const file = `bland_altman_${slug(o)}-vs-${slug(reference)}.svg`;
        charts.push({ file, svg });
        report.figure(
          svg,
          file,
          `Bland–Altman plot, ${o} − ${reference}: bias and limits (dashed) with exact confidence bands (shaded).`,
        );
      } catch (e) {
        report.p(`Bland–Altman analysis not computed: ${(e as Error).message}`);
      }
      if (maxReplicate > 1) {
        const ids: string[] = [];
        const ya: number[] = [];
        const xb: number[] = [];
        for (const s of subjects) {
          for (let rep = 1; rep <= maxReplicate; rep++) {
            const xv = num(get(s, reference, rep));
            const yv = num(get(s, o, rep));
            if (xv !== undefined && yv !== undefined) {
              ids.push(s);
              ya.push(yv);
              xb.push(xv);
            }
          }
        }
        try {
          const rm: BlandAltmanRepeatedResult = blandAltmanRepeated(ids, ya, xb, { multiplier });
          entry.blandAltmanRepeated = rm;
          report.h(3, "Bland–Altman with all replicates (Bland & Altman 2007)");
          report.table(["Quantity", "Estimate"], [
            ["Pairs (subjects)", `${rm.pairs} (${rm.subjects})`],
            ["Bias", fmt(rm.bias)],
            ["SD of a single difference", fmt(rm.sdDifferences)],
            ["Limits of agreement", `${fmt(rm.lowerLimit)} to ${fmt(rm.upperLimit)}`],
          ]);
          report.p(
            "Replicates are paired by replicate number; no confidence intervals (the 2007 method gives none).",
          );
        } catch (e) {
          report.p(`Repeated-measures Bland–Altman not computed: ${(e as Error).message}`);
        }
      }
      report.h(3, "Concordance and regression (first readings)");
      const rows: string[][] = [];
      const lines: { name: string; slope: number; intercept: number }[] = [];
      try {
        const c: ConcordanceResult = concordanceCorrelation(x, y, { confidence });
        entry.concordance = c;
        rows.push([
          "Lin's concordance correlation ρ_c",
          fmt(c.value),
          ci(c.ci),
          `Pearson r ${fmt(c.pearson)}, C_b ${fmt(c.biasCorrectionFactor)}`,
        ]);
      } catch (e) {
        rows.push(["Lin's concordance correlation", "not computed", "–", (e as Error).message]);
      }
      let lambda = 1;
      let lambdaNote = "error variance ratio 1 (no replicates to estimate it)";
      const rx = reps[reference];
      const ry = reps[o];
      if (typeof rx === "object" && typeof ry === "object") {
        lambda = (ry.withinSubjectSd / rx.withinSubjectSd) ** 2;
        lambdaNote = `error variance ratio ${
          fmt(lambda, 3)
        } = (s_w ${o} / s_w ${reference})² from the replicates`;
      }
      try {
        const d: DemingResult = demingRegression(x, y, { errorVarianceRatio: lambda, confidence });
        entry.deming = d;
        lines.push({ name: "Deming", slope: d.slope, intercept: d.intercept });
        rows.push(["Deming slope", fmt(d.slope), ci(d.slopeCi), `jackknife; ${lambdaNote}`]);
        rows.push(["Deming intercept", fmt(d.intercept), ci(d.interceptCi), "jackknife"]);
      } catch (e) {
        rows.push(["Deming regression", "not computed", "–", (e as Error).message]);
      }
      try {
        const pb: PassingBablokResult = passingBablokRegression(x, y, { confidence });
        entry.passingBablok = pb;
        lines.push({ name: "Passing–Bablok", slope: pb.slope, intercept: pb.intercept });
        rows.push([
          "Passing–Bablok slope",
          fmt(pb.slope),
          ci(pb.slopeCi),
          `${pb.slopesUsed} pairwise slopes`,
        ]);
        rows.push(["Passing–Bablok intercept", fmt(pb.intercept), ci(pb.interceptCi), ""]);
        rows.push([
          "Cusum linearity statistic",
          fmt(pb.linearity.statistic, 3),
          "–",
          `${
            pb.linearity.nonLinear ? "exceeds" : "does not exceed"
          } the 5 % critical value ${pb.linearity.criticalValue}`,
        ]);
      } catch (e) {
        rows.push(["Passing–Bablok regression", "not computed", "–", (e as Error).message]);
      }
      report.table(
        ["Statistic", "Estimate", `${Math.round(confidence * 100)} % CI`, "Notes"],
        rows,
      );
      const chart = methodComparisonChart(x, y, lines, {
        unit,
        methodX: reference,
        methodY: o,
        title: `${o} against ${reference}`,
      });
      const svg = await chart.toSVG();
      const file = `comparison-${slug(o)}-vs-${slug(reference)}.svg`;
      charts.push({ file, svg });
      report.figure(
        svg,
        file,
        `${o} against ${reference} with the line of identity and the fitted lines.`,
      );
      comparisons[`${o} vs ${reference}`] = entry;
    }
    results.methodComparison = comparisons;
    // ICC across all observers
    if (observers.length >= 2) {
      progress("intraclass correlation");
      report.h(2, "Agreement among all observers/methods: intraclass correlation (first readings)");
      const complete = subjects.filter((s) => observers.every((o) => get(s, o, 1) !== undefined));
      const left = subjects.filter((s) => !complete.includes(s));
      report.p(
        `${complete.length} subjects with a first reading by every observer/method (${
          observers.join(", ")
        }); left out as incomplete: ${left.length ? left.join(", ") : "none"}.`,
      );
      try {
        const icc: IntraclassCorrelationResult = intraclassCorrelations(
          complete.map((s) => observers.map((o) => Number(get(s, o, 1)!.value))),
          { confidence },
        );
        results.icc = icc;
        report.table(
          [
            "Shrout & Fleiss",
            "McGraw & Wong",
            "Model",
            "Definition",
            "Unit",
            "ICC",
            `${Math.round(confidence * 100)} % CI`,
            "F (df1, df2)",
            "p",
          ],
          icc.forms.map((f) => [
            f.form,
            f.mcGrawWong,
            f.model,
            f.definition,
            f.unit,
            fmt(f.value, 3),
            ci(f.ci, 3),
            `${fmt(f.f, 4)} (${fmt(f.df1)}, ${fmt(f.df2)})`,
            pval(f.pValue),
          ]),
        );
        report.p(
          "Choose the form that matches the question before looking at the values: ICC(2,1)/ICC(A,1) for interchangeable observers drawn from a larger pool, ICC(3,1)/ICC(C,1) for these observers only; average-measure forms apply when the mean of all observers is what will be reported.",
        );
      } catch (e) {
        report.p(`Intraclass correlation not computed: ${(e as Error).message}`);
      }
    }
    const chart = observerChart(
      readings.map((r) => ({ subject: r.subject, observer: r.observer, value: Number(r.value) })),
      { unit, title: "All readings by subject and observer/method" },
    );
    const svg = await chart.toSVG();
    charts.push({ file: "observers.svg", svg });
    report.h(2, "Observer plot");
    report.figure(
      svg,
      "observers.svg",
      "Every reading by subject, coloured by observer/method (all replicates).",
    );
  }

  function gradedAnalysis() {
    const order = opt.categories
      ? opt.categories.split(",").map((c) => c.trim())
      : [...new Set(readings.map((r) => r.value))];
    const unknown = readings.filter((r) => !order.includes(r.value));
    if (unknown.length > 0) {
      fail(
        unknown.map((r) =>
          `error: line ${r.line}: column '${valueCol}': expected one of ${order.join(", ")}, got ${
            JSON.stringify(r.value)
          }`
        ),
      );
    }
    report.h(2, "Agreement on graded findings (first readings)");
    report.p(
      `Categories in order: ${order.join(" < ")}${
        opt.categories
          ? " (from --categories)"
          : " (order of first appearance; pass --categories to set the clinical order for weighted kappa)"
      }.`,
    );
    const kappas: Record<string, Record<string, CohenKappaResult | string>> = {};
    const rows: string[][] = [];
    for (let i = 0; i < observers.length; i++) {
      for (let j = i + 1; j < observers.length; j++) {
        const a = observers[i]!;
        const b = observers[j]!;
        progress(`kappa: ${a} vs ${b}`);
        const pairs = subjects.flatMap((s) => {
          const ra = get(s, a, 1);
          const rb = get(s, b, 1);
          return ra && rb ? [[ra.value, rb.value] as const] : [];
        });
        const key = `${a} vs ${b}`;
        kappas[key] = {};
        for (const weights of ["none", "linear", "quadratic"] as const) {
          try {
            const k = cohenKappa(pairs.map((p) => p[0]), pairs.map((p) => p[1]), {
              weights,
              categories: order,
              confidence,
            });
            kappas[key]![weights] = k;
            rows.push([
              key,
              weights === "none" ? "Cohen's kappa" : `weighted kappa (${weights})`,
              String(k.n),
              fmt(k.observedAgreement, 3),
              fmt(k.kappa, 3),
              fmt(k.standardError, 3),
              ci(k.ci, 3),
            ]);
          } catch (e) {
            kappas[key]![weights] = (e as Error).message;
            rows.push([
              key,
              weights,
              String(pairs.length),
              "–",
              "not computed",
              "–",
              (e as Error).message,
            ]);
          }
        }
      }
    }
    report.table([
      "Pair",
      "Statistic",
      "Subjects",
      "Observed agreement",
      "κ",
      "SE",
      `${Math.round(confidence * 100)} % CI`,
    ], rows);
    report.p(
      "Standard errors per Fleiss, Cohen & Everitt (1969); weights: linear 1 − |i−j|/(c−1), quadratic 1 − (i−j)²/(c−1)².",
    );
    results.cohenKappa = kappas;
    if (observers.length >= 3) {
      const complete = subjects.filter((s) => observers.every((o) => get(s, o, 1) !== undefined));
      const counts = complete.map((s) =>
        order.map((c) => observers.filter((o) => get(s, o, 1)!.value === c).length)
      );
      report.h(3, "Fleiss' kappa (all observers)");
      try {
        const fk: FleissKappaResult = fleissKappa(counts);
        results.fleissKappa = fk;
        report.table(["Subjects", "Ratings per subject", "P̄", "P̄e", "κ", "SE under κ = 0", "p"], [[
          String(fk.subjects),
          String(fk.ratersPerSubject),
          fmt(fk.observedAgreement, 3),
          fmt(fk.expectedAgreement, 3),
          fmt(fk.kappa, 3),
          fmt(fk.standardErrorNull, 3),
          pval(fk.pValue),
        ]]);
        report.p(`Subjects left out as incomplete: ${subjects.length - complete.length}.`);
      } catch (e) {
        report.p(`Fleiss' kappa not computed: ${(e as Error).message}`);
      }
    }
  }

  report.h(2, "Interpretation");
  report.p(
    "This report states no pass or fail. Whether the agreement is good enough is a clinical decision that must be made, and written down, before the data are seen: the largest acceptable difference between methods (compare it with the limits of agreement and their confidence intervals, the upper confidence limit of the upper limit in particular), the smallest acceptable ICC or kappa (compare it with the lower confidence limit), and the largest acceptable repeatability coefficient. Published rules of thumb for ICC or kappa categories are conventions, not properties of the data; if you use one, cite it and apply it to the confidence limits.",
  );
  report.h(2, "Cautions");
  report.list(cautions);

  const denoJson = JSON.parse(await Deno.readTextFile(new URL("../deno.json", import.meta.url)));
  const deps = [
    "papaparse",
    "zod",
    "vega",
    "vega-lite",
    "@stdlib/stats-base-dists-t-quantile",
    "@stdlib/stats-base-dists-f-quantile",
  ]
    .map((d) => `${d}: ${denoJson.imports?.[d] ?? "not pinned"}`);
  report.h(2, "Provenance");
  report.list([
    `Input: ${path}, SHA-256 ${sha256}`,
    `Rows: ${
      parsed.data.length - (trailing ? 1 : 0)
    } data rows, ${readings.length} readings used, ${missing.length} missing value cells left out`,
    `Tool: ${denoJson.name ?? "sonorigor"} ${
      denoJson.version ?? ""
    }, cli/validate.ts; Deno ${Deno.version.deno}`,
    `Dependencies: ${deps.join("; ")}`,
    `Date: ${new Date().toISOString()}`,
    `Seed: ${seed} (recorded for reproducibility; every statistic in this report is deterministic, none draws random numbers)`,
    `Options: multiplier ${multiplier}, confidence ${confidence}${opt.graded ? ", graded" : ""}`,
  ]);

  progress(`writing report to ${opt.out}`);
  await Deno.mkdir(opt.out, { recursive: true });
  for (const c of charts) await Deno.writeTextFile(`${opt.out}/${c.file}`, c.svg);
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<style>body{font-family:system-ui,sans-serif;max-width:1000px;margin:2em auto;padding:0 1em;color:#222}
table{border-collapse:collapse;margin:0.5em 0 1em}th,td{border:1px solid #ccc;padding:3px 8px;text-align:left;font-size:0.9em}
th{background:#f3f3f3}figure{margin:1em 0}figcaption{font-size:0.85em;color:#555}</style></head>
<body>
${report.html.join("\n")}
</body></html>
`;
  await Deno.writeTextFile(`${opt.out}/report.html`, html);
  await Deno.writeTextFile(`${opt.out}/report.md`, report.md.join("\n"));
  await Deno.writeTextFile(`${opt.out}/results.json`, JSON.stringify(results, null, 2) + "\n");
  progress(`done: ${opt.out}/report.html, ${opt.out}/report.md`);
}

function slug(s: string): string {
  return s.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "");
}

if (import.meta.main) await main();
