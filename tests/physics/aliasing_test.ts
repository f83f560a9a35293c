import assert from "node:assert/strict";
import {
  type AliasingCheck,
  aliasingCheck,
  type AliasingRemedy,
  evaluate,
  JUPYTER_DISPLAY,
  nyquistVelocity,
  nyquistVelocityAtDepth,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

const option = (r: AliasingCheck, remedy: AliasingRemedy) => {
  const o = r.options.find((x) => x.remedy === remedy);
  assert.ok(o, remedy);
  return o;
};

Deno.test("Nyquist limit at a depth: c²/(8·d·f0) and deeper or higher-frequency is lower", () => {
  // v_N,max = c²/(8·d·f0·cos θ) (Hatle & Angelsen 1985 ch. 2): 15 cm, 2 MHz → 0.98817 m/s
  // (hand check).
  const r = evaluate(nyquistVelocityAtDepth, { sampleDepthCm: 15, transmitFrequencyMHz: 2 });
  close(r.outputs.nyquistVelocity, 1540 ** 2 / (8 * 0.15 * 2e6), 1e-12, "15 cm 2 MHz");
  close(r.outputs.maxPrfHz, 5133.33, 0.01, "PRF for 15 cm");
  // Product d·f0·v_N is constant = c²/8 (hand check): 7.5 cm at 4 MHz gives the same limit.
  const other = evaluate(nyquistVelocityAtDepth, { sampleDepthCm: 7.5, transmitFrequencyMHz: 4 });
  close(other.outputs.nyquistVelocity, r.outputs.nyquistVelocity, 1e-12, "d·f constant");
  // Consistency with the Nyquist calculation at that PRF.
  const direct = evaluate(nyquistVelocity, { prfHz: r.outputs.maxPrfHz, transmitFrequencyMHz: 2 });
  close(
    direct.outputs.nyquistVelocity,
    r.outputs.nyquistVelocity,
    1e-12,
    "same as nyquistVelocity",
  );
});

Deno.test("aliasing check: 1.5 m/s at 2 MHz, 4 kHz, 15 cm aliases; the remedies and their limits", () => {
  const r = aliasingCheck({
    velocity: 1.5,
    prfHz: 4000,
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
  });
  // Current limit 2000·1540/(2·2e6) = 0.77 m/s (hand check from the Doppler equation).
  close(r.nyquistVelocity, 0.77, 1e-12, "current");
  assert.equal(r.aliases, true);
  assert.deepEqual(r.options.map((o) => o.remedy), [
    "maximumPrf",
    "baselineShift",
    "shallowerSampleVolume",
    "lowerTransmitFrequency",
    "continuousWave",
  ]);
  // Raising the PRF to c/2d = 5133 Hz gives 0.988 m/s: not enough (hand check).
  const prf = option(r, "maximumPrf");
  close(prf.nyquistVelocity, 0.98817, 1e-5, "max PRF");
  assert.equal(prf.resolves, false);
  close(prf.setting!.value, 5133.33, 0.01, "max PRF setting");
  // Baseline shift gives up to about 2× the range one way: 1.54 m/s ≥ 1.5 (common practice).
  const shift = option(r, "baselineShift");
  close(shift.nyquistVelocity, 1.54, 1e-12, "baseline");
  assert.equal(shift.resolves, true);
  // Shallower sample volume: PRF needed 2·Δf = 2·2·2e6·1.5/1540 = 7792.2 Hz → depth c/(2·PRF)
  // = 9.88 cm, where the Nyquist limit equals 1.5 m/s (hand check).
  const shallow = option(r, "shallowerSampleVolume");
  close(shallow.setting!.value, 9.8817, 1e-4, "depth");
  close(shallow.nyquistVelocity, 1.5, 1e-9, "limit at that depth");
  assert.equal(shallow.resolves, true);
  // Lower transmit frequency: f = 2·0.77/1.5 = 1.0267 MHz (Nyquist ∝ 1/f0, hand check).
  const lower = option(r, "lowerTransmitFrequency");
  close(lower.setting!.value, 1.02667, 1e-5, "frequency");
  close(lower.nyquistVelocity, 1.5, 1e-9, "limit at that frequency");
  assert.equal(lower.resolves, true);
  // Continuous-wave has no Nyquist limit (common practice).
  const cw = option(r, "continuousWave");
  assert.equal(cw.nyquistVelocity, Infinity);
  assert.equal(cw.resolves, true);
});

Deno.test("aliasing check: a given lower frequency reports its own Nyquist limit", () => {
  // 1.5 MHz at 4 kHz PRF: 2000·1540/(2·1.5e6) = 1.0267 m/s < 1.5 (hand check).
  const r = aliasingCheck({
    velocity: 1.5,
    prfHz: 4000,
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
    lowerTransmitFrequencyMHz: "1.5 MHz",
  });
  const lower = option(r, "lowerTransmitFrequency");
  close(lower.nyquistVelocity, 1.02667, 1e-5, "1.5 MHz");
  assert.equal(lower.resolves, false);
  assert.equal(lower.setting!.value, 1.5);
});

Deno.test("aliasing check: an aortic-stenosis jet of 5 m/s needs continuous-wave", () => {
  // At 2.5 MHz, 14 cm, PRF at its limit: Nyquist 1540²/(8·0.14·2.5e6) = 0.847 m/s (hand check).
  const r = aliasingCheck({
    velocity: 5,
    prfHz: 5500,
    transmitFrequencyMHz: 2.5,
    sampleDepthCm: 14,
  });
  assert.equal(r.aliases, true);
  assert.equal(option(r, "maximumPrf").resolves, false);
  assert.equal(option(r, "baselineShift").resolves, false);
  // The frequency needed is below 1 MHz, beyond usual cardiac probes (common practice).
  const lower = option(r, "lowerTransmitFrequency");
  assert.ok(lower.setting!.value < 1);
  assert.equal(lower.resolves, false);
  assert.match(lower.description, /below the usual lowest cardiac probe frequency/);
  assert.equal(option(r, "continuousWave").resolves, true);
});

Deno.test("aliasing check: a velocity under the limit does not alias", () => {
  const r = aliasingCheck({
    velocity: "50 cm/s",
    prfHz: 4000,
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
  });
  assert.equal(r.aliases, false);
  assert.equal(r.velocity, 0.5);
  // No shallower depth is needed: the option keeps the current depth.
  assert.equal(option(r, "shallowerSampleVolume").setting!.value, 15);
  assert.ok(r.options.every((o) => o.resolves));
  // Zero velocity never aliases.
  assert.equal(
    aliasingCheck({ velocity: 0, prfHz: 4000, transmitFrequencyMHz: 2, sampleDepthCm: 15 }).aliases,
    false,
  );
});

Deno.test("aliasing check: angle raises the Nyquist limit by 1/cos θ", () => {
  // At 60° the limit doubles (cos 60° = 0.5, hand check).
  const r = aliasingCheck({
    velocity: 1,
    prfHz: 4000,
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
    angleDeg: 60,
  });
  close(r.nyquistVelocity, 1.54, 1e-12, "60°");
  assert.equal(r.aliases, false);
  assert.equal(r.flags.length, 1); // 60° is outside the usual ≤ 20° practice
});

Deno.test("aliasing check displays a table of remedies in notebooks", () => {
  const r = aliasingCheck({
    velocity: 1.5,
    prfHz: 4000,
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
  });
  const bundle = r[JUPYTER_DISPLAY]();
  assert.match(String(bundle["text/plain"]), /1\.5 m\/s aliases \(Nyquist limit 0\.77 m\/s\)/);
  assert.match(String(bundle["text/plain"]), /continuousWave\s+no limit\s+yes/);
  assert.match(String(bundle["text/html"]), /<table/);
});
