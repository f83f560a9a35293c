import assert from "node:assert/strict";
import {
  bsaHaycock,
  bsaMosteller,
  continuityValveArea,
  csvTextCell,
  evaluateTable,
  PHN_2017_MODELS,
  readTable,
  writeTableCsv,
  zScoreCalculation,
} from "../../mod.ts";

Deno.test("written CSV reads back: headers label [unit], values as reported, flags per row", () => {
  const t = evaluateTable(
    readTable("id,height [cm],weight [kg]\nA,180,80\nB,175,abc\n"),
    bsaMosteller,
  );
  const text = writeTableCsv(t);
  const lines = text.trim().split("\n");
  // the cautions come first, as comment lines (one quoted cell when they hold a comma)
  assert.match(lines[0]!, /^"?# /);
  const data = lines.filter((l) => !/^"?#/.test(l));
  assert.equal(data[0], "id,Height [cm],Weight [kg],Body surface area [m^2],flags");
  // Mosteller: √(180·80/3600) = 2 m² (hand computation), shown to the quantity's 0.01 m²
  assert.equal(data[1], "A,180,80,2.00,");
  assert.match(data[2]!, /^B,175,,,"line 3, expected 'weight \[kg\]' \(Weight\) as a number/);
  // and it reads back to the same quantities
  const again = readTable(text);
  assert.deepEqual([...again.columns.keys()].slice(0, 4), ["id", "height", "weight", "bsa"]);
  // full precision on request
  assert.equal(
    writeTableCsv(t, { precision: "full", flags: false }).split("\n").filter((l) =>
      !/^"?#/.test(l)
    )[1],
    "A,180,80,2",
  );
});

Deno.test("text cells are neutralised against spreadsheet formulas and quoted per RFC 4180", () => {
  // OWASP, CSV injection: prefix a cell starting with = + - @ tab or CR with an apostrophe
  for (const cell of ['=HYPERLINK("x")', "+1+1", "-2", "@SUM(A1)", "\tx"]) {
    assert.ok(csvTextCell(cell).replace(/^"/, "").startsWith("'"), cell);
  }
  assert.equal(csvTextCell("René"), "René");
  assert.equal(csvTextCell('say "hi", twice'), '"say ""hi"", twice"');
  const t = readTable('id,height [cm],weight [kg]\n"+1+1",180,80\n');
  const written = writeTableCsv(t);
  assert.match(written, /\n'\+1\+1,180,80/);
  // and our reader takes the apostrophe off again: nothing lost on the round trip
  const back = readTable(written).columns.get("id")!;
  assert.ok(back.kind === "text" && back.values[0] === "+1+1");
});

Deno.test("every text the writer puts in a CSV is neutralised, and reads back exactly", () => {
  // OWASP CSV Injection and ASVS 5.0 §1.2.10: =, +, -, @, tab, CR, LF, NUL lead a formula; an
  // apostrophe before them is the common defence (a spreadsheet takes it as a text marker)
  const hostile = [
    "=1+1",
    "+1",
    "-2+3",
    "@SUM(A1)",
    "\t=x",
    "\r=x",
    "\n=x",
    "\0x",
    "'=already",
    "''-twice",
    "＝1+1", // full-width "=" (from memory: some spreadsheets convert it)
    "Dr A-B",
    "'plain'",
  ];
  const rows = hostile.map((h, i) => `${csvTextCell(h)},${170 + i}`).join("\n");
  const csv = `${csvTextCell("=header")},height [cm]\n${rows}\n`;
  for (const cell of [...hostile, "=header"].map(csvTextCell)) {
    const first = cell.replace(/^"/, "");
    assert.ok(!/^[=+\-@\t\r\n\0＝]/.test(first), `written cell starts a formula: ${cell}`);
  }
  const t = readTable(csv);
  const back = t.columns.get("=header")!;
  assert.ok(back.kind === "text");
  assert.deepEqual(back.values, hostile); // nothing lost on the round trip
  // the cautions (comment lines) and the flags are cells too
  const evaluated = evaluateTable(
    readTable("id,height [cm],weight [kg]\n=A,180,80\n"),
    bsaMosteller,
  );
  const text = writeTableCsv({ ...evaluated, cautions: ['a, =HYPERLINK("x")'] });
  assert.equal(text.split("\n")[0], '"# a, =HYPERLINK(""x"")"');
  assert.match(text, /\n'=A,180,80,2\.00,/);
});

Deno.test("reported precision: GUM rule next to an uncertainty, resolution otherwise, no conversion noise; full on request", () => {
  const t = readTable("id,lvot diameter [mm],lvot vti [cm],av vti [cm]\nC,19.3,18,77\nD,20,20,\n");
  const e = evaluateTable(t, continuityValveArea, {
    uncertainty: { lvotDiameter: { standardUncertainty: "0.8 mm" } },
  });
  const data = writeTableCsv(e).split("\n").filter((l) => l !== "" && !/^"?#/.test(l));
  const cells = data[1]!.split(",");
  // 19.3 mm is written 1.93 cm, not the binary 1.9300000000000002 of the conversion
  assert.equal(cells[1], "1.93");
  // AVA = π·1.93²/4·18/77 = 0.68389 cm²; u = AVA·2·0.08/1.93 = 0.05669 → 0.057, AVA to the same
  // place: 0.684 (JCGM 100:2008 §7.2.6, hand computation)
  assert.equal(cells[4], "0.684");
  assert.equal(cells[5], "0.057");
  // a missing value is an empty cell, never "NaN"
  assert.match(data[2]!, /^D,2,20,,,,,/);
  assert.doesNotMatch(data.join("\n"), /NaN/);
  // full precision on request: every digit of the double
  const full = writeTableCsv(e, { precision: "full" }).split("\n").find((l) => l.startsWith("C,"))!;
  assert.ok(full.split(",")[4]!.length > 10, full);
});

Deno.test("a computed header keeps what is not its unit: the Z-score model's source", () => {
  const t = evaluateTable(
    readTable("id,height [cm],weight [kg],aortic root [cm]\nA,120,22,2.0\n"),
    [bsaHaycock, zScoreCalculation(PHN_2017_MODELS.aorticRootSinus)],
  );
  const header = writeTableCsv(t).split("\n").find((l) => l.startsWith("id,"))!;
  assert.match(header, /Aortic root at the sinuses Z-score \(Lopez 2017\)/);
  assert.match(header, /Body surface area \[m\^2\]/);
});
