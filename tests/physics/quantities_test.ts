// The ultrasound quantities of calc/quantities/ultrasound.ts: declared once, listed, with ranges
// that hold the values of practice and of the physics (each check names its source).
import assert from "node:assert/strict";
import {
  ACOUSTIC_IMPEDANCE,
  ATTENUATION_COEFFICIENT,
  CYCLES_PER_PULSE,
  DEPTH,
  FOCAL_ZONES,
  inRange,
  INSONATION_ANGLE,
  INTENSITY_REFLECTED,
  MECHANICAL_INDEX,
  PARALLEL_RECEIVE_BEAMS,
  PRESSURE_REFLECTION_COEFFICIENT,
  PULSE_REPETITION_FREQUENCY,
  QUANTITIES,
  rangeWithin,
  SOUND_SPEED,
  TISSUE_ACOUSTIC_PROPERTIES,
  TRANSMIT_FREQUENCY,
  ULTRASOUND_QUANTITIES,
  WAVE_PERIOD,
  WAVELENGTH,
} from "../../mod.ts";
import * as ultrasound from "../../calc/quantities/ultrasound.ts";

Deno.test("every ultrasound quantity is listed once and found by its id", () => {
  const exported = Object.values(ultrasound).filter((v) =>
    typeof v === "object" && v !== null && (v as { kind?: string }).kind === "sonorigor.quantity"
  );
  assert.equal(exported.length, ULTRASOUND_QUANTITIES.length);
  for (const q of exported) assert.ok(ULTRASOUND_QUANTITIES.includes(q as never), String(q));
  const ids = ULTRASOUND_QUANTITIES.map((q) => q.id);
  assert.equal(new Set(ids).size, ids.length);
  for (const q of ULTRASOUND_QUANTITIES) {
    assert.equal(QUANTITIES.get(q.id), q, q.id);
    assert.ok(q.rangeNote, `${q.id} says where its ranges come from`);
    assert.ok(q.resolution > 0);
    if (q.typical) assert.ok(rangeWithin(q.typical, q.valid), q.id);
  }
});

Deno.test("ranges hold the values of practice", () => {
  const typical = (q: typeof DEPTH, v: number) => inRange(v, q.typical!);
  // Cardiac transducers 2-5 MHz, transoesophageal 5-7.5 MHz (common practice, no source).
  for (const f of [2, 2.5, 3.5, 5, 7.5]) assert.ok(typical(TRANSMIT_FREQUENCY, f), `${f} MHz`);
  // Apical views reach 16-24 cm in adults (common practice, no source).
  for (const d of [16, 24]) assert.ok(typical(DEPTH, d), `${d} cm`);
  // Pulsed-Doppler PRFs of a few kHz (common practice, no source).
  assert.ok(typical(PULSE_REPETITION_FREQUENCY, 4000));
  // Soft tissue 1540 m/s and water 1480 m/s are typical; air 330 m/s is possible but not typical
  // (Bushberg 2012 ch. 14, from memory).
  assert.ok(typical(SOUND_SPEED, TISSUE_ACOUSTIC_PROPERTIES.softTissue.soundSpeedMps));
  assert.ok(typical(SOUND_SPEED, TISSUE_ACOUSTIC_PROPERTIES.water.soundSpeedMps));
  assert.ok(inRange(330, SOUND_SPEED.valid) && !typical(SOUND_SPEED, 330));
  // Soft tissue, myocardium, fat and blood attenuation are typical (Bushberg 2012 ch. 14,
  // Culjat 2010 Table 1, from memory); water is possible but not typical.
  for (const name of ["softTissue", "myocardium", "fat", "blood"] as const) {
    assert.ok(
      typical(ATTENUATION_COEFFICIENT, TISSUE_ACOUSTIC_PROPERTIES[name].attenuationDbPerCmMHz!),
      name,
    );
  }
  assert.ok(
    !typical(ATTENUATION_COEFFICIENT, TISSUE_ACOUSTIC_PROPERTIES.water.attenuationDbPerCmMHz!),
  );
  // Soft tissue 1.62 MRayl and bone 7.8 MRayl are typical (Bushberg 2012 ch. 14, from memory).
  assert.ok(typical(ACOUSTIC_IMPEDANCE, 1.62) && typical(ACOUSTIC_IMPEDANCE, 7.8));
  // λ = c/f over 1-15 MHz at 1540 m/s: 1.54 mm down to 0.103 mm; T = 1/f: 1 µs down to
  // 0.067 µs (hand check).
  for (const f of [1, 15]) {
    assert.ok(typical(WAVELENGTH, 1540 / (f * 1000)), `λ at ${f} MHz`);
    assert.ok(typical(WAVE_PERIOD, 1 / f), `T at ${f} MHz`);
  }
  // Imaging pulses of 1-4 cycles and Doppler pulses of up to about 20 (common practice).
  assert.ok(typical(CYCLES_PER_PULSE, 2) && typical(CYCLES_PER_PULSE, 20));
  // The regulatory ceiling MI 1.9 ends the typical range (FDA Track 3, from memory).
  assert.equal(MECHANICAL_INDEX.typical!.max, 1.9);
});

Deno.test("ranges hold the physics", () => {
  // cos 90° = 0: the Doppler equation has no solution at 90° (Hatle & Angelsen 1985 ch. 2).
  assert.equal(inRange(90, INSONATION_ANGLE.valid), false);
  assert.equal(inRange(89.9, INSONATION_ANGLE.valid), true);
  // r = (Z₂ − Z₁)/(Z₂ + Z₁) with Z > 0 lies in (−1, 1); R = 100·r² in [0, 100] % (hand check
  // from the definition, Kremkau 2015 ch. 2).
  assert.deepEqual(PRESSURE_REFLECTION_COEFFICIENT.valid, { min: -1, max: 1 });
  assert.deepEqual(INTENSITY_REFLECTED.valid, { min: 0, max: 100 });
  // Counts are whole numbers of at least one.
  for (const q of [FOCAL_ZONES, PARALLEL_RECEIVE_BEAMS]) {
    assert.equal(q.integer, true, q.id);
    assert.equal(q.valid.min, 1, q.id);
  }
  // A frequency, a speed and a depth are positive: zero is outside.
  for (const q of [TRANSMIT_FREQUENCY, SOUND_SPEED, DEPTH, PULSE_REPETITION_FREQUENCY]) {
    assert.equal(inRange(0, q.valid), false, q.id);
  }
});
