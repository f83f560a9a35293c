import assert from "node:assert/strict";
import {
  continuityValveArea,
  evaluateTable,
  normal,
  PHN_2017_MODELS,
  propagate,
  propagateRow,
  randomStream,
  readTable,
  zScoreFromBodySize,
} from "../../mod.ts";
import type { EvaluateTableOptions, Table } from "../../mod.ts";
import { gumColumns } from "../../calc/table/gum_columns.ts";

const numeric = (t: Table, name: string): Float64Array => {
  const c = t.columns.get(name);
  assert.ok(c?.kind === "numeric", `${name} is a numeric column`);
  return c.values;
};

/** Every computed row of `evaluated` has, bit for bit, the numbers of that row's own
 * propagation (the reference: `propagate` row by row, JCGM 100:2008 §5 as the library
 * implements it for one patient). */
function assertRowsMatchPropagation(
  table: Table,
  evaluated: Table,
  calc: Parameters<typeof propagateRow>[1],
  options: EvaluateTableOptions,
  columns: Record<string, string>,
): number {
  let compared = 0;
  for (let row = 0; row < table.rowCount; row++) {
    const p = propagateRow(table, calc, row, options);
    for (const [output, column] of Object.entries(columns)) {
      const y = p.outputs[output as never] as unknown as {
        value: number;
        standardUncertainty: number;
        interval: { lower: number; upper: number };
      };
      const where = `row ${row}, ${output}`;
      assert.equal(numeric(evaluated, column)[row], y.value, where);
      assert.equal(numeric(evaluated, `${column} u`)[row], y.standardUncertainty, where);
      assert.equal(numeric(evaluated, `${column} lower`)[row], y.interval.lower, where);
      assert.equal(numeric(evaluated, `${column} upper`)[row], y.interval.upper, where);
      compared++;
    }
  }
  return compared;
}

Deno.test("GUM over columns: each random row has, bit for bit, its own propagation's numbers", () => {
  const rng = randomStream(1978);
  const lines = ["patient,lvot diameter [mm],lvot vti [cm],av vti [cm]"];
  for (let i = 0; i < 300; i++) {
    lines.push(
      `P${i},${15 + 12 * rng.uniform()},${10 + 20 * rng.uniform()},${30 + 120 * rng.uniform()}`,
    );
  }
  const table = readTable(lines.join("\n") + "\n");
  for (
    const options of [
      {
        uncertainty: {
          lvotDiameter: { standardUncertainty: "0.8 mm" },
          lvotVti: { relative: 0.06 },
          avVti: { relative: 0.05 },
        },
      },
      // one uncertain input, the others exact; another coverage probability
      { uncertainty: { avVti: { standardUncertainty: 3 } }, coverage: 0.9 },
    ] satisfies EvaluateTableOptions[]
  ) {
    const r = evaluateTable(table, continuityValveArea, options);
    assert.equal(r.issues.length, 0);
    const compared = assertRowsMatchPropagation(table, r, continuityValveArea, options, {
      avaCm2: "aorticValveArea",
    });
    assert.equal(compared, 300);
  }
});

Deno.test("GUM over columns: a chain of two outputs (BSA, then a Z-score) matches each row's propagation", () => {
  const rng = randomStream(2017);
  const lines = ["patient,height [cm],weight [kg],lvedd [cm]"];
  for (let i = 0; i < 200; i++) {
    const h = 50 + 140 * rng.uniform();
    const w = Math.max(3, 0.0000165 * h ** 2.9 * (0.85 + 0.3 * rng.uniform()));
    lines.push(`C${i},${h},${w},${(20 + 0.17 * h * (0.9 + 0.2 * rng.uniform())) / 10}`);
  }
  const table = readTable(lines.join("\n") + "\n", { population: "pediatric" });
  const calc = zScoreFromBodySize(PHN_2017_MODELS.lvEndDiastolicDimension);
  const options = {
    population: "pediatric",
    uncertainty: {
      height: { standardUncertainty: "0.5 cm" },
      weight: { relative: 0.02 },
      lvEndDiastolicDiameter: { standardUncertainty: "1 mm" },
    },
  } satisfies EvaluateTableOptions;
  const r = evaluateTable(table, calc, options);
  const names = [...r.columns.keys()];
  const bsa = names.find((n) => /bsa/i.test(n) && !/ /.test(n))!;
  const z = names.find((n) => /zScore/.test(n) && !/ /.test(n))!;
  assert.ok(bsa && z, `BSA and Z columns in ${names.join(", ")}`);
  const compared = assertRowsMatchPropagation(table, r, calc, options, {
    bsaM2: bsa,
    zScore: z,
  });
  assert.equal(compared, 400);
});

Deno.test("GUM over columns: one input's uncertainty by hand, and rows left to their own propagation", () => {
  // y = π·d²/4·v₁/v₂: ∂y/∂d = π·d/2·v₁/v₂, so u(y) = π·d/2·v₁/v₂·u(d) (hand computation of the
  // derivative of the continuity equation); k = 1.959964 for 95 % (standard normal table)
  const d = Float64Array.of(2, 1.8, 2.2, 2.4), v1 = Float64Array.of(20, 18, 22, 25);
  const v2 = Float64Array.of(80, 90, 70, 100);
  const ud = Float64Array.of(0.1, NaN, 0.05, -0.1);
  const skip = Uint8Array.of(0, 0, 1, 0);
  const r = gumColumns(continuityValveArea, [d, v1, v2], [ud, null, null], skip, 0.95);
  const u0 = Math.PI * 2 / 2 * 20 / 80 * 0.1;
  assert.ok(Math.abs(r.standardUncertainty[0]![0]! - u0) < 1e-9 * u0);
  assert.ok(Math.abs(r.upper[0]![0]! - (Math.PI / 4 + 1.959964 * u0)) < 1e-6);
  // an uncertainty that is not a finite number >= 0: left to the row's own propagation, which
  // refuses it with the reason; a skipped row is neither computed nor left to propagation
  assert.deepEqual([...r.perRow], [0, 1, 0, 1]);
  assert.ok(Number.isNaN(r.value[0]![1]!) && Number.isNaN(r.value[0]![2]!));
  assert.throws(
    () =>
      propagate(continuityValveArea, {
        lvotDiameterCm: normal(2.4, -0.1),
        lvotVtiCm: 25,
        avVtiCm: 100,
      }),
    /standard uncertainty/,
  );
  // through a table, the row with a bad uncertainty gets the propagation's own issue
  const table = readTable("patient,lvot diameter [mm],lvot vti [cm],av vti [cm]\nA,20,20,80\n");
  const bad = evaluateTable(table, continuityValveArea, {
    uncertainty: { lvotDiameter: { standardUncertainty: -1 } },
  });
  assert.ok(Number.isNaN(numeric(bad, "aorticValveArea")[0]!));
  assert.match(bad.issues.map((i) => `${i.field} ${i.expected}`).join("\n"), /lvotDiameterCm/);
});
