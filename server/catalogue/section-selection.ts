/**
 * The lightest section of a catalogue series that would carry a shear force: what an engineer asks next when a
 * member fails. Sections are tried lightest first (mass follows area, one steel density).
 */
import { type CheckParams, type MaterialInput, type PreparedCapacity, prepareCapacity, type Standard, utilisationOf } from '../engine/check';
import { GradeError } from '../engine/grades';
import { EngineInputError } from '../engine/input-error';
import type { CatalogueSection } from './catalogue-section';
import { sectionsInSeries, toSectionInput } from './catalogue';

export interface SelectionInput {
  series: string;
  shear_N: number;
  material: MaterialInput;
  standard: Standard;
  params?: CheckParams;
  project?: readonly CatalogueSection[];
  /** Largest acceptable utilisation; 1.0 unless the engineer wants spare capacity. */
  targetUtilisation?: number;
}

export interface Selection {
  section: CatalogueSection;
  capacity: PreparedCapacity;
  utilisation: number;
}

/** The lightest passing section of the series, or null when none passes. Throws EngineInputError for bad input. */
export function lightestPassingSection(input: SelectionInput): Selection | null {
  const target = input.targetUtilisation ?? 1;
  if (!(target > 0 && target <= 1)) throw new EngineInputError('targetUtilisation', `targetUtilisation must be in (0, 1], got ${target}`);
  if (!Number.isFinite(input.shear_N)) throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${input.shear_N}`);
  const candidates = sectionsInSeries(input.series, input.project);
  if (candidates.length === 0) throw new EngineInputError('series', `no catalogue series called '${input.series}'`);
  for (const section of candidates) {
    let capacity: PreparedCapacity;
    try {
      capacity = prepareCapacity(toSectionInput(section), input.material, input.standard, input.params);
    } catch (error) {
      // A plate thicker than the grade's table covers cannot be rated; the lighter and heavier ones still can.
      if (error instanceof GradeError && error.field === 'thickness_mm') continue;
      throw error;
    }
    const utilisation = utilisationOf(capacity, input.shear_N);
    if (utilisation <= target) return { section, capacity, utilisation };
  }
  return null;
}
