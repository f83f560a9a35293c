/**
 * Writes the reference documentation (run `deno task docs`; `--check` fails when any page is
 * stale, missing or left over):
 *
 * - docs/calculations.md: every calculation and family member of the catalog, derived from the
 *   definitions;
 * - docs/api.md and docs/api/*.md: every public export of the entry points (`mod.ts`,
 *   `plot/mod.ts`) with its declaration, documentation and examples, rendered from
 *   `deno doc --json` by `cli/api_reference.ts`.
 *
 * @module
 */
import * as api from "../mod.ts";
import {
  CATALOG,
  catalogCalculations,
  catalogMarkdown,
  formatRange,
  formatUnit,
  isCalculation,
  isQuantity,
} from "../mod.ts";
import { apiReference, type DocJson, type EntryPoint } from "./api_reference.ts";

const ROOT = new URL("../", import.meta.url);
const DOCS = new URL("docs/", ROOT);

/** The package's entry points (deno.json "exports"), in the order the reference lists them. */
const ENTRIES: readonly EntryPoint[] = [
  { url: new URL("mod.ts", ROOT).href, specifier: "@sonorigor/sonorigor" },
  { url: new URL("plot/mod.ts", ROOT).href, specifier: "@sonorigor/sonorigor/plot" },
];

/** Runs `deno doc --json` on modules (file URLs) and parses its output. */
async function denoDoc(urls: readonly string[]): Promise<DocJson> {
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["doc", "--json", ...urls.map((u) => new URL(u).pathname)],
    cwd: new URL(ROOT).pathname,
    stdout: "piped",
    stderr: "piped",
  }).output();
  if (!out.success) {
    throw new Error(`deno doc --json failed:\n${new TextDecoder().decode(out.stderr)}`);
  }
  return JSON.parse(new TextDecoder().decode(out.stdout));
}

/**
 * The module documentation of each source folder that declares exports: its mod.ts, else the
 * first of its declaring files (by name) that has one.
 */
async function folderDocs(doc: DocJson): Promise<Record<string, string>> {
  const files = new Map<string, Set<string>>();
  for (const node of Object.values(doc.nodes)) {
    for (const s of node.symbols) {
      const file = s.declarations[0]!.location.filename;
      const folder = file.slice(0, file.lastIndexOf("/") + 1);
      files.set(folder, (files.get(folder) ?? new Set()).add(file));
    }
  }
  const candidates = new Map<string, string[]>();
  for (const [folder, declaring] of files) {
    const mod = new URL("mod.ts", folder).href;
    const exists = await Deno.stat(new URL(mod)).then(() => true, () => false);
    candidates.set(folder, exists ? [mod] : [...declaring].sort());
  }
  const docs = await denoDoc([...candidates.values()].flat().sort());
  const result: Record<string, string> = {};
  for (const [folder, urls] of candidates) {
    const text = urls.map((u) => docs.nodes[u]?.module_doc?.doc).find((d) => d);
    if (text) result[folder.slice(ROOT.href.length, -1)] = text;
  }
  return result;
}

/** A heading's anchor as GitHub writes it: lower case, punctuation dropped, spaces as "-". */
const anchor = (heading: string) =>
  heading.toLowerCase().replace(/[^\p{L}\p{N}\s_-]/gu, "").replace(/\s/g, "-");

/**
 * What a quantity or a calculation of the package declares, for its API section: a quantity's
 * unit, ranges and resolution; a calculation's link to its section of calculations.md.
 */
function definitionNote(name: string): string | undefined {
  const value = (api as Record<string, unknown>)[name];
  if (isQuantity(value)) {
    const unit = formatUnit(value.unit);
    const typical = [
      value.typical ? `typical ${formatRange(value.typical, value.unit)} (adults)` : "",
      value.typicalPediatric && value.typicalPediatric !== value.typical
        ? `${formatRange(value.typicalPediatric, value.unit)} (children)`
        : "",
    ].filter(Boolean).join(", ");
    return `Quantity \`${value.id}\`: ${value.label}${
      unit ? ` in ${unit}` : " (dimensionless)"
    }; valid ${formatRange(value.valid, value.unit)}${
      typical ? `; ${typical}` : ""
    }; shown to ${value.resolution}${unit ? ` ${unit}` : ""}.`;
  }
  if (isCalculation(value)) {
    return `Calculation \`${value.id}\`: inputs, outputs, units, ranges, formula and citations in [calculations.md](../calculations.md#${
      anchor(`${value.title} (${value.id})`)
    }).`;
  }
  return undefined;
}

const doc = await denoDoc(ENTRIES.map((e) => e.url));
const pages = apiReference(doc, {
  entries: ENTRIES,
  root: ROOT.href,
  folderDocs: await folderDocs(doc),
  notes: definitionNote,
});
pages.set("calculations.md", catalogMarkdown(CATALOG));
const count = catalogCalculations(CATALOG).length;
const exports = Object.values(doc.nodes).reduce((n, node) => n + node.symbols.length, 0);
const summary = `(${count} calculations, ${exports} exports in ${pages.size - 2} API pages)`;

/** Pages under docs/api/ that the reference no longer has. */
async function leftOver(): Promise<string[]> {
  const found: string[] = [];
  try {
    for await (const e of Deno.readDir(new URL("api/", DOCS))) {
      if (e.isFile && !pages.has(`api/${e.name}`)) found.push(`api/${e.name}`);
    }
  } catch (error) {
    if (!(error instanceof Deno.errors.NotFound)) throw error;
  }
  return found.sort();
}

if (Deno.args.includes("--check")) {
  const stale: string[] = [];
  for (const [name, text] of pages) {
    const current = await Deno.readTextFile(new URL(name, DOCS)).catch(() => undefined);
    if (current !== text) stale.push(current === undefined ? `${name} (missing)` : name);
  }
  for (const name of await leftOver()) stale.push(`${name} (no longer generated)`);
  if (stale.length > 0) {
    console.error(`docs/ is out of date: run \`deno task docs\`\n  ${stale.join("\n  ")}`);
    Deno.exit(1);
  }
  console.log(`docs/ is current ${summary}`);
} else {
  await Deno.mkdir(new URL("api/", DOCS), { recursive: true });
  for (const name of await leftOver()) await Deno.remove(new URL(name, DOCS));
  for (const [name, text] of pages) await Deno.writeTextFile(new URL(name, DOCS), text);
  console.log(`Wrote docs/ ${summary}`);
}
