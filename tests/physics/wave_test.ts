import assert from "node:assert/strict";
import {
  AXIAL_RESOLUTION,
  axialResolution,
  CYCLES_PER_PULSE,
  evaluate,
  normal,
  propagate,
  WAVELENGTH,
  wavelengthAndPeriod,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("wave calculations take and give the declared quantities", () => {
  assert.equal(wavelengthAndPeriod.outputs.wavelengthMm.quantity, WAVELENGTH);
  assert.equal(axialResolution.outputs.axialResolutionMm.quantity, AXIAL_RESOLUTION);
  // The imaging range of cycles is narrower than the quantity's, with its reason.
  const cycles = axialResolution.inputs.cyclesPerPulse;
  assert.equal(cycles.quantity, CYCLES_PER_PULSE);
  assert.deepEqual(cycles.typical, { min: 1, max: 4 });
  assert.match(cycles.narrowedBecause!, /imaging pulses/);
});

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
  // A long Doppler pulse (10 cycles) is flagged as outside the imaging range [1, 4], with the
  // reason of the narrower range.
  const longPulse = evaluate(axialResolution, { transmitFrequencyMHz: 2, cyclesPerPulse: 10 });
  assert.equal(longPulse.flags.length, 1);
  assert.equal(
    longPulse.flags[0],
    "Axial resolution: 'cyclesPerPulse' (Cycles per pulse) = 10 lies outside the typical range [1, 4] (imaging pulses are 1 to 4 cycles long; a longer (Doppler) pulse is flagged): interpret with care",
  );
});

Deno.test("a zero frequency or too short a pulse is a RangeError naming the field and range", () => {
  assert.throws(() => evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: 0 }), {
    name: "RangeError",
    message:
      /^Wavelength and period: expected 'transmitFrequencyMHz' \(Transmit frequency\) in \(0, 100\] MHz, got 0$/,
  });
  assert.throws(() => evaluate(axialResolution, { transmitFrequencyMHz: 2, cyclesPerPulse: 0.4 }), {
    name: "RangeError",
    message:
      /^Axial resolution: expected 'cyclesPerPulse' \(Cycles per pulse\) in \[0\.5, 100\], got 0\.4$/,
  });
});

Deno.test("uncertainty: 1 % on the speed of sound gives 1 % on wavelength", () => {
  // For product/quotient models the relative standard uncertainties add in quadrature (JCGM
  // 100:2008 §5.1.6): λ = c/f with u(c)/c = 1 % and f exact → u(λ)/λ = 1 % (hand check).
  const g = propagate(wavelengthAndPeriod, {
    transmitFrequencyMHz: 3,
    soundSpeedMps: normal(1540, 15.4),
  });
  const w = g.outputs.wavelengthMm;
  assert.ok(Math.abs(w.standardUncertainty / w.value - 0.01) < 1e-6);
  assert.equal(g.outputs.periodUs.standardUncertainty, 0);
});
