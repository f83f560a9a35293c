import assert from "node:assert/strict";
import {
  ACOUSTIC_IMPEDANCE,
  ATTENUATION_COEFFICIENT,
  DEFAULT_SOUND_SPEED_MPS,
  inRange,
  MEDIUM_DENSITY,
  SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ,
  SOUND_SPEED,
  TISSUE_ACOUSTIC_PROPERTIES,
  tissueProperties,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("tissue table: facts of the trade and lookups", () => {
  const t = TISSUE_ACOUSTIC_PROPERTIES;
  // Soft tissue c = 1540 m/s and 0.5 dB/cm/MHz (common practice).
  assert.equal(t.softTissue.soundSpeedMps, 1540);
  assert.equal(t.softTissue.attenuationDbPerCmMHz, 0.5);
  // ... the same numbers as the scanner assumption and the attenuation default (one copy each).
  assert.equal(t.softTissue.soundSpeedMps, DEFAULT_SOUND_SPEED_MPS);
  assert.equal(t.softTissue.attenuationDbPerCmMHz, SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ);
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
  // Every row names at least one published source, and every "from memory" value says so.
  for (const row of Object.values(t)) {
    assert.ok(row.citations.length > 0, row.name);
    assert.match(row.note, /from memory/, row.name);
  }
  assert.equal(tissueProperties("myocardium").soundSpeedMps, 1576);
  // Rows are frozen: the shared table cannot be altered by a caller.
  assert.throws(() => {
    (t.softTissue as { soundSpeedMps: number }).soundSpeedMps = 1500;
  }, TypeError);
});

Deno.test("every tissue row lies inside the valid ranges of its quantities", () => {
  for (const row of Object.values(TISSUE_ACOUSTIC_PROPERTIES)) {
    assert.ok(inRange(row.soundSpeedMps, SOUND_SPEED.valid), `${row.name} speed`);
    assert.ok(inRange(row.densityKgPerM3, MEDIUM_DENSITY.valid), `${row.name} density`);
    assert.ok(inRange(row.impedanceMRayl, ACOUSTIC_IMPEDANCE.valid), `${row.name} impedance`);
    if (row.attenuationDbPerCmMHz !== null) {
      assert.ok(
        inRange(row.attenuationDbPerCmMHz, ATTENUATION_COEFFICIENT.valid),
        `${row.name} attenuation`,
      );
    }
  }
});

Deno.test("an unknown tissue is a TypeError listing the names", () => {
  assert.throws(() => tissueProperties("liver"), {
    name: "TypeError",
    message:
      /^Tissue properties: expected 'name' to be one of softTissue, blood, myocardium, fat, bone, water, air, got "liver"$/,
  });
  assert.throws(() => tissueProperties("toString"), {
    name: "TypeError",
    message: /got "toString"$/,
  });
  assert.throws(() => tissueProperties(3 as never), {
    name: "TypeError",
    message: /to be one of softTissue, .*, got 3$/,
  });
});
