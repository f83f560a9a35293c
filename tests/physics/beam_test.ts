import assert from "node:assert/strict";
import {
  APERTURE,
  BEAM_WIDTH,
  evaluate,
  lateralResolution,
  nearFieldLength,
  normal,
  propagate,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("beam calculations take and give the declared quantities", () => {
  assert.equal(lateralResolution.inputs.apertureMm.quantity, APERTURE);
  assert.equal(nearFieldLength.inputs.apertureMm.quantity, APERTURE);
  assert.equal(lateralResolution.outputs.beamWidthMm.quantity, BEAM_WIDTH);
  assert.equal(lateralResolution.outputs.beamWidthMm.label, "Lateral resolution at the focus");
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
  // 1.22·λ ≥ D → sin θ = 1.22·λ/D ≥ 1: the Airy pattern has no first zero (Kremkau 2015 ch. 3;
  // Szabo 2014 ch. 6), so there is no divergence half-angle: refused, naming the inputs whose
  // combination is impossible, instead of an asin of a number above 1.
  const message = (f: number, d: number) =>
    `Near-field length and far-field divergence: expected 'apertureMm' (Aperture diameter) > ` +
    `1.22 wavelengths (1.22·'soundSpeedMps' (Speed of sound)/'transmitFrequencyMHz' ` +
    `(Transmit frequency)), the smallest disc with a far-field main ` +
    `lobe, got transmitFrequencyMHz = ${f} MHz, apertureMm = ${d} mm, soundSpeedMps = 1540 m/s`;
  assert.throws(
    () => evaluate(nearFieldLength, { transmitFrequencyMHz: 1, apertureMm: 1 }),
    { name: "RangeError", message: message(1, 1) },
  );
  // 0.049 MHz lies inside the frequency's valid range (0, 100] MHz, but λ = 1540/49 000 m =
  // 31.4 mm, so a 10 mm disc is 0.32 wavelengths across (hand check): refused the same way
  assert.throws(
    () => evaluate(nearFieldLength, { transmitFrequencyMHz: 0.049, apertureMm: 10 }),
    { name: "RangeError", message: message(0.049, 10) },
  );
  // just above the limit the divergence exists and is close to 90° (hand check: sin θ → 1)
  const lambdaMm = 1540 / 1e3; // 1 MHz
  const r = evaluate(nearFieldLength, {
    transmitFrequencyMHz: 1,
    apertureMm: 1.22 * lambdaMm * 1.001,
  });
  assert.ok(r.outputs.divergenceHalfAngleDeg > 85 && r.outputs.divergenceHalfAngleDeg < 90);
});

Deno.test("a zero aperture is a RangeError naming the field and range", () => {
  assert.throws(
    () => evaluate(lateralResolution, { transmitFrequencyMHz: 3, apertureMm: 0, focalDepthCm: 8 }),
    {
      name: "RangeError",
      message:
        /^Lateral resolution at the focus: expected 'apertureMm' \(Aperture width\) in \(0, 200\] mm, got 0$/,
    },
  );
});

Deno.test("uncertainty: 1 % on c and 2 % on D give √5 % on the beam width", () => {
  // Beam width = 0.886·c·z/(f·D): 1 % on c and 2 % on D → √(1² + 2²) = 2.236 % (JCGM
  // 100:2008 §5.1.6, product/quotient form; hand check).
  const b = propagate(lateralResolution, {
    transmitFrequencyMHz: 3,
    apertureMm: normal(20, 0.4),
    focalDepthCm: 8,
    soundSpeedMps: normal(1540, 15.4),
  }).outputs.beamWidthMm;
  assert.ok(Math.abs(b.standardUncertainty / b.value - Math.sqrt(5) / 100) < 1e-4);
});
