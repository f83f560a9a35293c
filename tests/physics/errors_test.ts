// Bad input: clear errors naming the field and the valid range (project rules; issue 3 "Checks
// against the outside world", bad-input list).
import assert from "node:assert/strict";
import {
  aliasingCheck,
  angleCorrectedVelocity,
  evaluate,
  maximumPrfForDepth,
  mechanicalIndex,
  nyquistVelocity,
  rangeAmbiguity,
  velocityFromDopplerShift,
  wavelengthAndPeriod,
} from "../../mod.ts";

const base = { dopplerShiftHz: 3000, transmitFrequencyMHz: 2, angleDeg: 0 };

Deno.test("angle ≥ 90° is a RangeError naming the field and [0, 90)", () => {
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: 90 }), {
    name: "RangeError",
    message: /^Velocity from Doppler shift: expected 'angleDeg' in \[0, 90\) deg, got 90$/,
  });
  assert.throws(() => evaluate(angleCorrectedVelocity, { measuredVelocity: 1, angleDeg: 120 }), {
    name: "RangeError",
    message: /^Angle-corrected velocity: expected 'angleDeg' in \[0, 90\) deg, got 120$/,
  });
  // 1.6 rad = 91.67° (unit conversion before the range check).
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: "1.6 rad" }), {
    name: "RangeError",
    message: /expected 'angleDeg' in \[0, 90\) deg, got 91\.67/,
  });
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: -5 }), {
    name: "RangeError",
    message: /expected 'angleDeg' in \[0, 90\) deg, got -5$/,
  });
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: NaN }), {
    name: "RangeError",
    message: /expected 'angleDeg' in \[0, 90\) deg, got NaN$/,
  });
});

Deno.test("zero or negative frequency is a RangeError naming the field and (0, 100] MHz", () => {
  for (const f of [0, -2, "-2 MHz"]) {
    assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, transmitFrequencyMHz: f }), {
      name: "RangeError",
      message:
        /^Velocity from Doppler shift: expected 'transmitFrequencyMHz' in \(0, 100\] MHz, got -?[02]$/,
    });
  }
  assert.throws(() => evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: 0 }), {
    name: "RangeError",
    message: /^Wavelength and period: expected 'transmitFrequencyMHz' in \(0, 100\] MHz, got 0$/,
  });
  assert.throws(() => evaluate(nyquistVelocity, { prfHz: 0, transmitFrequencyMHz: 2 }), {
    name: "RangeError",
    message: /^Nyquist velocity limit: expected 'prfHz' in \(0, 1000000\] Hz, got 0$/,
  });
  assert.throws(
    () => evaluate(mechanicalIndex, { peakRarefactionalPressureMPa: 1, transmitFrequencyMHz: -1 }),
    {
      name: "RangeError",
      message: /^Mechanical index: expected 'transmitFrequencyMHz' in \(0, 100\] MHz, got -1$/,
    },
  );
});

Deno.test("a wrong unit or type is a TypeError naming the field", () => {
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { ...base, transmitFrequencyMHz: "2 cm" }),
    {
      name: "TypeError",
      message:
        /Velocity from Doppler shift: 'transmitFrequencyMHz': expected a quantity convertible to MHz, got "2 cm"/,
    },
  );
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { ...base, angleDeg: [] as unknown as number }),
    {
      name: "TypeError",
      message: /expected 'angleDeg' as a number or a quantity string, got an array/,
    },
  );
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { dopplerShiftHz: 3000, angleDeg: 0 } as never),
    { name: "TypeError", message: /missing input 'transmitFrequencyMHz'/ },
  );
});

Deno.test("negative velocity where a magnitude is required is a RangeError", () => {
  assert.throws(() => evaluate(angleCorrectedVelocity, { measuredVelocity: -1, angleDeg: 0 }), {
    name: "RangeError",
    message: /^Angle-corrected velocity: expected 'measuredVelocity' in \[0, 10\] m\/s, got -1$/,
  });
  assert.throws(
    () => aliasingCheck({ velocity: -1, prfHz: 4000, transmitFrequencyMHz: 2, sampleDepthCm: 15 }),
    {
      name: "RangeError",
      message: /^Aliasing check: expected 'velocity' in \[0, 20\] m\/s, got -1$/,
    },
  );
});

Deno.test("depth beyond what the PRF allows is a RangeError naming prfHz and the limit", () => {
  // 15 cm allows at most c/(2d) = 5133.33 Hz (hand check).
  assert.throws(
    () => aliasingCheck({ velocity: 1, prfHz: 6000, transmitFrequencyMHz: 2, sampleDepthCm: 15 }),
    {
      name: "RangeError",
      message:
        /^Aliasing check: expected 'prfHz' in \(0, 5133\.33\] Hz, the limit c\/\(2·d\) for 'sampleDepthCm' = 15 cm \(beyond it the mode is high-PRF and range-ambiguous\), got 6000$/,
    },
  );
  assert.throws(() => evaluate(maximumPrfForDepth, { depthCm: 0 }), {
    name: "RangeError",
    message: /^PRF limit for a depth: expected 'depthCm' in \(0, 50\] cm, got 0$/,
  });
  assert.throws(() => rangeAmbiguity({ sampleDepthCm: -3, prfHz: 4000, imagingDepthCm: 10 }), {
    name: "RangeError",
    message: /^Range ambiguity: expected 'sampleDepthCm' in \(0, 50\] cm, got -3$/,
  });
});

Deno.test("plain functions reject unknown keys, non-objects and a 'lower' frequency that is not lower", () => {
  assert.throws(
    () =>
      aliasingCheck(
        { velocity: 1, prfHz: 4000, transmitFrequencyMHz: 2, sampleDepthCm: 15, depth: 3 } as never,
      ),
    { name: "TypeError", message: /^Aliasing check: unknown input 'depth'/ },
  );
  assert.throws(() => aliasingCheck(null as never), {
    name: "TypeError",
    message: /^Aliasing check: expected an object of inputs, got null$/,
  });
  assert.throws(
    () =>
      aliasingCheck({
        velocity: 1,
        prfHz: 4000,
        transmitFrequencyMHz: 2,
        sampleDepthCm: 15,
        lowerTransmitFrequencyMHz: 3,
      }),
    {
      name: "RangeError",
      message:
        /^Aliasing check: expected 'lowerTransmitFrequencyMHz' in \(0, 2\) MHz \(below the current transmit frequency\), got 3$/,
    },
  );
  assert.throws(
    () =>
      aliasingCheck({
        velocity: 1,
        prfHz: 4000,
        transmitFrequencyMHz: 2,
        sampleDepthCm: 15,
        lowerTransmitFrequencyMHz: 0,
      }),
    {
      name: "RangeError",
      message: /expected 'lowerTransmitFrequencyMHz' in \(0, 100\] MHz, got 0$/,
    },
  );
});
