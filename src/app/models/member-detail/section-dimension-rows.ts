/** A member's section in rows of words and values for the member panel: each family's own dimensions, tapered ends. */
import type { FlangeInput } from '../../../../server/engine/section';
import { dimensionsLabel } from '../../../../server/engine/section-family';
import type { MemberProfile, SectionDimensions } from '../models-api';
import { mmText } from '../model-words';

export interface DimensionRow {
  label: string;
  value: string;
}

/** One section along a varying member: where it is, its dimensions in a line, and whether checks use it. */
export interface StationRow {
  at: string;
  dimensions: string;
  governs: boolean;
}

const mm = (value: number): string => `${mmText(value)} mm`;

// Sloped flanges are given in percent in section tables (e.g. 8 % for UPN): common practice, no source.
const slopeText = (slope_rad: number): string => `${(Math.tan(slope_rad) * 100).toLocaleString('en', { maximumFractionDigits: 1 })} %`;

const flangeText = (flange: FlangeInput): string => `${mmText(flange.width_mm)} × ${mmText(flange.thickness_mm)} mm, r ${mm(flange.filletRadius_mm)}`;

/** Rows whose value is absent (optional dimensions the file did not give) are left out. */
function rows(entries: readonly [label: string, value: number | undefined, format?: (value: number) => string][]): DimensionRow[] {
  return entries.filter(([, value]) => value !== undefined).map(([label, value, format = mm]) => ({ label, value: format(value!) }));
}

/** The dimensions a family has, in the words of the trade, millimetres (slopes in percent). */
export function dimensionRows(d: SectionDimensions): DimensionRow[] {
  switch (d.family) {
    case 'I':
      return [
        { label: 'Depth', value: mm(d.depth_mm) },
        { label: 'Web thickness', value: mm(d.webThickness_mm) },
        { label: 'Top flange', value: flangeText(d.topFlange) },
        { label: 'Bottom flange', value: flangeText(d.bottomFlange) },
      ];
    case 'channel':
      return rows([
        ['Depth', d.depth_mm],
        ['Width, web included', d.width_mm],
        ['Web thickness', d.webThickness_mm],
        ['Flange thickness', d.flangeThickness_mm],
        ['Root radius', d.rootRadius_mm],
        ['Flange tip radius', d.edgeRadius_mm],
        ['Flange slope', d.slope_rad, slopeText],
        ['Lip', d.lip_mm],
      ]);
    case 'tee':
      return rows([
        ['Depth', d.depth_mm],
        ['Flange width', d.width_mm],
        ['Stem thickness', d.webThickness_mm],
        ['Flange thickness', d.flangeThickness_mm],
        ['Root radius', d.rootRadius_mm],
        ['Flange tip radius', d.flangeEdgeRadius_mm],
        ['Stem tip radius', d.webEdgeRadius_mm],
        ['Flange slope', d.flangeSlope_rad, slopeText],
        ['Stem slope', d.webSlope_rad, slopeText],
      ]);
    case 'angle':
      return rows([
        ['Leg along the depth', d.depth_mm],
        ['Leg along the width', d.width_mm],
        [d.widthLegThickness_mm === undefined ? 'Thickness' : 'Thickness of the depth leg', d.thickness_mm],
        ['Thickness of the width leg', d.widthLegThickness_mm],
        ['Root radius', d.rootRadius_mm],
        ['Leg tip radius', d.edgeRadius_mm],
      ]);
    case 'box':
      return rows([
        ['Depth', d.depth_mm],
        ['Width', d.width_mm],
        ['Side walls (webs)', d.webThickness_mm],
        ['Top and bottom walls', d.flangeThickness_mm],
        ['Outer corner radius', d.outerCornerRadius_mm],
        ['Inner corner radius', d.innerCornerRadius_mm],
      ]);
    case 'tube':
      return rows([
        ['Outside diameter', d.diameter_mm],
        ['Wall thickness', d.wallThickness_mm],
      ]);
    case 'plate':
      return rows([
        ['Depth', d.depth_mm],
        ['Width', d.width_mm],
      ]);
    case 'other':
      return [{ label: 'Shape', value: d.description }, ...rows([
        ['Overall depth', d.depth_mm],
        ['Overall width', d.width_mm],
      ])];
  }
}

/** Where along the member, as a share of its length from the start. */
export function stationText(at: number): string {
  const percent = `${Math.round(at * 100)} %`;
  if (at === 0) return `${percent} (start)`;
  if (at === 1) return `${percent} (end)`;
  return percent;
}

/** The sections along a varying member, start to end; none for a member of constant section. */
export function stationRows(profile: MemberProfile): StationRow[] {
  return (profile.along ?? []).map((station) => ({
    at: stationText(station.at),
    dimensions: dimensionsLabel(station.dimensions),
    governs: station.at === profile.governingAt,
  }));
}

/** Which section of a varying member the checks use: always the smallest, never a larger one. */
export function governingText(profile: MemberProfile): string | null {
  const { along, governingAt } = profile;
  if (!along?.length || governingAt === undefined) return null;
  const which = along.length === 2 ? 'smaller' : 'smallest';
  const where = governingAt === 0 ? 'at the start' : governingAt === 1 ? 'at the end' : `at ${Math.round(governingAt * 100)} % of the length`;
  return `The checks use the ${which} section, ${where}; never a larger one.`;
}
