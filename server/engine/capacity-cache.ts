/**
 * Prepared capacities by profile, grade, standard and parameters: a model has thousands of members but a few dozen
 * profiles, so the expensive part of the check runs once per distinct key.
 */
import { type CheckParams, type MaterialInput, type PreparedCapacity, prepareCapacity, type Standard } from './check';
import type { ISectionInput } from './section';

function flangeKey(f: ISectionInput['topFlange']): string {
  return `${f.width_mm},${f.thickness_mm},${f.filletRadius_mm},${f.edgeRadius_mm ?? 0},${f.slope_rad ?? 0}`;
}

function paramsKey(params: CheckParams): string {
  const keys = Object.keys(params);
  if (keys.length === 0) return '';
  // Fixed key order, so equal parameter sets give equal keys however the caller built the object.
  return keys
    .sort()
    .map((k) => `${k}=${String(params[k as keyof CheckParams] ?? null)}`)
    .join(';');
}

/** Text key of everything the prepared capacity depends on (built by hand: it runs once per member). */
export function capacityKey(section: ISectionInput, material: MaterialInput, standard: Standard, params: CheckParams = {}): string {
  return `${standard}|${section.fabrication}|${section.depth_mm},${section.webThickness_mm}|${flangeKey(section.topFlange)}|${flangeKey(section.bottomFlange)}|${material.grade ?? ''}|${material.fy_MPa ?? ''}|${paramsKey(params)}`;
}

export class CapacityCache {
  private readonly entries = new Map<string, PreparedCapacity>();

  get(section: ISectionInput, material: MaterialInput, standard: Standard, params: CheckParams = {}): PreparedCapacity {
    const key = capacityKey(section, material, standard, params);
    let capacity = this.entries.get(key);
    if (!capacity) {
      capacity = prepareCapacity(section, material, standard, params);
      this.entries.set(key, capacity);
    }
    return capacity;
  }

  get size(): number {
    return this.entries.size;
  }
}
