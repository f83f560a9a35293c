import assert from "node:assert/strict";
import {
  angleCorrectedVelocity,
  BLOOD_VELOCITY,
  CLINICAL_CAUTION,
  DEFAULT_SOUND_SPEED_MPS,
  DOPPLER_SHIFT,
  dopplerShiftFromVelocity,
  evaluate,
  INSONATION_ANGLE,
  normal,
  NYQUIST_VELOCITY,
  nyquistVelocity,
  propagate,
  rectangular,
  velocityFromDopplerShift,
} from "../../mod.ts";
import { close } from "./helpers.ts";

const base = { dopplerShiftHz: 3000, transmitFrequencyMHz: 2, angleDeg: 0 };

Deno.test("default speed of sound is the soft-tissue 1540 m/s", () => {
  // Soft-tissue c ≈ 1540 m/s (common practice; Kremkau 2015 ch. 2, from memory).
  assert.equal(DEFAULT_SOUND_SPEED_MPS, 1540);
  assert.equal(velocityFromDopplerShift.inputs.soundSpeedMps.default, 1540);
});

Deno.test("the Doppler calculations take and give the declared quantities", () => {
  assert.equal(velocityFromDopplerShift.inputs.dopplerShiftHz.quantity, DOPPLER_SHIFT);
  assert.equal(velocityFromDopplerShift.inputs.angleDeg.quantity, INSONATION_ANGLE);
  assert.equal(velocityFromDopplerShift.outputs.velocity.quantity, BLOOD_VELOCITY);
  assert.equal(dopplerShiftFromVelocity.inputs.velocity.quantity, BLOOD_VELOCITY);
  assert.equal(nyquistVelocity.outputs.nyquistVelocity.quantity, NYQUIST_VELOCITY);
  // A displayed velocity is a magnitude: its narrower range carries the reason.
  assert.match(angleCorrectedVelocity.inputs.measuredVelocity.narrowedBecause!, /magnitude/);
});

Deno.test("Doppler equation: velocity from shift, hand-checked values", () => {
  // v = c·Δf/(2·f0·cos θ) (Hatle & Angelsen 1985 ch. 2): 1540·2597.4026/(2·2e6) = 1.0000 m/s
  // (hand check from the published formula).
  const r = evaluate(velocityFromDopplerShift, {
    dopplerShiftHz: 2597.4026,
    transmitFrequencyMHz: 2,
    angleDeg: 0,
  });
  close(r.outputs.velocity, 1, 1e-8, "velocity at 0°");
  // At 60° cos θ = 0.5 exactly, so the same shift means twice the velocity (hand check).
  const at60 = evaluate(velocityFromDopplerShift, {
    dopplerShiftHz: "2.5974026 kHz",
    transmitFrequencyMHz: "2000 kHz",
    angleDeg: 60,
  });
  close(at60.outputs.velocity, 2, 1e-8, "velocity at 60°");
  // A negative shift (flow away) gives a negative velocity (sign convention of the equation).
  const away = evaluate(velocityFromDopplerShift, {
    dopplerShiftHz: -2597.4026,
    transmitFrequencyMHz: 2,
    angleDeg: 0,
  });
  close(away.outputs.velocity, -1, 1e-8, "velocity away");
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
});

Deno.test("Doppler equation: shift from velocity inverts velocity from shift", () => {
  // Δf = 2·f0·v·cos θ/c (Hatle & Angelsen 1985 ch. 2): 2·3e6·1.5·cos 30°/1540 = 5061.19 Hz
  // (hand check).
  const shift = evaluate(dopplerShiftFromVelocity, {
    velocity: 1.5,
    transmitFrequencyMHz: 3,
    angleDeg: 30,
  });
  close(shift.outputs.dopplerShiftHz, (2 * 3e6 * 1.5 * Math.sqrt(3) / 2) / 1540, 1e-9, "shift");
  close(shift.outputs.dopplerShiftHz, 5061.19, 0.01, "shift, rounded hand value");
  const back = evaluate(velocityFromDopplerShift, {
    dopplerShiftHz: shift.outputs.dopplerShiftHz,
    transmitFrequencyMHz: 3,
    angleDeg: 30,
  });
  close(back.outputs.velocity, 1.5, 1e-12, "round trip");
});

Deno.test("speed of sound is overridable", () => {
  // Same shift in a medium with c = 1570 m/s (blood, Bushberg 2012 ch. 14, from memory) reads
  // 1570/1540 higher (hand check from the Doppler equation).
  const soft = evaluate(velocityFromDopplerShift, {
    dopplerShiftHz: 3000,
    transmitFrequencyMHz: 2,
    angleDeg: 0,
  });
  const blood = evaluate(velocityFromDopplerShift, {
    dopplerShiftHz: 3000,
    transmitFrequencyMHz: 2,
    angleDeg: 0,
    soundSpeedMps: 1570,
  });
  close(blood.outputs.velocity / soft.outputs.velocity, 1570 / 1540, 1e-12, "ratio");
});

