import assert from "node:assert/strict";
import fc from "fast-check";
import {
  arcsine,
  exact,
  expressionModel,
  normal,
  propagate,
  rectangular,
  rectangularHalfWidth,
  roundForReport,
  triangular,
  typeA,
} from "../../mod.ts";

const wide = { min: -1e6, max: 1e6 };
const twoInputs = expressionModel({
  expression: "a + 2 * b",
  inputs: {
    a: { unit: "mm", description: "a", range: wide },
    b: { unit: "mm", description: "b", range: wide },
  },
  output: { name: "y", unit: "mm", description: "y" },
});

Deno.test("standard uncertainties of the Type B shapes (JCGM 100:2008 §4.3.7, §4.3.9; JCGM 101 §6.4.6)", () => {
  const u = (input: Parameters<typeof propagate>[1][string]) =>
    propagate(twoInputs, { a: input!, b: 0 }).inputs.a.standardUncertainty;
  assert.ok(Math.abs(u(rectangular(-1, 1)) - 1 / Math.sqrt(3)) < 1e-15); // a/√3, §4.3.7
  assert.ok(Math.abs(u(rectangularHalfWidth(5, 1)) - 1 / Math.sqrt(3)) < 1e-15);
  assert.ok(Math.abs(u(triangular(-1, 1)) - 1 / Math.sqrt(6)) < 1e-15); // a/√6, §4.3.9
  assert.ok(Math.abs(u(arcsine(-1, 1)) - 1 / Math.sqrt(2)) < 1e-15); // a/√2, JCGM 101 §6.4.6.3
  assert.equal(u(exact(3)), 0);
  assert.equal(u(normal("1 cm", "0.5 mm")), 0.5); // unit conversion into the canonical mm
});

Deno.test("Type A: mean, s/√n and ν = n − 1 (JCGM 100:2008 §4.2, eq. (3)–(5))", () => {
  // JCGM 100:2008 H.2 Table H.2 voltages: V̄ = 4.9990 V, s(V̄) = 0.0032 V
  const v = typeA([5.007, 4.994, 5.005, 4.990, 4.999]);
  assert.equal(Number(v.value).toFixed(4), "4.9990");
  assert.equal(Number(v.standardUncertainty).toFixed(4), "0.0032");
  assert.equal(v.dof, 4);
});

Deno.test("bad input to propagation: negative u, NaN, unknown and missing names, wrong unit, coverage", () => {
  assert.throws(() => propagate(twoInputs, { a: normal(1, -0.1), b: 0 }), {
    name: "RangeError",
    message: "Expression model: a + 2 * b: expected the standard uncertainty of 'a' >= 0, got -0.1",
  });
  assert.throws(() => propagate(twoInputs, { a: normal(NaN, 0.1), b: 0 }), {
    name: "RangeError",
    message: /expected 'a' in \[-1000000, 1000000\] mm, got NaN/,
  });
  assert.throws(() => propagate(twoInputs, { a: normal(1, Infinity), b: 0 }), {
    name: "RangeError",
    message: /expected the standard uncertainty of 'a' as a finite number, got Infinity/,
  });
  assert.throws(() => propagate(twoInputs, { a: 1, b: 0, c: 2 } as never), {
    name: "TypeError",
    message: /unknown input 'c': expected one of a, b, got 2/,
  });
  assert.throws(() => propagate(twoInputs, { a: 1 }), {
    name: "TypeError",
    message: /missing input 'b': expected a value in \[-1000000, 1000000\] mm, got nothing/,
  });
  assert.throws(() => propagate(twoInputs, { a: normal("1 mmHg", 0.1), b: 0 }), {
    name: "TypeError",
    message: /expected 'a' in \[-1000000, 1000000\] mm \(a unit convertible to mm\), got "1 mmHg"/,
  });
  for (const coverage of [0, 1, 1.5, NaN]) {
    assert.throws(() => propagate(twoInputs, { a: 1, b: 0 }, { coverage }), {
      name: "RangeError",
      message:
        `Expression model: a + 2 * b: expected coverage probability in (0, 1), got ${coverage}`,
    });
  }
  assert.throws(() => propagate(twoInputs, { a: rectangular(2, 1), b: 0 }), {
    name: "RangeError",
    message: /expected the upper bound of 'a' >= the lower bound 2, got 1/,
  });
  assert.throws(() => typeA([1]), {
    name: "RangeError",
    message: "Type A input: expected at least 2 readings, got 1",
  });
  assert.throws(() => propagate(twoInputs, { a: 1, b: 0 }, { method: "monteCarlo", trials: 10 }), {
    name: "RangeError",
    message: /expected at least 1\/\(1 − p\) = 20 trials for coverage 0.95, got 10/,
  });
  assert.throws(() => propagate(twoInputs, { a: 1, b: 0 }, { method: "monteCarlo", seed: 0 }), {
    name: "RangeError",
    message: /expected a seed that is an integer in \[1, 2\^32 - 1\], got 0/,
  });
});

