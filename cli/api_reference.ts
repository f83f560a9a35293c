/**
 * The API reference in Markdown, rendered from the JSON that `deno doc --json` writes for the
 * package's entry points (the source of truth: every public export, its signature and its JSDoc).
 * One page per source folder (`docs/api/<folder>.md`) with each export's signature, its
 * documentation, parameters, return value, errors and examples, and an index page
 * (`docs/api.md`). `cli/docs.ts` runs `deno doc` and writes the pages.
 *
 * @module
 */

/** A type as `deno doc --json` describes it (the fields read here). */
export interface DocType {
  /** The kind of type: "keyword", "typeRef", "union", "literal", … */
  kind: string;
  /** The source text where deno doc keeps it. */
  repr?: string;
  /** The kind-specific content. */
  // deno-lint-ignore no-explicit-any
  value?: any;
}

/** A JSDoc block as `deno doc --json` describes it. */
export interface DocJs {
  /** The text before the tags. */
  doc?: string;
  /** The tags (`@param`, `@returns`, `@throws`, `@example`, …). */
  tags?: { kind: string; name?: string; doc?: string; value?: string; tsType?: DocType }[];
}

/** One declaration of an exported symbol. */
export interface DocDeclaration {
  /** Where it is declared. */
  location: { filename: string; line: number };
  /** "function", "interface", "class", "typeAlias", "variable", "enum", "namespace". */
  kind: string;
  /** Its JSDoc. */
  jsDoc?: DocJs;
  /** The kind-specific definition. */
  // deno-lint-ignore no-explicit-any
  def?: any;
}

/** An exported symbol with its declarations (several for overloads). */
export interface DocSymbol {
  /** The exported name. */
  name: string;
  /** Its declarations. */
  declarations: DocDeclaration[];
}

/** The output of `deno doc --json` (format version 2). */
export interface DocJson {
  /** Per module URL: its module documentation and exported symbols. */
  nodes: Record<string, { module_doc?: DocJs; symbols: DocSymbol[] }>;
}

/** An entry point of the package: the module file, and the specifier users import. */
export interface EntryPoint {
  /** The module URL as deno doc keys it (e.g. `file:///…/mod.ts`). */
  url: string;
  /** The import specifier (e.g. `@sonorigor/sonorigor/plot`). */
  specifier: string;
}

/** Options of {@linkcode apiReference}. */
export interface ApiReferenceOptions {
  /** The package's entry points, in the order their pages are listed. */
  entries: readonly EntryPoint[];
  /** The repository root as a file URL ending in "/" (locations are shown relative to it). */
  root: string;
  /** The module documentation of each source folder (relative path → text), when it has one. */
  folderDocs?: Readonly<Record<string, string>>;
  /**
   * Markdown added to an export's section from its value (what a quantity or calculation
   * declares), or undefined for nothing; `page` is the page's path under docs/api/.
   */
  notes?: (name: string) => string | undefined;
}

const KEYWORD_TYPES = new Set(["keyword", "this"]);

function literalText(value: { kind: string; string?: string; number?: number; boolean?: boolean }) {
  if (value.kind === "string") return JSON.stringify(value.string);
  if (value.kind === "number") return String(value.number);
  if (value.kind === "boolean") return String(value.boolean);
  return "unknown";
}

function needsParens(t: DocType): boolean {
  return ["union", "intersection", "fnOrConstructor", "conditional"].includes(t.kind);
}

// deno-lint-ignore no-explicit-any
function paramText(p: any): string {
  if (p.kind === "rest") {
    return `...${paramText(p.arg)}${p.tsType ? `: ${typeText(p.tsType)}` : ""}`;
  }
  if (p.kind === "assign") {
    const left = paramText(p.left);
    return left.includes(":") ? left.replace(/:/, "?:") : `${left}?`;
  }
  const name = p.kind === "identifier" ? p.name : p.kind === "object" ? "{…}" : "[…]";
  return `${name}${p.optional ? "?" : ""}${p.tsType ? `: ${typeText(p.tsType)}` : ""}`;
}

// deno-lint-ignore no-explicit-any
function typeParamsText(params: any[] | undefined): string {
  if (params === undefined || params.length === 0) return "";
  return `<${
    params.map((p) =>
      `${p.name}${p.constraint ? ` extends ${typeText(p.constraint)}` : ""}${
        p.default ? ` = ${typeText(p.default)}` : ""
      }`
    ).join(", ")
  }>`;
}

