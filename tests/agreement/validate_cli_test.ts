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
  ]);
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stderr, /\[validate\] 180 readings, 30 subjects, 3 observers\/methods/);
  const html = await Deno.readTextFile(`${out}/report.html`);
  const md = await Deno.readTextFile(`${out}/report.md`);
  // seven charts inlined: 3 Bland–Altman, 3 comparison scatters (each pair), 1 observer plot
  assert.equal(html.match(/<svg/g)?.length, 7);
  assert.doesNotMatch(html, /<script|https?:\/\/(?!www\.w3\.org)/); // self-contained
  for (const text of [md, html]) {
    assert.match(text, /Bland–Altman analysis/);
    assert.match(text, /ICC\(2,1\)/);
    assert.match(text, /Passing–Bablok slope/);
    assert.match(text, /Repeatability coefficient/);
    assert.match(text, /states no pass or fail/);
    // nothing random is drawn, so no seed is stated
    assert.doesNotMatch(text, /Seed/);
    assert.match(text, /nothing random is drawn, so no seed is needed/);
    // each reader against the reference, and reader against reader
    assert.match(
      text,
      /Method comparison: sonographer\\?_B against the reference sonographer\\?_A/,
    );
    assert.match(text, /Method comparison: auto\\?_trace against the reference sonographer\\?_A/);
    assert.match(text, /Observer comparison: auto\\?_trace against sonographer\\?_B/);
    // plain wording: one replicate count when all agree, never "2–2"
    assert.doesNotMatch(text, /\d–\d/);
    // differences of a quantity in % are percentage points; the CV is a percentage of the mean
    assert.match(text, /SD of differences \(percentage points\)/);
    assert.match(text, /Within-subject CV, root mean square \(% of the subject mean\)/);
    assert.doesNotMatch(text, /SD \(%\)|differences \(%\)/);
    // one precision: no statistic with four or more decimals or significant digits beside
    // rounded ones (JCGM 100:2008 §7.2.6 for values with an interval)
    assert.doesNotMatch(
      text.replace(/<svg[\s\S]*?<\/svg>/g, "").replace(
        /SHA-256 [0-9a-f]+|\d{4}-\d\d-\d\dT[\d:.]+Z|@[\d.]+/g,
        "",
      ),
      /\d\.\d{4,}|[1-9]\d\.\d{3,}|[1-9]\d{2}\.\d\d/,
    );
  }
  // the unit in every table header that holds a quantity of the study
  assert.match(
    md,
    /\| Bias \(mean of sonographer\\_B − sonographer\\_A\) \(percentage points\) \|/,
  );
  assert.match(md, /\| Deming intercept \(%\) \|/);
  // the CV (no interval) to two significant digits in every row, not "5.0" beside "3.19"
  assert.match(
    md,
    /\| auto\\_trace \| 30 \| 1\.66 \\\[1\.32, 2\.21\\\] \| 4\.6 \\\[3\.7, 6\.1\\\] \| 3\.2 \|/,
  );
  // provenance: the SHA-256 of the input as computed independently with WebCrypto
  const digest = await crypto.subtle.digest(
    "SHA-256",
    await Deno.readFile(`${root}examples/data/validation_demo.csv`),
  );
  const hex = [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
  assert.match(md, new RegExp(`SHA-256 ${hex}`));
  const results = JSON.parse(await Deno.readTextFile(`${out}/results.json`));
  assert.equal(results.icc.outcome.result.forms.length, 6);
  assert.equal(results.provenance.inputSha256, hex);
  assert.equal(results.readings, undefined); // the input file holds them
  // written piece by piece, it is the text JSON.stringify gives (the platform's serialiser)
  const json = await Deno.readTextFile(`${out}/results.json`);
  assert.equal(json, JSON.stringify(JSON.parse(json), null, 2) + "\n");
  // one SVG file per figure, named after the observers
  const files = [...Deno.readDirSync(out)].map((e) => e.name).filter((n) => n.endsWith(".svg"));
  assert.deepEqual(files.sort(), [
    "bland_altman_auto-trace_vs_sonographer-a.svg",
    "bland_altman_auto-trace_vs_sonographer-b.svg",
    "bland_altman_sonographer-b_vs_sonographer-a.svg",
    "method_comparison_auto-trace_vs_sonographer-a.svg",
    "method_comparison_auto-trace_vs_sonographer-b.svg",
    "method_comparison_sonographer-b_vs_sonographer-a.svg",
    "observers.svg",
  ]);
  // the chart values are those of the table: bias and limits written on the lines
  const ba = await Deno.readTextFile(`${out}/bland_altman_sonographer-b_vs_sonographer-a.svg`);
  const bias =
    /\| Bias \(mean of sonographer\\_B − sonographer\\_A\) \(percentage points\) \| ([^ |]+) \|/
      .exec(md)![1]!;
  assert.match(ba, new RegExp(`>bias ${bias.replace(".", "\\.")}<`));
  assert.match(ba, /Bias and limits of agreement/);
  assert.match(ba, /Not a diagnosis/);
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
  // the messages of the one reader and the one validator, with the label and valid range
  assert.match(
    r.stderr,
    /5 problem\(s\) in examples\/data\/validation_defects.csv; nothing was computed/,
  );
  assert.match(
    r.stderr,
    /line 4, expected 'lvef_percent' \(LV ejection fraction\) as a number in \[0, 100\] %, got "abc"/,
  );
  assert.match(
    r.stderr,
    /line 8, missing column 'patient' \(Subject\): expected a subject identifier, got an empty cell/,
  );
  assert.match(
    r.stderr,
    /line 9, expected 'replicate' \(Replicate number\) as a number in \[1, ∞\), got "x"/,
  );
  assert.match(
    r.stderr,
    /line 11, expected one reading per subject, observer and replicate, got a second reading for subject 'P05', observer 'sonographer_A', replicate 1 \(first on line 10\)/,
  );
  assert.match(r.stderr, /line 12, expected 4 fields as in the header.*, got 5 fields/);
  assert.match(
    r.stderr,
    /line 6: subject 'P03', observer 'sonographer_A', replicate 1: empty value cell/,
  );
  await assert.rejects(() => Deno.stat(out), Deno.errors.NotFound);
});

