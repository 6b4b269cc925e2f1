/**
 * Prepared capacities by profile, grade, standard and parameters: a model has thousands of members but a few dozen
 * profiles, so the expensive part of the check runs once per distinct key.
 */
import { type CheckParams, type MaterialInput, type PreparedCapacity, prepareCapacity, type Standard } from './check';
import type { ISectionInput } from './section';

export function capacityKey(section: ISectionInput, material: MaterialInput, standard: Standard, params: CheckParams = {}): string {
  const flange = (f: ISectionInput['topFlange']): number[] => [f.width_mm, f.thickness_mm, f.filletRadius_mm, f.edgeRadius_mm ?? 0, f.slope_rad ?? 0];
  return JSON.stringify([
    standard,
    section.fabrication,
    section.depth_mm,
    section.webThickness_mm,
    flange(section.topFlange),
    flange(section.bottomFlange),
    material.grade ?? null,
    material.fy_MPa ?? null,
    // Fixed key order, so equal parameter sets give equal keys however the caller built the object.
    Object.keys(params)
      .sort()
      .map((k) => [k, params[k as keyof CheckParams] ?? null]),
  ]);
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
