/**
 * From what the file says about a member's section to the section it is checked with: parameters written in the file,
 * an outline or a body cut measured (geometry is the truth), else a designation looked up in the catalogues (a name is
 * only a fallback and a cross-check). I-sections get the engine's section properties and are checked; other families
 * are listed with their dimensions and are "not applicable" until their check exists; a section that cannot be
 * identified for certain makes the member "flagged" with the reason — never a guess.
 * Results are kept per profile, because thousands of members share a handful of profiles.
 */
import { findSection } from '../catalogue/catalogue';
import { findCatalogueEntry } from '../catalogue/catalogue-lookup';
import type { CatalogueHit, CatalogueSection } from '../catalogue/catalogue-section';
import type { FlangeInput, ISectionInput } from '../engine/section';
import { SectionInputError } from '../engine/section';
import { dimensionValues, overallDepth_mm, overallWidth_mm, SECTION_FAMILY_LABELS, webThickness_mm, type SectionDimensions, type SectionPolygon } from '../engine/section-family';
import { defaultFabrication } from '../engine/family-capacity';
import { polygonAxisSection } from '../engine/polygon-axis-section';
import { sectionOutline } from '../engine/section-outline';
import { normalisePolygon, polygonProperties, type PolygonProperties } from '../engine/section-polygon';
import { recogniseSection } from '../engine/section-recognition';
import { sectionProperties } from '../engine/section-properties';
import { fabricationOf } from './fabrication';
import { type MemberFlag, type MemberProfile, type MemberSection, type ProfileSource, sectionDimensionsOf } from './model-read-result';
import type { IShapeReading, ProfileReading } from './profile-reader';

/** Chord tolerance of the outlines members are measured with: far below any rolling tolerance (common practice, no source). */
const OUTLINE_TOLERANCE_MM = 0.01;

export type SectionOutcome =
  | { status: 'ok'; profile: MemberProfile; section: MemberSection; flags: MemberFlag[] }
  /** A section of a family without a web check yet: listed with its dimensions. */
  | { status: 'not-applicable'; reason: string; profile?: MemberProfile; flags: MemberFlag[] }
  | { status: 'flagged'; reason: string; flags: MemberFlag[] };

/** Zero toe radii and slopes are left out, as exporters that do not write them mean the same. */
function flangeOf(f: FlangeInput): FlangeInput {
  return {
    width_mm: f.width_mm,
    thickness_mm: f.thickness_mm,
    filletRadius_mm: f.filletRadius_mm,
    ...(f.edgeRadius_mm ? { edgeRadius_mm: f.edgeRadius_mm } : {}),
    ...(f.slope_rad ? { slope_rad: f.slope_rad } : {}),
  };
}

function describe(reading: Pick<ProfileReading, 'ifcType' | 'name'>, name: string | null = reading.name): string {
  return name ? `'${name}' (${reading.ifcType})` : `an unnamed ${reading.ifcType}`;
}

/** What a section was read from, for the member's profile. */
export interface SectionOrigin {
  name: string;
  source: ProfileSource;
  ifcType: string;
  flags: MemberFlag[];
}

export class SectionResolver {
  private readonly cache = new WeakMap<ProfileReading, Map<string, SectionOutcome>>();
  /** Recognitions by outline: members with the same body share one cut outline (body-cut.ts). */
  private readonly recognitions = new WeakMap<SectionPolygon, ReturnType<typeof recogniseSection>>();

  constructor(private readonly projectCatalogue: readonly CatalogueSection[] = []) {}

  /**
   * `fallbackNames` are tried after the profile's own name for a name-only profile (the material profile's name, the
   * element's ObjectType and Name, its type's name), because exporters put the section designation in different places.
   */
  resolve(reading: ProfileReading, fallbackNames: readonly (string | null)[] = []): SectionOutcome {
    const key = fallbackNames.join('\u0000');
    let byNames = this.cache.get(reading);
    if (!byNames) {
      byNames = new Map();
      this.cache.set(reading, byNames);
    }
    let outcome = byNames.get(key);
    if (!outcome) {
      outcome = this.resolveUncached(reading, fallbackNames);
      byNames.set(key, outcome);
    }
    return outcome;
  }