Deno.test("validate: unknown column and missing file are reported", async () => {
  const a = await runValidate(["examples/data/validation_demo.csv", "--value", "nope"]);
  assert.equal(a.code, 1);
  assert.match(
    a.stderr,
    /got columns patient, observer, replicate, lvef_percent, with 1 problem: no column "nope" for the value \(option 'value'\); candidate columns by their contents: value: 'lvef_percent' \(numbers of a known quantity\)/,
  );
  // one message for every header problem
  assert.equal(a.stderr.match(/^error:/gm)?.length, 1);
  // a label for a quantity the package knows would rename it silently: refused
  const labelled = await runValidate(["examples/data/validation_demo.csv", "--label", "EF"]);
  assert.equal(labelled.code, 1);
  assert.match(
    labelled.stderr,
    /error: column 'lvef_percent' holds LV ejection fraction, a quantity the package knows; expected no --label, got --label EF/,
  );
  const b = await runValidate(["examples/data/no-such-file.csv"]);
  assert.equal(b.code, 1);
  assert.match(b.stderr, /cannot read 'examples\/data\/no-such-file.csv'/);
});

Deno.test("validate: a value column the package does not know needs its unit and label", async () => {
  const dir = await Deno.makeTempDir();
  const csv = `${dir}/flow.csv`;
  // invented readings: three subjects, two meters
  await Deno.writeTextFile(
    csv,
    "subject,method,value\nS1,W,494\nS1,M,512\nS2,W,395\nS2,M,430\nS3,W,516\nS3,M,520\nS4,W,434\nS4,M,428\n",
  );
  const bare = await runValidate([csv, "--out", `${dir}/a`]);
  assert.equal(bare.code, 1);
  assert.match(
    bare.stderr,
    /expected the unit of column 'value' in its header \(e\.g\. 'value \[mm\]'\) or stated \(--unit on the command line\)/,
  );
  const stated = await runValidate([
    csv,
    "--unit",
    "L/min",
    "--label",
    "Peak flow",
    "--out",
    `${dir}/b`,
  ]);
  assert.equal(stated.code, 0, stated.stderr);
  const md = await Deno.readTextFile(`${dir}/b/report.md`);
  assert.match(md, /the reading of Peak flow \(L\/min\), a quantity stated by the user/);
  assert.match(md, /\| Bias \(mean of M − W\) \(L\/min\) \|/);
  const svg = await Deno.readTextFile(`${dir}/b/bland_altman_m_vs_w.svg`);
  assert.match(svg, /Peak flow: M − W \(L\/min\)/);

  // the unit from the header: "value [mm]" needs no --unit; the label comes from the header
  const mm = `${dir}/mm.csv`;
  await Deno.writeTextFile(
    mm,
    "subject,method,jet_width [mm]\nS1,W,4.9\nS1,M,5.1\nS2,W,3.9\nS2,M,4.3\nS3,W,5.2\nS3,M,5.2\nS4,W,4.3\nS4,M,4.3\n",
  );
  const fromHeader = await runValidate([mm, "--out", `${dir}/c`]);
  assert.equal(fromHeader.code, 0, fromHeader.stderr);
  const mmReport = await Deno.readTextFile(`${dir}/c/report.md`);
  assert.match(mmReport, /the reading of Jet width \(mm\), a quantity stated by the user/);
  assert.match(mmReport, /\| SD of differences \(mm\) \|/);
  assert.match(mmReport, /\| Deming intercept \(mm\) \|/);
  for (const file of ["bland_altman_m_vs_w.svg", "method_comparison_m_vs_w.svg", "observers.svg"]) {
    assert.match(await Deno.readTextFile(`${dir}/c/${file}`), /Jet width.*\(mm\)/, file);
  }
  // a header unit and a different --unit: refused
  const both = await runValidate([mm, "--unit", "cm", "--out", `${dir}/d`]);
  assert.equal(both.code, 1);
  assert.match(
    both.stderr,
    /expected one unit for column 'jet_width \[mm\]': its header states mm, got also cm/,
  );
  await Deno.remove(dir, { recursive: true });
});

