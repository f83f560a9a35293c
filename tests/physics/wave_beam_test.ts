import assert from "node:assert/strict";
import {
  axialResolution,
  evaluate,
  gum,
  lateralResolution,
  nearFieldLength,
  normal,
  wavelengthAndPeriod,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

Deno.test("wavelength ≈ 0.77 mm at 2 MHz and ≈ 0.13 mm at 12 MHz in soft tissue", () => {
  // λ ≈ 0.77 mm at 2 MHz and ≈ 0.13 mm at 12 MHz (common practice; Kremkau 2015 ch. 2).
  const at2 = evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: 2 });
  close(at2.outputs.wavelengthMm, 0.77, 0.005, "2 MHz");
  const at12 = evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: "12 MHz" });
  close(at12.outputs.wavelengthMm, 0.13, 0.005, "12 MHz");
  // Period = 1/f: 0.5 µs at 2 MHz (hand check from T = 1/f).
  assert.equal(at2.outputs.periodUs, 0.5);
  // λ = c/f: in water (c = 1480 m/s, Bushberg 2012 ch. 14, from memory) at 1 MHz λ = 1.48 mm.
  const water = evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: 1, soundSpeedMps: 1480 });
  close(water.outputs.wavelengthMm, 1.48, 1e-12, "water");
});

Deno.test("structures closer than about one wavelength are not resolved axially", () => {
  // Axial resolution = SPL/2 = n·λ/2 (Kremkau 2015 ch. 3). With the shortest practical imaging
  // pulse of 2-3 cycles the resolution is about one wavelength or more (common practice:
  // "structures closer than about one wavelength are not resolved").
  for (const f of [2, 3.5, 5, 12]) {
    const lambda = evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: f }).outputs.wavelengthMm;
    const r = evaluate(axialResolution, { transmitFrequencyMHz: f, cyclesPerPulse: 2 });
    close(r.outputs.axialResolutionMm, lambda, 1e-12, `${f} MHz, 2 cycles`);
    const r3 = evaluate(axialResolution, { transmitFrequencyMHz: f, cyclesPerPulse: 3 });
    assert.ok(r3.outputs.axialResolutionMm > lambda);
  }
});

Deno.test("axial resolution: textbook worked numbers", () => {
  // 3 cycles at 2 MHz: SPL = 3·0.77 = 2.31 mm, axial resolution 1.155 mm, pulse duration 1.5 µs
  // (hand check from SPL = n·λ, Kremkau 2015 ch. 2).
  const r = evaluate(axialResolution, { transmitFrequencyMHz: 2, cyclesPerPulse: 3 });
  close(r.outputs.spatialPulseLengthMm, 2.31, 1e-12, "SPL");
  close(r.outputs.axialResolutionMm, 1.155, 1e-12, "axial");
  close(r.outputs.pulseDurationUs, 1.5, 1e-12, "duration");
  // A long Doppler pulse (10 cycles) is flagged as outside the imaging range [1, 4].
  const longPulse = evaluate(axialResolution, { transmitFrequencyMHz: 2, cyclesPerPulse: 10 });
  assert.equal(longPulse.flags.length, 1);
});

/** Root of sinc²(u) = 1/2 on (0, 1) by bisection, sinc(u) = sin(πu)/(πu): the half-power point of
 * the one-way intensity of a uniform line aperture (Fraunhofer diffraction, standard result). */