// deno-lint-ignore no-explicit-any
function memberText(m: any): string {
  const prefix = m.readonly ? "readonly " : "";
  const name = m.computed ? `[${m.name}]` : m.name;
  if (m.kind === "method" || m.params !== undefined && m.returnType !== undefined) {
    return `${name}${m.optional ? "?" : ""}${typeParamsText(m.typeParams)}(${
      (m.params ?? []).map(paramText).join(", ")
    }): ${typeText(m.returnType)}`;
  }
  return `${prefix}${name}${m.optional ? "?" : ""}: ${typeText(m.tsType)}`;
}

// deno-lint-ignore no-explicit-any
function objectText(v: any): string {
  const members = [
    ...(v.properties ?? []).map(memberText),
    ...(v.methods ?? []).map(memberText),
    ...(v.callSignatures ?? []).map((c: DocDeclaration["def"]) =>
      `(${(c.params ?? []).map(paramText).join(", ")}): ${typeText(c.tsType)}`
    ),
    ...(v.indexSignatures ?? []).map((s: DocDeclaration["def"]) =>
      `${s.readonly ? "readonly " : ""}[${(s.params ?? []).map(paramText).join(", ")}]: ${
        typeText(s.tsType)
      }`
    ),
  ];
  return members.length === 0 ? "{}" : `{ ${members.join("; ")} }`;
}

/**
 * A type written as TypeScript source text, from its `deno doc --json` description.
 *
 * @param t The type (undefined reads as `unknown`, as TypeScript infers nothing to show).
 * @returns The TypeScript text, e.g. `readonly number[]` or `"gum" | "monteCarlo"`.
 *
 * @example
 * ```ts
 * import { typeText } from "./api_reference.ts";
 * import assert from "node:assert/strict";
 * const numbers = { kind: "array", value: { kind: "keyword", value: "number" } };
 * assert.equal(typeText({ kind: "typeOperator", value: { operator: "readonly", tsType: numbers } }), "readonly number[]");
 * assert.equal(
 *   typeText({ kind: "union", value: [
 *     { kind: "literal", value: { kind: "string", string: "gum" } },
 *     { kind: "literal", value: { kind: "string", string: "monteCarlo" } },
 *   ] }),
 *   '"gum" | "monteCarlo"',
 * );
 * ```
 */
export function typeText(t: DocType | undefined): string {
  if (t === undefined) return "unknown";
  const v = t.value;
  if (KEYWORD_TYPES.has(t.kind)) return typeof v === "string" ? v : t.repr ?? t.kind;
  switch (t.kind) {
    case "literal":
      return v.kind === "template" ? t.repr ?? "string" : literalText(v);
    case "typeRef":
      return `${v.typeName}${
        v.typeParams?.length ? `<${v.typeParams.map(typeText).join(", ")}>` : ""
      }`;
    case "union":
      return v.map(typeText).join(" | ");
    case "intersection":
      return v.map(typeText).join(" & ");
    case "array":
      return needsParens(v) ? `(${typeText(v)})[]` : `${typeText(v)}[]`;
    case "tuple":
      return `[${v.map(typeText).join(", ")}]`;
    case "typeOperator":
      return `${v.operator} ${typeText(v.tsType)}`;
    case "parenthesized":
      return `(${typeText(v)})`;
    case "typeLiteral":
      return objectText(v);
    case "fnOrConstructor":
      return `${v.constructor ? "new " : ""}(${v.params.map(paramText).join(", ")}) => ${
        typeText(v.tsType)
      }`;
    case "mapped":
      return `{ ${v.readonly ? "readonly " : ""}[${v.typeParam.name} in ${
        typeText(v.typeParam.constraint)
      }]${v.optional === true ? "?" : ""}: ${typeText(v.tsType)} }`;
    case "conditional":
      return `${typeText(v.checkType)} extends ${typeText(v.extendsType)} ? ${
        typeText(v.trueType)
      } : ${typeText(v.falseType)}`;
    case "infer":
      return `infer ${v.typeParam.name}`;
    case "indexedAccess":
      return `${typeText(v.objType)}[${typeText(v.indexType)}]`;
    case "typeQuery":
      return `typeof ${typeof v === "string" ? v : t.repr}`;
    case "optional":
      return `${typeText(v)}?`;
    case "rest":
      return `...${typeText(v)}`;
    case "typePredicate":
      return t.repr ??
        `${v.asserts ? "asserts " : ""}${v.param?.name ?? "this"} is ${typeText(v.type)}`;
    default:
      return t.repr ?? "unknown";
  }
}

