import assert from "node:assert/strict";
import {
  compareZScoreModels,
  JUPYTER_DISPLAY,
  normal,
  normalLimits,
  PHN_2017_MODELS,
  zScore,
} from "../../mod.ts";

const text = (r: { [JUPYTER_DISPLAY](): Record<string, unknown> }) =>
  String(r[JUPYTER_DISPLAY]()["text/plain"]);
const html = (r: { [JUPYTER_DISPLAY](): Record<string, unknown> }) =>
  String(r[JUPYTER_DISPLAY]()["text/html"]);

Deno.test("a Z-score without uncertainty: labels with units, resolution rounding, no raw numbers", () => {
  const r = zScore(PHN_2017_MODELS.aorticRootSinus, { measurement: 2.5, bsaM2: 1 }) as unknown as {
    [JUPYTER_DISPLAY](): Record<string, unknown>;
  };
  const t = text(r);
  // Lopez 2017 form at 1 m²: Z = (2.5 − 2.06)/0.18 = 2.444 → 2.44; expected 2.06 cm; range
  // 2.06 ∓ 0.36 = 1.70 to 2.42 cm (hand computation)
  assert.match(t, /Aortic root at the sinuses \(cm\)\s+2\.50\n/);
  assert.match(t, /Z-score\s+2\.44\n/);
  assert.match(t, /Expected \(Z = 0\)\s+2\.06 cm/);
  assert.match(t, /1\.70 to 2\.42 cm/);
  assert.doesNotMatch(t, /\d\.\d{5,}|NaN|\{/);
  assert.match(html(r), /<table/);
});

Deno.test("a Z-score with uncertainty: Z and u by the metrology rule (JCGM 100:2008 §7.2.6)", () => {
  const r = zScore(PHN_2017_MODELS.aorticRootSinus, {
    measurement: normal(2.5, 0.1),
    bsaM2: 1,
  }) as unknown as { [JUPYTER_DISPLAY](): Record<string, unknown> };
  // u(Z) = u(X)/S = 0.1/0.18 = 0.5556 → 0.56, Z to the same decimal place: 2.44 (hand computation)
  assert.match(text(r), /Z-score\s+2\.44 \(u = 0\.56\)/);
  assert.doesNotMatch(text(r), /\d\.\d{5,}|NaN/);
});

Deno.test("normal limits and model comparisons display themselves (never a raw object)", () => {
  const l = normalLimits(PHN_2017_MODELS.aorticRootSinus, 0.81);
  // (2.06 ± 2·0.18)·√0.81 = 1.530 and 2.178 cm (hand computation)
  assert.match(text(l), /Aortic root at the sinuses at Z = −2 \(cm\)\s+1\.53/);
  assert.match(text(l), /Aortic root at the sinuses at Z = \+2 \(cm\)\s+2\.18/);
  assert.match(text(l), /Not a diagnosis/);
  const rows = compareZScoreModels(
    [PHN_2017_MODELS.aorticRootSinus, PHN_2017_MODELS.lvMass],
    { measurement: 2.5, bsaM2: 1 },
  );
  const t = text(rows);
  assert.match(t, /Aortic root at the sinuses\s+Lopez L 2017\s+1\.00\s+2\.44\s+99\.3/);
  // a model that cannot be applied (g against cm) shows "not measured" and the reason
  assert.match(t, /LV mass\s+Lopez L 2017\s+not measured\s+not measured\s+not measured\s+.*g/);
  assert.doesNotMatch(t, /NaN/);
  assert.doesNotMatch(t, /^phn2017/m); // the model column names the measurement, not its id
  assert.match(t, /Not a diagnosis/);
});
