import assert from "node:assert/strict";
import { unit as mathUnit } from "mathjs";
import {
  AORTIC_VTI,
  AT_TRUE_SOUND_SPEED,
  atTrueSoundSpeed,
  atTrueSoundSpeedChain,
  bsaMosteller,
  CATALOG,
  CHAMBER_AREA,
  continuityValveArea,
  createMonteCarloPool,
  ejectionFraction,
  evaluate,
  fingerprint,
  FLOW_QUANTITIES,
  HEIGHT,
  LV_END_DIASTOLIC_VOLUME,
  LV_MASS,
  lvMassLinear,
  LVOT_DIAMETER,
  LVOT_VTI,
  normal,
  PEAK_VELOCITY,
  propagate,
  rebuild,
  simplifiedBernoulli,
  SOUND_SPEED,
  soundSpeedPower,
  soundSpeedScale,
  STRUCTURE_QUANTITIES,
  TISSUE_ACOUSTIC_PROPERTIES,
  trueSoundSpeedScale,
  type UncertainValue,
} from "../../mod.ts";
import { close, shownText } from "./helpers.ts";

/** The share and relative contribution of the scale's source in a GUM output. */
function scaleRow(v: UncertainValue, scale: UncertainValue) {
  const key = scale.budget[0]!.source;
  const row = v.budget.find((b) => b.source === key)!;
  return { share: row.share, relative: Math.abs(row.contribution) / v.value };
}

Deno.test("sound-speed scale: s = c_true/1540 (the scanner's assumption)", () => {
  // 1540 m/s assumed for soft tissue (Kremkau 2015 ch. 2); s = 1560/1540 (hand arithmetic)
  const s = evaluate(soundSpeedScale, { trueSoundSpeedMps: 1560 }).outputs.soundSpeedScale;
  close(s, 1560 / 1540, 1e-15, "blood");
  close(
    evaluate(soundSpeedScale, { trueSoundSpeedMps: 1480, assumedSoundSpeedMps: 1480 }).outputs
      .soundSpeedScale,
    1,
    1e-15,
    "a water phantom on a scanner set to water",
  );
});

Deno.test("sound-speed power: 1 for distances and velocities (VTI too), 2 for areas, 3 for volumes", () => {
  // the range equation d = c·t/2 and the Doppler equation v ∝ c (Kremkau 2015 ch. 2 and 5)
  assert.equal(soundSpeedPower(LVOT_DIAMETER), 1);
  assert.equal(soundSpeedPower(PEAK_VELOCITY), 1);
  assert.equal(soundSpeedPower(LVOT_VTI), 1);
  assert.equal(soundSpeedPower(CHAMBER_AREA), 2);
  assert.equal(soundSpeedPower(LV_END_DIASTOLIC_VOLUME), 3);
  // the power is the length exponent of the unit, as the mathjs unit engine (a general-purpose
  // reference library) reads it, for every echo quantity of the package
  for (const q of [...STRUCTURE_QUANTITIES, ...FLOW_QUANTITIES]) {
    let dims: number[] | null = null;
    try {
      dims = (mathUnit(1, q.unit) as unknown as { dimensions: number[] }).dimensions;
    } catch {
      dims = null; // "%", "1", "bpm": not units of a length
    }
    let k: number | null = null;
    try {
      k = soundSpeedPower(q);
    } catch {
      k = null;
    }
    if (k !== null) {
      assert.deepEqual([dims![0], dims![1]], [0, k], `${q.id} in ${q.unit}`);
    } else if (dims !== null && !q.unit.includes("/m^2")) {
      // every measured quantity with a length in its unit (and no mass) is rescaled; indexed
      // quantities divide by BSA, which is not read from echoes
      assert.ok(dims[0] !== 0 || dims[1] === 0, `${q.id} in ${q.unit} should be rescaled`);
    }
  }
  assert.throws(() => soundSpeedPower(LV_MASS), {
    name: "TypeError",
    message:
      "At the true speed of sound: expected 'quantity' a distance, velocity, area or volume read from echoes (mm, cm, m/s, cm/s, m/s^2, cm^2, mL, mL/s, L/min), got LV mass in g",
  });
  assert.throws(() => soundSpeedPower(HEIGHT), TypeError);
  assert.throws(() => soundSpeedPower(SOUND_SPEED), TypeError);
});

