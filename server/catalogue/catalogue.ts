/**
 * The built-in I-section catalogue and tolerant name lookup: 'IPE300' = 'IPE 300', 'W18x50' = 'W18X50',
 * 'HE 200 A' = 'HEA200' = 'HE200A', 'UC 310x96.8' = '310UC96.8'. A project catalogue (uploaded CSV) can be passed in
 * and wins over the built-in one. Sections of every family, and designations inside free text: catalogue-lookup.ts.
 */
import type { ISectionInput } from '../engine/section';
import type { IDimensions } from '../engine/section-family';
import { sectionProperties } from '../engine/section-properties';
import { AU_PFC_SOURCE } from './au-channels';
import { AU_HOLLOW_SOURCE } from './au-hollow';
import { AU_HOT_ROLLED_SOURCE, AU_SECTIONS, AU_WELDED_SOURCE } from './au-sections';
import type { CatalogueEntry, CatalogueSection, CatalogueSource } from './catalogue-section';
import { designationKey } from './designation';
import { EN_UPE_SOURCE, EN_UPN_SOURCE } from './en-channels';
import { EN_10210_SOURCE, EN_10219_SOURCE } from './en-hollow';
import { EN_HD_SOURCE, EN_I_SECTIONS, EN_IPN_SOURCE } from './en-i-sections';
import { EN_SECTIONS, EN_SOURCE } from './en-sections';
import { UK_PFC_SOURCE } from './uk-channels';
import { UK_SECTIONS, UK_SOURCE } from './uk-sections';
import { US_HSS_SOURCE } from './us-hollow';
import { US_I_SECTIONS, US_SHAPES_SOURCE } from './us-shapes';
import { W_SECTIONS, W_SOURCE } from './w-shapes';

export const CATALOGUE_SOURCES: Readonly<Record<string, CatalogueSource>> = Object.fromEntries(
  [EN_SOURCE, EN_IPN_SOURCE, EN_HD_SOURCE, EN_UPN_SOURCE, EN_UPE_SOURCE, W_SOURCE, US_SHAPES_SOURCE, US_HSS_SOURCE, UK_SOURCE, UK_PFC_SOURCE, AU_HOT_ROLLED_SOURCE, AU_WELDED_SOURCE, AU_PFC_SOURCE, AU_HOLLOW_SOURCE, EN_10219_SOURCE, EN_10210_SOURCE].map((s) => [s.id, s]),
);

export const BUILT_IN_SECTIONS: readonly CatalogueSection[] = [...EN_SECTIONS, ...EN_I_SECTIONS, ...W_SECTIONS, ...US_I_SECTIONS, ...UK_SECTIONS, ...AU_SECTIONS];

/**
 * Canonical lookup key of a section name: upper case, no spaces, hyphens or underscores, '×' read as 'X', and the
 * HE letter moved in front of the size ('HE 200 A' → 'HEA200').
 */
export function sectionKey(name: string): string {
  const compact = String(name).toUpperCase().replace(/×/g, 'X').replace(/[\s_-]+/g, '');
  const he = /^HE(\d+)([ABM])$/.exec(compact);
  return he ? `HE${he[2]}${he[1]}` : compact;
}

/** Each section under its plain key and, when its name is a designation, under the designation's key as well. */
function indexByKey(sections: readonly CatalogueSection[]): Map<string, CatalogueSection> {
  const index = new Map<string, CatalogueSection>();
  for (const s of sections) {
    index.set(sectionKey(s.name), s);
    const designation = designationKey(s.name);
    if (designation) index.set(designation, s);
  }
  return index;
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
  const exact = projectIndex(project).get(key) ?? BUILT_IN_INDEX.get(key);
  if (exact) return exact;
  const designation = designationKey(name);
  return designation ? (projectIndex(project).get(designation) ?? BUILT_IN_INDEX.get(designation) ?? null) : null;
}

function flangeOf(section: CatalogueSection): ISectionInput['topFlange'] {
  return {
    width_mm: section.width_mm,
    thickness_mm: section.flangeThickness_mm,
    filletRadius_mm: section.rootRadius_mm,
    ...(section.edgeRadius_mm ? { edgeRadius_mm: section.edgeRadius_mm } : {}),
    ...(section.flangeSlope_rad ? { slope_rad: section.flangeSlope_rad } : {}),
  };
}

/** Engine input of a catalogue section: equal flanges, root fillets of radius r, rolled unless the table says welded. */
export function toSectionInput(section: CatalogueSection): ISectionInput {
  return {
    depth_mm: section.depth_mm,
    webThickness_mm: section.webThickness_mm,
    topFlange: flangeOf(section),
    bottomFlange: flangeOf(section),
    fabrication: section.fabrication ?? 'rolled',
  };
}

const entries = new WeakMap<CatalogueSection, CatalogueEntry>();

/** The same section as a catalogue entry of the 'I' family (one object per section, so callers may compare them). */
export function entryOfSection(section: CatalogueSection): CatalogueEntry {
  let entry = entries.get(section);
  if (!entry) {
    const dimensions: IDimensions = {
      family: 'I',
      depth_mm: section.depth_mm,
      webThickness_mm: section.webThickness_mm,
      topFlange: flangeOf(section),
      bottomFlange: flangeOf(section),
    };
    entry = {
      name: section.name,
      series: section.series,
      family: 'I',
      dimensions,
      process: section.fabrication === 'welded' ? 'welded' : 'hot-rolled',
      sourceId: section.sourceId,
    };
    entries.set(section, entry);
  }
  return entry;
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
