/**
 * Rolled or welded, from what the model says about the section: unequal flanges are welded plate girders; root
 * fillets or a name found in the rolled-section catalogue mean rolled; a fillet-less section not in the catalogue is
 * taken as welded. The choice can be overridden later per member or profile.
 */
import type { Fabrication, FlangeInput } from '../engine/section';

export interface FabricationEvidence {
  topFlange: Pick<FlangeInput, 'width_mm' | 'thickness_mm' | 'filletRadius_mm'>;
  bottomFlange: Pick<FlangeInput, 'width_mm' | 'thickness_mm' | 'filletRadius_mm'>;
  inRolledCatalogue: boolean;
}

/** Exporters write the same plate as 220. and 219.99999999999997; that is not asymmetry. */
const differ = (a: number, b: number): boolean => Math.abs(a - b) > 1e-6 * Math.max(Math.abs(a), Math.abs(b));

export function fabricationOf(section: FabricationEvidence): Fabrication {
  const { topFlange: top, bottomFlange: bottom } = section;
  const asymmetric = differ(top.width_mm, bottom.width_mm) || differ(top.thickness_mm, bottom.thickness_mm);
  if (asymmetric) return 'welded';
  if (top.filletRadius_mm > 0 || bottom.filletRadius_mm > 0 || section.inRolledCatalogue) return 'rolled';
  return 'welded';
}