function sincSquaredHalfPower(): number {
  let lo = 0.1, hi = 0.9;
  const f = (u: number) => (Math.sin(Math.PI * u) / (Math.PI * u)) ** 2 - 0.5;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

Deno.test("lateral resolution matches the diffraction width of a line aperture", () => {
  // Pulse-echo −6 dB width of a uniform line aperture at the focus = 2·u½·λ·F/D, where sinc²(u½)
  // = 1/2 (Szabo 2014 ch. 6, Fraunhofer pattern of a rectangular aperture; computed here
  // independently by bisection: u½ = 0.44295).
  const u = sincSquaredHalfPower();
  close(u, 0.44295, 1e-5, "sinc² half-power root");
  const r = evaluate(lateralResolution, {
    transmitFrequencyMHz: 3.5,
    apertureMm: 20,
    focalDepthCm: 10,
  });
  const lambda = 1540 / 3.5e3;
  assert.equal(r.outputs.fNumber, 5);
  close(r.outputs.beamWidthMm, 2 * u * lambda * 5, 2e-4, "beam width");
  // Rule of thumb "lateral resolution ≈ λ × F-number" (common practice) agrees within 15 %.
  assert.ok(Math.abs(r.outputs.beamWidthMm / (lambda * 5) - 1) < 0.15);
  // Higher frequency → narrower beam (common practice).
  const r7 = evaluate(lateralResolution, {
    transmitFrequencyMHz: 7,
    apertureMm: 20,
    focalDepthCm: 10,
  });
  close(r7.outputs.beamWidthMm, r.outputs.beamWidthMm / 2, 1e-12, "halves at double frequency");
});

Deno.test("near-field length D²/(4λ) and far-field divergence", () => {
  // N = D²/(4λ) (Kremkau 2015 ch. 3): 10 mm disc at 5 MHz → 100/(4·0.308) mm = 8.117 cm
  // (hand check).
  const r = evaluate(nearFieldLength, { transmitFrequencyMHz: 5, apertureMm: 10 });
  close(r.outputs.nearFieldLengthCm, 8.117, 1e-3, "near field");
  // sin θ = 1.22·λ/D (first zero of the Airy pattern; 1.22 = 3.8317/π, the first zero of J1
  // divided by π, standard table of Bessel zeros): 1.22·0.308/10 → 2.154°.
  close(
    r.outputs.divergenceHalfAngleDeg,
    (Math.asin(0.037576) * 180) / Math.PI,
    1e-3,
    "divergence",
  );
  close(3.8317 / Math.PI, 1.22, 0.0005, "Airy constant");
  // Larger aperture or higher frequency → longer near field and less divergence (common
  // practice, Kremkau 2015 ch. 3).
  const bigger = evaluate(nearFieldLength, { transmitFrequencyMHz: 5, apertureMm: 20 });
  close(bigger.outputs.nearFieldLengthCm, 4 * r.outputs.nearFieldLengthCm, 1e-12, "∝ D²");
  assert.ok(bigger.outputs.divergenceHalfAngleDeg < r.outputs.divergenceHalfAngleDeg);
  const higher = evaluate(nearFieldLength, { transmitFrequencyMHz: 10, apertureMm: 10 });
  close(higher.outputs.nearFieldLengthCm, 2 * r.outputs.nearFieldLengthCm, 1e-12, "∝ f");
});

Deno.test("an aperture smaller than 1.22 wavelengths has no far-field lobe: a clear error", () => {
  // 1.22·λ > D → asin undefined (diffraction: no first zero), reported instead of NaN.
  assert.throws(
    () => evaluate(nearFieldLength, { transmitFrequencyMHz: 1, apertureMm: 1 }),
    {
      name: "RangeError",
      message:
        /Near-field length and far-field divergence: output 'divergenceHalfAngleDeg' is not finite for transmitFrequencyMHz = 1, apertureMm = 1, soundSpeedMps = 1540, got NaN/,
    },
  );
});

Deno.test("uncertainty: 1 % on the speed of sound gives 1 % on wavelength and beam width", () => {
  // For product/quotient models the relative standard uncertainties add in quadrature (JCGM
  // 100:2008 §5.1.6): λ = c/f with u(c)/c = 1 % and f exact → u(λ)/λ = 1 % (hand check).
  const g = gum(wavelengthAndPeriod, {
    transmitFrequencyMHz: 3,
    soundSpeedMps: normal(1540, 15.4),
  });
  const w = g.outputs.wavelengthMm;
  assert.ok(Math.abs(w.standardUncertainty / w.value - 0.01) < 1e-6);
  assert.equal(g.outputs.periodUs.standardUncertainty, 0);
  // Beam width = 0.886·c·z/(f·D): 1 % on c and 2 % on D → √(1² + 2²) = 2.236 % (hand check).
  const b = gum(lateralResolution, {
    transmitFrequencyMHz: 3,
    apertureMm: normal(20, 0.4),
    focalDepthCm: 8,
    soundSpeedMps: normal(1540, 15.4),
  }).outputs.beamWidthMm;
  assert.ok(Math.abs(b.standardUncertainty / b.value - Math.sqrt(5) / 100) < 1e-4);
});
