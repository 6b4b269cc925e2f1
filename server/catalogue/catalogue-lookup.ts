/**
 * Sections of every family by the text an exporter wrote: a profile name, an ObjectType, an element or type name or a
 * property value ('Beam:IPE270:341211', 'HEA360-S355', 'Steel - 310UC96.8'). The project catalogue wins over the
 * built-in tables, and the hit says which one it came from. A designation that names two different sections
 * (the same size in two tables with different corners) finds nothing rather than a guess, unless it is written in the
 * naming form of exactly one of those tables ('100x6.0SHS' is the AS/NZS form; 'SHS 100x100x6' is no one's).
 */
import { AU_PFC_ENTRIES } from './au-channels';
import { AU_HOLLOW_ENTRIES } from './au-hollow';
import { BUILT_IN_SECTIONS, CATALOGUE_SOURCES, entryOfSection, sectionKey } from './catalogue';
import type { CatalogueEntry, CatalogueHit, CatalogueOrigin, CatalogueSection } from './catalogue-section';
import { type DesignationMatch, designationIn, designationKey, keysOf } from './designation';
import { EN_CHANNEL_ENTRIES } from './en-channels';
import { EN_HOLLOW_ENTRIES } from './en-hollow';
import { UK_PFC_ENTRIES } from './uk-channels';
import { US_HSS_ENTRIES, US_ROUND_HSS_ENTRIES } from './us-hollow';
import { US_CHANNEL_ENTRIES } from './us-shapes';

export const BUILT_IN_ENTRIES: readonly CatalogueEntry[] = [
  ...BUILT_IN_SECTIONS.map(entryOfSection),
  ...EN_CHANNEL_ENTRIES,
  ...UK_PFC_ENTRIES,
  ...US_CHANNEL_ENTRIES,
  ...AU_PFC_ENTRIES,
  ...AU_HOLLOW_ENTRIES,
  ...EN_HOLLOW_ENTRIES,
  ...US_HSS_ENTRIES,
  ...US_ROUND_HSS_ENTRIES,
];

interface EntryIndex {
  /** Whole names, compared as sectionKey does ('HE 200 A' = 'HEA200'), for project names that are not designations. */
  byName: Map<string, CatalogueEntry>;
  /** The different sections each designation key names, in table order (one for most keys). */
  byDesignation: Map<string, CatalogueEntry[]>;
}

/** Two tables name the same section only when shape and making agree (a cold-formed and a hot-finished tube differ). */
function sameSection(a: CatalogueEntry, b: CatalogueEntry): boolean {
  return a.process === b.process && JSON.stringify(a.dimensions) === JSON.stringify(b.dimensions);
}

function indexOf(entries: readonly CatalogueEntry[]): EntryIndex {
  const index: EntryIndex = { byName: new Map(), byDesignation: new Map() };
  for (const entry of entries) {
    index.byName.set(sectionKey(entry.name), entry);
    const key = designationKey(entry.designation ?? entry.name);
    if (!key) continue;
    for (const k of keysOf(key)) {
      const there = index.byDesignation.get(k);
      if (!there) index.byDesignation.set(k, [entry]);
      else if (!there.some((e) => sameSection(e, entry))) there.push(entry);
    }
  }
  return index;
}

const BUILT_IN_INDEX = indexOf(BUILT_IN_ENTRIES);

/** Lookups are repeated for thousands of members sharing a few texts; each cache is dropped when it grows this big. */
const CACHE_LIMIT = 20_000;

interface ProjectLookup {
  index: EntryIndex;
  cache: Map<string, CatalogueHit | null>;
}

const builtInCache = new Map<string, CatalogueHit | null>();
const projectLookups = new WeakMap<readonly CatalogueSection[], ProjectLookup>();

function projectLookup(project: readonly CatalogueSection[]): ProjectLookup {
  let lookup = projectLookups.get(project);
  if (!lookup) {
    lookup = { index: indexOf(project.map(entryOfSection)), cache: new Map() };
    projectLookups.set(project, lookup);
  }
  return lookup;
}

function hit(entry: CatalogueEntry | null | undefined, origin: CatalogueOrigin, designation: string): CatalogueHit | null | undefined {
  return entry ? { entry, origin, designation } : entry;
}

/**
 * The one section a designation names; where it names several, the one whose table's naming form the text is written
 * in, if exactly one; else null. Undefined when the key names nothing.
 */
function named(sections: readonly CatalogueEntry[] | undefined, found: DesignationMatch): CatalogueEntry | null | undefined {
  if (!sections) return undefined;
  if (sections.length === 1) return sections[0];
  const inForm = found.form ? sections.filter((e) => CATALOGUE_SOURCES[e.sourceId]?.namingForm === found.form) : [];
  return inForm.length === 1 ? inForm[0] : null;
}

function lookUp(text: string, project: EntryIndex | null): CatalogueHit | null {
  const trimmed = String(text).trim();
  if (!trimmed) return null;
  const name = sectionKey(trimmed);
  const byName = (project && hit(project.byName.get(name), 'project-catalogue', trimmed)) ?? hit(BUILT_IN_INDEX.byName.get(name), 'catalogue', trimmed);
  if (byName !== undefined) return byName;
  const found = designationIn(trimmed);
  if (!found) return null;
  const fromProject = project ? hit(named(project.byDesignation.get(found.key), found), 'project-catalogue', found.text) : undefined;
  return fromProject !== undefined ? fromProject : (hit(named(BUILT_IN_INDEX.byDesignation.get(found.key), found), 'catalogue', found.text) ?? null);
}

/**
 * The section named in `text`, from the project catalogue first, then the built-in tables; null when the text names
 * no section we know, or names one ambiguously. Never a near miss: '310UC97' does not find '310UC96.8'.
 */
export function findCatalogueEntry(text: string, project: readonly CatalogueSection[] = []): CatalogueHit | null {
  const lookup = project.length ? projectLookup(project) : null;
  const cache = lookup ? lookup.cache : builtInCache;
  const key = String(text);
  if (cache.has(key)) return cache.get(key)!;
  const result = lookUp(key, lookup ? lookup.index : null);
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(key, result);
  return result;
}

export { designationIn };
