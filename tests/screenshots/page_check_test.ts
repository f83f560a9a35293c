/**
 * The rules of the screenshot check (page_check.ts) on hand-made page snapshots, so each rule is
 * seen to fail on a page that breaks it and to pass on one that keeps it.
 */
import assert from "node:assert/strict";
import { findDefects, forbiddenIdentifiers, type PageSnapshot } from "./page_check.ts";

const forbidden = forbiddenIdentifiers();
const page = (p: Partial<PageSnapshot>): PageSnapshot => ({
  outputs: [],
  axisTitles: [],
  tables: [],
  clippedTexts: [],
  ...p,
});

Deno.test("forbidden identifiers: the catalog's input and output names and camelCase quantity ids", () => {
  // names from issue 16's report, all inputs or outputs of catalog calculations
  for (const title of ["trueGradient [mmHg]", "angleDeg [deg]", "lvotDiameterCm [cm]"]) {
    assert.match(title, forbidden, title);
  }
  assert.match("mean of auto_trace and sonographer_A", forbidden); // snake_case
  for (
    const title of [
      "LVOT diameter (cm)",
      "True gradient (mmHg)",
      "Insonation angle (°)",
      "Height (cm)",
    ]
  ) {
    assert.doesNotMatch(title, forbidden, title);
  }
});

Deno.test("rule 1: an output opening with { is a raw object dump", () => {
  const defects = findDefects(
    page({ outputs: ["Aortic valve area = 0.77 cm²", '{ value: 0.7705, "u": 0.08 }'] }),
    forbidden,
  );
  assert.deepEqual(defects.map((d) => d.rule), ["raw object dump"]);
  assert.match(defects[0]!.detail, /^output 2 opens with "\{ value: 0\.7705/);
});

Deno.test("rule 2: a snake_case name is accepted only where the page's tables show it as a name", () => {
  const titles = ["LV ejection fraction: auto_trace − sonographer_A (%)"];
  // the tables call the methods "Auto trace" and "Sonographer A": the chart shows code
  const pretty = page({
    axisTitles: titles,
    tables: [{
      headers: ["method", "readings"],
      rows: [["Auto trace", "60"], ["Sonographer A", "60"]],
    }],
  });
  assert.deepEqual(findDefects(pretty, forbidden).map((d) => d.detail), [
    '"LV ejection fraction: auto_trace − sonographer_A (%)" shows `auto_trace`',
  ]);
  // the user's file names them so, and the tables use those names too
  const raw = page({
    axisTitles: titles,
    tables: [{
      headers: ["Observer / method", "Readings"],
      rows: [["auto_trace", "60"], ["sonographer_A", "60"]],
    }],
  });
  assert.deepEqual(findDefects(raw, forbidden), []);
  // a catalog identifier is never a name
  const catalog = page({
    axisTitles: ["angleDeg (°)"],
    tables: [{ headers: ["x"], rows: [["angleDeg"]] }],
  });
  assert.equal(findDefects(catalog, forbidden).length, 1);
});

Deno.test("rule 2: a code identifier in an axis or legend title is named", () => {
  const defects = findDefects(
    page({ axisTitles: ["Insonation angle (°)", "angleDeg [deg]"] }),
    forbidden,
  );
  assert.deepEqual(defects, [{
    rule: "code identifier in a chart title",
    detail: '"angleDeg [deg]" shows `angleDeg`',
  }]);
});

Deno.test("rule 3: numeric columns need a unit in the header, per row, or a unitless statistic", () => {
  const ok = page({
    tables: [
      {
        headers: ["patient", "LVOT diameter (cm)", "note"],
        rows: [["VC-01", "2.1", "invented"], ["VC-02", "not measured", ""]],
      },
      {
        headers: ["form", "ICC", "95 % CI", "pairs"],
        rows: [["ICC(2,1)", "0.913", "[0.826, 0.957]", "30"]],
      },
      // an uncertainty budget: each row's source names its unit
      {
        headers: ["Source", "Estimate xᵢ", "u(xᵢ)"],
        rows: [["Height (cm)", "172.0", "0.5"], ["Weight (kg)", "70.0", "0.2"]],
      },
      { headers: ["patient", "class"], rows: [["P1", "severe"]] }, // not numeric
    ],
  });
  assert.deepEqual(findDefects(ok, forbidden), []);
  const bad = page({
    tables: [
      {
        headers: ["comparison", "bias", "bias 95 % CI"],
        rows: [["B − A", "-1.75", "[-2.85, -0.64]"]],
      },
      {
        headers: ["Statistic", "Estimate"],
        rows: [["Deming slope", "0.94"], ["Deming intercept", "2.1"]],
      },
    ],
  });
  assert.deepEqual(findDefects(bad, forbidden).map((d) => d.detail), [
    'table 1 (comparison | bias | bias 95 % CI): column "bias" holds numbers such as "-1.75" and names no unit',
    'table 1 (comparison | bias | bias 95 % CI): column "bias 95 % CI" holds numbers such as "[-2.85, -0.64]" and names no unit',
    'table 2 (Statistic | Estimate): column "Estimate" holds numbers such as "2.1" (row "Deming intercept") and names no unit',
  ]);
});

Deno.test("rule 4: clipped chart text is reported with what the browser measured", () => {
  const defects = findDefects(
    page({
      clippedTexts: [{ text: "Transmit frequency …", problem: "is cut short with an ellipsis" }],
    }),
    forbidden,
  );
  assert.deepEqual(defects, [{
    rule: "chart text clipped",
    detail: '"Transmit frequency …" is cut short with an ellipsis',
  }]);
});

Deno.test("rule 5: a number with 9 or more significant digits is unrounded", () => {
  const defects = findDefects(
    page({
      outputs: [
        "velocity 4.267 m/s, 200000 trials, 0.00012345 s", // 4, integer, 5 significant digits
        "Insonation angle within 15°: velocity 4.266666666666667 m/s displayed",
        "share 0.000000123456789", // 9 significant digits after the leading zeros
      ],
    }),
    forbidden,
  );
  assert.deepEqual(defects.map((d) => d.detail), [
    'output 2 shows 4.266666666666667 ("…on angle within 15°: velocity 4.266666666666667 m/s displ…")',
    'output 3 shows 0.000000123456789 ("…share 0.000000123456789…")',
  ]);
});
