import assert from "node:assert/strict";
import {
  type AliasingCheck,
  aliasingCheck,
  type AliasingRemedy,
  evaluate,
  JUPYTER_DISPLAY,
  maximumPrfForDepth,
  NYQUIST_VELOCITY,
  nyquistVelocity,
  nyquistVelocityAtDepth,
} from "../../mod.ts";
import { close } from "./helpers.ts";

/** Pulsed-Doppler settings of the worked examples: 4 kHz PRF at 2 MHz, sample volume at 15 cm. */
const SETTINGS = { prfHz: 4000, transmitFrequencyMHz: 2, sampleDepthCm: 15 } as const;

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

Deno.test("the Nyquist limit at a depth is a chain of the PRF limit and the Nyquist limit", () => {
  assert.equal(nyquistVelocityAtDepth.recipe.kind, "chain");
  assert.equal(nyquistVelocityAtDepth.outputs.nyquistVelocity.quantity, NYQUIST_VELOCITY);
  assert.deepEqual(nyquistVelocityAtDepth.outputNames, ["maxPrfHz", "nyquistVelocity"]);
  // Its caution comes from the PRF limit it is built on.
  assert.ok(
    maximumPrfForDepth.cautions.every((c) => nyquistVelocityAtDepth.cautions.includes(c)),
  );
});

Deno.test("aliasing check: 1.5 m/s at 2 MHz, 4 kHz, 15 cm aliases; the remedies and their limits", () => {
  const r = aliasingCheck({
    ...SETTINGS,
    velocity: 1.5,
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
    ...SETTINGS,
    velocity: 1.5,
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
    ...SETTINGS,
    velocity: "50 cm/s",
  });
  assert.equal(r.aliases, false);
  assert.equal(r.velocity, 0.5);
  // No shallower depth is needed: the option keeps the current depth.
  assert.equal(option(r, "shallowerSampleVolume").setting!.value, 15);
  assert.ok(r.options.every((o) => o.resolves));
  // Zero velocity never aliases.
  assert.equal(
    aliasingCheck({ ...SETTINGS, velocity: 0 }).aliases,
    false,
  );
});

Deno.test("aliasing check: angle raises the Nyquist limit by 1/cos θ", () => {
  // At 60° the limit doubles (cos 60° = 0.5, hand check).
  const r = aliasingCheck({
    ...SETTINGS,
    velocity: 1,
    angleDeg: 60,
  });
  close(r.nyquistVelocity, 1.54, 1e-12, "60°");
  assert.equal(r.aliases, false);
  assert.equal(r.flags.length, 1); // 60° is outside the usual ≤ 20° practice
  assert.match(r.flags[0]!, /'angleDeg' \(Insonation angle\) = 60° lies outside the typical range/);
});

Deno.test("aliasing check keeps the checked arguments and labels its settings", () => {
  const r = aliasingCheck({
    velocity: "150 cm/s",
    prfHz: "4 kHz",
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
  });
  // Defaults filled in: beam aligned, soft-tissue speed of sound (common practice); the optional
  // lower frequency, not given, is absent.
  assert.deepEqual(r.arguments.values, {
    ...SETTINGS,
    velocity: 1.5,
    angleDeg: 0,
    soundSpeedMps: 1540,
  });
  const prf = option(r, "maximumPrf").setting!;
  assert.equal(prf.name, "prfHz");
  assert.equal(prf.label, "Pulse repetition frequency");
  assert.equal(prf.unit, "Hz");
  assert.equal(option(r, "shallowerSampleVolume").setting!.label, "Sample-volume depth");
  assert.equal(r.outputDefinitions.nyquistVelocity.label, "Nyquist velocity");
});

Deno.test("aliasing check displays a table of remedies in notebooks", () => {
  const r = aliasingCheck({
    ...SETTINGS,
    velocity: 1.5,
  });
  const bundle = r[JUPYTER_DISPLAY]();
  const text = String(bundle["text/plain"]);
  // Current limit 2000·1540/(2·2e6) = 0.77 m/s; at the depth limit 0.99 m/s (hand checks above).
  assert.match(text, /^Aliasing check: 1\.50 m\/s aliases \(Nyquist velocity 0\.77 m\/s\)/);
  assert.match(text, /Nyquist velocity \(m\/s\)/);
  assert.match(
    text,
    /Raise the PRF to its depth limit\s+Pulse repetition frequency = 5133 Hz\s+0\.99\s+no/,
  );
  assert.match(text, /Continuous-wave Doppler\s+no limit\s+yes/);
  assert.match(text, /Setting: Insonation angle = 0°/);
  assert.match(String(bundle["text/html"]), /<table/);
});

