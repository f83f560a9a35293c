import assert from "node:assert/strict";
import { decodeUtf8, detectDelimiter, readTable, throwIfErrors } from "../../mod.ts";

const numeric = (t: ReturnType<typeof readTable>, name: string): Float64Array => {
  const c = t.columns.get(name);
  assert.ok(c?.kind === "numeric", `${name} is a numeric column`);
  return c.values;
};

Deno.test("the demo pediatric clinic list: columns by quantity, units converted, nothing dropped", async () => {
  // examples/data/pediatric_clinic.csv is INVENTED demo data
  const t = readTable(
    await Deno.readFile(new URL("../../examples/data/pediatric_clinic.csv", import.meta.url)),
    { source: "pediatric_clinic.csv", population: "pediatric" },
  );
  assert.equal(t.rowCount, 20);
  assert.deepEqual([...t.columns.keys()], [
    "patient",
    "sex",
    "age",
    "height",
    "weight",
    "lvEndDiastolicDiameter",
    "aorticRoot",
    "lvMass",
  ]);
  // mm → cm conversion of the declared header unit: 24 mm = 2.4 cm exactly (SI prefixes)
  assert.equal(numeric(t, "lvEndDiastolicDiameter")[0], 2.4);
  // two empty LV mass cells: noted as not measured with their lines, never dropped
  const notMeasured = t.issues.filter((x) => x.kind === "notMeasured");
  assert.deepEqual(notMeasured.map((x) => [x.line, x.field]), [[2, "lv mass [g]"], [
    20,
    "lv mass [g]",
  ]]);
  assert.ok(Number.isNaN(numeric(t, "lvMass")[0]!));
});

Deno.test("units from headers: brackets, the units option, a trailing unit word; converted exactly", () => {
  // 1 in = 2.54 cm and 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959)
  const t = readTable("h,w\n70.8661,176.37\n", {
    columns: { h: "height", w: "weight" },
    units: { h: "inch", w: "lb" },
  });
  assert.ok(Math.abs(numeric(t, "height")[0]! - 70.8661 * 2.54) < 1e-9);
  assert.ok(Math.abs(numeric(t, "weight")[0]! - 176.37 * 0.45359237) < 1e-9);
  const words = readTable("lvotDiameterMm,age [y]\n21,40\n");
  // 21 mm = 2.1 cm
  assert.equal(numeric(words, "lvotDiameter")[0], 2.1);
  assert.equal(numeric(words, "age")[0], 40);
  assert.throws(() => readTable("height,weight [kg]\n180,80\n"), {
    name: "TypeError",
    message:
      "table: column 'height' (Height) has no unit: expected it in the header, e.g. 'height [cm]', got 'height'",
  });
  assert.throws(() => readTable("height [mmHg],weight [kg]\n180,80\n", { source: "x.csv" }), {
    name: "TypeError",
    message:
      "x.csv: column 'height [mmHg]' (Height): expected a unit convertible to cm, got 'mmHg'",
  });
});

Deno.test("bad cells: line-numbered issues naming the column, the value and the valid range", () => {
  const csv = "id,height [cm],weight [kg]\nA,180,80\nB,175,abc\nC,900,70\nD,180,\n";
  const t = readTable(csv, { source: "clinic.csv" });
  const errors = t.issues.filter((i) => i.severity === "error");
  assert.deepEqual(errors.map((i) => [i.line, i.kind]), [[3, "type"], [4, "range"]]);
  assert.throws(() => throwIfErrors(t.issues), {
    name: "TypeError",
    message:
      `clinic.csv: line 3, expected 'weight [kg]' (Weight) as a number in [0.2, 650] kg, got "abc" (and 1 more problem)`,
  });
  assert.throws(() => readTable("id,height [cm],weight [kg]\nC,900,70\n", { onInvalid: "throw" }), {
    name: "RangeError",
    message: "table: line 2, expected 'height [cm]' (Height) in [15, 280] cm, got 900",
  });
  // converted units are checked after conversion: 2000 lb = 907 kg is outside the human range
  assert.throws(() => readTable("height [cm],weight [lb]\n180,2000\n", { onInvalid: "throw" }), {
    name: "RangeError",
    message:
      `table: line 2, expected 'weight [lb]' (Weight) in [0.2, 650] kg, got "2000 lb" (907.18474 kg)`,
  });
  // a short row is kept (its missing cell empty) and reported with its line
  const short = readTable("id,height [cm],weight [kg]\nA,180\n");
  assert.equal(short.rowCount, 1);
  assert.equal(short.issues[0]!.kind, "format");
  assert.equal(short.issues[0]!.line, 2);
});

Deno.test("blank lines and quoted multi-line cells keep every line number exact", () => {
  const csv = 'id,height [cm],weight [kg]\n"A\nsecond line",180,80\n\nB,175,abc\nC,170,70\n';
  const t = readTable(csv);
  assert.equal(t.rowCount, 3);
  assert.deepEqual(Array.from(t.lines), [2, 5, 6]);
  assert.deepEqual(t.blankLines, [4]);
  assert.equal(t.issues[0]!.line, 5);
});

Deno.test("delimiters: comma, semicolon and tab detected from the header line", () => {
  assert.equal(detectDelimiter("a;b;c\n1;2;3"), ";");
  assert.equal(detectDelimiter('"a,b";c\n'), ";");
  assert.equal(detectDelimiter("a\tb\n"), "\t");
  const t = readTable("id;height [cm];weight [kg]\nA;180;80\n");
  assert.equal(numeric(t, "height")[0], 180);
});

Deno.test("strict UTF-8: an invalid byte is an error with its offset and line, never replaced", () => {
  // "Ren" + 0xE8: "è" in Latin-1, not UTF-8 (RFC 3629); "é" before it takes two bytes, so the
  // bad byte is byte 16 (0-based) of line 3
  const bytes = Uint8Array.of(
    ...new TextEncoder().encode("id,v\nRené,1\n"),
    0x52,
    0x65,
    0x6e,
    0xe8,
  );
  assert.throws(() => decodeUtf8(bytes, "people.csv"), {
    name: "TypeError",
    message: /^people\.csv: expected UTF-8 text, got an invalid byte 0xe8 at byte 16, line 3/,
  });
  assert.throws(() => readTable(bytes, { source: "people.csv" }), TypeError);
  assert.equal(decodeUtf8(new TextEncoder().encode("René"), "x"), "René");
});

Deno.test("malformed files: unclosed quote by line, an empty file, two columns of one quantity", () => {
  assert.throws(() => readTable('id,height [cm]\nA,180\n"B,170\n'), {
    name: "TypeError",
    message: /^table: line 3: expected every quoted field to be closed, got an unclosed quote/,
  });
  assert.throws(() => readTable(""), {
    name: "TypeError",
    message: "table: expected a header line, got an empty file",
  });
  assert.throws(() => readTable("height [cm],stature [cm]\n1,2\n"), {
    name: "TypeError",
    message:
      "table: columns 'height [cm]' and 'stature [cm]' both hold Height; expected one (map one of them as text)",
  });
});
