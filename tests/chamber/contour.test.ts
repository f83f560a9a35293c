import assert from "node:assert/strict";
import {
  biplaneDiscVolume,
  contourLongAxis,
  discDiameters,
  singlePlaneDiscVolume,
  validateContour,
} from "../../calc/chamber/mod.ts";
import { halfEllipse } from "./shapes.ts";

const good = halfEllipse(8, 4, 101);

Deno.test("disc diameters: straight-walled chamber and a two-lobed (non-convex) section", () => {
  // Hand-checkable geometry: walls at x = ±1 up to y = 4, apex (0, 6); L = 6, h = 0.3; disc k
  // sits at (k + ½)·0.3, so discs 0…12 (up to 3.75 cm) are exactly 2 cm wide.
  const c = validateContour([[-1, 0], [-1, 4], [0, 6], [1, 4], [1, 0]], "Test", "apical");
  const d = discDiameters(c, contourLongAxis(c), 20);
  for (let k = 0; k <= 12; k++) assert.ok(Math.abs(d[k]! - 2) < 1e-12, `disc ${k}: ${d[k]}`);
  // Above y = 4 the width narrows linearly to the apex: at y = 5.85 (disc 19), 2·(6 − 5.85)/2 = 0.15.
  assert.ok(Math.abs(d[19]! - 0.15) < 1e-12);
  // A side lobe: walls at x = −3 and along (−2, 8)–(−2, 5)–(−1.5, 5)–(−1.5, 9), apex (0, 12), right
  // wall from (1.5, 9) to (3, 0). L = 12, h = 0.6; disc 10 at y = 6.3 crosses the outline 4 times, at
  // x = −3, −2, −1.5 and 1.5 + 1.5·(9 − 6.3)/9 = 1.95: inside width (−2 + 3) + (1.95 + 1.5) = 4.45 cm
  // (hand-checkable).
  const lobed = validateContour(
    [[-3, 0], [-3, 8], [-2.5, 8.5], [-2, 8], [-2, 5], [-1.5, 5], [-1.5, 9], [0, 12], [1.5, 9], [
      3,
      0,
    ]],
    "Test",
    "apical",
  );
  const axis = contourLongAxis(lobed);
  assert.equal(axis.lengthCm, 12);
  assert.ok(Math.abs(discDiameters(lobed, axis, 20)[10]! - 4.45) < 1e-12);
});

Deno.test("bad contours: fewer than 3 points, wrong shapes, non-finite values", () => {
  assert.throws(() => biplaneDiscVolume({ fourChamber: good, twoChamber: [[0, 0], [1, 2]] }), {
    name: "RangeError",
    message:
      /^Biplane method of discs: expected at least 3 points in the apical two-chamber contour, got 2$/,
  });
  assert.throws(() => singlePlaneDiscVolume([]), {
    name: "RangeError",
    message:
      /^Single-plane method of discs: expected at least 3 points in the apical four-chamber contour, got 0$/,
  });
  assert.throws(
    () => biplaneDiscVolume({ fourChamber: "0,0 1,2 2,0" as unknown as [], twoChamber: good }),
    {
      name: "TypeError",
      message:
        /expected the apical four-chamber contour as an array of \[x, y\] points in cm, got string$/,
    },
  );
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1] as unknown as [number, number], [2, 0]]), {
    name: "TypeError",
    message:
      /expected point 1 of the apical four-chamber contour as \[x, y\] or \{ x, y \} in cm, got \[1\]$/,
  });
  assert.throws(
    () => singlePlaneDiscVolume([[0, 0], ["1", 2] as unknown as [number, number], [2, 0]]),
    {
      name: "TypeError",
      message:
        /expected point 1 of the apical four-chamber contour to hold numbers in cm, got \["1",2\]$/,
    },
  );
  assert.throws(
    () => singlePlaneDiscVolume([[0, 0], [NaN, 2], [2, 0]], { view: "apical three-chamber" }),
    {
      name: "RangeError",
      message:
        /expected finite coordinates at point 1 of the apical three-chamber contour, got \(NaN, 2\)$/,
    },
  );
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1, 2], [1, 2], [2, 0]]), {
    name: "RangeError",
    message:
      /expected point 2 of the apical four-chamber contour to differ from point 1, got the repeated point \(1, 2\)$/,
  });
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1, 2], [0, 0]]), {
    name: "RangeError",
    message:
      /expected distinct annulus hinge points \(first and last points\) in the apical four-chamber contour, got \(0, 0\) twice$/,
  });
  assert.throws(
    () => biplaneDiscVolume({ fourChamber: good, twoChamber: good }, { discCount: 2.5 }),
    {
      name: "RangeError",
      message: /expected 'discCount' as an integer in \[1, 100000\], got 2.5$/,
    },
  );
});

Deno.test("bad contours: self-intersections, including the annulus segment and fold-backs", () => {
  // A bow-tie: segment 0–1 from (0, 0) to (2, 4) crosses segment 2–3 from (0, 4) to (2, 0) at (1, 2).
  assert.throws(
    () => biplaneDiscVolume({ fourChamber: [[0, 0], [2, 4], [0, 4], [2, 0]], twoChamber: good }),
    {
      name: "RangeError",
      message:
        /^Biplane method of discs: expected the apical four-chamber contour not to cross itself \(the outline is closed by the annulus segment 3–0\), got segment 0–1 crossing segment 2–3 near point 0 at \(0, 0\)$/,
    },
  );
  // Dipping below the annulus: segment 1–2 from (1, −1) to (1.5, 3) crosses the annulus segment
  // 3–0 from (2, 0) to (0, 0).
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1, -1], [1.5, 3], [2, 0]]), {
    name: "RangeError",
    message: /got segment 1–2 crossing segment 3–0 near point 1 at \(1, -1\)$/,
  });
  // Folding back on itself along a line: (0, 0) → (0, 4) → (0, 2).
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [0, 4], [0, 2], [1, 0]]), {
    name: "RangeError",
    message: /got segment 0–1 crossing segment 1–2/,
  });
  // A loop near the apex of a traced half-ellipse (points 40 and 60 swapped) is detected.
  const looped = halfEllipse(8, 4, 101).map((p) => [...p] as [number, number]);
  [looped[40], looped[60]] = [looped[60]!, looped[40]!];
  assert.throws(() => biplaneDiscVolume({ fourChamber: good, twoChamber: looped }), {
    name: "RangeError",
    message: /apical two-chamber contour not to cross itself/,
  });
  // All points collinear: no cavity (the annulus segment overlaps the contour).
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1, 0], [2, 0]]), {
    name: "RangeError",
    message: /not to cross itself/,
  });
  // Touching (a vertex lying on a non-adjacent segment) counts as crossing.
  assert.throws(
    () => singlePlaneDiscVolume([[0, 0], [0, 4], [2, 4], [2, 6], [1, 4], [1, 8], [4, 0]]),
    {
      name: "RangeError",
      message: /got segment 1–2 crossing segment 3–4 near point 1 at \(0, 4\)$/,
    },
  );
  // A valid triangle passes.
  assert.equal(validateContour([[0, 0], [1, 3], [2, 0]], "Test", "apical").x.length, 3);
});
