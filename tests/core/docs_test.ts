import assert from "node:assert/strict";

Deno.test("docs/ (calculations.md, api.md, api/*.md) is generated from the current sources (run `deno task docs`)", async () => {
  const out = await new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--allow-read",
      "--allow-env",
      "--allow-sys",
      "--allow-run",
      new URL("../../cli/docs.ts", import.meta.url).pathname,
      "--check",
    ],
    stdout: "piped",
    stderr: "piped",
  }).output();
  assert.ok(out.success, new TextDecoder().decode(out.stderr));
  assert.match(
    new TextDecoder().decode(out.stdout),
    /docs\/ is current \(\d+ calculations, \d+ exports in \d+ API pages\)/,
  );
});

Deno.test("the API reference documents every export of mod.ts and plot/mod.ts, with its example", async () => {
  const root = new URL("../../", import.meta.url);
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["doc", "--json", "mod.ts", "plot/mod.ts"],
    cwd: root.pathname,
    stdout: "piped",
    stderr: "piped",
  }).output();
  assert.ok(out.success, new TextDecoder().decode(out.stderr));
  const doc = JSON.parse(new TextDecoder().decode(out.stdout)) as {
    nodes: Record<
      string,
      {
        symbols: {
          name: string;
          declarations: { jsDoc?: { tags?: { kind: string; doc?: string }[] } }[];
        }[];
      }
    >;
  };
  const pages: string[] = [];
  for await (const e of Deno.readDir(new URL("docs/api/", root))) {
    pages.push(await Deno.readTextFile(new URL(`docs/api/${e.name}`, root)));
  }
  const all = pages.join("\n");
  const index = await Deno.readTextFile(new URL("docs/api.md", root));
  let count = 0;
  for (const [entry, node] of Object.entries(doc.nodes)) {
    const specifier = entry.endsWith("/plot/mod.ts")
      ? "@sonorigor/sonorigor/plot"
      : "@sonorigor/sonorigor";
    for (const symbol of node.symbols) {
      count++;
      assert.ok(
        all.includes(`### \`${symbol.name}\`\n\n`) &&
          all.includes(`\`import { ${symbol.name} } from "${specifier}"\``),
        `${symbol.name} (${specifier}) has no section in docs/api/`,
      );
      const example = symbol.declarations.flatMap((d) => d.jsDoc?.tags ?? [])
        .find((t) => t.kind === "example")?.doc;
      const code = example?.match(/```ts\n([^]*?)```/)?.[1];
      if (code !== undefined) assert.ok(all.includes(code), `${symbol.name}: its example is shown`);
    }
  }
  assert.ok(count > 700, `mod.ts and plot/mod.ts export hundreds of names, got ${count}`);
  assert.match(index, new RegExp(`^${count} exports:$`, "m"));
});

Deno.test("the reference lists every calculation, every family member, with quantities and citations", async () => {
  const { CATALOG, catalogCalculations, catalogMarkdown, calculationMarkdown } = await import(
    "../../mod.ts"
  );
  const md = catalogMarkdown(CATALOG);
  for (const c of catalogCalculations(CATALOG)) {
    assert.ok(md.includes(`(\`${c.id}\`)`), c.id);
    const section = calculationMarkdown(c);
    assert.match(section, /Citations:\n- /);
    for (const input of c.inputNames) {
      const d = c.inputs[input]!;
      assert.ok(
        section.includes(`| \`${input}\` | ${d.label.replace(/\|/g, "\\|")} |`),
        `${c.id}: ${input}`,
      );
    }
  }
});

Deno.test("the API reference's links to calculations.md land on a heading", async () => {
  const root = new URL("../../", import.meta.url);
  const calculations = await Deno.readTextFile(new URL("docs/calculations.md", root));
  // GitHub's heading anchors: lower case, punctuation dropped, spaces as "-" (GitHub Flavored
  // Markdown as rendered on github.com; common practice, no source)
  const anchors = new Set(
    [...calculations.matchAll(/^#+ (.+)$/gm)].map((m) =>
      m[1]!.toLowerCase().replace(/[^\p{L}\p{N}\s_-]/gu, "").replace(/\s/g, "-")
    ),
  );
  let links = 0;
  for await (const e of Deno.readDir(new URL("docs/api/", root))) {
    const page = await Deno.readTextFile(new URL(`docs/api/${e.name}`, root));
    for (const m of page.matchAll(/\]\(\.\.\/calculations\.md#([^)]+)\)/g)) {
      links++;
      assert.ok(anchors.has(m[1]!), `${e.name}: no heading for #${m[1]}`);
    }
  }
  assert.ok(links > 50, `every exported calculation links to its section, got ${links} links`);
});
