/** Invented I-sections shared by the engine tests: test data only, from no project and no published example. */
import type { Fabrication, ISectionInput } from './section';

/** [width, thickness, root fillet] of one flange, millimetres. */
export type FlangeSpec = readonly [width_mm: number, thickness_mm: number, filletRadius_mm: number];

export function iSection(depth_mm: number, webThickness_mm: number, top: FlangeSpec, bottom: FlangeSpec = top, fabrication?: Fabrication): ISectionInput {
  const flange = ([width_mm, thickness_mm, filletRadius_mm]: FlangeSpec) => ({ width_mm, thickness_mm, filletRadius_mm });
  const filleted = top[2] > 0 || bottom[2] > 0;
  return { depth_mm, webThickness_mm, topFlange: flange(top), bottomFlange: flange(bottom), fabrication: fabrication ?? (filleted ? 'rolled' : 'welded') };
}

/** Welded plate girder with a slender web: web 1540 × 10 mm, flanges 400 × 30 mm (h/tw = 154). */
export const SLENDER_GIRDER: ISectionInput = iSection(1600, 10, [400, 30, 0]);