Deno.test("atTrueSoundSpeed: one member per quantity, registered and made again from its data", () => {
  const member = atTrueSoundSpeed(CHAMBER_AREA);
  // 30 cm² at s = 1.02: 30·1.02² = 31.212 cm² (hand arithmetic)
  const r = evaluate(member, { chamberArea: 30, soundSpeedScale: 1.02 });
  close(r.outputs.chamberAreaAtTrueSoundSpeed!, 31.212, 1e-12, "area × s²");
  assert.equal(AT_TRUE_SOUND_SPEED.calculation(CHAMBER_AREA), member);
  assert.equal(CATALOG.families.get("atTrueSoundSpeed"), AT_TRUE_SOUND_SPEED);
  const again = rebuild(CATALOG, structuredClone(member.recipe));
  assert.equal(again, member);
  assert.equal(fingerprint(again), fingerprint(member));
  assert.equal(CATALOG.calculations.get("soundSpeedScale"), soundSpeedScale);
  assert.throws(() => AT_TRUE_SOUND_SPEED.fromData("nope"), {
    name: "TypeError",
    message:
      `At the true speed of sound: expected 'quantity' the id of a quantity the package declares, got "nope"`,
  });
});

Deno.test("trueSoundSpeedScale: rectangular between blood and myocardium, one source labelled from memory", () => {
  const s = trueSoundSpeedScale();
  const { blood, myocardium } = TISSUE_ACOUSTIC_PROPERTIES;
  // rectangular on [1560, 1576] m/s: mean 1568, u = 16/√12 (JCGM 100 §4.3.7), over 1540
  close(s.value, (blood.soundSpeedMps + myocardium.soundSpeedMps) / 2 / 1540, 1e-12, "value");
  close(s.standardUncertainty, 16 / Math.sqrt(12) / 1540, 1e-12, "u(s)");
  assert.equal(s.budget.length, 1);
  assert.match(s.budget[0]!.label, /1560–1576 m\/s .*from memory.*: True speed of sound$/);
  // the mark reaches what a notebook shows with the number
  assert.match(shownText(s), /from memory/);
  const own = trueSoundSpeedScale({ trueSoundSpeed: normal(1570, 10), source: "phantom study" });
  close(own.value, 1570 / 1540, 1e-12, "own value");
  close(own.standardUncertainty, 10 / 1540, 1e-12, "own u");
  assert.equal(own.budget[0]!.label, "True speed of sound (phantom study): True speed of sound");
  assert.throws(() => trueSoundSpeedScale({ tissues: ["blood"] }), {
    name: "RangeError",
    message:
      "True speed-of-sound scale: expected 'tissues' tissues of at least two different speeds, or your own trueSoundSpeed, got blood (1560 m/s)",
  });
  assert.throws(() => trueSoundSpeedScale({ tissues: ["liver" as never] }), TypeError);
});

Deno.test("the shared scale cancels in EF and enters the gradient as s², LV mass as about s³, AVA as s²", () => {
  const s = trueSoundSpeedScale();
  const ur = s.standardUncertainty / s.value;
  // EF = 100·(EDV − ESV)/EDV is unchanged when both volumes are multiplied by s³
  const ef = propagate(atTrueSoundSpeedChain(ejectionFraction), {
    endDiastolicVolumeMl: normal(150, 5),
    endSystolicVolumeMl: normal(60, 4),
    soundSpeedScale: s,
  });
  assert.ok(scaleRow(ef.outputs.ejectionFractionPercent, s).share < 1e-15, "EF: no scale share");
  close(ef.outputs.ejectionFractionPercent.value, 60, 1e-9, "EF = 100·90/150");
  // stroke volume = EDV − ESV scales as s³: relative contribution 3·u_r(s)
  close(scaleRow(ef.outputs.strokeVolumeMl, s).relative, 3 * ur, 1e-7, "SV: 3·u_r(s)");
  // gradient 4(v·s)²: relative contribution 2·u_r(s) (JCGM 100 eq. (10), hand-checkable)
  const g = propagate(atTrueSoundSpeedChain(simplifiedBernoulli), {
    peakVelocity: normal(4, 0.1),
    soundSpeedScale: s,
  });
  close(scaleRow(g.outputs.gradient, s).relative, 2 * ur, 1e-7, "gradient: 2·u_r(s)");
  // AVA = π d²/4 · VTI_LVOT/VTI_AV: s²·s/s = s²
  const a = propagate(atTrueSoundSpeedChain(continuityValveArea), {
    lvotDiameterCm: 2,
    lvotVtiCm: 20,
    avVtiCm: 80,
    soundSpeedScale: s,
  });
  close(scaleRow(a.outputs.avaCm2, s).relative, 2 * ur, 1e-7, "AVA: 2·u_r(s)");
  close(a.outputs.avaCm2.value, (Math.PI * 20) / 80 * s.value ** 2, 1e-12, "AVA × s²");
  // LV mass 0.832·(S³ − L³)·s³ + 0.6 (Lang 2015 formula): relative 3·u_r(s)·(M − 0.6)/M
  const m = propagate(atTrueSoundSpeedChain(lvMassLinear), {
    septalThicknessDiastoleCm: 1,
    lvInternalDiameterDiastoleCm: 5,
    posteriorWallThicknessDiastoleCm: 1,
    soundSpeedScale: s,
  });
  const mass = m.outputs.lvMassG.value;
  close(scaleRow(m.outputs.lvMassG, s).relative, (3 * ur * (mass - 0.6)) / mass, 1e-7, "mass");
  // a VTI is a distance: the member of the aortic VTI scales by s
  close(
    evaluate(atTrueSoundSpeed(AORTIC_VTI), { aorticVti: 100, soundSpeedScale: 1.01 }).outputs
      .aorticVtiAtTrueSoundSpeed!,
    101,
    1e-12,
    "VTI × s",
  );
});

