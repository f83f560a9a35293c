import assert from "node:assert/strict";

const root = new URL("../../", import.meta.url).pathname;

async function runValidate(
  args: string[],
): Promise<{ code: number; stdout: string; stderr: string }> {
  const cmd = new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--allow-read",
      "--allow-write",
      "--allow-env",
      "--allow-sys",
      "cli/validate.ts",
      ...args,
    ],
    cwd: root,
    stdout: "piped",
    stderr: "piped",
  });
  const out = await cmd.output();
  const dec = new TextDecoder();
  return { code: out.code, stdout: dec.decode(out.stdout), stderr: dec.decode(out.stderr) };
}

Deno.test("validate: demo table gives an HTML report with inline charts and a Markdown twin", async () => {
  const out = await Deno.makeTempDir();
  const r = await runValidate([
    "examples/data/validation_demo.csv",
    "--subject",
    "patient",
    "--value",
    "lvef_percent",
    "--unit",
    "%",
    "--out",
    out,
    "--seed",
    "7",
  ]);
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stderr, /\[validate\] 180 readings, 30 subjects, 3 observers\/methods/);
  const html = await Deno.readTextFile(`${out}/report.html`);
  const md = await Deno.readTextFile(`${out}/report.md`);
  // five charts inlined: 2 Bland–Altman, 2 comparison scatters, 1 observer plot
  assert.equal(html.match(/<svg/g)?.length, 5);
  assert.doesNotMatch(html, /<script|https?:\/\/(?!www\.w3\.org)/); // self-contained
  for (const text of [md, html]) {
    assert.match(text, /Bland–Altman analysis/);
    assert.match(text, /ICC\(2,1\)/);
    assert.match(text, /Passing–Bablok slope/);
    assert.match(text, /Repeatability coefficient/);
    assert.match(text, /states no pass or fail/);
    assert.match(text, /Seed: 7/);
  }
  // provenance: the SHA-256 of the input as computed independently with WebCrypto
  const digest = await crypto.subtle.digest(
    "SHA-256",
    await Deno.readFile(`${root}examples/data/validation_demo.csv`),
  );
  const hex = [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
  assert.match(md, new RegExp(`SHA-256 ${hex}`));
  const results = JSON.parse(await Deno.readTextFile(`${out}/results.json`));
  assert.equal(results.icc.forms.length, 6);
  await Deno.remove(out, { recursive: true });
});

Deno.test("validate: graded table gives Cohen's and Fleiss' kappa", async () => {
  const out = await Deno.makeTempDir();
  const r = await runValidate([
    "examples/data/validation_grades.csv",
    "--subject",
    "patient",
    "--rater",
    "reader",
    "--value",
    "mr_grade",
    "--graded",
    "--categories",
    "none,mild,moderate,severe",
    "--out",
    out,
  ]);
  assert.equal(r.code, 0, r.stderr);
  const md = await Deno.readTextFile(`${out}/report.md`);
  assert.match(md, /weighted kappa \(quadratic\)/);
  assert.match(md, /Fleiss' kappa/);
  await Deno.remove(out, { recursive: true });
});

Deno.test("validate: defective table fails with line-numbered errors and writes nothing", async () => {
  const out = `${await Deno.makeTempDir()}/report`;
  const r = await runValidate([
    "examples/data/validation_defects.csv",
    "--subject",
    "patient",
    "--value",
    "lvef_percent",
    "--out",
    out,
  ]);
  assert.equal(r.code, 1);
  assert.match(r.stderr, /line 4: column 'lvef_percent': expected a number, got "abc"/);
  assert.match(r.stderr, /line 8: column 'patient': expected a subject identifier, got ""/);
  assert.match(
    r.stderr,
    /line 9: column 'replicate': expected a replicate number 1, 2, …, got "x"/,
  );
  assert.match(
    r.stderr,
    /line 11: duplicate reading for subject 'P05', observer 'sonographer_A', replicate 1 \(first on line 10\)/,
  );
  assert.match(r.stderr, /line 12: Too many fields/);
  assert.match(r.stderr, /line 6: subject 'P03'.*empty value cell/);
  await assert.rejects(() => Deno.stat(out), Deno.errors.NotFound);
});

Deno.test("validate: unknown column and missing file are reported", async () => {
  const a = await runValidate(["examples/data/validation_demo.csv", "--value", "nope"]);
  assert.equal(a.code, 1);
  assert.match(
    a.stderr,
    /value column 'nope' not found; the header has patient, observer, replicate, lvef_percent/,
  );
  const b = await runValidate(["examples/data/no-such-file.csv"]);
  assert.equal(b.code, 1);
  assert.match(b.stderr, /cannot read 'examples\/data\/no-such-file.csv'/);
});
