/**
 * The main dimensions of a section of another family (channel, tee, angle, box, tube) as marks to draw on its
 * calculation sheet, in the notation of the run's standard, shared by the web sheet and the PDF. Positions are
 * section millimetres in the frame of the outline the sheet draws: the section's own frame (centred on its bounding
 * box, y along the depth) for the major axis, turned a quarter for the minor axis so the shear always runs up the page.
 *
 * Symbols: EN 1993-1-1 §1.7 and Table 5.2 (h, b, tw, tf, t, d for a tube); AISC, the Manual's dimension tables (d, bf,
 * tw, tf; H, B, t for rectangular HSS; D, t for round HSS; from memory).
 */
import type { FamilySheetSection } from '../checks/checks-api-types';
import type { Standard } from '../engine/check';
import type { Point2_mm } from '../engine/section-family';
import type { ShearAxis } from '../engine/shear-axis';
import { formatNumber } from '../engine/trace';

type FamilyDimensions = FamilySheetSection['dimensions'];
export type MarkSide = 'left' | 'right' | 'top' | 'bottom';

/**
 * 'extent': an overall size, drawn outside the outline on `side` from `from` to `to` (their coordinate across the
 * side is the outline's edge). 'thickness': a plate's thickness across it from `from` to `to`, labelled beyond `to`.
 */
export interface SectionDimensionMark {
  key: 'depth' | 'width' | 'web' | 'flange' | 'wall';
  kind: 'extent' | 'thickness';
  side: MarkSide;
  label: string;
  from: Point2_mm;
  to: Point2_mm;
}

interface Symbols {
  depth: string;
  width: string;
  web: string;
  flange: string;
  wall: string;
}

const EN: Symbols = { depth: 'h', width: 'b', web: 'tw', flange: 'tf', wall: 't' };
const AISC: Symbols = { depth: 'd', width: 'bf', web: 'tw', flange: 'tf', wall: 't' };

function symbolsOf(d: FamilyDimensions, standard: Standard): Symbols & { diameter: string } {
  if (standard === 'en1993-1-1') return { ...EN, diameter: 'd' };
  if (d.family === 'box') return { ...AISC, depth: 'H', width: 'B', diameter: 'D' };
  if (d.family === 'angle') return { ...AISC, width: 'b', wall: 't', diameter: 'D' };
  return { ...AISC, diameter: 'D' };
}

const labelled = (symbol: string, value_mm: number): string => `${symbol} = ${formatNumber(value_mm)}`;

function extent(key: 'depth' | 'width', side: MarkSide, label: string, half_mm: number, edge_mm: number): SectionDimensionMark {
  const vertical = side === 'left' || side === 'right';
  return vertical
    ? { key, kind: 'extent', side, label, from: [edge_mm, -half_mm], to: [edge_mm, half_mm] }
    : { key, kind: 'extent', side, label, from: [-half_mm, edge_mm], to: [half_mm, edge_mm] };
}

function thickness(key: 'web' | 'flange' | 'wall', side: MarkSide, label: string, from: Point2_mm, to: Point2_mm): SectionDimensionMark {
  return { key, kind: 'thickness', side, label, from, to };
}