/** Writes a declaration over several lines when it is longer than a line of the reference. */
function wrapSignature(head: string, parts: string[], tail: string): string {
  const flat = `${head}(${parts.join(", ")})${tail}`;
  if (flat.length <= 100 || parts.length === 0) return flat;
  return `${head}(\n${parts.map((p) => `  ${p},`).join("\n")}\n)${tail}`;
}

/**
 * The TypeScript declaration of one export, without its body or initializer: a function's
 * signature, an interface's or class's head, a type alias, a constant with its type.
 *
 * @param name The exported name.
 * @param declaration One of its declarations.
 * @returns The declaration as TypeScript text.
 *
 * @example
 * ```ts
 * import { declarationText } from "./api_reference.ts";
 * import assert from "node:assert/strict";
 * const text = declarationText("clamp", {
 *   kind: "function",
 *   location: { filename: "file:///a.ts", line: 1 },
 *   def: {
 *     params: [
 *       { kind: "identifier", name: "x", optional: false, tsType: { kind: "keyword", value: "number" } },
 *     ],
 *     returnType: { kind: "keyword", value: "number" },
 *   },
 * });
 * assert.equal(text, "function clamp(x: number): number");
 * ```
 */
export function declarationText(name: string, declaration: DocDeclaration): string {
  const def = declaration.def ?? {};
  switch (declaration.kind) {
    case "function":
      return wrapSignature(
        `${def.isAsync ? "async " : ""}function${def.isGenerator ? "*" : ""} ${name}${
          typeParamsText(def.typeParams)
        }`,
        (def.params ?? []).map(paramText),
        `: ${typeText(def.returnType)}`,
      );
    case "interface":
      return `interface ${name}${typeParamsText(def.typeParams)}${
        def.extends?.length ? ` extends ${def.extends.map(typeText).join(", ")}` : ""
      }`;
    case "class":
      return `${def.isAbstract ? "abstract " : ""}class ${name}${typeParamsText(def.typeParams)}${
        def.extends ? ` extends ${def.extends}` : ""
      }${def.implements?.length ? ` implements ${def.implements.map(typeText).join(", ")}` : ""}`;
    case "typeAlias":
      return `type ${name}${typeParamsText(def.typeParams)} = ${typeText(def.tsType)}`;
    case "variable":
      return `${def.kind ?? "const"} ${name}: ${typeText(def.tsType)}`;
    case "enum":
      return `enum ${name} { ${
        (def.members ?? []).map((m: { name: string }) => m.name).join(", ")
      } }`;
    default:
      return `${declaration.kind} ${name}`;
  }
}

/** A heading's anchor as GitHub writes it for "### `name`": lower case, `$` dropped. */
function slug(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9_\- ]/g, "").replace(/ /g, "-");
}

/** Where each exported name is documented: page file name and anchor. */
type Links = Map<string, { page: string; anchor: string }>;

/** Replaces `{@link X}` and `{@linkcode X}` by Markdown links to the page documenting X. */
function withLinks(text: string, page: string, links: Links): string {
  return text.replace(
    /\{@link(code|plain)?\s+([^\s}|]+)(?:\s*\|\s*|\s+)?([^}]*)\}/g,
    (_all, code: string | undefined, target: string, label: string) => {
      const shown = label.trim() !== "" ? label.trim() : target;
      const text = code === "plain" ? shown : `\`${shown}\``;
      const at = links.get(target.split(".")[0]!);
      if (at === undefined) return text;
      return `[${text}](${at.page === page ? "" : at.page}#${at.anchor})`;
    },
  );
}

/** Indents every line after the first (a multi-line text inside a list item). */
const indented = (text: string) => text.trim().replace(/\n/g, "\n  ");

