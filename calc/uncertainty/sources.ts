/**
 * Elementary sources of uncertainty and the linear parts built on them: keys that identify a
 * source across the steps of a chain, sets of sources merged from several values (with a clear
 * error when one key means two different measurements), variances and covariances of linear
 * parts (JCGM 100:2008 eq. (13) and (F.2)), budgets and Welch–Satterthwaite degrees of freedom.
 *
 * @module
 */
import type { BudgetRow, Source, SourceSet } from "./types.ts";
import { withUnit } from "../core/text.ts";

/** A set with no sources: the sources of an exact value. */
export const NO_SOURCES: SourceSet = Object.freeze({
  sources: new Map(),
  correlations: new Map(),
  samples: new Map(),
});

/**
 * The key of the source created for input `name` in a propagation labelled `label`: the name
 * itself, or "label/name".
 *
 * @example
 * ```ts
 * import { sourceKey } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(sourceKey(undefined, "heightCm"), "heightCm");
 * assert.equal(sourceKey("P07", "heightCm"), "P07/heightCm");
 * ```
 */
export function sourceKey(label: string | undefined, name: string): string {
  return label === undefined || label === "" ? name : `${label}/${name}`;
}

/** The key of a pair of sources in a correlation map (order-free). */
export function pairKey(a: string, b: string): string {
  return a < b ? `${a}\u0000${b}` : `${b}\u0000${a}`;
}

const FNV_OFFSET = 0xcbf29ce484222325n;
const FNV_PRIME = 0x100000001b3n;
const MASK_64 = (1n << 64n) - 1n;

/**
 * Two 32-bit words from a source key (64-bit FNV-1a of its UTF-8 bytes; Fowler, Noll and Vo): the
 * part of a Monte Carlo stream key that names the source, so that a source's draws depend on its
 * key only and adding a source never shifts another's.
 *
 * @example
 * ```ts
 * import { keyWords } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // FNV-1a 64 of "a" is 0xaf63dc4c8601ec8c (reference value of the FNV test suite)
 * assert.deepEqual(keyWords("a"), [0xaf63dc4c, 0x8601ec8c]);
 * ```
 */
export function keyWords(key: string): [number, number] {
  let h = FNV_OFFSET;
  for (const byte of new TextEncoder().encode(key)) {
    h ^= BigInt(byte);
    h = (h * FNV_PRIME) & MASK_64;
  }
  return [Number(h >> 32n), Number(h & 0xffffffffn)];
}

function sameDistribution(a: Source, b: Source): boolean {
  const x = a.distribution, y = b.distribution;
  return a.unit === b.unit && x.kind === y.kind && x.estimate === y.estimate &&
    x.standardUncertainty === y.standardUncertainty && x.dof === y.dof && x.lower === y.lower &&
    x.upper === y.upper && x.mode === y.mode;
}

function describeSource(s: Source): string {
  const d = s.distribution;
  return `${d.kind} ${withUnit(String(d.estimate), s.unit)}, u = ${
    withUnit(String(d.standardUncertainty), s.unit)
  }`;
}

/**
 * The union of several source sets. The same key in two sets must be the same measurement (same
 * distribution, same correlations); otherwise two different measurements were given one name.
 *
 * @param sets The sets to merge.
 * @param where Who merges (the calculation title), for the message.
 * @returns The merged set.
 * @throws {TypeError} Naming the key and both definitions when they differ, and how to tell the
 * two apart (a `label` for one of the propagations).
 *
 * @example
 * ```ts
 * import { mergeSources, normal, propagate, bsaMosteller } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const a = propagate(bsaMosteller, { heightCm: normal(180, 1), weightKg: normal(80, 1) });
 * const b = propagate(bsaMosteller, { heightCm: normal(170, 1), weightKg: normal(80, 1) });
 * assert.throws(() => mergeSources([a.outputs.bsaM2.sources, b.outputs.bsaM2.sources], "Demo"), TypeError);
 * ```
 */
export function mergeSources(sets: readonly SourceSet[], where: string): SourceSet {
  const nonEmpty = sets.filter((s) => s.sources.size > 0);
  if (nonEmpty.length === 0) return NO_SOURCES;
  if (nonEmpty.length === 1) return nonEmpty[0]!;
  const sources = new Map<string, Source>();
  const correlations = new Map<string, number>();
  const samples = new Map<string, Float64Array>();
  for (const set of nonEmpty) {
    for (const [key, s] of set.sources) {
      const known = sources.get(key);
      if (known === undefined) sources.set(key, s);
      else if (known !== s && !sameDistribution(known, s)) {
        throw new TypeError(
          `${where}: the source '${key}' is given twice with different values (${
            describeSource(known)
          } and ${
            describeSource(s)
          }); expected one measurement per name: give one of the propagations a distinct 'label'`,
        );
      }
    }
    for (const [pair, rho] of set.correlations) {
      const known = correlations.get(pair);
      if (known !== undefined && known !== rho) {
        throw new TypeError(
          `${where}: the correlation of '${
            pair.replace("\u0000", "' and '")
          }' is declared twice with different values, got ${known} and ${rho}`,
        );
      }
      correlations.set(pair, rho);
    }
    for (const [key, draws] of set.samples) {
      const known = samples.get(key);
      if (known !== undefined && known !== draws) {
        throw new TypeError(
          `${where}: the source '${key}' was drawn in two different Monte Carlo runs; expected one run per chain (pass the earlier step's input value to the later step)`,
        );
      }
      samples.set(key, draws);
    }
  }
  return Object.freeze({ sources, correlations, samples });
}

