/**
 * Partial derivatives of a calculation's outputs: exact when the calculation supplies them
 * (expression models), otherwise central finite differences with Richardson extrapolation.
 *
 * @module
 */
import type { Calculation, InputValues } from "../core/types.ts";

/** Step for differentiating with respect to an input with estimate x and uncertainty u. */
export function stepFor(x: number, u: number, fraction: number): number {
  return u > 0 ? u * fraction : Math.max(Math.abs(x), 1) * 1e-4;
}

type Evaluator = (x: Record<string, number>) => number;

function evaluator(calc: Calculation, output: string): Evaluator {
  return (x) => (calc.formula(x as InputValues<string>) as Record<string, number>)[output]!;
}

function shifted(x: Record<string, number>, name: string, delta: number): Record<string, number> {
  return { ...x, [name]: x[name]! + delta };
}

/** First derivative of g along `name` by Richardson-extrapolated central differences, falling back
 * to one-sided differences where the formula is not finite on one side. */
function firstDerivative(g: Evaluator, x: Record<string, number>, name: string, h: number): number {
  const central = (s: number) => (g(shifted(x, name, s)) - g(shifted(x, name, -s))) / (2 * s);
  const d1 = central(h);
  const d2 = central(h / 2);
  const r = (4 * d2 - d1) / 3;
  if (Number.isFinite(r)) return r;
  for (const sign of [1, -1]) {
    const f0 = g(x);
    const one = (s: number) => (g(shifted(x, name, sign * s)) - f0) / (sign * s);
    const e = 2 * one(h / 2) - one(h);
    if (Number.isFinite(e)) return e;
  }
  return NaN;
}

/**
 * The partial derivative ∂ⁿ output / ∂wrt[0]…∂wrt[n−1] at `x`: exact when the calculation
 * supplies `partial`, otherwise nested finite differences with steps `steps[name]`.
 */
export function partialDerivative(
  calc: Calculation,
  output: string,
  wrt: readonly string[],
  x: Record<string, number>,
  steps: Record<string, number>,
): number {
  if (calc.partial) return calc.partial(output, wrt)(x as InputValues<string>);
  let g = evaluator(calc, output);
  for (let k = wrt.length - 1; k >= 1; k--) {
    const inner = g;
    const name = wrt[k]!;
    g = (y) => firstDerivative(inner, y, name, steps[name]!);
  }
  return firstDerivative(g, x, wrt[0]!, steps[wrt[0]!]!);
}