Deno.test("validate: hostile files — another encoding, semicolons, an unclosed quote", async () => {
  const dir = await Deno.makeTempDir();
  // invented readings; "René" and "Renè" are two people (Windows-1252: é = 0xE9, è = 0xE8)
  const rows = ["patient;observer;lvef percent"];
  const people = ["René", "Renè", "Zoë", "Zoe"];
  people.forEach((p, i) => rows.push(`${p};A;${50 + 3 * i}`, `${p};B;${51 + 3 * i + (i % 2)}`));
  const csv = `${dir}/people.csv`;
  await Deno.writeFile(csv, Uint8Array.from(rows.join("\r\n") + "\r\n", (c) => c.charCodeAt(0)));
  const strict = await runValidate([csv, "--out", `${dir}/a`]);
  assert.equal(strict.code, 1);
  // "patient;observer;lvef percent\r\n" is 31 bytes, "Ren" 3 more: 0xE9 at byte 34, line 2
  assert.match(
    strict.stderr,
    /error: .*people\.csv: expected UTF-8 text, got an invalid byte 0xe9 at byte 34, line 2/,
  );
  await assert.rejects(() => Deno.stat(`${dir}/a`), Deno.errors.NotFound);
  const named = await runValidate([csv, "--encoding", "windows-1252", "--out", `${dir}/b`]);
  assert.equal(named.code, 0, named.stderr);
  // four people, none merged with another: 8 readings, 4 subjects (semicolons detected)
  assert.match(named.stderr, /\[validate\] 8 readings, 4 subjects, 2 observers\/methods/);
  const md = await Deno.readTextFile(`${dir}/b/report.md`);
  assert.match(md, /4 subjects with a first reading by both/);

  const unclosed = `${dir}/unclosed.csv`;
  await Deno.writeTextFile(
    unclosed,
    'patient,observer,lvef percent\nP1,A,55\n"P1,B,54\nP2,A,40\nP2,B,43\n',
  );
  const bad = await runValidate([unclosed, "--out", `${dir}/c`]);
  assert.equal(bad.code, 1);
  assert.match(
    bad.stderr,
    /error: .*unclosed\.csv: line 3, expected every quoted field to be closed, got a quote that opens a field here and is never closed/,
  );
  const wrongLabel = await runValidate([csv, "--encoding", "klingon", "--out", `${dir}/d`]);
  assert.equal(wrongLabel.code, 1);
  assert.match(wrongLabel.stderr, /expected 'encoding' as an encoding label .*, got "klingon"/);
  await Deno.remove(dir, { recursive: true });
});