function jsDocMarkdown(js: DocJs | undefined, page: string, links: Links): string[] {
  if (js === undefined) return [];
  const out: string[] = [];
  if (js.doc) out.push(withLinks(js.doc.trim(), page, links), "");
  const tags = js.tags ?? [];
  const params = tags.filter((t) => t.kind === "param");
  if (params.length > 0) {
    out.push("Parameters:", "");
    for (const p of params) {
      out.push(`- \`${p.name}\`${p.doc ? `: ${withLinks(indented(p.doc), page, links)}` : ""}`);
    }
    out.push("");
  }
  for (const t of tags) {
    if (t.kind === "return" && t.doc) {
      out.push(`Returns: ${withLinks(t.doc.trim(), page, links)}`, "");
    }
  }
  const throws = tags.filter((t) => t.kind === "throws");
  if (throws.length > 0) {
    out.push("Throws:", "");
    for (const t of throws) {
      const type = t.tsType ? `\`${typeText(t.tsType)}\`` : "an error";
      out.push(`- ${type}${t.doc ? `: ${withLinks(indented(t.doc), page, links)}` : ""}`);
    }
    out.push("");
  }
  for (const t of tags) {
    if (t.kind === "deprecated") out.push(`**Deprecated.** ${t.doc ?? ""}`.trim(), "");
    if (t.kind === "see" && t.doc) out.push(`See: ${withLinks(t.doc.trim(), page, links)}`, "");
    if (t.kind === "default" && t.value) out.push(`Default: \`${t.value}\``, "");
  }
  for (const t of tags) {
    if (t.kind !== "example" || !t.doc) continue;
    const doc = t.doc.trim();
    const fence = doc.indexOf("```");
    const title = (fence < 0 ? "" : doc.slice(0, fence)).trim();
    out.push(
      title === "" ? "Example:" : `Example: ${title}`,
      "",
      fence < 0 ? doc : doc.slice(fence),
    );
    out.push("");
  }
  return out;
}

/** `@default x` on a member arrives as an unsupported tag with the text "@default x". */
function memberNote(js: DocJs | undefined): string {
  const defaults = (js?.tags ?? []).map((t) => t.value)
    .filter((v): v is string => typeof v === "string")
    .map((v) => v.replace(/^@default\s+/, ""));
  return defaults.length > 0 ? ` (default \`${defaults.join(", ")}\`)` : "";
}

// deno-lint-ignore no-explicit-any
function membersMarkdown(def: any, page: string, links: Links): string[] {
  // deno-lint-ignore no-explicit-any
  const visible = (m: any) =>
    m.accessibility !== "private" && m.accessibility !== "protected" &&
    !String(m.name).startsWith("#");
  const members = [
    // deno-lint-ignore no-explicit-any
    ...(def.constructors ?? []).filter(visible).map((c: any) => ({
      text: `new ${def.name ?? "constructor"}(${(c.params ?? []).map(paramText).join(", ")})`,
      js: c.jsDoc,
    })),
    // deno-lint-ignore no-explicit-any
    ...(def.properties ?? []).filter(visible).map((m: any) => ({
      text: `${m.isStatic ? "static " : ""}${memberText(m)}`,
      js: m.jsDoc,
    })),
    // deno-lint-ignore no-explicit-any
    ...(def.methods ?? []).filter(visible).map((m: any) => ({
      text: `${m.isStatic ? "static " : ""}${
        m.functionDef
          ? `${m.name}${typeParamsText(m.functionDef.typeParams)}(${
            (m.functionDef.params ?? []).map(paramText).join(", ")
          }): ${typeText(m.functionDef.returnType)}`
          : memberText(m)
      }`,
      js: m.jsDoc,
    })),
    ...(def.callSignatures ?? []).map((c: DocDeclaration["def"]) => ({
      text: `(${(c.params ?? []).map(paramText).join(", ")}): ${typeText(c.tsType)}`,
      js: c.jsDoc,
    })),
    ...(def.indexSignatures ?? []).map((s: DocDeclaration["def"]) => ({
      text: `[${(s.params ?? []).map(paramText).join(", ")}]: ${typeText(s.tsType)}`,
      js: s.jsDoc,
    })),
  ];
  if (members.length === 0) return [];
  return [
    "Members:",
    "",
    ...members.map(({ text, js }) =>
      `- \`${text.replace(/`/g, "'")}\`${memberNote(js)}${
        js?.doc ? `: ${withLinks(indented(js.doc), page, links)}` : ""
      }`
    ),
    "",
  ];
}