/** The correlation coefficient of two sources of a set (1 with itself, 0 when none declared). */
export function sourceCorrelation(set: SourceSet, a: string, b: string): number {
  if (a === b) return 1;
  return set.correlations.get(pairKey(a, b)) ?? 0;
}

/** The standard uncertainty of a source of a set. */
function uOf(set: SourceSet, key: string): number {
  return set.sources.get(key)?.distribution.standardUncertainty ?? 0;
}

/**
 * The covariance of two linear parts over the sources of a set: Σᵢ Σⱼ aᵢ bⱼ u(xᵢ) u(xⱼ) r(xᵢ, xⱼ)
 * (JCGM 100:2008 eq. (F.2)); with a = b the variance of eq. (13).
 *
 * @example
 * ```ts
 * import { linearCovariance, normal, propagate, bsaMosteller } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(bsaMosteller, { heightCm: normal(180, 1), weightKg: normal(80, 1) });
 * const bsa = r.outputs.bsaM2;
 * const v = linearCovariance(bsa.sources, bsa.sensitivities, bsa.sensitivities);
 * assert.ok(Math.abs(Math.sqrt(v) - bsa.standardUncertainty) < 1e-15);
 * ```
 */
export function linearCovariance(
  set: SourceSet,
  a: ReadonlyMap<string, number>,
  b: ReadonlyMap<string, number>,
): number {
  let s = 0;
  if (set.correlations.size === 0) {
    // independent sources: only the terms i = j, in the same order (no pair keys to build)
    for (const [ka, ca] of a) {
      const ua = uOf(set, ka);
      const cb = b.get(ka);
      if (ca === 0 || ua === 0 || cb === undefined || cb === 0) continue;
      s += ca * cb * ua * ua;
    }
    return s;
  }
  for (const [ka, ca] of a) {
    const ua = uOf(set, ka);
    if (ca === 0 || ua === 0) continue;
    for (const [kb, cb] of b) {
      const r = sourceCorrelation(set, ka, kb);
      if (r === 0 || cb === 0) continue;
      s += ca * cb * ua * uOf(set, kb) * r;
    }
  }
  return s;
}

/**
 * The budget of a linear part: one row per source with its estimate, u, ν, sensitivity,
 * contribution cᵢ·u(xᵢ) and share cᵢ²u²(xᵢ)/u²(y), largest share first.
 */
export function budgetOf(
  set: SourceSet,
  linear: ReadonlyMap<string, number>,
  variance: number,
): BudgetRow[] {
  const rows: BudgetRow[] = [];
  for (const [key, c] of linear) {
    const s = set.sources.get(key);
    if (s === undefined) continue;
    const d = s.distribution;
    const contribution = c * d.standardUncertainty;
    rows.push({
      source: key,
      label: s.label,
      unit: s.unit,
      distribution: d.kind,
      estimate: d.estimate,
      standardUncertainty: d.standardUncertainty,
      dof: d.dof,
      sensitivity: c,
      contribution,
      share: variance > 0 ? contribution ** 2 / variance : 0,
    });
  }
  return rows;
}

/**
 * Welch–Satterthwaite effective degrees of freedom over the sources of a linear part,
 * ν_eff = u⁴(y) / Σ (cᵢu(xᵢ))⁴/νᵢ (JCGM 100:2008 eq. (G.2b)). Not defined when sources with
 * finite degrees of freedom are correlated with others: then `dof` is null and `reason` says why.
 *
 * @example
 * ```ts
 * import { normal, propagate, typeA, continuityValveArea, welchSatterthwaite } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(continuityValveArea, {
 *   lvotDiameterCm: 2, lvotVtiCm: typeA([20, 21, 22]), avVtiCm: 80,
 * });
 * const ava = r.outputs.avaCm2;
 * // one source with ν = 2: ν_eff = 2
 * const dof = welchSatterthwaite(ava.sources, ava.sensitivities, ava.standardUncertainty ** 2).dof!;
 * assert.ok(Math.abs(dof - 2) < 1e-12);
 * ```
 */
export function welchSatterthwaite(
  set: SourceSet,
  linear: ReadonlyMap<string, number>,
  variance: number,
): { dof: number | null; reason: string | null } {
  let denominator = 0;
  const finite: string[] = [];
  for (const [key, c] of linear) {
    const s = set.sources.get(key);
    if (s === undefined) continue;
    const d = s.distribution;
    const term = (c * d.standardUncertainty) ** 4;
    if (term > 0 && Number.isFinite(d.dof)) {
      denominator += term / d.dof;
      finite.push(key);
    }
  }
  for (const key of set.correlations.size === 0 ? [] : finite) {
    for (const other of linear.keys()) {
      if (other !== key && sourceCorrelation(set, key, other) !== 0) {
        return {
          dof: null,
          reason:
            `the Welch–Satterthwaite formula (JCGM 100:2008 eq. (G.2b)) assumes independent sources, but '${key}', which has finite degrees of freedom, is correlated with '${other}'`,
        };
      }
    }
  }
  return { dof: denominator > 0 ? variance ** 2 / denominator : Infinity, reason: null };
}