Deno.test("angle correction: cos θ error under about 6 % below 20°", () => {
  // cos θ error is under about 6 % below 20° of angle (common practice; Quiñones et al. 2002,
  // J Am Soc Echocardiogr 15:167, angle discussion, from memory).
  for (const angleDeg of [0, 5, 10, 15, 19.9]) {
    const r = evaluate(angleCorrectedVelocity, { measuredVelocity: 3, angleDeg });
    assert.ok(r.outputs.underestimationPercent < 6.03, `angle ${angleDeg}`);
    assert.equal(r.flags.length, 0);
  }
  // 1 − cos 20° = 0.060307 (hand check); 1 − cos 60° = 0.5 exactly.
  const at20 = evaluate(angleCorrectedVelocity, { measuredVelocity: 4, angleDeg: 20 });
  close(at20.outputs.underestimationPercent, 6.0307, 1e-4, "20°");
  const at60 = evaluate(angleCorrectedVelocity, { measuredVelocity: 2, angleDeg: 60 });
  close(at60.outputs.underestimationPercent, 50, 1e-9, "60°");
  close(at60.outputs.trueVelocity, 4, 1e-12, "60° true velocity");
  // 60° is outside the usual ≤ 20° practice: flagged, not rejected (common practice).
  assert.equal(at60.flags.length, 1);
  assert.equal(
    at60.flags[0],
    "Angle-corrected velocity: 'angleDeg' (Insonation angle) = 60° lies outside the typical range [0, 20]°: interpret with care",
  );
  // θ = 0 leaves the velocity unchanged.
  const at0 = evaluate(angleCorrectedVelocity, { measuredVelocity: 2.5, angleDeg: 0 });
  assert.equal(at0.outputs.trueVelocity, 2.5);
  assert.equal(at0.outputs.underestimationPercent, 0);
});

Deno.test("angle correction refuses a corrected velocity no blood can reach", () => {
  // 8 m/s read at 80°: 8/cos 80° = 46 m/s, beyond the blood-velocity range [−20, 20] m/s
  // (hand check): an impossible output is an error naming the inputs, not a number.
  assert.throws(() => evaluate(angleCorrectedVelocity, { measuredVelocity: 8, angleDeg: 80 }), {
    name: "RangeError",
    message:
      /^Angle-corrected velocity: output 'trueVelocity' \(Angle-corrected velocity\) expected in \[-20, 20\] m\/s, got 46\.0\d* from measuredVelocity = 8 m\/s, angleDeg = 80°$/,
  });
});

Deno.test("Nyquist limit: hand value and falls with transmit frequency at the same PRF", () => {
  // v_N = (PRF/2)·c/(2·f0·cos θ) (Hatle & Angelsen 1985 ch. 2): 5 kHz, 2 MHz → 0.9625 m/s
  // (hand check).
  const at2 = evaluate(nyquistVelocity, { prfHz: "5 kHz", transmitFrequencyMHz: 2 });
  close(at2.outputs.nyquistVelocity, 0.9625, 1e-12, "2 MHz");
  assert.equal(at2.outputs.nyquistShiftHz, 2500);
  // Higher transmit frequency lowers the Nyquist velocity at the same PRF (common practice).
  let previous = Infinity;
  for (const f of [1.5, 2, 2.5, 3.5, 5, 7.5]) {
    const v = evaluate(nyquistVelocity, { prfHz: 5000, transmitFrequencyMHz: f }).outputs
      .nyquistVelocity;
    assert.ok(v < previous, `Nyquist at ${f} MHz`);
    previous = v;
  }
  // Halving f0 doubles the limit (inverse proportionality, hand check).
  const at1 = evaluate(nyquistVelocity, { prfHz: 5000, transmitFrequencyMHz: 1 });
  close(at1.outputs.nyquistVelocity, 2 * at2.outputs.nyquistVelocity, 1e-12, "1 MHz");
});

Deno.test("uncertainty: a 2 % shift uncertainty gives 2 % on velocity (GUM and Monte Carlo)", () => {
  // For a model v = Δf·const, the relative standard uncertainties are equal (JCGM 100:2008
  // §5.1.6, product/quotient form; hand check).
  const inputs = {
    dopplerShiftHz: normal(5000, 100),
    transmitFrequencyMHz: 2,
    angleDeg: 0,
  };
  const g = propagate(velocityFromDopplerShift, inputs);
  const v = g.outputs.velocity;
  close(v.standardUncertainty / v.value, 0.02, 1e-6, "GUM relative u");
  const m = propagate(velocityFromDopplerShift, inputs, {
    method: "monteCarlo",
    trials: 20000,
    seed: 7,
  });
  close(m.outputs.velocity.standardUncertainty / v.value, 0.02, 0.0008, "MC relative u");
});