/** Plural headings of the contents list of a page. */
const KIND_PLURALS: Readonly<Record<string, string>> = {
  function: "Functions",
  interface: "Interfaces",
  class: "Classes",
  typeAlias: "Types",
  variable: "Constants",
  enum: "Enums",
  namespace: "Namespaces",
};

const KIND_WORDS: Readonly<Record<string, string>> = {
  function: "function",
  interface: "interface",
  class: "class",
  typeAlias: "type",
  variable: "constant",
  enum: "enum",
  namespace: "namespace",
};

function symbolMarkdown(
  symbol: DocSymbol,
  page: string,
  links: Links,
  options: ApiReferenceOptions,
  specifier: string,
): string {
  const root = options.root;
  // an overloaded function: the signatures, without the implementation's
  const overloads = symbol.declarations.filter((d) => !(d.kind === "function" && d.def?.hasBody));
  const declarations = overloads.length > 0 ? overloads : symbol.declarations;
  const first = declarations[0]!;
  const where = first.location.filename.startsWith(root)
    ? first.location.filename.slice(root.length)
    : first.location.filename;
  const lines = [
    `### \`${symbol.name}\``,
    "",
    `${
      KIND_WORDS[first.kind] ?? first.kind
    } · \`import { ${symbol.name} } from "${specifier}"\` · ${where}`,
    "",
    "```ts",
    ...declarations.map((d) => declarationText(symbol.name, d)),
    "```",
    "",
  ];
  const note = options.notes?.(symbol.name);
  if (note !== undefined) lines.push(note, "");
  const seen = new Set<string>();
  for (const d of declarations) {
    const key = JSON.stringify(d.jsDoc ?? null);
    if (seen.has(key)) continue;
    seen.add(key);
    for (const line of jsDocMarkdown(d.jsDoc, page, links)) lines.push(line);
    if (d.kind === "interface" || d.kind === "class") {
      for (const line of membersMarkdown({ ...d.def, name: symbol.name }, page, links)) {
        lines.push(line);
      }
    }
  }
  return lines.join("\n").replace(/\n{3,}/g, "\n\n").trimEnd() + "\n";
}

/** A page of the reference: one source folder of one entry point. */
interface Page {
  file: string;
  folder: string;
  entry: EntryPoint;
  symbols: DocSymbol[];
}

function folderOf(url: string, root: string): string {
  const path = url.startsWith(root) ? url.slice(root.length) : url;
  const slash = path.lastIndexOf("/");
  return slash < 0 ? "." : path.slice(0, slash);
}

function pagesOf(doc: DocJson, options: ApiReferenceOptions): Page[] {
  const pages = new Map<string, Page>();
  for (const entry of options.entries) {
    const node = doc.nodes[entry.url];
    if (node === undefined) throw new Error(`deno doc gave nothing for ${entry.url}`);
    for (const symbol of node.symbols) {
      const folder = folderOf(symbol.declarations[0]!.location.filename, options.root);
      const key = `${entry.specifier} ${folder}`;
      let page = pages.get(key);
      if (page === undefined) {
        const base = folder.replace(/^calc\//, "").replace(/\//g, "_") || "root";
        page = { file: `${base}.md`, folder, entry, symbols: [] };
        pages.set(key, page);
      }
      page.symbols.push(symbol);
    }
  }
  const byFile = new Map<string, number>();
  for (const page of pages.values()) {
    const n = byFile.get(page.file) ?? 0;
    byFile.set(page.file, n + 1);
    if (n > 0) page.file = page.file.replace(/\.md$/, `_${n + 1}.md`);
    page.symbols.sort((a, b) =>
      a.name.toLowerCase() < b.name.toLowerCase()
        ? -1
        : a.name.toLowerCase() > b.name.toLowerCase()
        ? 1
        : a.name < b.name
        ? -1
        : 1
    );
  }
  return [...pages.values()];
}

const firstSentence = (text: string) => {
  const flat = text.replace(/\{@link(?:code|plain)?\s+([^\s}|]+)[^}]*\}/g, "`$1`")
    .replace(/\s+/g, " ").trim();
  const end = flat.search(/\.(\s|$)/);
  return end < 0 ? flat : flat.slice(0, end + 1);
};