  /** A section known by its dimensions (from a parametric profile, a measured outline or a body cut). */
  fromDimensions(dimensions: SectionDimensions, origin: SectionOrigin, inRolledCatalogue = false): SectionOutcome {
    if (dimensions.family !== 'I') return this.fromOtherFamily(dimensions, origin);
    const input: ISectionInput = {
      depth_mm: dimensions.depth_mm,
      webThickness_mm: dimensions.webThickness_mm,
      topFlange: dimensions.topFlange,
      bottomFlange: dimensions.bottomFlange,
      fabrication: fabricationOf({ ...dimensions, inRolledCatalogue }),
    };
    return this.withProperties(input, origin);
  }

  /**
   * Channels, tees, angles, boxes and tubes are checked through their outline (engine/family-capacity.ts); plates and
   * other shapes have no shear rule and are listed with their dimensions only.
   */
  private fromOtherFamily(dimensions: Exclude<SectionDimensions, { family: 'I' }>, origin: SectionOrigin): SectionOutcome {
    const profile: MemberProfile = { ...dimensions, name: origin.name, source: origin.source, ifcType: origin.ifcType, fabrication: defaultFabrication(dimensions) };
    const family = SECTION_FAMILY_LABELS[dimensions.family];
    const named = origin.name ? `'${origin.name}': ${family}` : `Section: ${family}`;
    if (dimensions.family === 'plate' || dimensions.family === 'other') {
      return { status: 'not-applicable', reason: `${named}. There is no web shear rule for this family; it is listed with its dimensions only.`, profile, flags: origin.flags };
    }
    try {
      const major = polygonAxisSection(sectionOutline(dimensions, OUTLINE_TOLERANCE_MM), 'major');
      const section: MemberSection = {
        area_mm2: major.area_mm2,
        iMajor_mm4: major.i_mm4,
        qMax_mm3: major.firstMoment_mm3(major.neutralAxis_mm),
        neutralAxisFromBottom_mm: major.neutralAxis_mm - major.from_mm,
      };
      return { status: 'ok', profile, section, flags: origin.flags };
    } catch (error) {
      if (!(error instanceof SectionInputError)) throw error;
      return { status: 'flagged', reason: `${named} with dimensions that do not make a section: ${error.message}.`, flags: [...origin.flags, 'invalid-profile'] };
    }
  }

  private resolveUncached(reading: ProfileReading, fallbackNames: readonly (string | null)[]): SectionOutcome {
    switch (reading.kind) {
      case 'not-i-shape':
        return { status: 'not-applicable', reason: `Not a steel section Taulens reads: its profile is ${describe(reading)}.`, flags: [] };
      case 'unreadable':
        return { status: 'flagged', reason: `The section could not be read: ${reading.reason}.`, flags: ['invalid-profile'] };
      case 'i-shape':
        return this.fromIShape(reading);
      case 'parametric':
        return this.fromDimensions(reading.dimensions, { name: reading.name ?? '', source: 'ifc-profile', ifcType: reading.ifcType, flags: reading.flags });
      case 'outline':
        return this.fromOutline(reading.polygon, { name: reading.name ?? '', source: 'outline', ifcType: reading.ifcType, flags: reading.flags }, [reading.name, ...fallbackNames]);
      case 'name-only':
        return this.fromCatalogue(reading, fallbackNames);
    }
  }

  /**
   * A measured outline (a profile curve or a body cut): recognised from the geometry, its name only a cross-check. When
   * the geometry cannot be recognised, a named catalogue section is taken only if its own outline has the measured
   * area and second moments — otherwise the member is flagged with the reason.
   */
  fromOutline(polygon: SectionPolygon, origin: SectionOrigin, names: readonly (string | null)[]): SectionOutcome {
    const hit = this.lookUp(names);
    let recognition = this.recognitions.get(polygon);
    if (!recognition) {
      recognition = recogniseSection(polygon);
      this.recognitions.set(polygon, recognition);
    }
    if (recognition.status === 'recognised') {
      const measured = recognition.dimensions;
      const agrees = hit !== null && sameSection(hit.entry.dimensions, measured);
      const flags: MemberFlag[] = hit && !agrees ? [...origin.flags, 'name-and-geometry-differ'] : origin.flags;
      const name = origin.name || (agrees ? hit.entry.name : '');
      return this.fromDimensions(measured, { ...origin, name, flags }, agrees && hit.entry.process === 'hot-rolled');
    }
    if (hit && outlineMatches(polygon, hit.entry.dimensions)) {
      return this.fromDimensions(hit.entry.dimensions, { ...origin, name: origin.name || hit.entry.name, source: hit.origin }, hit.entry.process === 'hot-rolled');
    }
    const what = origin.name ? `'${origin.name}' (${origin.ifcType})` : `the ${origin.source === 'body-cut' ? 'body' : 'outline'} (${origin.ifcType})`;
    return { status: 'flagged', reason: `The section of ${what} could not be recognised: ${recognition.reason}`, flags: [...origin.flags, 'section-unrecognised'] };
  }

