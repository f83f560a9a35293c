// Notebook displays of the physics results (display/physics.ts): labels from quantities, numbers
// rounded to each quantity's resolution, flags and settings below the table.
import assert from "node:assert/strict";
import {
  aliasingCheck,
  displayAliasingCheck,
  displayRangeAmbiguity,
  rangeAmbiguity,
} from "../../mod.ts";

Deno.test("aliasing display: a given lower frequency, an impractical one, and the flags", () => {
  // 1 m/s at 60°, 2 MHz, 4 kHz: Nyquist 2000·1540/(2·2e6·0.5) = 1.54 m/s (hand check).
  const r = aliasingCheck({
    velocity: 1,
    prfHz: 4000,
    transmitFrequencyMHz: 2,
    sampleDepthCm: 15,
    angleDeg: 60,
    lowerTransmitFrequencyMHz: 1.5,
  });
  const text = String(displayAliasingCheck(r)["text/plain"]);
  assert.match(text, /^Aliasing check: 1\.00 m\/s does not alias \(Nyquist velocity 1\.54 m\/s\)/);
  assert.match(text, /Transmit frequency = 1\.5 MHz/);
  assert.match(text, /Transmit at the lower frequency given \(current PRF\)/);
  assert.match(text, /Setting: Lower transmit frequency = 1\.5 MHz/);
  assert.match(text, /Flag: Aliasing check: 'angleDeg' \(Insonation angle\) = 60° lies outside/);
  // A 5 m/s jet at 14 cm: the frequency needed is below usual cardiac probes (common practice).
  const jet = aliasingCheck({
    velocity: 5,
    prfHz: 5500,
    transmitFrequencyMHz: 2.5,
    sampleDepthCm: 14,
  });
  const html = String(displayAliasingCheck(jet)["text/html"]);
  assert.match(html, /below the usual lowest cardiac probe frequency of about 1 MHz/);
  assert.match(html, /<th[^>]*>Nyquist velocity \(m\/s\)<\/th>/);
});

Deno.test("range-ambiguity display: conventional pulsed Doppler", () => {
  // 6 cm at 10 kHz: within the 7.7 cm unambiguous depth (hand check c/(2·PRF)).
  const r = rangeAmbiguity({ sampleDepthCm: 6, prfHz: 10000, imagingDepthCm: 6 });
  const text = String(displayRangeAmbiguity(r)["text/plain"]);
  assert.match(
    text,
    /^Range ambiguity: the sample volume lies within the unambiguous depth; Unambiguous depth 7\.7 cm/,
  );
  assert.match(text, /6\.0\s+intended/);
  assert.doesNotMatch(text, /ambiguous\n/);
  assert.match(text, /Setting: Speed of sound = 1540 m\/s/);
});