Deno.test("bad correlations: not symmetric, not unit diagonal, out of range, not PSD, non-normal in MC", () => {
  const three = expressionModel({
    expression: "a + b + c",
    inputs: {
      a: { unit: "1", description: "a", range: wide },
      b: { unit: "1", description: "b", range: wide },
      c: { unit: "1", description: "c", range: wide },
    },
    output: { name: "y", unit: "1", description: "y" },
  });
  const inputs = { a: normal(0, 1), b: normal(0, 1), c: normal(0, 1) };
  assert.throws(() => propagate(three, inputs, { correlations: [["a", "b", 1.2]] }), {
    name: "RangeError",
    message: /expected correlation of 'a' and 'b' in \[-1, 1\], got 1.2/,
  });
  assert.throws(() => propagate(three, inputs, { correlations: [["a", "z", 0.2]] }), {
    name: "TypeError",
    message: /unknown input 'z' in correlations/,
  });
  const names = ["a", "b", "c"];
  assert.throws(
    () =>
      propagate(three, inputs, {
        correlations: { names, matrix: [[1, 0.5, 0], [0.4, 1, 0], [0, 0, 1]] },
      }),
    {
      name: "RangeError",
      message: /expected a symmetric correlation matrix/,
    },
  );
  assert.throws(
    () =>
      propagate(three, inputs, {
        correlations: { names, matrix: [[2, 0, 0], [0, 1, 0], [0, 0, 1]] },
      }),
    {
      name: "RangeError",
      message: /expected a unit diagonal, got 2 for 'a'/,
    },
  );
  // r(a,b) = r(b,c) = 0.9, r(a,c) = −0.9 has a negative eigenvalue (hand-checkable determinant < 0)
  assert.throws(
    () =>
      propagate(three, inputs, {
        correlations: [["a", "b", 0.9], ["b", "c", 0.9], ["a", "c", -0.9]],
      }),
    { name: "RangeError", message: /expected a positive semi-definite correlation matrix/ },
  );
  // perfectly correlated inputs are semi-definite and allowed: u(a + b) = 2 when r = 1
  const g = propagate(three, { ...inputs, c: 0 }, { correlations: [["a", "b", 1]] });
  assert.ok(Math.abs(g.outputs.y.standardUncertainty - 2) < 1e-12);
  // an exact input cannot be correlated: it has no distribution
  assert.throws(
    () =>
      propagate(three, { a: rectangular(0, 1), b: 2, c: 0 }, {
        method: "monteCarlo",
        correlations: [["a", "b", 0.5]],
        trials: 100,
      }),
    { name: "TypeError", message: /'b'/ },
  );
});

Deno.test("correlated Monte Carlo reproduces the GUM covariance for a linear model", () => {
  const inputs = { a: normal(1, 0.2), b: normal(2, 0.1) };
  const correlations = [["a", "b", -0.6]] as const;
  const g = propagate(twoInputs, inputs, { correlations });
  const m = propagate(twoInputs, inputs, {
    method: "monteCarlo",
    correlations,
    trials: 200_000,
    seed: 4,
  });
  // u² = 0.2² + 4·0.1² + 2·2·(−0.6)·0.2·0.1 = 0.032 (JCGM 100 eq. (13), hand-checkable)
  assert.ok(Math.abs(g.outputs.y.standardUncertainty ** 2 - 0.032) < 1e-12);
  assert.ok(Math.abs(m.outputs.y.standardUncertainty / g.outputs.y.standardUncertainty - 1) < 0.01);
});

Deno.test("property: for linear models GUM and Monte Carlo agree within Monte Carlo tolerance", () => {
  fc.assert(
    fc.property(
      fc.double({ min: -5, max: 5, noNaN: true }),
      fc.double({ min: 0.01, max: 3, noNaN: true }),
      fc.double({ min: 0.01, max: 3, noNaN: true }),
      fc.integer({ min: 1, max: 2 ** 31 }),
      (a, ua, ub, seed) => {
        const inputs = { a: normal(a, ua), b: rectangularHalfWidth(1, ub) };
        const g = propagate(twoInputs, inputs).outputs.y;
        const m =
          propagate(twoInputs, inputs, { method: "monteCarlo", trials: 40_000, seed }).outputs.y;
        // relative standard error of an SD estimate at M = 4·10⁴ is ≈ 1/√(2M) ≈ 0.0035; allow 5 %
        return Math.abs(m.standardUncertainty / g.standardUncertainty - 1) < 0.05 &&
          Math.abs(m.value - g.value) < 5 * g.standardUncertainty / Math.sqrt(40_000);
      },
    ),
    { numRuns: 15, seed: 42 },
  );
});

Deno.test("property: an exact input contributes nothing; scaling an input's u scales its contribution", () => {
  fc.assert(
    fc.property(
      fc.double({ min: -100, max: 100, noNaN: true }),
      fc.double({ min: 0.001, max: 10, noNaN: true }),
      fc.double({ min: 0.1, max: 10, noNaN: true }),
      (x, u, scale) => {
        const base = propagate(twoInputs, { a: normal(x, u), b: exact(x) }).outputs.y;
        const scaled = propagate(twoInputs, { a: normal(x, u * scale), b: exact(x) }).outputs.y;
        // an exact input is no source of uncertainty: no row in the budget
        return !base.budget.some((r) => r.source === "b") && base.budget.length === 1 &&
          Math.abs(scaled.budget[0]!.contribution / base.budget[0]!.contribution - scale) <
            1e-9 * scale;
      },
    ),
    { numRuns: 100, seed: 7 },
  );
});

Deno.test("rounding per JCGM 100:2008 §7.2.6 keeps two significant digits of the uncertainty", () => {
  // §7.2.6: u_c = 0.35 mg style; estimate rounded to the same place
  assert.deepEqual(roundForReport(0.84217, 0.1287), { value: "0.84", uncertainty: "0.13" });
  assert.deepEqual(roundForReport(64.3, 5.2), { value: "64.3", uncertainty: "5.2" });
  assert.deepEqual(roundForReport(1234.5, 96), { value: "1235", uncertainty: "96" }); // half rounds up
});