/** The marks in the section's own frame. Thickness marks sit off mid-depth, clear of the neutral axis. */
function ownFrameMarks(d: FamilyDimensions, standard: Standard): SectionDimensionMark[] {
  const s = symbolsOf(d, standard);
  if (d.family === 'tube') {
    const R = d.diameter_mm / 2;
    const r = R - d.wallThickness_mm;
    const c = Math.SQRT1_2;
    return [
      extent('depth', 'left', labelled(s.diameter, d.diameter_mm), R, -R),
      thickness('wall', 'right', labelled(s.wall, d.wallThickness_mm), [r * c, r * c], [R * c, R * c]),
    ];
  }
  const h = d.depth_mm / 2;
  const b = d.width_mm / 2;
  const marks = [extent('depth', 'left', labelled(s.depth, d.depth_mm), h, -b)];
  switch (d.family) {
    case 'channel':
      marks.push(
        extent('width', 'top', labelled(s.width, d.width_mm), b, h),
        thickness('web', 'right', labelled(s.web, d.webThickness_mm), [-b + d.webThickness_mm, 0.25 * h], [-b, 0.25 * h]),
        thickness('flange', 'right', labelled(s.flange, d.flangeThickness_mm), [b - 0.3 * d.width_mm, h - d.flangeThickness_mm], [b - 0.3 * d.width_mm, h]),
      );
      break;
    case 'tee':
      marks.push(
        extent('width', 'top', labelled(s.width, d.width_mm), b, h),
        thickness('web', 'right', labelled(s.web, d.webThickness_mm), [-d.webThickness_mm / 2, -0.5 * h], [d.webThickness_mm / 2, -0.5 * h]),
        thickness('flange', 'right', labelled(s.flange, d.flangeThickness_mm), [0.7 * b, h - d.flangeThickness_mm], [0.7 * b, h]),
      );
      break;
    case 'angle': {
      marks.push(
        extent('width', 'bottom', labelled(s.width, d.width_mm), b, -h),
        thickness('wall', 'right', labelled(s.wall, d.thickness_mm), [-b, 0.4 * h], [-b + d.thickness_mm, 0.4 * h]),
      );
      const t2 = d.widthLegThickness_mm;
      if (t2 !== undefined && t2 !== d.thickness_mm) {
        marks.push(thickness('flange', 'right', labelled(s.wall, t2), [0.5 * b, -h], [0.5 * b, -h + t2]));
      }
      break;
    }
    case 'plate':
    case 'other':
      marks.push(extent('width', 'top', labelled(s.width, d.width_mm), b, h));
      break;
    case 'box': {
      marks.push(extent('width', 'top', labelled(s.width, d.width_mm), b, h));
      const same = d.webThickness_mm === d.flangeThickness_mm;
      marks.push(thickness('web', 'right', labelled(same ? s.wall : s.web, d.webThickness_mm), [b - d.webThickness_mm, 0.25 * h], [b, 0.25 * h]));
      if (!same) marks.push(thickness('flange', 'right', labelled(s.flange, d.flangeThickness_mm), [0.3 * b, h - d.flangeThickness_mm], [0.3 * b, h]));
      break;
    }
  }
  return marks;
}

/** A quarter turn counter-clockwise, (x, y) → (−y, x): the turn engine/shear-axis.ts gives the minor axis. */
const turned = ([x, y]: Point2_mm): Point2_mm => [-y, x];
const TURNED_SIDE: Readonly<Record<MarkSide, MarkSide>> = { left: 'bottom', top: 'left', right: 'top', bottom: 'right' };

/** The marks of a family's section for the frame its sheet is drawn in (turned for the minor axis). */
export function sectionDimensionMarks(d: FamilyDimensions, standard: Standard, axis: ShearAxis): SectionDimensionMark[] {
  const marks = ownFrameMarks(d, standard);
  if (axis === 'major') return marks;
  return marks.map((mark) => ({
    ...mark,
    side: mark.kind === 'extent' ? TURNED_SIDE[mark.side] : mark.side,
    from: turned(mark.from),
    to: turned(mark.to),
  }));
}

/** The formula of the web average the run reports for each family (engine/section-family.ts webShearArea_mm2). */
export const WEB_AVERAGE_FORMULAS: Readonly<Record<FamilyDimensions['family'], string>> = {
  channel: 'V/(hw·tw)',
  tee: 'V/(hw·tw)',
  box: 'V/(2·hw·tw)',
  angle: 'V/(h·t)',
  tube: 'V/(π·(d − t)·t/2)',
  plate: 'V/(h·b)',
  other: 'V/(h·b)',
};
