/**
 * Provenance reaches the user: every number whose source data were recalled ("from memory") or
 * not checked against the publication ("not verified") carries that mark in its result's
 * cautions and in its notebook display, not only in a source comment. The project rule this
 * checks: "A 'from memory' mark must also reach the user with the number (result, display,
 * chart, CSV), not stay in a comment."
 *
 * @module
 */
import assert from "node:assert/strict";
import {
  ADULT_REFERENCE_LANG_2015,
  adultSeverityTable,
  CATALOG,
  cautionsOf,
  evaluate,
  gradeSeverity,
  GUIDELINE_SEVERITY_TABLES,
  JUPYTER_DISPLAY,
  measurementAtZ,
  normal,
  PHN_2017_MODELS,
  pisaFlowRate,
  propagate,
  type SeverityTable,
  zScore,
} from "../../mod.ts";

/** The marks a user must see: recalled data, or data not checked against the publication. */
const MARK = /from memory|not verified/i;

/** The plain-text notebook display of a result. */
const text = (r: unknown) =>
  String((r as Record<symbol, () => Record<string, unknown>>)[JUPYTER_DISPLAY]!()["text/plain"]);

/** Every guideline severity table of the package: the valve and pulmonary-hypertension tables,
 * and the table made from each adult reference row. */
const SEVERITY_TABLES: readonly SeverityTable[] = [
  ...GUIDELINE_SEVERITY_TABLES,
  ...ADULT_REFERENCE_LANG_2015.map(adultSeverityTable),
];

/** A finite value inside a band (its midpoint, or next to its finite end). */
function valueIn(table: SeverityTable, i: number): number {
  const { min, max } = table.bands[i]!.range;
  const lo = Math.max(min, table.quantity.valid.min);
  const hi = Math.min(max, table.quantity.valid.max);
  if (Number.isFinite(lo) && Number.isFinite(hi)) return (lo + hi) / 2;
  return Number.isFinite(lo) ? lo + 1 : hi - 1;
}

Deno.test("every recalled severity table says 'from memory' in each grade and its display", () => {
  // project rule: a recalled threshold is marked where the user reads the grade
  let marked = 0;
  for (const table of SEVERITY_TABLES) {
    if (!table.bands.some((b) => b.fromMemory)) continue;
    marked++;
    for (let i = 0; i < table.bands.length; i++) {
      const g = gradeSeverity(table, valueIn(table, i));
      assert.equal(g.band, table.bands[i], `${table.id}: value graded into band ${i}`);
      assert.ok(g.cautions.some((c) => /from memory/.test(c)), `${table.id} cautions`);
      assert.match(text(g), /from memory/, `${table.id} display`);
    }
    // a distribution (samples) carries the same mark
    const d = gradeSeverity(table, [valueIn(table, 0), valueIn(table, table.bands.length - 1)]);
    assert.ok(d.cautions.some((c) => /from memory/.test(c)), `${table.id} distribution`);
    assert.match(text(d), /from memory/, `${table.id} distribution display`);
  }
  // all of them are recalled today (the guideline tables were not re-read here): every valve and
  // pulmonary-hypertension table and one per adult row
  assert.equal(marked, GUIDELINE_SEVERITY_TABLES.length + ADULT_REFERENCE_LANG_2015.length);
});

Deno.test("every unverified Z-score model says 'not verified' in each result and its display", () => {
  for (const model of Object.values(PHN_2017_MODELS)) {
    if (!MARK.test(model.provenance)) continue;
    const exact = zScore(model, { measurement: measurementAtZ(model, 1.5, 0.9), bsaM2: 0.9 });
    assert.ok(exact.cautions.some((c) => /not verified/.test(c)), model.id);
    assert.match(text(exact), /not verified/, model.id);
    const x = measurementAtZ(model, 0, 0.9);
    const uncertain = zScore(model, { measurement: normal(x, x / 50), bsaM2: 0.9 });
    assert.ok(uncertain.cautions.some((c) => /not verified/.test(c)), `${model.id} with u`);
    assert.match(text(uncertain), /not verified/, `${model.id} with u`);
  }
});

Deno.test("every recalled adult row says 'from memory' where its grade is read", () => {
  for (const row of ADULT_REFERENCE_LANG_2015) {
    if (!row.fromMemory) continue;
    const table = adultSeverityTable(row);
    const g = gradeSeverity(table, valueIn(table, 0));
    assert.ok(g.cautions.some((c) => /from memory/.test(c)), `${row.parameter} ${row.sex}`);
    assert.match(text(g), /from memory/, `${row.parameter} ${row.sex}`);
  }
});

Deno.test("every calculation citing a recalled source carries the mark in its cautions", () => {
  // The cautions of a calculation are what its evaluation, propagation and table results carry
  // and display (cautionsOf), so a recalled citation must reach them.
  let cited = 0;
  for (const calc of CATALOG.calculations.values()) {
    const recalled = calc.citations.filter((c) => MARK.test(c.locator ?? ""));
    if (recalled.length === 0) continue;
    cited++;
    const cautions = cautionsOf(calc);
    for (const c of recalled) {
      const who = c.authors.split(/[ ,]/)[0]!;
      assert.ok(
        cautions.some((s) => s.includes(who) && s.includes(String(c.year)) && MARK.test(s)),
        `${calc.id}: ${who} ${c.year} (${c.locator}) not marked in ${JSON.stringify(cautions)}`,
      );
    }
  }
  assert.ok(cited >= 2, `expected the PISA calculations among them, got ${cited}`);
  // and it is shown: an evaluation and a propagation of the PISA flow rate (Pu 1995, from memory)
  const e = evaluate(pisaFlowRate, { radiusCm: 1, aliasingVelocityCmPerS: 40 });
  assert.match(text(e), /Pu 1995.*from memory/);
  const p = propagate(pisaFlowRate, { radiusCm: normal(1, 0.05), aliasingVelocityCmPerS: 40 });
  assert.ok(p.cautions.some((c) => /Pu 1995.*from memory/.test(c)));
});
