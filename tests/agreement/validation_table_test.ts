import assert from "node:assert/strict";
import {
  pairedReadings,
  statedQuantity,
  validationColumns,
  validationReadings,
  validationReadOptions,
} from "../../calc/agreement/mod.ts";
import { readTable } from "../../calc/table/mod.ts";
import { renderIssue } from "../../calc/core/mod.ts";

Deno.test("columns are found by the usual names, or as named, and refused with the headers", () => {
  const t = readTable("Patient,Reader,Round,value [mm]\nP1,A,1,21\n", {
    source: "c.csv",
    columns: { value: statedQuantity({ label: "Jet width", unit: "mm" }) },
  });
  // names compared as headers are (case, spaces and underscores ignored)
  assert.deepEqual(validationColumns(t), {
    subject: "Patient",
    observer: "Reader",
    replicate: "Round",
    value: "value [mm]",
  });
  assert.deepEqual(validationColumns(t, { replicate: null }).replicate, null);
  assert.throws(() => validationColumns(t, { subject: "case" }), {
    name: "TypeError",
    message:
      `c.csv: expected a subject, an observer (or method) and a value column, found by their usual names or named with the options 'subject', 'observer', 'replicate' and 'value' (--subject, --rater, --replicate, --value on the command line), got columns Patient, Reader, Round, value [mm], with 1 problem: no column "case" for the subject (option 'subject'); candidate columns by their contents: subject: none`,
  });
  const bare = readTable("col1,col2,col3,col4\n1,2,3,4\n", { source: "bare.csv" });
  assert.throws(() => validationColumns(bare), (e: unknown) => {
    assert.ok(e instanceof TypeError);
    assert.match(
      e.message,
      /^bare\.csv: expected a subject, .*, got columns col1, col2, col3, col4, with 3 problems: no subject column \(none named subject, patient, subject_id, id\); no observer column \(none named observer, rater, reader, method\); no value column \(none named 'value', and 4 columns left over instead of one\); candidate columns by their contents: subject: none; observer: none; value: none; replicate: none$/,
    );
    return true;
  });
  assert.throws(() => validationColumns(t, { observer: "Patient" }), {
    name: "TypeError",
    message:
      "c.csv: expected a different column for subject, observer, replicate and value, got Patient, Patient, Round, value [mm]",
  });
});

Deno.test("every header problem in one message, with the candidate columns named by their contents", () => {
  // invented readings: 4 subjects × 2 readers × 2 rounds, headers the package does not know
  const rows = ["case no,who,pass,thickness"];
  const values = [
    9.1,
    9.4,
    8.8,
    9.0,
    11.2,
    11.5,
    10.9,
    11.3,
    7.6,
    7.9,
    7.7,
    8.1,
    10.1,
    9.8,
    10.4,
    10,
  ];
  let i = 0;
  for (const s of ["C1", "C2", "C3", "C4"]) {
    for (const r of ["R1", "R2"]) {
      for (const k of [1, 2]) rows.push(`${s},${r},${k},${values[i++]}`);
    }
  }
  const t = readTable(rows.join("\n"), { source: "odd.csv" });
  assert.throws(() => validationColumns(t), (e: unknown) => {
    assert.ok(e instanceof TypeError);
    // one message: the three problems, then what each column could be
    assert.equal((e as { issues?: unknown[] }).issues?.length, 1);
    assert.match(
      e.message,
      /with 3 problems: no subject column .*; no observer column .*; no value column .*; candidate columns by their contents: subject: 'case no' \(4 distinct values\); observer: 'who' \(2 distinct values\); value: 'thickness' \(numbers\); replicate: 'pass' \(whole numbers 1 to 2\)$/,
    );
    return true;
  });
  // named as the message suggests, the same table is read
  assert.deepEqual(
    validationColumns(t, {
      subject: "case no",
      observer: "who",
      replicate: "pass",
      value: "thickness",
    }),
    { subject: "case no", observer: "who", replicate: "pass", value: "thickness" },
  );
});

