import assert from "node:assert/strict";
import {
  ATTENUATION_COEFFICIENT,
  ATTENUATION_LOSS,
  attenuationLoss,
  evaluate,
  PENETRATION_DEPTH,
  penetrationDepth,
  SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ,
  TISSUE_ACOUSTIC_PROPERTIES,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("attenuation calculations take and give the declared quantities", () => {
  assert.equal(attenuationLoss.inputs.attenuationDbPerCmMHz.quantity, ATTENUATION_COEFFICIENT);
  assert.equal(attenuationLoss.outputs.oneWayLossDb.quantity, ATTENUATION_LOSS);
  assert.equal(attenuationLoss.outputs.roundTripLossDb.quantity, ATTENUATION_LOSS);
  assert.equal(attenuationLoss.outputs.roundTripLossDb.label, "Round-trip attenuation");
  assert.equal(penetrationDepth.outputs.maxDepthCm.quantity, PENETRATION_DEPTH);
});

Deno.test("attenuation: 0.5 dB/cm/MHz soft-tissue rule of thumb is the default", () => {
  // 0.5 dB/cm/MHz soft-tissue rule of thumb (common practice; Kremkau 2015 ch. 2).
  assert.equal(SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ, 0.5);
  assert.equal(attenuationLoss.inputs.attenuationDbPerCmMHz.default, 0.5);
  assert.equal(penetrationDepth.inputs.attenuationDbPerCmMHz.default, 0.5);
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
  // A penetration beyond any imaging depth is still a number: 120 dB through water-like
  // attenuation at 1 MHz reaches 120 / (2 · 0.01 · 1) = 6000 cm (hand check).
  const water = evaluate(penetrationDepth, {
    dynamicRangeDb: 120,
    transmitFrequencyMHz: 1,
    attenuationDbPerCmMHz: "0.01 dB/cm/MHz",
  });
  close(water.outputs.maxDepthCm, 6000, 1e-9, "weak attenuation");
});

Deno.test("attenuation inputs outside their range are RangeErrors naming the field", () => {
  assert.throws(
    () =>
      evaluate(attenuationLoss, { transmitFrequencyMHz: 3, depthCm: 5, attenuationDbPerCmMHz: 0 }),
    {
      name: "RangeError",
      message:
        /^Attenuation loss: expected 'attenuationDbPerCmMHz' \(Attenuation coefficient\) in \(0, 50\] dB\/cm\/MHz, got 0$/,
    },
  );
  assert.throws(() => evaluate(penetrationDepth, { dynamicRangeDb: 0, transmitFrequencyMHz: 3 }), {
    name: "RangeError",
    message:
      /^Penetration depth: expected 'dynamicRangeDb' \(Dynamic range\) in \(0, 200\] dB, got 0$/,
  });
});
