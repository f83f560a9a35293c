/**
 * The validation report command: reads a long-format measurement table (subject, observer or
 * method, replicate, value) with the one table reader, runs the library's `methodValidation`,
 * draws its charts and writes report.html (self-contained), report.md, results.json and one SVG
 * per chart. All analysis lives in the library (calc/agreement/method_validation.ts); this file
 * parses arguments, reads and writes files.
 *
 * Usage: `deno task validate <table.csv> [--subject col] [--rater col] [--replicate col]
 * [--value col] [--unit u] [--label text] [--out dir] [--seed n] [--graded] [--categories a,b,c]
 * [--reference name] [--multiplier 1.96|2] [--confidence 0.95] [--title text]`
 *
 * Missing-cell policy: a reading whose value cell is empty is reported by line number and left
 * out; every statistic then states how many subjects it used, and balanced methods (ICC, Fleiss'
 * kappa) use only subjects with a complete set of readings, listing the ones left out. Any
 * other defect (an invalid value, a missing subject or observer, a bad replicate number, a
 * duplicate reading, a wrong number of fields, an unknown category) stops the command with
 * line-numbered errors and exit code 1, and nothing is written.
 *
 * @module
 */
import { parseArgs } from "node:util";
import {
  InputRangeError,
  InputTypeError,
  methodValidation,
  methodValidationHtml,
  methodValidationMarkdown,
  missingReadingText,
  type Quantity,
  readTable,
  renderIssue,
  statedQuantity,
  type Table,
  validationColumns,
  type ValidationDesignOptions,
  validationReadings,
  validationReadOptions,
} from "../mod.ts";
import { methodValidationChart } from "../plot/agreement.ts";

const progress = (msg: string) => console.error(`[validate] ${msg}`);

const HELP = `Usage: deno task validate <table.csv> [options]
  --subject col      subject column (default "subject"; falls back to "patient", "subject_id", "id")
  --rater col        observer/method column (default "observer"; falls back to "rater", "reader", "method")
  --replicate col    replicate column (default "replicate"; falls back to "repeat", "reading", "round";
                     optional: absent means one reading each)
  --value col        value column (default "value"; falls back to the single remaining column)
  --unit u           unit of the values in the file (e.g. "mm"; a known quantity is converted from it);
                     required, with --label, when the value column is not a quantity the package knows
  --label text       what was measured, for a value column the package does not know (default: its header)
  --out dir          output folder (default "out/validation")
  --seed n           recorded in provenance (all statistics here are deterministic)
  --graded           values are ordered categories: kappa statistics
  --categories a,b   order of the categories for weighted kappa (default: order of first appearance)
  --reference name   reference observer/method for method comparison (default: first in the table)
  --multiplier m     limits-of-agreement multiplier, 1.96 (default) or 2
  --confidence c     confidence level of intervals (default 0.95)
  --title text       study title`;

function fail(messages: readonly string[]): never {
  for (const m of messages) console.error(m);
  Deno.exit(1);
}

/** The messages of an error thrown by the reader or the library (every issue when it has them). */
function messagesOf(e: unknown): string[] {
  if (e instanceof InputTypeError || e instanceof InputRangeError) {
    return e.issues.filter((i) => i.severity === "error").map((i) => `error: ${renderIssue(i)}`);
  }
  if (e instanceof TypeError || e instanceof RangeError) return [`error: ${e.message}`];
  throw e;
}

/** Runs a step that may reject the input, printing its messages and exiting with code 1. */
function orFail<T>(step: () => T): T {
  try {
    return step();
  } catch (e) {
    return fail(messagesOf(e));
  }
}

async function sha256(bytes: Uint8Array<ArrayBuffer>): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest("SHA-256", bytes));
  return Array.from(digest, (b) => b.toString(16).padStart(2, "0")).join("");
}

/** Tool name, version and the pinned dependencies the report depends on, from deno.json. */
async function toolInfo(): Promise<{ tool: string; dependencies: string[] }> {
  const deno = JSON.parse(await Deno.readTextFile(new URL("../deno.json", import.meta.url)));
  const imports: Record<string, string> = deno.imports ?? {};
  const used = Object.keys(imports).filter((d) =>
    ["papaparse", "mathjs", "vega", "vega-lite"].includes(d) ||
    d.startsWith("@stdlib/stats-base-dists-")
  );
  return {
    tool: `${deno.name ?? "sonorigor"} ${deno.version ?? ""}, cli/validate.ts`,
    dependencies: used.map((d) => `${d}: ${imports[d]}`),
  };
}

/** Reads the table with the one reader; a second time only when the value column must be
 * mapped (a unit or quantity stated on the command line, text for graded findings). */
