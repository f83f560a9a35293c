import assert from "node:assert/strict";
import { evaluate, modifiedBernoulli, simplifiedBernoulli } from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("simplified Bernoulli: 4 m/s gives 64 mmHg", () => {
  // Issue 3 / Hatle & Angelsen 1985 ch. 2: ΔP = 4v², v = 4 m/s → 64 mmHg (hand-checkable)
  assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: 4 }).outputs.gradient, 64);
  // unit conversion: 400 cm/s is the same velocity
  assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: "400 cm/s" }).outputs.gradient, 64);
  // Baumgartner 2009 (from memory): severe AS threshold 4 m/s ↔ 64 mmHg peak gradient; 5 m/s → 100
  assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: 5 }).outputs.gradient, 100);
});

Deno.test("simplified Bernoulli constant agrees with ½ρ for blood converted to mmHg", () => {
  // Physics: ΔP = ½ρv²; ρ_blood ≈ 1060 kg/m³ (common practice, no source);
  // 1 mmHg = 133.322 Pa (standard definition). ½·1060/133.322 = 3.975 mmHg per (m/s)²
  const physical = 0.5 * 1060 / 133.322;
  const g = evaluate(simplifiedBernoulli, { peakVelocity: 1 }).outputs.gradient;
  close(g, physical, 0.01 * physical, "constant within 1 %");
});

Deno.test("modified Bernoulli subtracts the proximal term", () => {
  // Baumgartner 2009 (from memory): ΔP = 4(v2² − v1²); hand check 4·(16 − 2.25) = 55 mmHg
  close(
    evaluate(modifiedBernoulli, { jetVelocity: 4, proximalVelocity: 1.5 }).outputs.gradient,
    55,
    1e-12,
  );
  // v1 = 0 reduces to the simplified form (hand-checkable)
  assert.equal(
    evaluate(modifiedBernoulli, { jetVelocity: 3, proximalVelocity: 0 }).outputs.gradient,
    36,
  );
});

Deno.test("Bernoulli rejects a negative velocity with field and range", () => {
  // Issue 3: negative velocity where a magnitude is required → RangeError naming field and range
  assert.throws(() => evaluate(simplifiedBernoulli, { peakVelocity: -1 }), {
    name: "RangeError",
    message:
      /^Simplified Bernoulli gradient: expected 'peakVelocity' \(Peak velocity\) in \[0, 10\] m\/s, got -1$/,
  });
  assert.throws(() => evaluate(modifiedBernoulli, { jetVelocity: 4, proximalVelocity: -0.5 }), {
    name: "RangeError",
    message:
      /^Modified Bernoulli gradient: expected 'proximalVelocity' \(Proximal velocity\) in \[0, 10\] m\/s, got -0.5$/,
  });
  assert.throws(() => evaluate(simplifiedBernoulli, { peakVelocity: Number.NaN }), {
    name: "RangeError",
    message:
      /^Simplified Bernoulli gradient: expected 'peakVelocity' \(Peak velocity\) in \[0, 10\] m\/s, got NaN$/,
  });
  // a pressure unit for a velocity is a TypeError
  assert.throws(() => evaluate(simplifiedBernoulli, { peakVelocity: "4 mmHg" }), {
    name: "TypeError",
    message:
      `Simplified Bernoulli gradient: expected 'peakVelocity' (Peak velocity) in [0, 10] m/s (a unit convertible to m/s), got "4 mmHg"`,
  });
});

Deno.test("modified Bernoulli refuses a proximal velocity above the jet velocity", () => {
  // Physics of a restriction (Hatle & Angelsen 1985 ch. 2): flow accelerates through it, so
  // v₁ > v₂ means swapped inputs; it would give a negative, impossible gradient
  assert.throws(() => evaluate(modifiedBernoulli, { jetVelocity: 1.5, proximalVelocity: 4 }), {
    name: "RangeError",
    message:
      "Modified Bernoulli gradient: expected 'proximalVelocity' (Proximal velocity) ≤ 'jetVelocity' (Jet velocity), got proximalVelocity = 4 m/s, jetVelocity = 1.5 m/s",
  });
});