Deno.test("readings: subjects and observers trimmed, replicates checked by the validator, duplicates and blanks found", () => {
  const csv = [
    "patient,observer,replicate,lvef percent",
    " P1 , A ,1,55",
    "P1,A,2,56",
    "P1,A,2,57",
    "P2,,1,60",
    "P2,A,0,60",
    "P2,A,1.5,60",
    "P2,A,,60",
    "P2,A,1,",
  ].join("\n");
  // the replicate column as text (a table read without validationReadOptions): the validator
  const plain = validationReadings(readTable(csv, { source: "r.csv" }));
  assert.deepEqual(plain.readings.map((r) => [r.subject, r.observer, r.replicate, r.value]), [
    ["P1", "A", 1, 55],
    ["P1", "A", 2, 56],
  ]);
  assert.deepEqual(plain.missing, [{ subject: "P2", observer: "A", replicate: 1, line: 9 }]);
  assert.deepEqual(plain.issues.filter((i) => i.severity === "error").map(renderIssue), [
    "r.csv: line 4, expected one reading per subject, observer and replicate, got a second reading for subject 'P1', observer 'A', replicate 2 (first on line 3)",
    "r.csv: line 5, missing column 'observer' (Observer): expected an observer or method name, got an empty cell",
    `r.csv: line 6, expected 'replicate' (Replicate number) in [1, ∞), got "0" (0)`,
    `r.csv: line 7, expected 'replicate' (Replicate number) as a whole number in [1, ∞), got "1.5" (1.5)`,
    "r.csv: line 8, missing column 'replicate' (Replicate number): expected a value in [1, ∞), got nothing",
  ]);
  assert.equal(plain.maxReplicate, 2);
  // the replicate column read as numbers by the reader: the same rows are refused
  const mapped = validationReadings(
    readTable(csv, { source: "r.csv", ...validationReadOptions() }),
  );
  assert.deepEqual(
    mapped.issues.filter((i) => i.severity === "error").map((i) => [i.line, i.kind]),
    [[4, "constraint"], [5, "missing"], [6, "range"], [7, "integer"], [8, "missing"]],
  );
  assert.deepEqual(mapped.readings, plain.readings);
});

Deno.test("graded readings keep their categories in order and refuse unknown ones", () => {
  const csv = "patient,reader,grade\nP1,A,mild\nP1,B,none\nP2,A,severe\nP2,B,\n";
  const firstSeen = validationReadings(readTable(csv, { source: "g.csv" }), { graded: true });
  assert.equal(firstSeen.design, "graded");
  assert.ok(firstSeen.design === "graded");
  assert.deepEqual(firstSeen.categories, ["mild", "none", "severe"]);
  assert.equal(firstSeen.categoriesFrom, "first appearance");
  assert.deepEqual(firstSeen.missing, [{ subject: "P2", observer: "B", replicate: 1, line: 5 }]);
  const ordered = validationReadings(readTable(csv, { source: "g.csv" }), {
    graded: true,
    categories: ["none", "mild", "moderate"],
  });
  assert.deepEqual(ordered.issues.map(renderIssue), [
    `g.csv: line 4, expected 'grade' one of none, mild, moderate, got "severe"`,
  ]);
  // numbers for graded findings, text for measurements, categories for measurements: refused
  const numeric = readTable("patient,reader,lvef percent\nP1,A,50\n", { source: "n.csv" });
  assert.throws(() => validationReadings(numeric, { graded: true }), {
    name: "TypeError",
    message:
      `n.csv: expected the graded column 'lvef percent' as text, got numbers of LV ejection fraction; read it with readTable(…, { columns: { "lvef percent": "text" } })`,
  });
  assert.throws(
    () => validationReadings(numeric, { categories: ["a", "b"] }),
    {
      name: "TypeError",
      message: "n.csv: expected 'categories' only with graded findings, got them",
    },
  );
});

Deno.test("paired readings keep the subjects read by both", () => {
  const t = readTable(
    "patient,observer,replicate,lvef percent\nP1,A,1,50\nP1,B,1,52\nP2,A,1,61\nP3,B,1,40\nP3,A,1,41\nP3,A,2,44\n",
    { source: "p.csv" },
  );
  const r = validationReadings(t);
  assert.ok(r.design === "continuous");
  assert.deepEqual(pairedReadings(r.readings, "B", "A"), {
    subjects: ["P1", "P3"],
    test: [52, 40],
    reference: [50, 41],
  });
  assert.deepEqual(pairedReadings(r.readings, "A", "A", 2).subjects, ["P3"]);
});

Deno.test("a stated quantity: any finite value, its unit from the header or stated", () => {
  const q = statedQuantity({ label: "Peak flow", unit: "L/min" });
  assert.deepEqual([q.id, q.label, q.unit], ["statedQuantity", "Peak flow", "L/min"]);
  const t = readTable("subject,method,flow\nS1,W,494\nS2,W,\nS3,W,x\n", {
    source: "f.csv",
    columns: { flow: q },
    units: { flow: "L/min" },
  });
  const c = t.columns.get("statedQuantity")!;
  assert.ok(c.kind === "numeric");
  assert.equal(c.values[0], 494);
  assert.deepEqual(t.issues.map((i) => [i.line, i.kind]), [[3, "notMeasured"], [4, "type"]]);
  assert.throws(() => statedQuantity({ label: "", unit: "mm" }), TypeError);
  assert.throws(() => statedQuantity({ label: "x", unit: "mm", valid: { min: 2, max: 1 } }), {
    name: "TypeError",
    message: /expected a non-empty valid range/,
  });
});
