/**
 * The validation report command: reads a long-format measurement table (subject, observer or
 * method, replicate, value) with the one table reader, runs the library's `methodValidation`,
 * draws its charts and writes report.html (self-contained), report.md, results.json and one SVG
 * per chart. All analysis lives in the library (calc/agreement/method_validation.ts); this file
 * parses arguments, reads and writes files.
 *
 * Usage: `deno task validate <table.csv> [--subject col] [--rater col] [--replicate col]
 * [--value col] [--unit u] [--label text] [--encoding label] [--out dir] [--graded]
 * [--categories a,b,c] [--reference name] [--multiplier 1.96|2] [--confidence 0.95]
 * [--title text]`
 *
 * The table is streamed from the file (its SHA-256 computed on the way), so its size is limited
 * by the readings held for the statistics, not by the file: a table of several million readings
 * gives a report (bench/large_table.md has the figures). Charts with more points than
 * `MAX_CHART_POINTS` are not drawn; the report says which and why.
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
import { createHash, type Hash } from "node:crypto";
import {
  InputRangeError,
  InputTypeError,
  methodValidation,
  methodValidationHtml,
  methodValidationMarkdown,
  type MethodValidationReport,
  missingReadingText,
  type Quantity,
  type ReadTableOptions,
  readTableStream,
  renderIssue,
  statedColumnQuantity,
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
  --unit u           unit of the values in the file (e.g. "mm"), when the value column's header does not
                     state it as "value [mm]"; a known quantity is converted from it. A value column of no
                     quantity the package knows needs a unit, in its header or here. The unit is shown in
                     every table header and chart axis of the report
  --label text       what was measured, for a value column the package does not know (default: its header,
                     e.g. "jet_width [mm]" gives "Jet width")
  --encoding label   text encoding of the file, e.g. windows-1252 or iso-8859-1 (default utf-8; decoding is
                     strict: a byte the encoding cannot hold stops the command with its offset and line)
  --out dir          output folder (default "out/validation")
  --graded           values are ordered categories: kappa statistics
  --categories a,b   order of the categories for weighted kappa (default: order of first appearance)
  --reference name   reference observer/method (default: first in the table): each other one is compared
                     with it, then every pair of the others with each other
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

/** The file's bytes as a stream, each chunk also fed to `hash` when one is given. */
async function fileStream(path: string, hash: Hash | null): Promise<ReadableStream<Uint8Array>> {
  const file = await Deno.open(path, { read: true });
  if (hash === null) return file.readable;
  return file.readable.pipeThrough(
    new TransformStream<Uint8Array, Uint8Array>({
      transform(chunk, controller) {
        hash.update(chunk);
        controller.enqueue(chunk);
      },
    }),
  );
}

/** Reads the table from the file, streamed; stops with the reader's message on a defect. */
async function readStreamed(
  path: string,
  options: ReadTableOptions,
  hash: Hash | null,
): Promise<Table> {
  let stream: ReadableStream<Uint8Array>;
  try {
    stream = await fileStream(path, hash);
  } catch (e) {
    return fail([`error: cannot read '${path}': ${(e as Error).message}`]);
  }
  try {
    return await readTableStream(stream, options);
  } catch (e) {
    return fail(messagesOf(e));
  }
}

/** The pieces of `JSON.stringify(value, null, 2)`, in order, without building the whole text. */
function* jsonPieces(value: unknown, indent: string): Generator<string> {
  const v = (value as { toJSON?: () => unknown } | null)?.toJSON
    ? (value as { toJSON: () => unknown }).toJSON()
    : value;
  if (v === null || typeof v !== "object") {
    yield JSON.stringify(v) ?? "null";
    return;
  }
  const inner = indent + "  ";
  if (Array.isArray(v)) {
    if (v.length === 0) return yield "[]";
    yield "[\n";
    for (let i = 0; i < v.length; i++) {
      yield inner;
      const x = v[i];
      if (x === undefined || typeof x === "function" || typeof x === "symbol") yield "null";
      else yield* jsonPieces(x, inner);
      yield i < v.length - 1 ? ",\n" : "\n";
    }
    return yield `${indent}]`;
  }
  const keys = Object.keys(v).filter((k) => {
    const x = (v as Record<string, unknown>)[k];
    return x !== undefined && typeof x !== "function" && typeof x !== "symbol";
  });
  if (keys.length === 0) return yield "{}";
  yield "{\n";
  for (let i = 0; i < keys.length; i++) {
    yield `${inner}${JSON.stringify(keys[i])}: `;
    yield* jsonPieces((v as Record<string, unknown>)[keys[i]!], inner);
    yield i < keys.length - 1 ? ",\n" : "\n";
  }
  yield `${indent}}`;
}