  /**
   * No dimensions from the file (a name-only profile, or a body that could not be cut): a designation is the only
   * fallback. `unread` says why the geometry gave none.
   */
  fromNamesOnly(names: readonly (string | null)[], unread: string, ifcType: string, flags: MemberFlag[] = []): SectionOutcome {
    const hit = this.lookUp(names);
    if (hit) return this.fromDimensions(hit.entry.dimensions, { name: hit.entry.name, source: hit.origin, ifcType, flags }, hit.entry.process === 'hot-rolled');
    const named = names.some((n) => typeof n === 'string' && n.trim() !== '');
    const reason = named
      ? `The section cannot be identified: ${unread}, and no section of its names is in the catalogues; add it to the project catalogue.`
      : `The section cannot be identified: ${unread}, and the member names no section.`;
    return { status: 'flagged', reason, flags: [...flags, 'profile-not-in-catalogue'] };
  }

  private lookUp(names: readonly (string | null)[]): CatalogueHit | null {
    for (const name of names) {
      if (typeof name !== 'string' || name.trim() === '') continue;
      const hit = findCatalogueEntry(name, this.projectCatalogue);
      if (hit) return hit;
    }
    return null;
  }

  private fromIShape(reading: IShapeReading): SectionOutcome {
    const inRolledCatalogue = reading.name !== null && findSection(reading.name, this.projectCatalogue) !== null;
    const { depth_mm, webThickness_mm, topFlange, bottomFlange } = reading;
    return this.fromDimensions(
      { family: 'I', depth_mm, webThickness_mm, topFlange, bottomFlange },
      { name: reading.name ?? '', source: 'ifc-profile', ifcType: reading.ifcType, flags: reading.flags },
      inRolledCatalogue,
    );
  }

  private fromCatalogue(reading: ProfileReading, fallbackNames: readonly (string | null)[]): SectionOutcome {
    const flags = reading.kind === 'name-only' ? reading.flags : [];
    const names = [reading.name, ...fallbackNames].filter((n): n is string => typeof n === 'string' && n.trim() !== '');
    const hit = this.lookUp(names);
    if (hit) return this.fromDimensions(hit.entry.dimensions, { name: hit.entry.name, source: hit.origin, ifcType: reading.ifcType, flags }, hit.entry.process === 'hot-rolled');
    const unread = reading.kind === 'name-only' && reading.reason ? ` (${reading.reason})` : '';
    const reason = names.length
      ? `Its profile ${describe(reading)} gives no dimensions${unread} and no section of that name is in the catalogues; add it to the project catalogue.`
      : `Its profile is ${describe(reading)} with no section name${unread}, so the section cannot be identified.`;
    return { status: 'flagged', reason, flags: [...flags, 'profile-not-in-catalogue'] };
  }

  private withProperties(input: ISectionInput, origin: SectionOrigin): SectionOutcome {
    try {
      const properties = sectionProperties(input);
      const profile: MemberProfile = {
        family: 'I',
        name: origin.name,
        source: origin.source,
        ifcType: origin.ifcType,
        fabrication: input.fabrication,
        depth_mm: input.depth_mm,
        webThickness_mm: input.webThickness_mm,
        topFlange: flangeOf(input.topFlange),
        bottomFlange: flangeOf(input.bottomFlange),
      };
      const section: MemberSection = {
        area_mm2: properties.area_mm2,
        iMajor_mm4: properties.iMajor_mm4,
        qMax_mm3: properties.qMax_mm3,
        neutralAxisFromBottom_mm: properties.neutralAxisFromBottom_mm,
      };
      return { status: 'ok', profile, section, flags: origin.flags };
    } catch (error) {
      if (!(error instanceof SectionInputError)) throw error;
      const description = origin.name ? `'${origin.name}' (${origin.ifcType})` : `an unnamed ${origin.ifcType}`;
      return { status: 'flagged', reason: `The profile ${description} is not a valid I-section: ${error.message}.`, flags: [...origin.flags, 'invalid-profile'] };
    }
  }
}

