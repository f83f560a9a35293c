import assert from "node:assert/strict";
import {
  caliperDistance,
  caliperPlacement,
  caliperTracedArea,
  continuityValveArea,
  propagate,
} from "../../mod.ts";
import { close, shownText } from "./helpers.ts";

const SETTINGS = {
  imageDepthCm: 16,
  imageRows: 800,
  transmitFrequencyMHz: 3,
  cyclesPerPulse: 2,
  apertureMm: 20,
  focalDepthCm: 8,
  measurementDepthCm: 10,
  orientation: "alongBeam",
} as const;

Deno.test("caliper: pixel and axial components, each a rectangular cell u = R/√12", () => {
  const c = caliperPlacement(Object.freeze({ ...SETTINGS }));
  // display pixel 160 mm / 800 rows = 0.2 mm (hand arithmetic); u = 0.2/√12 = 0.0577 mm, the
  // resolution of a digital indication, JCGM 100:2008 F.2.2.1 (u = 0.29·δx)
  close(c.pixelSizeMm, 0.2, 1e-12, "pixel");
  close(c.components[0]!.standardUncertaintyMm, 0.2 / Math.sqrt(12), 1e-12, "u pixel");
  close(c.components[0]!.standardUncertaintyMm / 0.2, 0.2887, 1e-4, "0.29·δx, JCGM F.2.2.1");
  // axial resolution = SPL/2 = n·λ/2 = 2·(1540/3000 mm)/2 = 0.5133 mm (Kremkau 2015 ch. 3)
  close(c.axialResolutionMm, 0.51333, 1e-5, "axial resolution");
  assert.equal(c.components[1]!.name, "axialResolution");
  close(c.components[1]!.standardUncertaintyMm, 0.51333 / Math.sqrt(12), 1e-5, "u axial");
  // the cell taken as rectangular over ±R/2: common practice, no single source
  close(c.boundaryUncertaintyMm, Math.hypot(0.2, 1540 / 3000) / Math.sqrt(12), 1e-12, "√Σu²");
  close(c.boundaryUncertaintyCm, c.boundaryUncertaintyMm / 10, 1e-15, "cm");
  assert.ok(
    c.components.every((k) =>
      Math.abs(k.standardUncertaintyCm * 10 - k.standardUncertaintyMm) < 1e-15
    ),
  );
});

Deno.test("caliper: across the beam, the beam width at the focus widens away from it", () => {
  const atFocus = caliperPlacement({
    ...SETTINGS,
    measurementDepthCm: 8,
    orientation: "acrossBeam",
  });
  // w_f = 0.886·λ·F# = 0.8859·0.51333·4 = 1.819 mm at 3 MHz, 20 mm, 8 cm (Szabo 2014 ch. 6; the
  // same hand check as the physics module's example)
  close(atFocus.beamWidthAtFocusMm, 1.819, 1e-3, "width at the focus");
  close(atFocus.beamWidthAtDepthMm, atFocus.beamWidthAtFocusMm, 1e-15, "at the focus, no cone");
  assert.equal(atFocus.components[1]!.name, "lateralResolution");
  // 4 cm beyond: geometric cone D·|z − z_f|/z_f = 20·4/8 = 10 mm, w = √(1.819² + 10²) = 10.164 mm
  // (hand computation of the stated model: common practice, no single source)
  const deep = caliperPlacement({ ...SETTINGS, measurementDepthCm: 12, orientation: "acrossBeam" });
  close(deep.beamWidthAtDepthMm, Math.hypot(deep.beamWidthAtFocusMm, 10), 1e-12, "w(12 cm)");
  close(deep.beamWidthAtDepthMm, 10.164, 1e-3, "w(12 cm) value");
  close(deep.components[1]!.standardUncertaintyMm, 10.164 / Math.sqrt(12), 1e-3, "u lateral");
  // focusing at the measurement depth shrinks the lateral component (same model)
  const refocused = caliperPlacement({
    ...SETTINGS,
    focalDepthCm: 12,
    measurementDepthCm: 12,
    orientation: "acrossBeam",
  });
  assert.ok(refocused.boundaryUncertaintyMm < deep.boundaryUncertaintyMm / 2);
  // the provenance reaches the display with the number
  const text = shownText(deep);
  assert.match(text, /common practice, no single source/);
  assert.match(text, /F\.2\.2\.1/);
});