function readStudyTable(
  bytes: Uint8Array,
  source: string,
  design: ValidationDesignOptions,
  stated: { unit?: string | undefined; label?: string | undefined },
): Table {
  const mapped = validationReadOptions(design).columns;
  const table = orFail(() => readTable(bytes, { source, columns: mapped }));
  const header = orFail(() => validationColumns(table, design)).value;
  const column = [...table.columns.values()].find((c) => c.header === header)!;
  const columns: Record<string, string | Quantity> = { ...mapped };
  const units: Record<string, string> = {};
  if (design.graded) {
    if (column.kind === "text") return table;
    columns[header] = "text";
  } else if (column.kind === "text") {
    if (stated.unit === undefined) {
      fail([
        `error: column '${header}' holds values of no quantity the package knows: state their unit with --unit (and what was measured with --label), or pass --graded for graded findings`,
      ]);
    }
    columns[header] = statedQuantity({ label: stated.label ?? header, unit: stated.unit });
    units[header] = stated.unit;
  } else if (stated.unit !== undefined && column.sourceUnit !== stated.unit) {
    if (/\[[^\]]+\]\s*$/.test(header)) {
      fail([
        `error: column '${header}' states its unit in the header; expected no --unit, got --unit ${stated.unit}`,
      ]);
    }
    units[header] = stated.unit;
  } else return table;
  return orFail(() => readTable(bytes, { source, columns, units }));
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
      unit: { type: "string" },
      label: { type: "string" },
      out: { type: "string", default: "out/validation" },
      seed: { type: "string", default: "1" },
      graded: { type: "boolean", default: false },
      categories: { type: "string" },
      reference: { type: "string" },
      multiplier: { type: "string", default: "1.96" },
      confidence: { type: "string", default: "0.95" },
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
  if (opt.label !== undefined && opt.unit === undefined) {
    fail([`error: expected --label together with --unit, got --label ${opt.label} alone`]);
  }

  progress(`reading ${path}`);
  let bytes: Uint8Array<ArrayBuffer>;
  try {
    bytes = await Deno.readFile(path);
  } catch (e) {
    fail([`error: cannot read '${path}': ${(e as Error).message}`]);
  }
  const design: ValidationDesignOptions = {
    ...(opt.subject !== undefined ? { subject: opt.subject } : {}),
    ...(opt.rater !== undefined ? { observer: opt.rater } : {}),
    ...(opt.replicate !== undefined ? { replicate: opt.replicate } : {}),
    ...(opt.value !== undefined ? { value: opt.value } : {}),
    graded: opt.graded,
    ...(opt.categories !== undefined
      ? { categories: opt.categories.split(",").map((c) => c.trim()) }
      : {}),
  };
  const table = readStudyTable(bytes, path, design, { unit: opt.unit, label: opt.label });

  progress("checking the readings");
  const study = orFail(() => validationReadings(table, design));
  const errors = study.issues.filter((i) => i.severity === "error");
  if (errors.length > 0) {
    fail([
      `error: ${errors.length} problem(s) in ${path}; nothing was computed:`,
      ...errors.map((i) => `  ${renderIssue(i)}`),
      ...study.missing.map((m) =>
        `  ${
          missingReadingText(m)
        }: empty value cell (would be left out under the missing-cell policy)`
      ),
    ]);
  }
  progress(
    `${study.readings.length} readings, ${study.subjects.length} subjects, ${study.observers.length} observers/methods`,
  );

  const { tool, dependencies } = await toolInfo();
  const inputSha256 = await sha256(bytes);
  const report = orFail(() =>
    methodValidation(table, {
      ...design,
      ...(opt.reference !== undefined ? { reference: opt.reference } : {}),
      multiplier,
      confidence,
      ...(opt.title !== undefined ? { title: opt.title } : {}),
      provenance: {
        inputSha256,
        tool,
        runtime: `Deno ${Deno.version.deno}`,
        dependencies,
        date: new Date().toISOString(),
        seed,
      },
    })
  );
  const svgs: Record<string, string> = {};
  for (const figure of report.figures) {
    progress(`chart ${figure.file}`);
    svgs[figure.file] = await methodValidationChart(report, figure).toSVG();
  }

  progress(`writing report to ${opt.out}`);
  await Deno.mkdir(opt.out, { recursive: true });
  for (const [file, svg] of Object.entries(svgs)) {
    await Deno.writeTextFile(`${opt.out}/${file}`, svg);
  }
  await Deno.writeTextFile(`${opt.out}/report.html`, methodValidationHtml(report, { svgs }));
  await Deno.writeTextFile(`${opt.out}/report.md`, methodValidationMarkdown(report));
  // results.json: the report without the readings (the input file holds them; its hash is above)
  const { readings: _readings, ...results } = report;
  await Deno.writeTextFile(`${opt.out}/results.json`, JSON.stringify(results, null, 2) + "\n");
  progress(`done: ${opt.out}/report.html, ${opt.out}/report.md`);
}

if (import.meta.main) await main();
