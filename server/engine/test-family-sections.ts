import type { SectionDimensions } from './section-family';

/** Invented sections, one or two per family: test data only, from no project and no published table. */
export const FAMILY_SECTIONS: readonly SectionDimensions[] = [
  { family: 'I', depth_mm: 400, webThickness_mm: 9, topFlange: { width_mm: 180, thickness_mm: 14, filletRadius_mm: 20 }, bottomFlange: { width_mm: 180, thickness_mm: 14, filletRadius_mm: 20 } },
  {
    family: 'I',
    depth_mm: 260,
    webThickness_mm: 9.4,
    topFlange: { width_mm: 113, thickness_mm: 14.1, filletRadius_mm: 9.4, edgeRadius_mm: 5.6, slope_rad: Math.atan(0.14) },
    bottomFlange: { width_mm: 113, thickness_mm: 14.1, filletRadius_mm: 9.4, edgeRadius_mm: 5.6, slope_rad: Math.atan(0.14) },
  },
  { family: 'channel', depth_mm: 220, width_mm: 80, webThickness_mm: 9, flangeThickness_mm: 12.5, rootRadius_mm: 12.5, edgeRadius_mm: 6.5, slope_rad: Math.atan(0.08) },
  { family: 'tee', depth_mm: 150, width_mm: 200, webThickness_mm: 9, flangeThickness_mm: 15, rootRadius_mm: 18, webEdgeRadius_mm: 3 },
  { family: 'angle', depth_mm: 120, width_mm: 80, thickness_mm: 10, rootRadius_mm: 11, edgeRadius_mm: 5.5 },
  { family: 'box', depth_mm: 200, width_mm: 100, webThickness_mm: 8, flangeThickness_mm: 8, outerCornerRadius_mm: 16, innerCornerRadius_mm: 8 },
  { family: 'I', depth_mm: 900, webThickness_mm: 12, topFlange: { width_mm: 300, thickness_mm: 20, filletRadius_mm: 0 }, bottomFlange: { width_mm: 400, thickness_mm: 25, filletRadius_mm: 0 } },
  { family: 'channel', depth_mm: 250, width_mm: 90, webThickness_mm: 8, flangeThickness_mm: 15, rootRadius_mm: 15 },
  { family: 'angle', depth_mm: 90, width_mm: 150, thickness_mm: 12, rootRadius_mm: 12, edgeRadius_mm: 6, widthLegThickness_mm: 10 },
  { family: 'box', depth_mm: 600, width_mm: 400, webThickness_mm: 15, flangeThickness_mm: 25 },
  { family: 'tube', diameter_mm: 168.3, wallThickness_mm: 6.3 },
  { family: 'plate', depth_mm: 300, width_mm: 20 },
];
