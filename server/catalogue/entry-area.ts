/**
 * Cross-section areas of channels, hollow boxes and tubes in closed form (quarter-circle fillets and corners, flange
 * slope linear), which let the tests compare each table with its published areas and masses; and the area of the
 * engine's own outline of any family, the strongest check of a table converted to our conventions.
 */
import type { BoxDimensions, ChannelDimensions, SectionDimensions, TubeDimensions } from '../engine/section-family';
import { sectionOutline } from '../engine/section-outline';
import { polygonProperties } from '../engine/section-polygon';

/** Material added by a quarter-circle fillet of radius r in a right-angled corner. */
function filletArea_mm2(radius_mm: number): number {
  return (1 - Math.PI / 4) * radius_mm * radius_mm;
}

/** Channel: web, two flange outstands at their mean thickness, two root fillets less two toe roundings. */
export function channelArea_mm2(c: ChannelDimensions): number {
  const outstand_mm = c.width_mm - c.webThickness_mm;
  const edge_mm = c.edgeRadius_mm ?? 0;
  return c.depth_mm * c.webThickness_mm + 2 * outstand_mm * c.flangeThickness_mm + 2 * filletArea_mm2(c.rootRadius_mm) - 2 * filletArea_mm2(edge_mm);
}

/** Hollow box: the four rounded corners take (4 − π)(ro² − ri²) off the sharp-cornered ring. */
export function boxArea_mm2(b: BoxDimensions): number {
  const outer_mm = b.outerCornerRadius_mm ?? 0;
  const inner_mm = b.innerCornerRadius_mm ?? 0;
  const inside_mm2 = (b.depth_mm - 2 * b.flangeThickness_mm) * (b.width_mm - 2 * b.webThickness_mm);
  return b.depth_mm * b.width_mm - inside_mm2 - (4 - Math.PI) * (outer_mm * outer_mm - inner_mm * inner_mm);
}

export function tubeArea_mm2(t: TubeDimensions): number {
  const inner_mm = t.diameter_mm - 2 * t.wallThickness_mm;
  return (Math.PI / 4) * (t.diameter_mm * t.diameter_mm - inner_mm * inner_mm);
}

/** Area of the idealised outline the engine draws for any family (chords within 1 µm of their arcs). */
export function outlineArea_mm2(d: SectionDimensions): number {
  return polygonProperties(sectionOutline(d, 0.001)).area_mm2;
}