Deno.test("uncertainty: angle uniform on [0, 20°] biases the true velocity by E[1/cos θ]", () => {
  // E[1/cos θ] for θ ~ U(0, a) is ln(sec a + tan a)/a (integral of sec, standard calculus
  // table): a = 20° → 1.020949 (hand check).
  const a = (20 * Math.PI) / 180;
  const expected = Math.log(1 / Math.cos(a) + Math.tan(a)) / a;
  close(expected, 1.020949, 1e-6, "analytic mean");
  const m = propagate(angleCorrectedVelocity, {
    measuredVelocity: 1,
    angleDeg: rectangular(0, 20),
  }, { method: "monteCarlo", trials: 100000, seed: 11 });
  // Monte Carlo standard error ≈ 0.017/√1e5 ≈ 5e-5; allow 4e-4.
  close(m.outputs.trueVelocity.value, expected, 4e-4, "MC mean");
  // The GUM first-order law at θ = 0 would see zero sensitivity to the angle (∂/∂θ of 1/cos θ
  // vanishes at 0): its uncertainty is zero while Monte Carlo's is not.
  const g = propagate(angleCorrectedVelocity, { measuredVelocity: 1, angleDeg: normal(0, 5) });
  close(g.outputs.trueVelocity.standardUncertainty, 0, 1e-6, "GUM at θ = 0");
  // ... and the zero sensitivity is flagged rather than reported as certainty.
  assert.ok(
    g.warnings.some((w) =>
      /First-order propagation is inadequate for Angle-corrected velocity with respect to Insonation angle/
        .test(w)
    ),
  );
  assert.equal(g.outputs.trueVelocity.firstOrderAdequate, false);
  assert.ok(m.outputs.trueVelocity.standardUncertainty > 0.01);
});

// Bad input: clear errors naming the field, its label, the valid range and the value (project
// rules, bad-input list); messages from the one validator.

Deno.test("angle ≥ 90° is a RangeError naming the field and [0, 90)", () => {
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: 90 }), {
    name: "RangeError",
    message:
      /^Velocity from Doppler shift: expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got 90$/,
  });
  assert.throws(() => evaluate(angleCorrectedVelocity, { measuredVelocity: 1, angleDeg: 120 }), {
    name: "RangeError",
    message:
      /^Angle-corrected velocity: expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got 120$/,
  });
  // 1.6 rad = 91.67° (unit conversion before the range check).
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: "1.6 rad" }), {
    name: "RangeError",
    message: /expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got "1\.6 rad" \(91\.67/,
  });
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: -5 }), {
    name: "RangeError",
    message: /expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got -5$/,
  });
  assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, angleDeg: NaN }), {
    name: "RangeError",
    message: /expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got NaN$/,
  });
});

Deno.test("zero or negative frequency is a RangeError naming the field and (0, 100] MHz", () => {
  for (const f of [0, -2]) {
    assert.throws(() => evaluate(velocityFromDopplerShift, { ...base, transmitFrequencyMHz: f }), {
      name: "RangeError",
      message:
        /^Velocity from Doppler shift: expected 'transmitFrequencyMHz' \(Transmit frequency\) in \(0, 100\] MHz, got -?[02]$/,
    });
  }
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { ...base, transmitFrequencyMHz: "-2 MHz" }),
    {
      name: "RangeError",
      message:
        /^Velocity from Doppler shift: expected 'transmitFrequencyMHz' \(Transmit frequency\) in \(0, 100\] MHz, got "-2 MHz" \(-2 MHz\)$/,
    },
  );
  assert.throws(() => evaluate(nyquistVelocity, { prfHz: 0, transmitFrequencyMHz: 2 }), {
    name: "RangeError",
    message:
      /^Nyquist velocity limit: expected 'prfHz' \(Pulse repetition frequency\) in \(0, 1000000\] Hz, got 0$/,
  });
});

Deno.test("a wrong unit or type, or a missing input, is a TypeError naming the field and range", () => {
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { ...base, transmitFrequencyMHz: "2 cm" }),
    {
      name: "TypeError",
      message:
        /^Velocity from Doppler shift: expected 'transmitFrequencyMHz' \(Transmit frequency\) in \(0, 100\] MHz \(a unit convertible to MHz\), got "2 cm"$/,
    },
  );
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { ...base, angleDeg: [] as unknown as number }),
    {
      name: "TypeError",
      message:
        /^Velocity from Doppler shift: expected 'angleDeg' \(Insonation angle\) as a number or a quantity in \[0, 90\)°, got an array$/,
    },
  );
  assert.throws(
    () => evaluate(velocityFromDopplerShift, { dopplerShiftHz: 3000, angleDeg: 0 } as never),
    {
      name: "TypeError",
      message:
        /^Velocity from Doppler shift: missing input 'transmitFrequencyMHz' \(Transmit frequency\): expected a value in \(0, 100\] MHz, got nothing$/,
    },
  );
});

Deno.test("negative velocity where a magnitude is required is a RangeError", () => {
  assert.throws(() => evaluate(angleCorrectedVelocity, { measuredVelocity: -1, angleDeg: 0 }), {
    name: "RangeError",
    message:
      /^Angle-corrected velocity: expected 'measuredVelocity' \(Displayed velocity\) in \[0, 10\] m\/s, got -1$/,
  });
});
