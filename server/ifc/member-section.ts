/**
 * From a profile reading to the member's checked section: dimensions (from the file, or from the catalogue for a
 * name-only profile), fabrication, and the section properties of the engine. A profile that is not an I-section makes
 * the member "not applicable"; one that should be an I-section but cannot be used makes it "flagged", with the reason.
 * Results are kept per profile, because thousands of members share a handful of profiles.
 */
import { findSection, toSectionInput } from '../catalogue/catalogue';
import type { CatalogueSection } from '../catalogue/catalogue-section';
import type { ISectionInput } from '../engine/section';
import { SectionInputError } from '../engine/section';
import { sectionProperties } from '../engine/section-properties';
import { fabricationOf } from './fabrication';
import type { MemberFlag, MemberProfile, MemberSection, ProfileFlange } from './model-read-result';
import type { FlangeReading, IShapeReading, ProfileReading } from './profile-reader';

export type SectionOutcome =
  | { status: 'ok'; profile: MemberProfile; section: MemberSection; flags: MemberFlag[] }
  | { status: 'not-applicable'; reason: string }
  | { status: 'flagged'; reason: string; flags: MemberFlag[] };

function flangeOf(f: FlangeReading | ISectionInput['topFlange']): ProfileFlange {
  return {
    width_mm: f.width_mm,
    thickness_mm: f.thickness_mm,
    filletRadius_mm: f.filletRadius_mm,
    ...(f.edgeRadius_mm ? { edgeRadius_mm: f.edgeRadius_mm } : {}),
    ...(f.slope_rad ? { slope_rad: f.slope_rad } : {}),
  };
}

function describe(reading: ProfileReading, name: string | null = reading.name): string {
  return name ? `'${name}' (${reading.ifcType})` : `an unnamed ${reading.ifcType}`;
}

export class SectionResolver {
  private readonly cache = new WeakMap<ProfileReading, Map<string, SectionOutcome>>();

  constructor(private readonly projectCatalogue: readonly CatalogueSection[] = []) {}

  /**
   * `fallbackNames` are tried after the profile's own name for a name-only profile (the material profile's name, the
   * element's ObjectType), because exporters put the section designation in different places.
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

  private resolveUncached(reading: ProfileReading, fallbackNames: readonly (string | null)[]): SectionOutcome {
    switch (reading.kind) {
      case 'not-i-shape':
        return { status: 'not-applicable', reason: `Not an I-section: its profile is ${describe(reading)}.` };
      case 'unreadable':
        return { status: 'flagged', reason: `The section could not be read: ${reading.reason}.`, flags: ['invalid-profile'] };
      case 'i-shape':
        return this.fromIShape(reading);
      case 'name-only':
        return this.fromCatalogue(reading, fallbackNames);
    }
  }

  private fromIShape(reading: IShapeReading): SectionOutcome {
    const inRolledCatalogue = reading.name !== null && findSection(reading.name, this.projectCatalogue) !== null;
    const input: ISectionInput = {
      depth_mm: reading.depth_mm,
      webThickness_mm: reading.webThickness_mm,
      topFlange: reading.topFlange,
      bottomFlange: reading.bottomFlange,
      fabrication: fabricationOf({ ...reading, inRolledCatalogue }),
    };
    return this.withProperties(input, reading.name ?? '', 'ifc', reading.ifcType, reading.flags, describe(reading));
  }

  private fromCatalogue(reading: ProfileReading, fallbackNames: readonly (string | null)[]): SectionOutcome {
    const flags = reading.kind === 'name-only' ? reading.flags : [];
    const names = [reading.name, ...fallbackNames].filter((n): n is string => typeof n === 'string' && n.trim() !== '');
    for (const name of names) {
      const section = findSection(name, this.projectCatalogue);
      if (section) return this.withProperties(toSectionInput(section), name, 'catalogue', reading.ifcType, flags, describe(reading, name));
    }
    const reason = names.length
      ? `Its profile is an outline ${describe(reading)} and no section of that name is in the catalogue; add it to the project catalogue.`
      : `Its profile is ${describe(reading)} with no section name, so the section cannot be identified.`;
    return { status: 'flagged', reason, flags: [...flags, 'profile-not-in-catalogue'] };
  }

  private withProperties(
    input: ISectionInput,
    name: string,
    source: MemberProfile['source'],
    ifcType: string,
    flags: MemberFlag[],
    description: string,
  ): SectionOutcome {
    try {
      const properties = sectionProperties(input);
      const profile: MemberProfile = {
        name,
        source,
        ifcType,
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
      return { status: 'ok', profile, section, flags };
    } catch (error) {
      if (!(error instanceof SectionInputError)) throw error;
      return { status: 'flagged', reason: `The profile ${description} is not a valid I-section: ${error.message}.`, flags: [...flags, 'invalid-profile'] };
    }
  }
}
