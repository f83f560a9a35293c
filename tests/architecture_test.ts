/**
 * The architecture's rules, checked on the module graph and the sources: no import cycle inside
 * the package (code or type imports), one module that parses CSV, presentation apart from
 * computation, and no transition shim left behind.
 */
import assert from "node:assert/strict";

const ROOT = new URL("../", import.meta.url);

interface InfoModule {
  readonly specifier: string;
  readonly dependencies?: readonly {
    readonly code?: { readonly specifier?: string };
    readonly type?: { readonly specifier?: string };
  }[];
}

async function moduleGraph(entry: string): Promise<Map<string, string[]>> {
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["info", "--json", new URL(entry, ROOT).pathname],
    stdout: "piped",
    stderr: "piped",
  }).output();
  assert.ok(out.success, new TextDecoder().decode(out.stderr));
  const info = JSON.parse(new TextDecoder().decode(out.stdout)) as { modules: InfoModule[] };
  const local = (s: string | undefined) =>
    s !== undefined && s.startsWith(ROOT.href) && !s.includes("/node_modules/");
  const graph = new Map<string, string[]>();
  for (const m of info.modules) {
    if (!local(m.specifier)) continue;
    const deps = (m.dependencies ?? []).flatMap((d) =>
      [d.code?.specifier, d.type?.specifier].filter(local) as string[]
    );
    graph.set(m.specifier, [...new Set(deps)]);
  }
  return graph;
}

/** A cycle of the graph as module paths, or null. */
function findCycle(graph: Map<string, string[]>): string[] | null {
  const state = new Map<string, 1 | 2>();
  const stack: string[] = [];
  const visit = (node: string): string[] | null => {
    state.set(node, 1);
    stack.push(node);
    for (const next of graph.get(node) ?? []) {
      if (state.get(next) === 1) return [...stack.slice(stack.indexOf(next)), next];
      if (!state.has(next)) {
        const found = visit(next);
        if (found) return found;
      }
    }
    stack.pop();
    state.set(node, 2);
    return null;
  };
  for (const node of graph.keys()) {
    if (!state.has(node)) {
      const found = visit(node);
      if (found) return found.map((s) => s.slice(ROOT.href.length));
    }
  }
  return null;
}

for (const entry of ["mod.ts", "plot/mod.ts", "cli/validate.ts"]) {
  Deno.test(`no import cycle inside the package from ${entry} (code and type imports)`, async () => {
    const graph = await moduleGraph(entry);
    assert.ok(graph.size > 10, `${graph.size} modules`);
    assert.equal(findCycle(graph)?.join(" → ") ?? null, null);
  });
}

Deno.test("presentation apart from computation: display/ imports only types and pure text helpers from calc/", async () => {
  const graph = await moduleGraph("mod.ts");
  const allowed = [
    /[/_]types\.ts$/,
    /calc\/core\/(text|range|issues)\.ts$/,
    /calc\/uncertainty\/rounding\.ts$/,
  ];
  for (const [module, deps] of graph) {
    if (!module.includes("/display/")) continue;
    for (const dep of deps.filter((d) => d.includes("/calc/"))) {
      assert.ok(allowed.some((a) => a.test(dep)), `${module} imports ${dep}`);
    }
  }
  // and computation never imports a chart
  for (const [module, deps] of graph) {
    if (!module.includes("/calc/")) continue;
    assert.ok(!deps.some((d) => d.includes("/plot/")), `${module} imports a chart module`);
  }
});

async function sources(dir: string, ext: RegExp): Promise<string[]> {
  const found: string[] = [];
  const walk = async (url: URL) => {
    for await (const e of Deno.readDir(url)) {
      const child = new URL(e.name + (e.isDirectory ? "/" : ""), url);
      if (e.isDirectory && !["node_modules", "out", ".git", ".scratch"].includes(e.name)) {
        await walk(child);
      } else if (e.isFile && ext.test(e.name)) found.push(child.pathname);
    }
  };
  await walk(new URL(dir, ROOT));
  return found;
}

