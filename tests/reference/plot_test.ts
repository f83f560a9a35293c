import assert from "node:assert/strict";
import {
  bsaHaycock,
  evaluateTable,
  measurementAtZ,
  PHN_2017_MODELS,
  readTable,
  zScoreBands,
} from "../../mod.ts";
import { adultLimitChart, tableZScoreChart, zScoreChart } from "../../plot/mod.ts";
import { svgText } from "../plot/svg_text.ts";

type Layer = { data?: { values: Record<string, number | string>[] }; layer?: Layer[] };

Deno.test("Z-score bands are the model's measurements at Z = −3…3", () => {
  const model = PHN_2017_MODELS.aorticRootSinus;
  for (const row of zScoreBands(model, 0.2, 2.4, 5)) {
    // Lopez 2017 form: at BSA b the Z = +2 measurement is (M + 2S)·b^α (hand-checkable)
    assert.ok(Math.abs(row["z2"] - (2.06 + 0.36) * row.bsa ** 0.5) < 1e-12);
    assert.equal(row["z-3"], measurementAtZ(model, -3, row.bsa));
  }
  assert.throws(() => zScoreBands(model, 2, 1), {
    name: "RangeError",
    message:
      "Z-score bands (phn2017.aorticRootSinus): expected a BSA range 0 < from < to, got [2, 1]",
  });
});

Deno.test("pediatric chart bands are the model's measurements at Z = −3…3", async () => {
  const model = PHN_2017_MODELS.aorticRootSinus;
  const chart = zScoreChart(model, {
    points: [{ bsaM2: 1, value: 2.4, valueUncertainty: 0.05, bsaUncertainty: 0.03, label: "P1" }],
  });
  const layers = chart.content.layer as Layer[];
  const grid = layers[0]!.data!.values;
  const row = grid[Math.floor(grid.length / 2)]!;
  // Lopez 2017 form: at BSA b the Z = +2 measurement is (M + 2S)·b^α (hand-checkable)
  const b = row.bsa as number;
  assert.ok(Math.abs((row["z2"] as number) - (2.06 + 0.36) * b ** 0.5) < 1e-12);
  assert.equal(row["z-3"], measurementAtZ(model, -3, b));
  // Error bars: ±2·u by default (coverage factor 2)
  const pts = layers[2]!.data!.values[0]!;
  assert.deepEqual([pts.valueLow, pts.valueHigh], [2.4 - 0.1, 2.4 + 0.1]);
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  // axis titles are quantity labels with units
  assert.match(svg, /Body surface area \(m²\)/);
  assert.match(svg, /Aortic root at the sinuses \(cm\)/);
});

Deno.test("pediatric chart rejects bad points naming the field", () => {
  assert.throws(
    () => zScoreChart(PHN_2017_MODELS.lvMass, { points: [{ bsaM2: NaN, value: 40 }] }),
    {
      name: "TypeError",
      message:
        "Z-score chart (phn2017.lvMass): expected point 0 'bsaM2' as a finite number, got NaN",
    },
  );
  assert.throws(
    () =>
      zScoreChart(PHN_2017_MODELS.lvMass, {
        points: [{ bsaM2: 1, value: 40, valueUncertainty: -1 }],
      }),
    {
      name: "RangeError",
      message: "Z-score chart (phn2017.lvMass): expected point 0 'valueUncertainty' >= 0, got -1",
    },
  );
});

Deno.test("cohort chart plots every row with a value; adult chart draws sex-specific limits", async () => {
  const text = await Deno.readTextFile(
    new URL("../../examples/data/pediatric_clinic.csv", import.meta.url),
  );
  const model = PHN_2017_MODELS.lvMass;
  const t = evaluateTable(readTable(text, { population: "pediatric" }), bsaHaycock);
  const chart = tableZScoreChart(t, model);
  // 20 invented rows, 2 with LV mass not measured → 18 points
  assert.equal((chart.content.layer as Layer[])[2]!.data!.values.length, 18);
  assert.match(await chart.toSVG(), /^<svg/);

  const adult = adultLimitChart("lvEjectionFraction", {
    points: [{ value: 48, sex: "female", uncertainty: 3, label: "A03" }, {
      value: 38,
      sex: "male",
      label: "A04",
    }],
  });
  const limits = (adult.content.layer as Layer[])[0]!.data!.values;
  // Lang 2015 Table 2 (from memory): women 54–74 with cut points 41 and 30; men 52–72, 41, 30
  assert.deepEqual(
    limits.filter((l) => l.sex === "female").map((l) => l.value),
    [30, 41, 54, 74],
  );
  assert.deepEqual(limits.filter((l) => l.sex === "male").map((l) => l.value), [30, 41, 52, 72]);
  assert.match(await adult.toSVG(), /^<svg/);
  assert.throws(
    () => adultLimitChart("lvEjectionFraction", { points: [{ value: 50, sex: "x" as never }] }),
    {
      name: "TypeError",
      message:
        `Adult limit chart (lvEjectionFraction): expected point 0 'sex' "male" or "female", got "x"`,
    },
  );
});

Deno.test("adult chart draws one set of limits when the guideline gives one range for both sexes", () => {
  const chart = adultLimitChart("laVolumeIndex");
  const limits = (chart.content.layer as Layer[])[0]!.data!.values;
  // Lang 2015 Table 2 (from memory): LA volume index 16–34, cut points 41 and 48, both sexes
  assert.deepEqual(limits.map((l) => [l.sex, l.value]), [
    ["both sexes", 16],
    ["both sexes", 34],
    ["both sexes", 41],
    ["both sexes", 48],
  ]);
});

Deno.test("pediatric chart: points outside ±2 are named with their Z, every point has a titled tooltip, the bands a legend", async () => {
  const model = PHN_2017_MODELS.aorticRootSinus;
  const chart = zScoreChart(model, {
    points: [{ bsaM2: 1, value: 2.5, label: "P07" }, { bsaM2: 1, value: 2.3, label: "P08" }],
  });
  const svg = svgText(await chart.toSVG());
  // Lopez 2017 form at BSA 1 m²: Z = (X − M)/S = (2.5 − 2.06)/0.18 = 2.44 (hand computation);
  // (2.3 − 2.06)/0.18 = 1.33 lies inside ±2 and is not named
  assert.match(svg, /P07 \(Z 2\.44\)/);
  assert.doesNotMatch(svg, /P08/);
  // the legend names the shaded bands and the mean
  for (
    const name of ["Normal range", "Z between −2 and +2", "Z between −1 and +1", "Mean (Z = 0)"]
  ) {
    assert.ok(svg.includes(name), name);
  }
  // hover: every tooltip field has a reader's title, and the Z is among them
  const spec = JSON.stringify(chart.spec);
  const tooltips = [...spec.matchAll(/"tooltip":\[(.*?)\]/g)].map((m) => m[1]!);
  assert.ok(tooltips.length > 0);
  for (const t of tooltips) {
    for (const entry of t.split("},{")) assert.match(entry, /"title":"[^"]+"/, entry);
  }
  assert.match(spec, /"zText":"1\.33"/);
});
