import assert from "node:assert/strict";
import { JUPYTER_DISPLAY, rangeAmbiguity } from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("range ambiguity: sample volumes spaced by c/(2·PRF)", () => {
  // High-PRF: sample volumes at d₀ + k·c/(2·PRF) (Kremkau 2015 ch. 5). PRF 10 kHz → spacing
  // 7.7 cm; intended 12 cm → gates at 4.3 and 12 cm up to 16 cm (hand check).
  const r = rangeAmbiguity({ sampleDepthCm: 12, prfHz: "10 kHz", imagingDepthCm: 16 });
  assert.equal(r.highPrf, true);
  assert.equal(r.pulsesInFlight, 2);
  close(r.unambiguousDepthCm, 7.7, 1e-12, "spacing");
  assert.equal(r.sampleVolumeDepthsCm.length, 2);
  close(r.sampleVolumeDepthsCm[0]!, 4.3, 1e-9, "shallow gate");
  assert.equal(r.sampleVolumeDepthsCm[1], 12);
  assert.equal(r.ambiguousDepthsCm.length, 1);
  // Deeper imaging depth reveals the gate at 19.7 cm too.
  const deep = rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 20 });
  assert.deepEqual(deep.ambiguousDepthsCm.map((d) => Number(d.toFixed(6))), [4.3, 19.7]);
  // Conventional pulsed Doppler within the unambiguous range: no shallower gate.
  const pw = rangeAmbiguity({ sampleDepthCm: 6, prfHz: 10000, imagingDepthCm: 6 });
  assert.equal(pw.highPrf, false);
  assert.deepEqual(pw.ambiguousDepthsCm, []);
  assert.equal(pw.pulsesInFlight, 1);
  // Depth exactly at a multiple of the spacing.
  const edge = rangeAmbiguity({ sampleDepthCm: 15.4, prfHz: 10000, imagingDepthCm: 15.4 });
  assert.deepEqual(edge.sampleVolumeDepthsCm.map((d) => Number(d.toFixed(6))), [7.7, 15.4]);
});

Deno.test("range ambiguity keeps the checked arguments, defaults included, with their labels", () => {
  const r = rangeAmbiguity({ sampleDepthCm: "120 mm", prfHz: 10000, imagingDepthCm: 16 });
  assert.deepEqual(r.arguments.values, {
    sampleDepthCm: 12,
    prfHz: 10000,
    imagingDepthCm: 16,
    soundSpeedMps: 1540, // the soft-tissue default (common practice)
  });
  assert.equal(r.arguments.definitions.imagingDepthCm.label, "Imaging depth");
  assert.equal(r.outputDefinitions.unambiguousDepthCm.label, "Unambiguous depth");
  // A PRF above the usual range is flagged, not rejected (common practice, no source).
  const fast = rangeAmbiguity({ sampleDepthCm: 12, prfHz: 60000, imagingDepthCm: 16 });
  assert.equal(fast.flags.length, 1);
  assert.match(fast.flags[0]!, /'prfHz' \(Pulse repetition frequency\) = 60000 Hz lies outside/);
});

Deno.test("range ambiguity displays the gates in notebooks", () => {
  const r = rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 20 });
  const bundle = r[JUPYTER_DISPLAY]();
  const text = String(bundle["text/plain"]);
  // Gates at 4.3, 12 and 19.7 cm (hand check: 12 ∓ 7.7 cm).
  assert.match(text, /^Range ambiguity: high-PRF, 2 pulses in flight/);
  assert.match(text, /Sample-volume depth \(cm\)/);
  assert.match(text, /4\.3\s+ambiguous\n12\.0\s+intended\n19\.7\s+ambiguous/);
  assert.match(String(bundle["text/html"]), /<table/);
});

// Bad input: clear errors naming the field, its label, the valid range and the value (project
// rules, bad-input list); messages from the one validator.

Deno.test("range ambiguity rejects bad arguments with the field and range", () => {
  assert.throws(() => rangeAmbiguity({ sampleDepthCm: -3, prfHz: 4000, imagingDepthCm: 10 }), {
    name: "RangeError",
    message:
      /^Range ambiguity: expected 'sampleDepthCm' \(Sample-volume depth\) in \(0, 50\] cm, got -3$/,
  });
  assert.throws(() => rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 8 }), {
    name: "RangeError",
    message:
      /^Range ambiguity: expected 'sampleDepthCm' \(Sample-volume depth\) ≤ 'imagingDepthCm' \(Imaging depth\), got sampleDepthCm = 12 cm, imagingDepthCm = 8 cm$/,
  });
  assert.throws(() => rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000 } as never), {
    name: "TypeError",
    message:
      /^Range ambiguity: missing input 'imagingDepthCm' \(Imaging depth\): expected a value in \(0, 50\] cm, got nothing$/,
  });
  assert.throws(
    () => rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 16, gate: 1 } as never),
    {
      name: "TypeError",
      message:
        /^Range ambiguity: unknown input 'gate': expected one of sampleDepthCm, prfHz, imagingDepthCm, soundSpeedMps, got 1$/,
    },
  );
});
