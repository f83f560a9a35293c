import assert from "node:assert/strict";
import {
  BSA_METHODS,
  bsaBoyd,
  bsaCalculation,
  bsaDuBois,
  bsaGehanGeorge,
  bsaHaycock,
  bsaMosteller,
  evaluate,
  normal,
  propagate,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

Deno.test("BSA formulas at 180 cm, 80 kg match the published formulas", () => {
  const args = { heightCm: 180, weightKg: 80 };
  // Mosteller RD, N Engl J Med 1987;317:1098: √(180·80/3600) = √4 = 2.00 m² exactly (hand-checkable)
  assert.equal(evaluate(bsaMosteller, args).outputs.bsaM2, 2);
  // DuBois D, DuBois EF, Arch Intern Med 1916;17:863: 0.007184·80^0.425·180^0.725 = 1.99642 m²
  // (hand computation of the published formula; commonly quoted as ≈ 2.00 m²)
  close(evaluate(bsaDuBois, args).outputs.bsaM2, 1.99642, 1e-5, "DuBois");
  // Haycock GB et al., J Pediatr 1978;93:62: 0.024265·80^0.5378·180^0.3964 = 2.00656 m² (hand computation)
  close(evaluate(bsaHaycock, args).outputs.bsaM2, 2.00656, 1e-5, "Haycock");
  // Gehan EA, George SL, Cancer Chemother Rep 1970;54:225: 0.0235·80^0.51456·180^0.42246 = 2.00948 m²
  // (hand computation; ≈ 2.01 m², not 2.02)
  close(evaluate(bsaGehanGeorge, args).outputs.bsaM2, 2.00948, 1e-5, "Gehan & George");
  // Boyd E 1935: 0.0003207·180^0.3·80000^(0.7285 − 0.0188·log10 80000) = 2.00736 m², weight in grams
  // (hand computation of the published formula)
  close(evaluate(bsaBoyd, args).outputs.bsaM2, 2.00736, 1e-5, "Boyd");
});

Deno.test("BSA formulas in a newborn (50 cm, 3.5 kg) agree with hand computation", () => {
  const args = { heightCm: 50, weightKg: 3.5 };
  // Mosteller: √(50·3.5/3600) = √0.048611 = 0.220479 m² (hand computation)
  close(evaluate(bsaMosteller, args).outputs.bsaM2, 0.220479, 1e-6, "Mosteller newborn");
  // Haycock: 0.024265·3.5^0.5378·50^0.3964 = 0.224415 m² (hand computation)
  close(evaluate(bsaHaycock, args).outputs.bsaM2, 0.224415, 1e-6, "Haycock newborn");
  // Boyd with weight in grams: 0.0003207·50^0.3·3500^(0.7285 − 0.0188·log10 3500) = 0.229883 m²
  // (hand computation; using kilograms instead would give a value off by orders of magnitude)
  close(evaluate(bsaBoyd, args).outputs.bsaM2, 0.229883, 1e-6, "Boyd newborn");
});

Deno.test("BSA accepts unit strings and rejects the wrong dimension", () => {
  // 1.8 m = 180 cm and 80000 g = 80 kg → Mosteller 2 m² (Mosteller 1987, hand-checkable)
  close(
    evaluate(bsaMosteller, { heightCm: "1.8 m", weightKg: "80000 g" }).outputs.bsaM2,
    2,
    1e-12,
    "units",
  );
  assert.throws(() => evaluate(bsaMosteller, { heightCm: "180 kg", weightKg: 80 }), {
    name: "TypeError",
    message:
      `Body surface area (Mosteller): expected 'heightCm' (Height) in [15, 280] cm (a unit convertible to cm), got "180 kg"`,
  });
});

Deno.test("BSA rejects heights and weights outside the human range, naming field, range and value", () => {
  assert.throws(() => evaluate(bsaHaycock, { heightCm: 400, weightKg: 80 }), {
    name: "RangeError",
    message: "Body surface area (Haycock): expected 'heightCm' (Height) in [15, 280] cm, got 400",
  });
  assert.throws(() => evaluate(bsaDuBois, { heightCm: 170, weightKg: -3 }), {
    name: "RangeError",
    message:
      "Body surface area (DuBois & DuBois): expected 'weightKg' (Weight) in [0.2, 650] kg, got -3",
  });
  assert.throws(() => evaluate(bsaMosteller, { heightCm: NaN, weightKg: 70 }), {
    name: "RangeError",
    message: /expected 'heightCm' \(Height\) in \[15, 280\] cm, got NaN$/,
  });
  assert.throws(() => bsaCalculation("metric" as never), {
    name: "TypeError",
    message: /expected a method in mosteller, duBois, haycock, gehanGeorge, boyd, got "metric"$/,
  });
});

Deno.test("BSA flags body sizes outside the typical range without failing", () => {
  const r = evaluate(bsaMosteller, { heightCm: 230, weightKg: 80 });
  // typical range is a project choice (common practice, no source): 45–220 cm
  assert.equal(r.flags.length, 1);
  assert.equal(
    r.flags[0],
    "Body surface area (Mosteller): 'heightCm' (Height) = 230 cm lies outside the typical range [45, 220] cm (the range the BSA formulas were fitted on, term newborn to very tall adult): interpret with care",
  );
  assert.ok(r.cautions.some((c) => c.startsWith("Not a diagnosis")));
});

Deno.test("every BSA method is one calculation object reused by name", () => {
  for (const [name, calc] of Object.entries(BSA_METHODS)) {
    assert.equal(bsaCalculation(name as keyof typeof BSA_METHODS), calc);
    assert.equal(calc.clinical, true);
  }
});

Deno.test("BSA uncertainty by GUM matches the power-law formula of JCGM 100 eq. (12)", () => {
  // DuBois BSA = c·W^0.425·H^0.725: (u/BSA)² = (0.425·0.5/80)² + (0.725·1/180)²
  // = (0.00265625)² + (0.00402778)² → u/BSA = 0.0048249 (hand computation, JCGM 100:2008 eq. (12))
  const body = { heightCm: normal(180, 1), weightKg: normal(80, 0.5) };
  const bsa = propagate(bsaDuBois, body).outputs.bsaM2;
  close(bsa.standardUncertainty / bsa.value, 0.0048249, 2e-6, "relative u DuBois");
  // Mosteller: u/BSA = ½·√((1/180)² + (0.5/80)²) = 0.0041818 (hand computation, eq. (12))
  const m = propagate(bsaMosteller, body);
  close(m.outputs.bsaM2.standardUncertainty, 2 * 0.0041818, 2e-6, "Mosteller u");
  assert.throws(() => propagate(bsaMosteller, { heightCm: normal(180, -1), weightKg: 80 }), {
    name: "RangeError",
    message:
      "Body surface area (Mosteller): expected the standard uncertainty of 'heightCm' (Height) >= 0, got -1",
  });
});
