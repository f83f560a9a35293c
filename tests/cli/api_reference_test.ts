/**
 * The API reference renderer (cli/api_reference.ts) on hand-made `deno doc --json` nodes: types
 * written back as TypeScript, overloads without the implementation, links between pages, and the
 * sections of a documented function.
 */
import assert from "node:assert/strict";
import {
  apiReference,
  declarationText,
  type DocDeclaration,
  type DocJson,
  typeText,
} from "../../cli/api_reference.ts";

const keyword = (value: string) => ({ kind: "keyword", value });
const ref = (typeName: string, typeParams?: unknown[]) => ({
  kind: "typeRef",
  value: { typeName, ...(typeParams ? { typeParams } : {}) },
});
const at = (file: string) => ({ filename: `file:///r/${file}`, line: 1 });

Deno.test("typeText writes types as TypeScript source (TypeScript syntax, no source needed)", () => {
  const cases: [unknown, string][] = [
    [
      { kind: "array", value: { kind: "union", value: [keyword("number"), keyword("null")] } },
      "(number | null)[]",
    ],
    [ref("Map", [keyword("string"), ref("Quantity")]), "Map<string, Quantity>"],
    [{ kind: "tuple", value: [keyword("number"), keyword("number")] }, "[number, number]"],
    [{ kind: "literal", value: { kind: "number", number: 0.95 } }, "0.95"],
    [{ kind: "literal", value: { kind: "boolean", boolean: false } }, "false"],
    [
      {
        kind: "fnOrConstructor",
        value: {
          constructor: false,
          params: [{ kind: "identifier", name: "x", optional: true, tsType: keyword("number") }],
          tsType: keyword("void"),
        },
      },
      "(x?: number) => void",
    ],
    [
      {
        kind: "typeLiteral",
        value: {
          properties: [
            { name: "lower", readonly: true, tsType: keyword("number") },
            { name: "upper", optional: true, tsType: keyword("number") },
          ],
        },
      },
      "{ readonly lower: number; upper?: number }",
    ],
    [{
      kind: "indexedAccess",
      value: {
        objType: ref("Model"),
        indexType: { kind: "literal", value: { kind: "string", string: "form" } },
      },
    }, 'Model["form"]'],
    [undefined, "unknown"],
  ];
  for (const [type, text] of cases) assert.equal(typeText(type as never), text);
});

Deno.test("declarationText: a long signature is wrapped one parameter a line; interfaces and constants", () => {
  const long: DocDeclaration = {
    kind: "function",
    location: at("a.ts"),
    def: {
      params: [
        { kind: "identifier", name: "measurementsOfTheFirstReader", tsType: ref("Float64Array") },
        { kind: "identifier", name: "measurementsOfTheSecondReader", tsType: ref("Float64Array") },
        { kind: "assign", left: { kind: "identifier", name: "options", tsType: ref("Options") } },
      ],
      returnType: ref("Promise", [ref("Agreement")]),
      isAsync: true,
    },
  };
  assert.equal(
    declarationText("compareReaders", long),
    "async function compareReaders(\n  measurementsOfTheFirstReader: Float64Array,\n" +
      "  measurementsOfTheSecondReader: Float64Array,\n  options?: Options,\n): Promise<Agreement>",
  );
  assert.equal(
    declarationText("Interval", {
      kind: "interface",
      location: at("a.ts"),
      def: { typeParams: [{ name: "T", default: keyword("number") }], extends: [ref("Base")] },
    }),
    "interface Interval<T = number> extends Base",
  );
  assert.equal(
    declarationText("LIMIT", {
      kind: "variable",
      location: at("a.ts"),
      def: { kind: "const", tsType: keyword("number") },
    }),
    "const LIMIT: number",
  );
});

Deno.test("apiReference: one page per folder, overloads without the implementation, links across pages", () => {
  const fn = (
    file: string,
    doc: string,
    extra: Partial<DocDeclaration["def"]> = {},
    hasBody = false,
  ) => ({
    kind: "function",
    location: at(file),
    jsDoc: { doc },
    def: {
      params: [{ kind: "identifier", name: "x", tsType: keyword("number") }],
      returnType: keyword("number"),
      hasBody,
      ...extra,
    },
  });
  const doc: DocJson = {
    nodes: {
      "file:///r/mod.ts": {
        symbols: [
          {
            name: "half",
            declarations: [fn("calc/math/half.ts", "Half of it; see {@linkcode double}.")],
          },
          {
            name: "double",
            declarations: [
              fn("calc/other/double.ts", "Twice a number."),
              fn("calc/other/double.ts", "Twice each.", {
                params: [{
                  kind: "identifier",
                  name: "x",
                  tsType: { kind: "array", value: keyword("number") },
                }],
                returnType: { kind: "array", value: keyword("number") },
              }),
              fn("calc/other/double.ts", "", {
                params: [{ kind: "identifier", name: "x", tsType: keyword("unknown") }],
                returnType: keyword("unknown"),
              }, true),
            ],
          },
        ],
      },
      "file:///r/plot/mod.ts": {
        symbols: [{
          name: "chart",
          declarations: [fn("plot/chart.ts", "Draws {@link half | the half}.")],
        }],
      },
    },
  };
  const pages = apiReference(doc, {
    entries: [
      { url: "file:///r/mod.ts", specifier: "@demo/demo" },
      { url: "file:///r/plot/mod.ts", specifier: "@demo/demo/plot" },
    ],
    root: "file:///r/",
    folderDocs: { "calc/math": "Arithmetic. More words." },
    notes: (name) => name === "half" ? "Declared: half of any number." : undefined,
  });
  assert.deepEqual([...pages.keys()].sort(), [
    "api.md",
    "api/math.md",
    "api/other.md",
    "api/plot.md",
  ]);
  const other = pages.get("api/other.md")!;
  assert.match(
    other,
    /```ts\nfunction double\(x: number\): number\nfunction double\(x: number\[\]\): number\[\]\n```/,
  );
  assert.ok(!other.includes("x: unknown"), "the implementation signature is not shown");
  assert.match(pages.get("api/math.md")!, /see \[`double`\]\(other\.md#double\)/);
  // the note from the value comes after the declaration, before the documentation
  assert.match(pages.get("api/math.md")!, /```\n\nDeclared: half of any number\.\n\nHalf of it/);
  assert.ok(!pages.get("api/other.md")!.includes("Declared:"));
  assert.match(pages.get("api/plot.md")!, /Draws \[`the half`\]\(math\.md#half\)/);
  assert.match(pages.get("api/plot.md")!, /`import \{ chart \} from "@demo\/demo\/plot"`/);
  assert.match(pages.get("api.md")!, /- \[calc\/math\]\(api\/math\.md\) \(1\): Arithmetic\.\n/);
  assert.match(pages.get("api.md")!, /^3 exports:$/m);
});