/** Writes `JSON.stringify(value, null, 2)` and a line break to a file, in blocks of about 1 MB. */
async function writeJson(path: string, value: unknown): Promise<void> {
  const file = await Deno.open(path, { write: true, create: true, truncate: true });
  const encoder = new TextEncoder();
  const write = async (text: string) => {
    const bytes = encoder.encode(text);
    for (let off = 0; off < bytes.length;) off += await file.write(bytes.subarray(off));
  };
  try {
    let block: string[] = [];
    let size = 0;
    for (const piece of jsonPieces(value, "")) {
      block.push(piece);
      size += piece.length;
      if (size >= 1 << 20) {
        await write(block.join(""));
        block = [];
        size = 0;
      }
    }
    block.push("\n");
    await write(block.join(""));
  } finally {
    file.close();
  }
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

/** The column mapping a second reading needs (a unit or quantity stated on the command line,
 * text for graded findings), or null when the table as read will do. */
function remapping(
  table: Table,
  mapped: Readonly<Record<string, string | Quantity>>,
  design: ValidationDesignOptions,
  stated: { unit?: string | undefined; label?: string | undefined },
): Pick<ReadTableOptions, "columns" | "units"> | null {
  const header = orFail(() => validationColumns(table, design)).value;
  const column = [...table.columns.values()].find((c) => c.header === header)!;
  const columns: Record<string, string | Quantity> = { ...mapped };
  const units: Record<string, string> = {};
  if (design.graded) {
    if (column.kind === "text") return null;
    columns[header] = "text";
  } else if (column.kind === "text") {
    // a column of no known quantity: its unit from the header ("value [mm]") or --unit
    const quantity = orFail(() => statedColumnQuantity(header, stated));
    columns[header] = quantity;
    units[header] = quantity.unit;
  } else if (stated.label !== undefined) {
    return fail([
      `error: column '${header}' holds ${column.quantity.label}, a quantity the package knows; expected no --label, got --label ${stated.label}`,
    ]);
  } else if (stated.unit !== undefined && column.sourceUnit !== stated.unit) {
    if (/\[[^\]]+\]\s*$/.test(header)) {
      fail([
        `error: column '${header}' states its unit in the header; expected no --unit, got --unit ${stated.unit}`,
      ]);
    }
    units[header] = stated.unit;
  } else return null;
  return { columns, units };
}

/** Reads the table with the one reader, streamed (hashing the bytes on the first pass); a second
 * time only when the value column must be mapped, the first table dropped before. */
async function readStudyTable(
  path: string,
  encoding: string | undefined,
  design: ValidationDesignOptions,
  stated: { unit?: string | undefined; label?: string | undefined },
  hash: Hash,
): Promise<Table> {
  const mapped = validationReadOptions(design).columns;
  const common = { source: path, ...(encoding !== undefined ? { encoding } : {}) };
  let first: Table | null = await readStreamed(path, { ...common, columns: mapped }, hash);
  const remap = remapping(first, mapped, design, stated);
  if (remap === null) return first;
  first = null; // released before the second pass
  return await readStreamed(path, { ...common, ...remap }, null);
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
      graded: { type: "boolean", default: false },
      categories: { type: "string" },
      reference: { type: "string" },
      multiplier: { type: "string", default: "1.96" },
      confidence: { type: "string", default: "0.95" },
      title: { type: "string" },
      encoding: { type: "string" },
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
  if (!(multiplier > 0 && multiplier <= 5)) {
    fail([`error: expected --multiplier in (0, 5], got ${opt.multiplier}`]);
  }
  if (!(confidence > 0 && confidence < 1)) {
    fail([`error: expected --confidence in (0, 1), got ${opt.confidence}`]);
  }

  progress(`reading ${path}`);
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
  const hash = createHash("sha256");
  const table = await readStudyTable(path, opt.encoding, design, {
    unit: opt.unit,
    label: opt.label,
  }, hash);
  const inputSha256 = hash.digest("hex");

  progress("analysing the readings");
  const { tool, dependencies } = await toolInfo();
  let report: MethodValidationReport;
  try {
    report = methodValidation(table, {
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
      },
    });
  } catch (e) {
    // a defective table: every problem with its line, and the empty value cells for context
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
    return fail(messagesOf(e));
  }
  progress(
    `${report.data.readingsUsed} readings, ${report.data.subjects} subjects, ${report.data.observers.length} observers/methods`,
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
  // results.json: the report without the readings (the input file holds them; its hash is above),
  // written piece by piece: for millions of readings the text would pass the longest string
  const { readings: _readings, ...results } = report;
  await writeJson(`${opt.out}/results.json`, results);
  progress(`done: ${opt.out}/report.html, ${opt.out}/report.md`);
}

if (import.meta.main) await main();