Deno.test("one module parses CSV: calc/table/read.ts", async () => {
  const files = [
    ...await sources("calc/", /\.ts$/),
    ...await sources("display/", /\.ts$/),
    ...await sources("plot/", /\.ts$/),
    ...await sources("cli/", /\.ts$/),
    ...await sources("examples/", /\.(ts|ipynb)$/),
    ...await sources("notebooks/", /\.ipynb$/),
  ];
  const parsers = [];
  for (const f of files) {
    if (/from\s+\\?["']papaparse\\?["']|Papa\.parse/.test(await Deno.readTextFile(f))) {
      parsers.push(f);
    }
  }
  assert.deepEqual(parsers.map((p) => p.slice(new URL(ROOT).pathname.length)), [
    "calc/table/read.ts",
  ]);
});

Deno.test("no transition shim is left: define.ts, display.ts in calc/core, legacy propagation", async () => {
  for (
    const path of ["calc/core/define.ts", "calc/core/display.ts", "calc/uncertainty/legacy.ts"]
  ) {
    const exists = await Deno.stat(new URL(path, ROOT)).then(() => true, () => false);
    assert.equal(exists, false, path);
  }
});

/**
 * Argument spreads (`Math.min(...values)`, `list.push(...more)`, `String.fromCharCode(...bytes)`)
 * and `f.apply(that, values)` put every element on the call stack: above roughly 10^5 elements
 * they throw "Maximum call stack size exceeded", so over data they are a crash waiting for a large
 * file. Found on the syntax tree (Deno's lint plugin API), not by a text search. Allowed: the spread
 * of an array literal, or of a choice between array literals (`...(flag ? [x] : [])`), whose size
 * is what the source writes.
 */
const SPREAD_RULE: Deno.lint.Plugin = {
  name: "sonorigor",
  rules: {
    "no-argument-spread": {
      create(context) {
        const literal = (n: Deno.lint.Node): boolean =>
          (n.type === "ArrayExpression" && n.elements.every((e) => e?.type !== "SpreadElement")) ||
          (n.type === "ConditionalExpression" && literal(n.consequent) && literal(n.alternate));
        const spread = (node: Deno.lint.SpreadElement) => {
          if (!literal(node.argument)) {
            context.report({ node, message: "argument spread over an array of any size" });
          }
        };
        return {
          "CallExpression > SpreadElement": spread,
          "NewExpression > SpreadElement": spread,
          CallExpression(node) {
            const callee = node.callee;
            const applied = callee.type === "MemberExpression" &&
              callee.property.type === "Identifier" && callee.property.name === "apply";
            const reflected = callee.type === "MemberExpression" &&
              callee.object.type === "Identifier" && callee.object.name === "Reflect";
            const list = node.arguments[applied ? 1 : 2];
            if ((applied || reflected) && list !== undefined && !literal(list)) {
              context.report({ node, message: "apply with an array of any size" });
            }
          },
        };
      },
    },
  },
};

Deno.test("no argument spread over data: every spread argument is an array literal", async () => {
  const files = [
    ...await sources("calc/", /\.ts$/),
    ...await sources("display/", /\.ts$/),
    ...await sources("plot/", /\.ts$/),
    ...await sources("cli/", /\.ts$/),
    new URL("mod.ts", ROOT).pathname,
  ];
  const found: string[] = [];
  for (const f of files) {
    const text = await Deno.readTextFile(f);
    for (const d of Deno.lint.runPlugin(SPREAD_RULE, f, text)) {
      const line = text.slice(0, d.range[0]).split("\n").length;
      found.push(`${f.slice(new URL(ROOT).pathname.length)}:${line}: ${d.message}`);
    }
  }
  assert.deepEqual(found, []);
  // the rule itself, on the patterns it must catch and the literals it lets through
  const caught = Deno.lint.runPlugin(
    SPREAD_RULE,
    "probe.ts",
    "Math.min(...counts); out.push(...rows); String.fromCharCode(...bytes); new Set(...x);" +
      "Math.max.apply(null, xs); Reflect.apply(f, null, xs);" +
      "f(...[a, b]); g(...(c ? [d] : [])); const all = [...xs]; function h(...rest) {}" +
      "k(...[...xs]);",
  );
  assert.equal(caught.length, 7);
});
