/**
 * Calipers used by several chamber tests (test data, not tests).
 *
 * IVSd 1.3, LVIDd 4.8, LVPWd 1.2 cm, BSA 1.9 m² (invented patient). Hand-checkable from the
 * Lang 2015 linear formulas: (7.3³ − 4.8³) = 389.017 − 110.592 = 278.425; LV mass
 * 0.832·278.425 + 0.6 = 232.2496 g; LVMi 232.2496/1.9 = 122.2366 g/m²; RWT 2·1.2/4.8 = 0.5 —
 * concentric hypertrophy for a man (122 > 115, 0.5 > 0.42).
 */
export const HYPERTROPHY_CALIPERS = {
  septalThicknessDiastoleCm: 1.3,
  lvInternalDiameterDiastoleCm: 4.8,
  posteriorWallThicknessDiastoleCm: 1.2,
  bodySurfaceAreaM2: 1.9,
} as const;

/** LV mass of {@linkcode HYPERTROPHY_CALIPERS}, g (hand computation above). */
export const HYPERTROPHY_LV_MASS_G = 232.2496;
