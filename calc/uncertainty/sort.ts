/**
 * Ascending sort of float64 values by least-significant-digit radix sort (Knuth, TAOCP vol. 3,
 * §5.2.5): four stable counting passes over 16-bit digits of an order-preserving transform of the
 * IEEE 754 bit pattern (sign bit flipped for non-negative values, all bits flipped for negative
 * ones). Same order as `Float64Array.prototype.sort` for values without NaN (−0 before +0), in
 * O(n) instead of O(n log n): about 2.5 times faster on the 50,000-value tails of a 10⁶-trial run
 * (bench/analysis.md). Checked against `Float64Array.prototype.sort` by property test
 * (tests/uncertainty/sort_test.ts).
 *
 * Internal: not exported from the package.
 *
 * @module
 */

/** Below this length the built-in sort is faster than four counting passes. */
const RADIX_MIN_LENGTH = 2048;

/** Sorts `values` (no NaN) ascending in place and returns it. */
export function sortFloat64(values: Float64Array): Float64Array {
  const n = values.length;
  if (n < RADIX_MIN_LENGTH) return values.sort();
  // keys as 32-bit halves: little-endian, word 2i is the low half, 2i + 1 the high half
  const words = new Uint32Array(values.buffer, values.byteOffset, 2 * n);
  const keys = new Uint32Array(2 * n);
  for (let i = 0; i < n; i++) {
    const lo = words[2 * i]!, hi = words[2 * i + 1]!;
    if (hi & 0x80000000) {
      keys[2 * i] = ~lo >>> 0;
      keys[2 * i + 1] = ~hi >>> 0;
    } else {
      keys[2 * i] = lo;
      keys[2 * i + 1] = (hi | 0x80000000) >>> 0;
    }
  }
  let source = keys, target = new Uint32Array(2 * n);
  const counts = new Uint32Array(65536);
  for (let pass = 0; pass < 4; pass++) {
    const word = pass >> 1, shift = (pass & 1) * 16;
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[(source[2 * i + word]! >>> shift) & 0xffff]!++;
    let total = 0;
    for (let d = 0; d < 65536; d++) {
      const c = counts[d]!;
      counts[d] = total;
      total += c;
    }
    for (let i = 0; i < n; i++) {
      const j = counts[(source[2 * i + word]! >>> shift) & 0xffff]!++;
      target[2 * j] = source[2 * i]!;
      target[2 * j + 1] = source[2 * i + 1]!;
    }
    [source, target] = [target, source];
  }
  // back from keys to values
  for (let i = 0; i < n; i++) {
    const lo = source[2 * i]!, hi = source[2 * i + 1]!;
    if (hi & 0x80000000) {
      words[2 * i] = lo;
      words[2 * i + 1] = (hi & 0x7fffffff) >>> 0;
    } else {
      words[2 * i] = ~lo >>> 0;
      words[2 * i + 1] = ~hi >>> 0;
    }
  }
  return values;
}
