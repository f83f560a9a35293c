import assert from "node:assert/strict";
import {
  CLINICAL_CAUTION,
  deratedPressure,
  DERATING_DB_PER_CM_MHZ,
  evaluate,
  MECHANICAL_INDEX,
  MECHANICAL_INDEX_LIMIT,
  mechanicalIndex,
  PEAK_RAREFACTIONAL_PRESSURE,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("acoustic-output calculations take and give the declared quantities", () => {
  assert.equal(deratedPressure.inputs.waterPressureMPa.quantity, PEAK_RAREFACTIONAL_PRESSURE);
  assert.equal(deratedPressure.outputs.deratedPressureMPa.quantity, PEAK_RAREFACTIONAL_PRESSURE);
  assert.equal(mechanicalIndex.outputs.mechanicalIndex.quantity, MECHANICAL_INDEX);
});

Deno.test("mechanical index: hand values, the 1.9 limit and the clinical caution", () => {
  // MI = p_r,derated/√f (Apfel & Holland 1991, Ultrasound Med Biol 17:179; AIUM/NEMA UD 3):
  // 2.6 MPa at 1.87 MHz → 1.901 (hand check).
  const r = evaluate(mechanicalIndex, {
    peakRarefactionalPressureMPa: 2.6,
    transmitFrequencyMHz: 1.87,
  });
  close(r.outputs.mechanicalIndex, 2.6 / Math.sqrt(1.87), 1e-12, "MI");
  close(r.outputs.mechanicalIndex, 1.901, 0.001, "MI value");
  // Regulatory limit 1.9 (Track 3 global maximum MI, as summarised from the FDA guidance by
  // secondary sources; the guidance's own table was not checked): the upper end of the
  // mechanical index's typical range, and the caution says where it comes from and that it was
  // not verified against the guidance text.
  assert.equal(MECHANICAL_INDEX_LIMIT, 1.9);
  assert.equal(MECHANICAL_INDEX.typical!.max, MECHANICAL_INDEX_LIMIT);
  assert.ok(r.outputs.percentOfRegulatoryLimit > 100);
  assert.ok(
    r.cautions.some((c) => /MI 1\.9/.test(c) && /February 2023/.test(c) && /not verified/.test(c)),
    JSON.stringify(r.cautions),
  );
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
  // Unit conversion: "1500 kPa" = 1.5 MPa.
  const kpa = evaluate(mechanicalIndex, {
    peakRarefactionalPressureMPa: "1500 kPa",
    transmitFrequencyMHz: 2.25,
  });
  close(kpa.outputs.mechanicalIndex, 1, 1e-12, "kPa");
});

Deno.test("the MI limit cites the current revision of the FDA ultrasound guidance", () => {
  // FDA guidance page "Marketing Clearance of Diagnostic Ultrasound Systems and Transducers,
  // Guidance for Industry and Food and Drug Administration Staff, February 2023, Final, docket
  // FDA-2017-D-5372" (the same docket as the June 27, 2019 issue, which it replaces)
  const fda = mechanicalIndex.citations.filter((c) =>
    /Food and Drug Administration/.test(c.authors)
  );
  assert.equal(fda.length, 1);
  assert.equal(fda[0]!.year, 2023);
  assert.match(
    fda[0]!.title,
    /^Marketing Clearance of Diagnostic Ultrasound Systems and Transducers/,
  );
  assert.match(fda[0]!.publication, /February 2023/);
  assert.match(fda[0]!.publication, /FDA-2017-D-5372/);
  assert.match(fda[0]!.locator!, /not verified/);
});

Deno.test("derating at 0.3 dB/cm/MHz", () => {
  // Derating 0.3 dB/cm/MHz (IEC 62359; AIUM/NEMA UD 3): 3 MHz, 5 cm → 4.5 dB → ×0.5957
  // (hand check).
  assert.equal(DERATING_DB_PER_CM_MHZ, 0.3);
  const r = evaluate(deratedPressure, { waterPressureMPa: 3, transmitFrequencyMHz: 3, depthCm: 5 });
  close(r.outputs.deratedPressureMPa, 3 * 0.59566, 1e-4, "derated");
  // Derated pressure feeds the MI.
  const mi = evaluate(mechanicalIndex, {
    peakRarefactionalPressureMPa: r.outputs.deratedPressureMPa,
    transmitFrequencyMHz: 3,
  });
  close(mi.outputs.mechanicalIndex, (3 * 0.59566) / Math.sqrt(3), 1e-4, "MI from derated");
});

Deno.test("acoustic-output inputs outside their range are RangeErrors naming the field", () => {
  assert.throws(
    () => evaluate(mechanicalIndex, { peakRarefactionalPressureMPa: 1, transmitFrequencyMHz: -1 }),
    {
      name: "RangeError",
      message:
        /^Mechanical index: expected 'transmitFrequencyMHz' \(Acoustic working frequency\) in \(0, 100\] MHz, got -1$/,
    },
  );
  assert.throws(
    () => evaluate(deratedPressure, { waterPressureMPa: 0, transmitFrequencyMHz: 3, depthCm: 5 }),
    {
      name: "RangeError",
      message:
        /^Derated peak rarefactional pressure: expected 'waterPressureMPa' \(Peak rarefactional pressure in water\) in \(0, 20\] MPa, got 0$/,
    },
  );
});