/** Name and geometry describe the same section: same family, every dimension within 2 % or 0.5 mm (common practice, no source). */
function sameSection(named: SectionDimensions, measured: SectionDimensions): boolean {
  if (named.family !== measured.family) return false;
  const a = dimensionValues(named);
  const b = dimensionValues(measured);
  const keys = Object.keys(a).filter((k) => !/radius|slope/i.test(k) && k in b);
  return keys.length > 0 && keys.every((k) => Math.abs(a[k] - b[k]) <= Math.max(0.5, 0.02 * Math.abs(a[k])));
}

/** Area and principal second moments within the tolerances recognition uses (1 % and 2 %). */
function outlineMatches(polygon: SectionPolygon, dimensions: SectionDimensions): boolean {
  const measured = normalisePolygon(polygon);
  if (measured.status !== 'valid') return false;
  let expected: PolygonProperties;
  try {
    expected = polygonProperties(sectionOutline(dimensions, 5e-4 * overallDepth_mm(dimensions)));
  } catch {
    return false;
  }
  const actual = polygonProperties(measured.polygon);
  const near = (x: number, y: number, tolerance: number): boolean => Math.abs(x - y) <= tolerance * Math.abs(y);
  return near(actual.area_mm2, expected.area_mm2, 0.01) && near(actual.iMajor_mm4, expected.iMajor_mm4, 0.02) && near(actual.iMinor_mm4, expected.iMinor_mm4, 0.02);
}

/** A rough size of the section's shear capacity (its web area) to tell the smaller end of a tapered member. */
function webArea_mm2(profile: MemberProfile): number {
  const d = sectionDimensionsOf(profile);
  return overallDepth_mm(d) * (webThickness_mm(d) ?? overallWidth_mm(d));
}

/** A section read at a point of a varying member: `at` is the fraction of the length from the start. */
export interface SectionAlong {
  at: number;
  outcome: SectionOutcome | undefined;
}

/**
 * The section of a varying member (a tapered solid's two ends, a sectioned solid's cross sections): every section kept
 * in `along`, the smallest web area governing — never a larger one. A section that cannot be read makes the member
 * flagged with its reason; sections of different families are not one member's taper, so they are flagged too.
 */
export function governingOfSections(sections: readonly SectionAlong[]): SectionOutcome {
  const percent = (at: number) => `${Math.round(at * 100)} %`;
  const missing = sections.find((s) => !s.outcome);
  if (missing || sections.length === 0) {
    const where = missing ? `at ${percent(missing.at)} of its length ` : '';
    return { status: 'flagged', reason: `The varying member's section ${where}is missing from the file.`, flags: ['tapered', 'invalid-profile'] };
  }
  const read: { at: number; outcome: Exclude<SectionOutcome, { status: 'flagged' }> }[] = [];
  for (const { at, outcome } of sections) {
    if (outcome!.status === 'flagged') return { ...outcome!, reason: `The varying member's section at ${percent(at)} of its length: ${outcome!.reason}`, flags: [...outcome!.flags, 'tapered'] };
    read.push({ at, outcome: outcome! });
  }
  const profiles = read.map((s) => s.outcome.profile);
  if (profiles.some((p) => !p)) return read.find((s) => !s.outcome.profile)!.outcome;
  if (new Set(profiles.map((p) => p!.family)).size > 1) {
    return { status: 'flagged', reason: 'The varying member changes from one section family to another along its length.', flags: ['tapered', 'invalid-profile'] };
  }
  let governing = read[0];
  for (const s of read) if (webArea_mm2(s.outcome.profile!) < webArea_mm2(governing.outcome.profile!)) governing = s;
  const along = read.map((s) => ({ at: s.at, dimensions: sectionDimensionsOf(s.outcome.profile!) }));
  const flags = [...new Set([...read.flatMap((s) => s.outcome.flags), 'tapered' as const])];
  return { ...governing.outcome, profile: { ...governing.outcome.profile!, along, governingAt: governing.at }, flags };
}
