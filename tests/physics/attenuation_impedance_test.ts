import assert from "node:assert/strict";
import {
  acousticImpedance,
  attenuationLoss,
  evaluate,
  interfaceReflection,
  penetrationDepth,
  TISSUE_ACOUSTIC_PROPERTIES,
  tissueProperties,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

Deno.test("attenuation: 0.5 dB/cm/MHz soft-tissue rule of thumb is the default", () => {
  // 0.5 dB/cm/MHz soft-tissue rule of thumb (common practice; Kremkau 2015 ch. 2).
  assert.equal(attenuationLoss.inputs.attenuationDbPerCmMHz.default, 0.5);
  // 5 MHz over 10 cm: 25 dB one way, 50 dB round trip (hand check from α·f·d).
  const r = evaluate(attenuationLoss, { transmitFrequencyMHz: 5, depthCm: 10 });
  close(r.outputs.oneWayLossDb, 25, 1e-12, "one way");
  close(r.outputs.roundTripLossDb, 50, 1e-12, "round trip");
});

Deno.test("attenuation: half-intensity depth is 6/f cm in soft tissue", () => {
  // Half-intensity depth (3 dB one way) ≈ 6/f cm in soft tissue (Kremkau 2015 ch. 2, from
  // memory); follows from 0.5 dB/cm/MHz.
  for (const f of [1, 2, 3, 5, 10]) {
    const r = evaluate(attenuationLoss, { transmitFrequencyMHz: f, depthCm: 6 / f });
    close(r.outputs.oneWayLossDb, 3, 1e-12, `${f} MHz`);
    close(10 ** (-r.outputs.oneWayLossDb / 10), 0.5, 0.002, "half intensity");
  }
});

Deno.test("penetration depth: DR / (2·α·f), falls with frequency", () => {
  // 60 dB at 3 MHz, 0.5 dB/cm/MHz → 20 cm (hand check from the round-trip loss, Kremkau 2015).
  const r = evaluate(penetrationDepth, { dynamicRangeDb: 60, transmitFrequencyMHz: 3 });
  close(r.outputs.maxDepthCm, 20, 1e-12, "3 MHz");
  // Higher frequency penetrates less, in inverse proportion (common practice).
  const r6 = evaluate(penetrationDepth, { dynamicRangeDb: 60, transmitFrequencyMHz: 6 });
  close(r6.outputs.maxDepthCm, 10, 1e-12, "6 MHz");
  // Consistency: the round-trip loss at the penetration depth equals the dynamic range.
  const loss = evaluate(attenuationLoss, { transmitFrequencyMHz: 3, depthCm: 20 });
  close(loss.outputs.roundTripLossDb, 60, 1e-12, "loss at depth");
  // Through fat (0.6 dB/cm/MHz, table row) penetration is shorter.
  const fat = evaluate(penetrationDepth, {
    dynamicRangeDb: 60,
    transmitFrequencyMHz: 3,
    attenuationDbPerCmMHz: TISSUE_ACOUSTIC_PROPERTIES.fat.attenuationDbPerCmMHz!,
  });
  assert.ok(fat.outputs.maxDepthCm < 20);
});

Deno.test("acoustic impedance Z = ρc reproduces the published table impedances", () => {
  // Published impedances (Bushberg 2012 ch. 14, from memory; myocardium Culjat 2010 Table 1,
  // from memory) agree with ρ·c within 3 %: a consistency check of the table rows.
  for (const row of Object.values(TISSUE_ACOUSTIC_PROPERTIES)) {
    const z = evaluate(acousticImpedance, {
      densityKgPerM3: row.densityKgPerM3,
      soundSpeedMps: row.soundSpeedMps,
    }).outputs.impedanceMRayl;
    assert.ok(
      Math.abs(z / row.impedanceMRayl - 1) < 0.03,
      `${row.name}: ${z} vs ${row.impedanceMRayl}`,
    );
  }
  // Soft tissue 1050 kg/m³ × 1540 m/s = 1.617 MRayl ≈ 1.62 (hand check; Bushberg, from memory).
  const z = evaluate(acousticImpedance, { densityKgPerM3: "1.05 g/cm^3" });
  close(z.outputs.impedanceMRayl, 1.617, 1e-9, "unit conversion of density");
});

Deno.test("interface reflection: textbook values", () => {
  const reflect = (a: number, b: number) =>
    evaluate(interfaceReflection, { impedance1MRayl: a, impedance2MRayl: b }).outputs;
  const t = TISSUE_ACOUSTIC_PROPERTIES;
  // Soft tissue/air ≈ 99.9 % reflected (common practice; Kremkau 2015 ch. 2).
  const air = reflect(t.softTissue.impedanceMRayl, t.air.impedanceMRayl);
  assert.ok(air.intensityReflectionPercent > 99.89 && air.intensityReflectionPercent < 100);
  assert.ok(air.pressureReflectionCoefficient < 0); // phase inversion at a softer medium
  // Soft tissue/fat: about 1 % reflected (Bushberg 2012 ch. 14 muscle/fat ≈ 0.01, from memory).
  const fat = reflect(t.softTissue.impedanceMRayl, t.fat.impedanceMRayl);
  assert.ok(fat.intensityReflectionPercent > 0.5 && fat.intensityReflectionPercent < 1.6);
  // Soft tissue/bone: about 40 % reflected (Bushberg 2012 ch. 14 muscle/bone ≈ 0.41, from memory).
  const bone = reflect(t.softTissue.impedanceMRayl, t.bone.impedanceMRayl);
  assert.ok(bone.intensityReflectionPercent > 35 && bone.intensityReflectionPercent < 50);
  // Conservation of energy: R + T = 100 %, and R is symmetric in Z₁, Z₂ (hand check).
  close(bone.intensityReflectionPercent + bone.intensityTransmissionPercent, 100, 1e-12, "R + T");
  close(
    reflect(t.bone.impedanceMRayl, t.softTissue.impedanceMRayl).intensityReflectionPercent,
    bone.intensityReflectionPercent,
    1e-12,
    "symmetry",
  );
  // Equal impedances reflect nothing.
  assert.equal(reflect(1.5, 1.5).intensityReflectionPercent, 0);
  // Hand check: Z 1 and 3 → r = 0.5, R = 25 %.
  close(reflect(1, 3).intensityReflectionPercent, 25, 1e-12, "r = 0.5");
});

Deno.test("tissue table: facts of the trade and lookups", () => {
  const t = TISSUE_ACOUSTIC_PROPERTIES;
  // Soft tissue c = 1540 m/s and 0.5 dB/cm/MHz (common practice).
  assert.equal(t.softTissue.soundSpeedMps, 1540);
  assert.equal(t.softTissue.attenuationDbPerCmMHz, 0.5);
  // Ordering of sound speeds: air < fat < water < soft tissue < blood ≤ myocardium < bone
  // (Bushberg 2012 ch. 14, from memory).
  assert.ok(t.air.soundSpeedMps < t.fat.soundSpeedMps);
  assert.ok(t.fat.soundSpeedMps < t.water.soundSpeedMps);
  assert.ok(t.water.soundSpeedMps < t.softTissue.soundSpeedMps);
  assert.ok(t.softTissue.soundSpeedMps < t.myocardium.soundSpeedMps);
  assert.ok(t.myocardium.soundSpeedMps < t.bone.soundSpeedMps);
  // Attenuation: water ≪ blood < soft tissue < bone (Bushberg 2012 ch. 14, from memory).
  assert.ok(t.water.attenuationDbPerCmMHz! < t.blood.attenuationDbPerCmMHz!);
  assert.ok(t.blood.attenuationDbPerCmMHz! < t.softTissue.attenuationDbPerCmMHz!);
  assert.ok(t.softTissue.attenuationDbPerCmMHz! < t.bone.attenuationDbPerCmMHz!);
  // Water attenuation at 1 MHz: α/f² = 25.3e-15 s²/m in Np (classical absorption of water at
  // 20 °C, from memory) → 0.0253 Np/m = 0.0022 dB/cm (hand check: 1 Np = 8.686 dB).
  close(25.3e-15 * 1e12 * 8.686 / 100, t.water.attenuationDbPerCmMHz!, 0.0001, "water α");
  // Every row names at least one source.
  for (const row of Object.values(t)) assert.ok(row.sources.length > 0, row.name);
  assert.equal(tissueProperties("myocardium").soundSpeedMps, 1576);
  assert.throws(() => tissueProperties("liver"), {
    name: "TypeError",
    message:
      /Tissue properties: expected 'name' to be one of softTissue, blood, myocardium, fat, bone, water, air, got "liver"/,
  });
  assert.throws(() => tissueProperties("toString"), { name: "TypeError" });
  // Rows are frozen: the shared table cannot be altered by a caller.
  assert.throws(() => {
    (t.softTissue as { soundSpeedMps: number }).soundSpeedMps = 1500;
  }, TypeError);
});
