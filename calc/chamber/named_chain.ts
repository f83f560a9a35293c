/**
 * Chains with renamed steps under the input and output names their type promises: the core
 * `chain` types a two-step chain without renames exactly, but a chain with renames is typed with
 * plain strings. This checks the chain's names against the declared ones when the module loads,
 * so the typed export cannot drift from what the chain computes.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { chain, type ChainOptions, type ChainStep } from "../core/chain.ts";

function sameNames(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((name, i) => name === b[i]);
}

/**
 * A chain of `steps` (see `chain`) whose inputs and outputs are exactly `names`, in order.
 *
 * @param names The chain's input names and the outputs it keeps, in order.
 * @param steps The steps, with renames.
 * @param options Identifier, title and description of the chain.
 * @returns The chain, typed by its names.
 * @throws {TypeError} When the chain's inputs or outputs are not the declared ones.
 *
 * @example
 * ```ts
 * import { namedChain } from "./named_chain.ts";
 * import { bsaMosteller, evaluate, indexedToBsa, LV_MASS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = namedChain(
 *   { inputs: ["heightCm", "weightKg", "massG"], outputs: ["indexGPerM2"] },
 *   [bsaMosteller, {
 *     calculation: indexedToBsa(LV_MASS),
 *     inputs: { lvMass: "massG" },
 *     outputs: { lvMassIndex: "indexGPerM2" },
 *   }],
 *   { id: "demoIndex" },
 * );
 * // Mosteller √(180·80/3600) = 2 m²; 190 g / 2 m² = 95 g/m² (hand-checkable)
 * assert.equal(evaluate(c, { heightCm: 180, weightKg: 80, massG: 190 }).outputs.indexGPerM2, 95);
 * ```
 */
export function namedChain<I extends string, O extends string>(
  names: { readonly inputs: readonly I[]; readonly outputs: readonly O[] },
  steps: readonly ChainStep[],
  options: ChainOptions,
): Calculation<I, O> {
  const c = chain(steps, { ...options, outputs: names.outputs });
  if (!sameNames(c.inputNames, names.inputs)) {
    throw new TypeError(
      `Chain '${c.title}': expected the inputs ${names.inputs.join(", ")}, got ${
        c.inputNames.join(", ")
      }`,
    );
  }
  return c as unknown as Calculation<I, O>;
}
