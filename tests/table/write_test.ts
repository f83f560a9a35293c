import assert from "node:assert/strict";
import { bsaMosteller, csvTextCell, evaluateTable, readTable, writeTableCsv } from "../../mod.ts";

Deno.test("written CSV reads back: headers label [unit], values as reported, flags per row", () => {
  const t = evaluateTable(
    readTable("id,height [cm],weight [kg]\nA,180,80\nB,175,abc\n"),
    bsaMosteller,
  );
  const text = writeTableCsv(t);
  const lines = text.trim().split("\n");
  // the cautions come first, as comment lines
  assert.ok(lines[0]!.startsWith("# "));
  const data = lines.filter((l) => !l.startsWith("#"));
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
      !l.startsWith("#")
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
