import assert from "node:assert/strict";
import {
  ACOUSTIC_IMPEDANCE,
  acousticImpedance,
  evaluate,
  interfaceReflection,
  MEDIUM_DENSITY,
  TISSUE_ACOUSTIC_PROPERTIES,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("impedance calculations take and give the declared quantities", () => {
  assert.equal(acousticImpedance.inputs.densityKgPerM3.quantity, MEDIUM_DENSITY);
  assert.equal(acousticImpedance.outputs.impedanceMRayl.quantity, ACOUSTIC_IMPEDANCE);
  // Both media are impedances, told apart by their roles.
  assert.equal(interfaceReflection.inputs.impedance1MRayl.quantity, ACOUSTIC_IMPEDANCE);
  assert.equal(interfaceReflection.inputs.impedance2MRayl.quantity, ACOUSTIC_IMPEDANCE);
  assert.equal(interfaceReflection.inputs.impedance1MRayl.label, "First medium impedance");
  assert.equal(interfaceReflection.inputs.impedance2MRayl.label, "Second medium impedance");
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

Deno.test("an impedance of zero is a RangeError naming the role and the range", () => {
  assert.throws(
    () => evaluate(interfaceReflection, { impedance1MRayl: 1.6, impedance2MRayl: 0 }),
    {
      name: "RangeError",
      message:
        /^Reflection at an interface: expected 'impedance2MRayl' \(Second medium impedance\) in \(0, 100\] MRayl, got 0$/,
    },
  );
  assert.throws(() => evaluate(acousticImpedance, { densityKgPerM3: -1 }), {
    name: "RangeError",
    message:
      /^Acoustic impedance: expected 'densityKgPerM3' \(Density\) in \(0, 25000\] kg\/m³, got -1$/,
  });
});