// Bad input: clear errors naming the field, its label, the valid range and the value (project
// rules, bad-input list); messages from the one validator.

Deno.test("aliasing check: a velocity or lower frequency outside its range is a RangeError", () => {
  assert.throws(
    () => aliasingCheck({ ...SETTINGS, velocity: -1 }),
    {
      name: "RangeError",
      message:
        /^Aliasing check: expected 'velocity' \(Velocity to display\) in \[0, 20\] m\/s, got -1$/,
    },
  );
  assert.throws(
    () =>
      aliasingCheck({
        ...SETTINGS,
        velocity: 1,
        lowerTransmitFrequencyMHz: 0,
      }),
    {
      name: "RangeError",
      message:
        /^Aliasing check: expected 'lowerTransmitFrequencyMHz' \(Lower transmit frequency\) in \(0, 100\] MHz, got 0$/,
    },
  );
});

Deno.test("aliasing check: a PRF beyond what the sample depth allows is a RangeError naming both", () => {
  // 15 cm allows at most c/(2d) = 5133.33 Hz (hand check): 6000 Hz breaks the relation.
  assert.throws(
    () => aliasingCheck({ velocity: 1, prfHz: 6000, transmitFrequencyMHz: 2, sampleDepthCm: 15 }),
    {
      name: "RangeError",
      message:
        /^Aliasing check: expected 'prfHz' \(Pulse repetition frequency\) ≤ 'soundSpeedMps' \(Speed of sound\) \/ \(2·'sampleDepthCm' \(Sample-volume depth\)\), the highest PRF the sample depth allows \(beyond it pulsed Doppler is high-PRF and range-ambiguous: see rangeAmbiguity\), got prfHz = 6000 Hz, sampleDepthCm = 15 cm, soundSpeedMps = 1540 m\/s$/,
    },
  );
  // Exactly at the limit is allowed (the maximum PRF option uses it).
  const limit = evaluate(maximumPrfForDepth, { depthCm: 15 }).outputs.maxPrfHz;
  assert.equal(
    aliasingCheck({ velocity: 1, prfHz: limit, transmitFrequencyMHz: 2, sampleDepthCm: 15 })
      .maxPrfHz,
    limit,
  );
});

Deno.test("aliasing check rejects unknown keys, non-objects and a 'lower' frequency that is not lower", () => {
  assert.throws(
    () =>
      aliasingCheck(
        { ...SETTINGS, velocity: 1, depth: 3 } as never,
      ),
    {
      name: "TypeError",
      message:
        /^Aliasing check: unknown input 'depth': expected one of velocity, prfHz, transmitFrequencyMHz, sampleDepthCm, angleDeg, soundSpeedMps, lowerTransmitFrequencyMHz, got 3$/,
    },
  );
  assert.throws(() => aliasingCheck(null as never), {
    name: "TypeError",
    message:
      /^Aliasing check: expected 'inputs' as an object with velocity, prfHz, transmitFrequencyMHz, sampleDepthCm, angleDeg, soundSpeedMps, lowerTransmitFrequencyMHz, got null$/,
  });
  assert.throws(
    () =>
      aliasingCheck({
        ...SETTINGS,
        velocity: 1,
        lowerTransmitFrequencyMHz: 3,
      }),
    {
      name: "RangeError",
      message:
        /^Aliasing check: expected 'lowerTransmitFrequencyMHz' \(Lower transmit frequency\) < 'transmitFrequencyMHz' \(Transmit frequency\), got lowerTransmitFrequencyMHz = 3 MHz, transmitFrequencyMHz = 2 MHz$/,
    },
  );
  // A lower frequency given as undefined is the same as not given.
  const r = aliasingCheck({
    ...SETTINGS,
    velocity: 1,
    lowerTransmitFrequencyMHz: undefined,
  });
  assert.equal(r.arguments.values.lowerTransmitFrequencyMHz, undefined);
});
