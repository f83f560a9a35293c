import assert from "node:assert/strict";
import {
  formatCount,
  formatInterval,
  formatNumber,
  formatPlusMinus,
  formatResolution,
  formatShare,
  roundForReport,
  roundLike,
} from "../../mod.ts";

Deno.test("rounding for reports follows JCGM 100:2008 §7.2.6 and its examples", () => {
  // §7.2.6: "if y = 10.057 62 Ω with u_c(y) = 27 mΩ, y should be rounded to 10.058 Ω"
  assert.deepEqual(roundForReport(10.05762, 0.027), { value: "10.058", uncertainty: "0.027" });
  // §7.2.6: "u(x_i) = 28.05 kHz should be rounded down to 28 kHz"
  assert.equal(roundForReport(1000, 28.05).uncertainty, "28");
  // §7.2.6: u_c = 10.47 mΩ to two significant digits is 10 mΩ (rounded to the nearest digit; the
  // GUM allows rounding up to 11 mΩ in a final report)
  assert.equal(roundForReport(5, 0.01047).uncertainty, "0.010");
  // §7.2.2: m_S = 100.021 47 g with u_c = 0.35 mg keeps all five decimals
  assert.deepEqual(roundForReport(100.02147, 0.00035), {
    value: "100.02147",
    uncertainty: "0.00035",
  });
  // one significant digit on request; a value and an uncertainty above 1 round to units or tens
  assert.deepEqual(roundForReport(1234.5, 56.7, 1), { value: "1230", uncertainty: "60" });
  assert.equal(roundLike(0.612345, 0.0473), "0.612");
  assert.equal(formatPlusMinus(64.04, 5.01, "mmHg"), "64.0 ± 5.0 mmHg");
  assert.equal(formatInterval({ lower: 59.213, upper: 69.347 }, 2.6, "mmHg"), "[59.2, 69.3] mmHg");
});

Deno.test("without an uncertainty: the quantity's resolution, counts as integers, missing as words", () => {
  // common practice, no source: a display resolution of 0.1 cm shows one decimal
  assert.equal(formatResolution(2.05, 0.1), "2.1");
  assert.equal(formatResolution(2, 0.1), "2.0");
  assert.equal(formatResolution(63.4, 1), "63");
  assert.equal(formatCount(1_010_000), "1010000");
  assert.equal(formatNumber(Number.NaN), "not measured");
  assert.equal(formatShare(0.4289), "42.9 %");
  assert.equal(roundLike(Number.NaN, 1), "not measured");
});
