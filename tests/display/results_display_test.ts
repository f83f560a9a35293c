/**
 * Every result type displays itself in a notebook (HTML and plain text): a compact table with
 * labels and units, never a raw object, never "NaN", never an unrounded double, never a code
 * identifier in place of a label.
 */
import assert from "node:assert/strict";
import {
  AORTIC_STENOSIS_2017,
  compareZScoreModels,
  continuityValveArea,
  evaluate,
  evaluateTable,
  gradeSeverity,
  gradeTable,
  JUPYTER_DISPLAY,
  normal,
  normalLimits,
  PHN_2017_MODELS,
  propagate,
  readTable,
  sensitivityCurve,
  simplifiedBernoulli,
  validateGumWithMonteCarlo,
  zScore,
} from "../../mod.ts";

type Displayable = { [JUPYTER_DISPLAY](): Record<string, unknown> };

const table = readTable(
  "patient,lvot diameter [mm],lvot vti [cm],av vti [cm]\nA,19.3,18,77\nB,21,20,\nC,22,21,70\n",
  { source: "clinic.csv" },
);
const areas = evaluateTable(table, continuityValveArea, {
  uncertainty: { lvotDiameter: { standardUncertainty: "0.8 mm" } },
});
const inputs = { peakVelocity: normal(4, 0.1) };
const gum = propagate(simplifiedBernoulli, inputs);
const mc = propagate(simplifiedBernoulli, inputs, {
  method: "monteCarlo",
  trials: 2000,
  seed: 1,
});

const RESULTS: [string, unknown][] = [
  ["evaluate", evaluate(simplifiedBernoulli, { peakVelocity: 4 })],
  ["propagate (GUM)", gum],
  ["propagate (Monte Carlo)", mc],
  ["readTable", table],
  ["evaluateTable", areas],
  ["gradeTable", gradeTable(areas, "aorticValveArea", AORTIC_STENOSIS_2017.valveArea)],
  ["zScore", zScore(PHN_2017_MODELS.aorticRootSinus, { measurement: 2.5, bsaM2: 1 })],
  [
    "zScore with uncertainty",
    zScore(PHN_2017_MODELS.aorticRootSinus, { measurement: normal(2.5, 0.1), bsaM2: 1 }),
  ],
  ["normalLimits", normalLimits(PHN_2017_MODELS.aorticRootSinus, 1)],
  [
    "compareZScoreModels",
    compareZScoreModels([PHN_2017_MODELS.aorticRootSinus, PHN_2017_MODELS.lvMass], {
      measurement: 2.5,
      bsaM2: 1,
    }),
  ],
  ["gradeSeverity (value)", gradeSeverity(AORTIC_STENOSIS_2017.valveArea, 0.85)],
  [
    "gradeSeverity (distribution)",
    gradeSeverity(
      AORTIC_STENOSIS_2017.valveArea,
      gum.outputs.gradient === undefined ? [0.9] : [0.9, 1.1],
    ),
  ],
  [
    "sensitivityCurve",
    sensitivityCurve(simplifiedBernoulli, { peakVelocity: 4 }, {
      vary: "peakVelocity",
      from: 3,
      to: 5,
    }),
  ],
  ["validateGumWithMonteCarlo", validateGumWithMonteCarlo(gum, mc, 2)],
];

Deno.test("every result type displays itself: HTML and plain text, no raw object", () => {
  for (const [name, result] of RESULTS) {
    const display = (result as Partial<Displayable>)[JUPYTER_DISPLAY];
    assert.equal(typeof display, "function", `${name}: no notebook display`);
    const bundle = display!.call(result);
    const text = String(bundle["text/plain"]);
    const html = String(bundle["text/html"]);
    assert.match(html, /^<div>.*<(table|p)\b/s, name);
    // no raw object dump, no NaN or undefined, no unrounded double (8 or more digits after the point)
    assert.doesNotMatch(text, /^\s*[{[]/m, `${name}: raw object`);
    assert.doesNotMatch(text, /\bNaN\b|\bundefined\b|\[object /, name);
    assert.doesNotMatch(text, /\d\.\d{8,}/, `${name}: unrounded number`);
    // the first line and the table header name things as a reader does (no camelCase ids)
    const [title, header] = text.split("\n");
    const words = `${title}\n${header}`.replace(/\b(mL|mmHg|MHz|kHz)\b/g, "");
    assert.doesNotMatch(words, /\b[a-z]+[A-Z][a-zA-Z]+\b/, `${name}: ${header}`);
  }
});

Deno.test("the clinical caution travels with every display of a number that could reach a patient", () => {
  for (const [name, result] of RESULTS) {
    if (name === "validateGumWithMonteCarlo" || name === "readTable") continue;
    const text = String((result as Displayable)[JUPYTER_DISPLAY]()["text/plain"]);
    assert.match(text, /Not a diagnosis/, name);
  }
});

Deno.test("missing values: 'not measured' in displays, empty cells in CSV", () => {
  const text = String((areas as unknown as Displayable)[JUPYTER_DISPLAY]()["text/plain"]);
  // row B has no aortic VTI: neither the VTI nor the area is measured
  assert.match(text, /^B\s+2\.1\s+20\s+not measured\s+not measured/m);
});
