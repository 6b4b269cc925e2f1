/**
 * The built-in section catalogue and tolerant name lookup: 'IPE300' = 'IPE 300', 'W18x50' = 'W18X50',
 * 'HE 200 A' = 'HEA200' = 'HE200A'. A project catalogue (uploaded CSV) can be passed in and wins over the built-in one.
 */
import type { ISectionInput } from '../engine/section';
import { sectionProperties } from '../engine/section-properties';
import type { CatalogueSection, CatalogueSource } from './catalogue-section';
import { EN_SECTIONS, EN_SOURCE } from './en-sections';
import { W_SECTIONS, W_SOURCE } from './w-shapes';

export const CATALOGUE_SOURCES: Readonly<Record<string, CatalogueSource>> = {
  [EN_SOURCE.id]: EN_SOURCE,
  [W_SOURCE.id]: W_SOURCE,
};

export const BUILT_IN_SECTIONS: readonly CatalogueSection[] = [...EN_SECTIONS, ...W_SECTIONS];

/**
 * Canonical lookup key of a section name: upper case, no spaces, hyphens or underscores, '×' read as 'X', and the
 * HE letter moved in front of the size ('HE 200 A' → 'HEA200').
 */
export function sectionKey(name: string): string {
  const compact = String(name).toUpperCase().replace(/×/g, 'X').replace(/[\s_-]+/g, '');
  const he = /^HE(\d+)([ABM])$/.exec(compact);
  return he ? `HE${he[2]}${he[1]}` : compact;
}

function indexByKey(sections: readonly CatalogueSection[]): Map<string, CatalogueSection> {
  return new Map(sections.map((s) => [sectionKey(s.name), s]));
}

const BUILT_IN_INDEX = indexByKey(BUILT_IN_SECTIONS);
const projectIndexes = new WeakMap<readonly CatalogueSection[], Map<string, CatalogueSection>>();

function projectIndex(project: readonly CatalogueSection[]): Map<string, CatalogueSection> {
  let index = projectIndexes.get(project);
  if (!index) {
    index = indexByKey(project);
    projectIndexes.set(project, index);
  }
  return index;
}

/** The section called `name`, looked up in the project catalogue first, then the built-in tables; null if unknown. */
export function findSection(name: string, project: readonly CatalogueSection[] = []): CatalogueSection | null {
  const key = sectionKey(name);
  return projectIndex(project).get(key) ?? BUILT_IN_INDEX.get(key) ?? null;
}

/** Engine input of a catalogue section: rolled, equal flanges, root fillets of radius r. */
export function toSectionInput(section: CatalogueSection): ISectionInput {
  const flange = { width_mm: section.width_mm, thickness_mm: section.flangeThickness_mm, filletRadius_mm: section.rootRadius_mm };
  return {
    depth_mm: section.depth_mm,
    webThickness_mm: section.webThickness_mm,
    topFlange: { ...flange },
    bottomFlange: { ...flange },
    fabrication: 'rolled',
  };
}

export function seriesOf(section: CatalogueSection): string {
  return section.series;
}

const areas = new WeakMap<CatalogueSection, number>();

/** Cross-section area, which orders a series by mass per metre (same steel density throughout). */
export function areaOf_mm2(section: CatalogueSection): number {
  let area = areas.get(section);
  if (area === undefined) {
    area = sectionProperties(toSectionInput(section)).area_mm2;
    areas.set(section, area);
  }
  return area;
}

/** Every section of `series` (project sections first replacing built-in ones of the same name), lightest first. */
export function sectionsInSeries(series: string, project: readonly CatalogueSection[] = []): CatalogueSection[] {
  const wanted = series.toUpperCase();
  const byKey = new Map<string, CatalogueSection>();
  for (const s of [...BUILT_IN_SECTIONS, ...project]) {
    if (s.series.toUpperCase() === wanted) byKey.set(sectionKey(s.name), s);
  }
  return [...byKey.values()].sort((a, b) => areaOf_mm2(a) - areaOf_mm2(b));
}

/** Names of every series available, built-in and project. */
export function seriesNames(project: readonly CatalogueSection[] = []): string[] {
  return [...new Set([...BUILT_IN_SECTIONS, ...project].map(seriesOf))];
}
