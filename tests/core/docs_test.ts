import assert from "node:assert/strict";

Deno.test("docs/calculations.md is generated from the current definitions (run `deno task docs`)", async () => {
  const out = await new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--allow-read",
      "--allow-env",
      "--allow-sys",
      new URL("../../cli/docs.ts", import.meta.url).pathname,
      "--check",
    ],
    stdout: "piped",
    stderr: "piped",
  }).output();
  assert.ok(out.success, new TextDecoder().decode(out.stderr));
  assert.match(
    new TextDecoder().decode(out.stdout),
    /docs\/calculations\.md is current \(\d+ calculations\)/,
  );
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
