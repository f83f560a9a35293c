/**
 * Geometric solids with known volumes, as traced contours (test helpers, not tests).
 *
 * A prolate half-ellipsoid standing on its equator: long semi-axis L (annulus midpoint to apex)
 * and equatorial diameter D. Its exact volume is ½·(4/3)·π·(D/2)²·L = (π/6)·L·D² (solid
 * geometry). Cut by a plane through the long axis it gives a half-ellipse with semi-axes L and
 * D/2, traced here from one hinge point (D/2, 0) over the apex (0, L) to the other (−D/2, 0).
 */

/** Half-ellipse contour with `points` points (odd, so the apex is a point), optionally rotated by
 * `angleRad` and shifted by (dx, dy). */
export function halfEllipse(
  lengthCm: number,
  diameterCm: number,
  points = 4001,
  angleRad = 0,
  dx = 0,
  dy = 0,
): [number, number][] {
  const c = Math.cos(angleRad), s = Math.sin(angleRad);
  return Array.from({ length: points }, (_, k) => {
    const t = (Math.PI * k) / (points - 1);
    const x = (diameterCm / 2) * Math.cos(t), y = lengthCm * Math.sin(t);
    return [c * x - s * y + dx, s * x + c * y + dy] as [number, number];
  });
}

/** Exact volume of the half-ellipsoid with long semi-axis L and equatorial diameters D1, D2:
 * (π/6)·L·D1·D2, mL for cm. */
export function halfEllipsoidVolume(lengthCm: number, d1Cm: number, d2Cm = d1Cm): number {
  return (Math.PI / 6) * lengthCm * d1Cm * d2Cm;
}
