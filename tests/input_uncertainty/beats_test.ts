import assert from "node:assert/strict";
import {
  LVOT_VTI,
  normal,
  PEAK_VELOCITY,
  propagate,
  repeatedBeats,
  simplifiedBernoulli,
} from "../../mod.ts";
import { close, shownText } from "./helpers.ts";

Deno.test("repeated beats: Type A mean, s/√n and ν = n − 1", () => {
  const readings = Object.freeze([4.1, "430 cm/s", 4.2]);
  const b = repeatedBeats(PEAK_VELOCITY, readings);
  // mean 4.2, s = 0.1 m/s (hand arithmetic), u = 0.1/√3 = 0.0577 m/s, ν = 2 (JCGM 100 §4.2)
  assert.deepEqual(b.readings, [4.1, 4.3, 4.2]);
  close(b.mean, 4.2, 1e-12, "mean");
  close(b.standardDeviation, 0.1, 1e-12, "s");
  close(b.standardUncertainty, 0.1 / Math.sqrt(3), 1e-12, "u");
  assert.equal(b.beats, 3);
  assert.equal(b.dof, 2);
  // t₀.₉₇₅(2) = 4.303 (Student t table, e.g. JCGM 100:2008 Table G.2 for 95 %: 4.30)
  close(b.coverageFactor95, 4.303, 1e-3, "k");
  assert.equal(b.input.kind, "studentT");
  assert.equal(b.input.dof, 2);
  close(Number(b.input.value), 4.2, 1e-12, "input value");
  // five VTIs: ν = 4, t₀.₉₇₅(4) = 2.776 (Student t table), and no warning
  const five = repeatedBeats(LVOT_VTI, [21, 22, 20, 23, 22]);
  close(five.coverageFactor95, 2.776, 1e-3, "k(4)");
  assert.deepEqual(five.warnings, []);
});

Deno.test("repeated beats: ν ≤ 2 warns in the model's notes and in the engine's Monte Carlo result", () => {
  for (const readings of [[4.1, 4.3], [4.1, 4.3, 4.2]]) {
    const b = repeatedBeats(PEAK_VELOCITY, readings);
    // JCGM 101:2008 §6.4.9.4: the t distribution's variance is infinite for ν ≤ 2
    assert.match(
      b.warnings[0]!,
      new RegExp(`Only ${readings.length} beats \\(ν = ${readings.length - 1}\\)`),
    );
    assert.match(b.warnings[0]!, /infinite variance/);
    assert.match(shownText(b), /Warning: Only/);
    const mc = propagate(simplifiedBernoulli, { peakVelocity: b.input }, {
      method: "monteCarlo",
      trials: 10_000,
      seed: 1,
    });
    assert.ok(mc.warnings.some((w) => /infinite for ν ≤ 2/.test(w)), mc.warnings.join("\n"));
  }
  const four = repeatedBeats(PEAK_VELOCITY, [4.1, 4.3, 4.2, 4.2]);
  assert.deepEqual(four.warnings, []);
  const mc = propagate(simplifiedBernoulli, { peakVelocity: four.input }, {
    method: "monteCarlo",
    trials: 10_000,
    seed: 1,
  });
  assert.ok(!mc.warnings.some((w) => /infinite/.test(w)));
  // GUM: u(4v²) = 8·v·u(v) (JCGM 100 eq. (10), hand-checkable)
  const gum = propagate(simplifiedBernoulli, { peakVelocity: four.input });
  close(
    gum.outputs.gradient.standardUncertainty,
    8 * four.mean * four.standardUncertainty,
    1e-6,
    "u",
  );
  close(gum.outputs.gradient.effectiveDof!, 3, 1e-9, "ν_eff = ν of the only source");
  // a normal input is unaffected (control)
  assert.equal(propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }).warnings.length, 0);
});

Deno.test("repeated beats: bad readings name the reading, the value and the range", () => {
  assert.throws(() => repeatedBeats(PEAK_VELOCITY, [4]), {
    name: "RangeError",
    message:
      "Repeated beats: expected 'readings' at least 2 readings (one per beat) for a Type A evaluation, got 1 reading",
  });
  assert.throws(() => repeatedBeats(PEAK_VELOCITY, [4, "abc"]), {
    name: "TypeError",
    message:
      `Repeated beats: expected 'readings[1]' (Peak velocity) as a number or a quantity in [0, 10] m/s, got "abc"`,
  });
  assert.throws(() => repeatedBeats(PEAK_VELOCITY, [4, -1]), {
    name: "RangeError",
    message: "Repeated beats: expected 'readings[1]' (Peak velocity) in [0, 10] m/s, got -1",
  });
  assert.throws(() => repeatedBeats(PEAK_VELOCITY, 4 as never), {
    name: "TypeError",
    message:
      "Repeated beats: expected 'readings' as an array of Peak velocity readings, one per beat, got 4",
  });
  assert.throws(() => repeatedBeats(PEAK_VELOCITY, [4, NaN]), RangeError);
});

Deno.test("repeated beats: the display rounds by the GUM rule (u to two digits, the mean alike)", () => {
  const b = repeatedBeats(PEAK_VELOCITY, [4.1, 4.3, 4.0, 4.2, 4.25]);
  // hand arithmetic: mean 4.17, s = √(0.058/4) = 0.1204, u = s/√5 = 0.0539 m/s; GUM (JCGM
  // 100:2008 §7.2.6): u to two significant digits, 0.054, the mean to the same place, 4.170
  const text = shownText(b);
  assert.match(text, /\b4\.170\s+0\.12\s+0\.054\b/, text);
});

Deno.test("repeated beats: a quantity that is not a quantity is a clear error naming it", () => {
  assert.throws(() => repeatedBeats([4.1, 4.3] as never, [4.1, 4.3]), {
    name: "TypeError",
    message: /^Repeated beats: expected 'quantity' as a quantity/,
  });
});