/**
 * The whole API reference: the index page and one page per source folder, keyed by file name
 * (`api.md` for the index; the folder pages under `api/`).
 *
 * @param doc What `deno doc --json` wrote for the entry points.
 * @param options The entry points, the repository root and the folders' module documentation.
 * @returns The Markdown of each page by its path under docs/.
 * @throws {Error} When `doc` has no node for an entry point.
 *
 * @example
 * ```ts
 * import { apiReference } from "./api_reference.ts";
 * import assert from "node:assert/strict";
 * const doc = {
 *   nodes: {
 *     "file:///r/mod.ts": {
 *       symbols: [{
 *         name: "double",
 *         declarations: [{
 *           kind: "function",
 *           location: { filename: "file:///r/calc/math/double.ts", line: 3 },
 *           jsDoc: { doc: "Twice the value.", tags: [{ kind: "param", name: "x", doc: "A number." }] },
 *           def: {
 *             params: [{ kind: "identifier", name: "x", tsType: { kind: "keyword", value: "number" } }],
 *             returnType: { kind: "keyword", value: "number" },
 *           },
 *         }],
 *       }],
 *     },
 *   },
 * };
 * const pages = apiReference(doc, {
 *   entries: [{ url: "file:///r/mod.ts", specifier: "@demo/demo" }],
 *   root: "file:///r/",
 * });
 * assert.deepEqual([...pages.keys()], ["api.md", "api/math.md"]);
 * assert.match(pages.get("api/math.md")!, /function double\(x: number\): number/);
 * assert.match(pages.get("api.md")!, /\[calc\/math\]\(api\/math\.md\)/);
 * ```
 */
export function apiReference(doc: DocJson, options: ApiReferenceOptions): Map<string, string> {
  const pages = pagesOf(doc, options);
  const links: Links = new Map();
  for (const page of pages) {
    const used = new Map<string, number>();
    for (const symbol of page.symbols) {
      const base = slug(symbol.name);
      const n = used.get(base) ?? 0;
      used.set(base, n + 1);
      if (!links.has(symbol.name)) {
        links.set(symbol.name, { page: page.file, anchor: n === 0 ? base : `${base}-${n}` });
      }
    }
  }
  const out = new Map<string, string>();
  const total = pages.reduce((n, p) => n + p.symbols.length, 0);
  const index = [
    "# API reference",
    "",
    "Generated by `deno task docs` from `deno doc --json` of the entry points; do not edit by hand.",
    "Each export is listed with its declaration, documentation, parameters, errors and examples.",
    "The calculations themselves (inputs, units, ranges, formulas, citations) are in",
    "[calculations.md](calculations.md).",
    "",
    `${total} exports:`,
    "",
  ];
  for (const entry of options.entries) {
    index.push(`## \`${entry.specifier}\``, "");
    for (const page of pages.filter((p) => p.entry === entry)) {
      const about = options.folderDocs?.[page.folder];
      index.push(
        `- [${page.folder}](api/${page.file}) (${page.symbols.length}): ${
          about ? firstSentence(about) : ""
        }`.trimEnd(),
      );
    }
    index.push("");
  }
  out.set("api.md", index.join("\n").trimEnd() + "\n");
  for (const page of pages) {
    const kinds = new Map<string, string[]>();
    for (const s of page.symbols) {
      const word = KIND_PLURALS[s.declarations[0]!.kind] ?? s.declarations[0]!.kind;
      kinds.set(word, [
        ...(kinds.get(word) ?? []),
        `[\`${s.name}\`](#${links.get(s.name)!.anchor})`,
      ]);
    }
    const about = options.folderDocs?.[page.folder];
    const text = [
      `# ${page.folder}`,
      "",
      `Exports of \`${page.entry.specifier}\` declared in ${page.folder}/. Generated by`,
      "`deno task docs`; do not edit by hand. [All pages](../api.md).",
      "",
      ...(about ? [withLinks(about.trim(), page.file, links), ""] : []),
      ...[...kinds.entries()].sort(([a], [b]) => a < b ? -1 : 1).flatMap(([word, names]) => [
        `- ${word}: ${names.join(", ")}`,
      ]),
      "",
      ...page.symbols.map((s) =>
        symbolMarkdown(s, page.file, links, options, page.entry.specifier)
      ),
    ].join("\n");
    out.set(`api/${page.file}`, text.trimEnd() + "\n");
  }
  return out;
}