Deno.test("the same scale value in Monte Carlo: EF draws equal the draws without the scale", () => {
  const s = trueSoundSpeedScale({ method: "monteCarlo", trials: 20_000, seed: 5 });
  const inputs = { endDiastolicVolumeMl: normal(150, 5), endSystolicVolumeMl: normal(60, 4) };
  const withScale = propagate(atTrueSoundSpeedChain(ejectionFraction), {
    ...inputs,
    soundSpeedScale: s,
  }, { method: "monteCarlo" });
  const without = propagate(ejectionFraction, inputs, {
    method: "monteCarlo",
    trials: 20_000,
    seed: 5,
  });
  // the volumes draw from the same streams (same source keys and seed); EF is scale-free, so
  // trial by trial it differs only by rounding (JCGM 101 trial-aligned samples)
  const a = withScale.outputs.ejectionFractionPercent.samples!;
  const b = without.outputs.ejectionFractionPercent.samples!;
  let worst = 0;
  for (let k = 0; k < a.length; k++) worst = Math.max(worst, Math.abs(a[k]! - b[k]!));
  assert.ok(worst < 1e-9, `largest trial difference ${worst}`);
});

Deno.test("atTrueSoundSpeedChain: keeps relations between inputs rescaled alike; refuses what it cannot rescale", async () => {
  const ef = atTrueSoundSpeedChain(ejectionFraction);
  assert.deepEqual([...ef.inputNames].sort(), [
    "endDiastolicVolumeMl",
    "endSystolicVolumeMl",
    "soundSpeedScale",
  ]);
  assert.throws(
    () => evaluate(ef, { endDiastolicVolumeMl: 50, endSystolicVolumeMl: 60, soundSpeedScale: 1 }),
    {
      name: "RangeError",
      message:
        "Ejection fraction at the true speed of sound: expected 'endSystolicVolumeMl' (LV end-systolic volume as displayed) ≤ 'endDiastolicVolumeMl' (LV end-diastolic volume as displayed), got endSystolicVolumeMl = 60 mL, endDiastolicVolumeMl = 50 mL",
    },
  );
  assert.throws(() => atTrueSoundSpeedChain(bsaMosteller), {
    name: "TypeError",
    message:
      "At the true speed of sound: expected 'inputs' at least one distance, velocity, area or volume read from echoes, got no input of 'bsaMosteller' to rescale",
  });
  assert.throws(() => atTrueSoundSpeedChain(simplifiedBernoulli, ["nope" as never]), {
    name: "TypeError",
    message:
      `At the true speed of sound: unknown input 'nope': expected one of peakVelocity, got "nope"`,
  });
  // a worker makes the chain again from its recipe (no unit engine in a worker): same numbers
  const g = atTrueSoundSpeedChain(simplifiedBernoulli);
  const inputs = { peakVelocity: normal(4, 0.1), soundSpeedScale: normal(1.02, 0.005) };
  const options = { method: "monteCarlo", trials: 30_000, seed: 9, keepSamples: false } as const;
  using pool = await createMonteCarloPool({ workers: 2 });
  const pooled = await pool.propagate(g, inputs, options);
  assert.equal(
    pooled.outputs.gradient!.value,
    propagate(g, inputs, options).outputs.gradient!.value,
  );
});
