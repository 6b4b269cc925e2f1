import {
  type LegendEntry,
  type RgbHex,
  NOT_CHECKED_COLOUR,
  STATUS_COLOURS,
  sectionColours,
  sectionLegend,
  statusLegend,
  utilisationColour,
  utilisationLegend,
} from './utilisation-colours';
import type { ViewerMember } from './viewer-member';

/** What the member colours show. */
export type ColourMode = 'utilisation' | 'status' | 'section';

export const COLOUR_MODE_LABELS: Readonly<Record<ColourMode, string>> = {
  utilisation: 'Utilisation',
  status: 'Check status',
  section: 'Section',
};

function sectionsOf(members: readonly ViewerMember[]): Map<string, RgbHex> {
  return sectionColours(members.flatMap((member) => (member.section === null ? [] : [member.section])));
}

/** GlobalId → colour for every member; members missing from the map are drawn as not checked. */
export function memberColours(members: readonly ViewerMember[], mode: ColourMode): Map<string, RgbHex> {
  const colours = new Map<string, RgbHex>();
  if (mode === 'utilisation') {
    for (const member of members) colours.set(member.globalId, utilisationColour(member.utilisationRatio));
  } else if (mode === 'status') {
    for (const member of members) colours.set(member.globalId, STATUS_COLOURS[member.status]);
  } else {
    const bySection = sectionsOf(members);
    for (const member of members) {
      const colour = member.section === null ? undefined : bySection.get(member.section);
      colours.set(member.globalId, colour ?? NOT_CHECKED_COLOUR);
    }
  }
  return colours;
}

/** The legend that matches `memberColours(members, mode)`. */
export function legendFor(mode: ColourMode, members: readonly ViewerMember[]): LegendEntry[] {
  if (mode === 'utilisation') return utilisationLegend();
  if (mode === 'status') return statusLegend();
  return sectionLegend(sectionsOf(members));
}
