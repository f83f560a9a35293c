import assert from "node:assert/strict";
import fc from "fast-check";
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
      "Biplane method of discs: expected 'twoChamber' (apical two-chamber contour) with 3 to 20000 points, got 2 points",
  });
  assert.throws(() => singlePlaneDiscVolume([]), {
    name: "RangeError",
    message:
      "Single-plane method of discs: expected 'contour' (apical four-chamber contour) with 3 to 20000 points, got 0 points",
  });
  assert.throws(
    () => biplaneDiscVolume({ fourChamber: "0,0 1,2 2,0" as unknown as [], twoChamber: good }),
    {
      name: "TypeError",
      message:
        `Biplane method of discs: expected 'fourChamber' (apical four-chamber contour) as an array of [x, y] points in cm, got "0,0 1,2 2,0"`,
    },
  );
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1] as unknown as [number, number], [2, 0]]), {
    name: "TypeError",
    message:
      "Single-plane method of discs: expected 'contour[1]' (point 1 of the apical four-chamber contour) as [x, y] or { x, y } in cm, got [1]",
  });
  assert.throws(
    () => singlePlaneDiscVolume([[0, 0], ["1", 2] as unknown as [number, number], [2, 0]]),
    {
      name: "TypeError",
      message:
        `Single-plane method of discs: expected 'contour[1]' (point 1 of the apical four-chamber contour) to hold numbers in cm, got ["1",2]`,
    },
  );
  assert.throws(
    () => singlePlaneDiscVolume([[0, 0], [NaN, 2], [2, 0]], { view: "apical three-chamber" }),
    {
      name: "RangeError",
      message:
        "Single-plane method of discs: expected 'contour[1]' (point 1 of the apical three-chamber contour) with finite coordinates in cm, got (NaN, 2)",
    },
  );
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1, 2], [1, 2], [2, 0]]), {
    name: "RangeError",
    message:
      "Single-plane method of discs: expected 'contour[2]' (point 2 of the apical four-chamber contour) to differ from point 1, got the repeated point (1, 2)",
  });
  assert.throws(() => singlePlaneDiscVolume([[0, 0], [1, 2], [0, 0]]), {
    name: "RangeError",
    message:
      "Single-plane method of discs: expected 'contour' (apical four-chamber contour) with distinct annulus hinge points (first and last points), got (0, 0) twice",
  });
  assert.throws(
    () => biplaneDiscVolume({ fourChamber: good, twoChamber: good }, { discCount: 2.5 }),
    {
      name: "RangeError",
      message:
        "Biplane method of discs: expected 'discCount' (Number of discs) as a whole number in [1, 100000], got 2.5",
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
        "Biplane method of discs: expected 'fourChamber' (apical four-chamber contour) not to cross itself (the outline is closed by the annulus segment 3–0), got segment 0–1 crossing segment 2–3 near point 0 at (0, 0)",
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
    message: /'twoChamber' \(apical two-chamber contour\) not to cross itself/,
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

// Independent brute-force oracle for the self-intersection rule (every pair of non-adjacent
// segments of the closed outline, touching included; adjacent segments folding back). Integer
// coordinates keep the orientation tests exact. Standard computational-geometry predicate
// (orientation signs plus collinear bounding-box overlap), common practice, no source.
function bruteForceCrosses(pts: readonly (readonly [number, number])[]): boolean {
  const n = pts.length;
  const o = (a: readonly number[], b: readonly number[], c: readonly number[]): number =>
    Math.sign((b[0]! - a[0]!) * (c[1]! - a[1]!) - (b[1]! - a[1]!) * (c[0]! - a[0]!));
  const on = (a: readonly number[], b: readonly number[], c: readonly number[]): boolean =>
    Math.min(a[0]!, b[0]!) <= c[0]! && c[0]! <= Math.max(a[0]!, b[0]!) &&
    Math.min(a[1]!, b[1]!) <= c[1]! && c[1]! <= Math.max(a[1]!, b[1]!);
  const hit = (
    p1: readonly number[],
    p2: readonly number[],
    p3: readonly number[],
    p4: readonly number[],
  ) => {
    const d1 = o(p3, p4, p1), d2 = o(p3, p4, p2), d3 = o(p1, p2, p3), d4 = o(p1, p2, p4);
    if (d1 * d2 < 0 && d3 * d4 < 0) return true;
    return (d1 === 0 && on(p3, p4, p1)) || (d2 === 0 && on(p3, p4, p2)) ||
      (d3 === 0 && on(p1, p2, p3)) || (d4 === 0 && on(p1, p2, p4));
  };
  for (let i = 0; i < n; i++) {
    const a = pts[i]!, b = pts[(i + 1) % n]!, c = pts[(i + 2) % n]!;
    const dot = (a[0] - b[0]) * (c[0] - b[0]) + (a[1] - b[1]) * (c[1] - b[1]);
    if (o(a, b, c) === 0 && dot > 0) return true;
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      if (hit(a, b, pts[j]!, pts[(j + 1) % n]!)) return true;
    }
  }
  return false;
}

Deno.test("property: the sweep self-intersection check agrees with a brute-force oracle", () => {
  fc.assert(
    fc.property(
      fc.array(fc.tuple(fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 })), {
        minLength: 3,
        maxLength: 12,
      }),
      (raw) => {
        // Drop consecutive repeats and a repeated closing point (those have their own errors).
        const pts = raw.filter((p, i) =>
          i === 0 || p[0] !== raw[i - 1]![0] || p[1] !== raw[i - 1]![1]
        );
        if (pts.length < 3) return;
        const last = pts[pts.length - 1]!;
        if (last[0] === pts[0]![0] && last[1] === pts[0]![1]) return;
        const expected = bruteForceCrosses(pts);
        let threw = false;
        try {
          validateContour(pts, "Property", "apical");
        } catch (e) {
          assert.ok(e instanceof RangeError);
          assert.match(e.message, /not to cross itself/);
          threw = true;
        }
        assert.equal(threw, expected, JSON.stringify(pts));
      },
    ),
    { numRuns: 3000, seed: 12345 },
  );
});

Deno.test("property: disc volume of any placed half-ellipsoid matches (π/6)·L·D1·D2·(1 + 1/3200)", () => {
  // Solid geometry and the midpoint-rule bias derived in volumes_test.ts; 2001-point contours
  // (polygon error < 2e-6), any rotation and translation.
  fc.assert(
    fc.property(
      fc.double({ min: 3, max: 12, noNaN: true }),
      fc.double({ min: 1, max: 5.5, noNaN: true }),
      fc.double({ min: 1, max: 5.5, noNaN: true }),
      fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
      fc.double({ min: -20, max: 20, noNaN: true }),
      (L, d1, d2, angle, shift) => {
        // The apex must be the farthest point: L > D/2 holds for all draws (L ≥ 3, D ≤ 5.5).
        const v = biplaneDiscVolume({
          fourChamber: halfEllipse(L, d1, 2001, angle, shift, -shift),
          twoChamber: halfEllipse(L, d2, 2001, -angle, 0, shift),
        }).volumeMl;
        const expected = (Math.PI / 6) * L * d1 * d2 * (1 + 1 / 3200);
        assert.ok(Math.abs(v / expected - 1) < 1e-5, `${v} vs ${expected}`);
      },
    ),
    { numRuns: 60, seed: 777 },
  );
});