Deno.test("caliper: a distance is two independent boundaries, u(d) = √2·u_b", () => {
  const c = caliperPlacement({ ...SETTINGS, measurementDepthCm: 9 });
  const d = caliperDistance(c, 2.1);
  // JCGM 100:2008 eq. (10) for d = B₂ − B₁ with independent B's
  close(d.standardUncertainty, Math.SQRT2 * c.boundaryUncertaintyCm, 1e-15, "√2·u_b");
  const r = propagate(continuityValveArea, { lvotDiameterCm: d.input, lvotVtiCm: 20, avVtiCm: 80 });
  close(r.inputs.lvotDiameterCm.standardUncertainty, d.standardUncertainty, 1e-15, "mm → cm");
  // the area goes as d²: u_r(AVA) = 2·u_r(d) (JCGM 100 eq. (10), hand-checkable)
  close(
    r.outputs.avaCm2.standardUncertainty / r.outputs.avaCm2.value,
    (2 * d.standardUncertainty) / 2.1,
    1e-8,
    "2·u_r(d)",
  );
  // a value given as a string keeps its unit
  const s = propagate(continuityValveArea, {
    lvotDiameterCm: caliperDistance(c, "21 mm").input,
    lvotVtiCm: 20,
    avVtiCm: 80,
  });
  close(s.inputs.lvotDiameterCm.value, 2.1, 1e-12, "21 mm");
  assert.throws(() => caliperDistance({} as never, 2), {
    name: "TypeError",
    message:
      "Caliper distance: expected 'placement' as the result of caliperPlacement(…), got a value of type object",
  });
});

Deno.test("caliper: a traced area moves by P·δ when its whole contour moves by δ", () => {
  const c = caliperPlacement({ ...SETTINGS, measurementDepthCm: 12, orientation: "acrossBeam" });
  const r = 2;
  const a = caliperTracedArea(c, { areaCm2: Math.PI * r * r, perimeterCm: 2 * Math.PI * r });
  // circle: π(r + δ)² − πr² = 2πr·δ + πδ², so dA/dδ = P at δ = 0 (hand-checkable; Steiner's
  // formula in general, from memory)
  const delta = 1e-6;
  const slope = (Math.PI * (r + delta) ** 2 - Math.PI * r * r) / delta;
  close(a.standardUncertainty / c.boundaryUncertaintyCm, slope, 1e-4, "P = dA/dδ");
  assert.equal(a.unit, "cm^2");
  assert.throws(() => caliperTracedArea(c, { areaCm2: 20, perimeterCm: 10 }), {
    name: "RangeError",
    message:
      "Caliper traced area: expected 'perimeterCm' (Traced perimeter)² ≥ 4π·'areaCm2' (Traced area) (no contour encloses more area than the circle of its perimeter), got areaCm2 = 20 cm², perimeterCm = 10 cm",
  });
});

Deno.test("caliper: bad settings are errors naming the field, the value and the range", () => {
  assert.throws(() => caliperPlacement({ ...SETTINGS, orientation: "sideways" as never }), {
    name: "RangeError",
    message:
      `Caliper placement: expected 'orientation' one of "alongBeam", "acrossBeam", got "sideways"`,
  });
  assert.throws(() => caliperPlacement({ ...SETTINGS, measurementDepthCm: 18 }), {
    name: "RangeError",
    message:
      "Caliper placement: expected 'measurementDepthCm' (Measurement depth) ≤ 'imageDepthCm' (Image depth), got measurementDepthCm = 18 cm, imageDepthCm = 16 cm",
  });
  assert.throws(() => caliperPlacement({ ...SETTINGS, imageRows: 600.5 }), {
    name: "RangeError",
    message:
      "Caliper placement: expected 'imageRows' (Image rows) as a whole number in [1, 100000], got 600.5",
  });
  const { imageRows: _, ...withoutRows } = SETTINGS;
  assert.throws(() => caliperPlacement(withoutRows as never), {
    name: "TypeError",
    message:
      "Caliper placement: missing input 'imageRows' (Image rows): expected a value in [1, 100000], got nothing",
  });
  assert.throws(() => caliperPlacement(null as never), {
    name: "TypeError",
    message: "Caliper placement: expected 'settings' as an object of scanner settings, got null",
  });
});
