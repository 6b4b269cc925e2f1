/**
 * From a section outline (a profile curve evaluated, or a body cut normal to the member axis) to a section family and
 * its dimensions.
 *
 * The outline is cleaned and checked, turned onto its dominant edge directions, and tried in the four quarter turns
 * (the web of an I can come out of a body cut horizontal). Each family is read with straight lines across the
 * outline: web and flange thicknesses where the faces are straight, flange slopes from two thicknesses along the
 * outstand, radii from the points where straight faces end (the arcs' tangent points) or from the file's arcs.
 *
 * Safety: a reading is only accepted when the idealised section rebuilt from the dimensions (section-outline.ts) has
 * the outline's area within 1 % and second moments within 2 %. One size step in a rolled series changes the area by
 * 5–15 %, so a reading that passes cannot be a neighbouring size or another shape; the rebuild is drawn with the same
 * chord error as the outline, so a coarsely faceted cut is not refused for its facets. I goes with the square of the
 * distances, hence twice the area tolerance. An outline that is close to a family but fails any check is
 * 'unrecognised' with the reason — never a guessed section.
 */
import { SectionInputError } from './section';
import type { FlangeInput } from './section';
import type { OutlineArc, Point2_mm, SectionDimensions, SectionFamily, SectionPolygon } from './section-family';
import { overallDepth_mm } from './section-family';
import { sectionOutline } from './section-outline';
import {
  type Crossing,
  type PolygonProperties,
  alignToEdges,
  crossings,
  intervals,
  normalisePolygon,
  polygonProperties,
  quarterTurn,
  signedArea_mm2,
  loopBounds,
} from './section-polygon';

/**
 * 'rotated': the section lies turned in the outline's plane (see rotation_rad). 'coarse-arcs': arcs came as few chords
 * (a faceted body), so radii are read from the facets' corners and are approximate. 'radii-from-arcs': radii are the
 * file's own arcs.
 */
export type RecognitionFlag = 'rotated' | 'coarse-arcs' | 'radii-from-arcs';

export interface RecognitionOptions {
  /** Largest relative difference of area between the outline and the rebuilt section; 0.01 by default. */
  areaTolerance?: number;
  /** Largest relative difference of either second moment; 0.02 by default. */
  inertiaTolerance?: number;
}

export interface RecognisedSection {
  status: 'recognised';
  dimensions: SectionDimensions;
  /**
   * Counter-clockwise rotation that brings the outline into the family's local axes, with the local origin (centre of
   * the bounding box) at `origin_mm` of the input: local = R(rotation_rad)·(input − origin_mm).
   */
  rotation_rad: number;
  origin_mm: Point2_mm;
  /** The outline's own properties, in the family's local axes. */
  properties: PolygonProperties;
  flags: RecognitionFlag[];
}

export type SectionRecognition = RecognisedSection | { status: 'unrecognised'; reason: string };

const AREA_TOLERANCE = 0.01;
const INERTIA_TOLERANCE = 0.02;
/** Vertices within this fraction of the section's size lie on the same straight face. */
const ON_LINE_RELATIVE = 1e-5;
/** Measurements that should be equal (both sides of a web, both flanges of a channel) may differ by this fraction. */
const EQUAL_RELATIVE = 0.002;
/** Chord error of the curve evaluator (0.05 % of the depth); coarser chords are a faceted body's. */
const FINE_CHORDS_RELATIVE = 0.0005;
/** Flange thicknesses are read at these fractions of the outstand, clear of fillets and toe radii. */
const SLOPE_STATIONS = [0.35, 0.65] as const;

/** A measurement that does not describe the family: the outline is close to it, but something is off. */
interface NearMiss {
  nearMiss: string;
}

const isNearMiss = (x: unknown): x is NearMiss => typeof x === 'object' && x !== null && 'nearMiss' in x;

/** An outline in a candidate orientation, bounding box centred on the origin, with its tolerances. */
interface Local {
  p: SectionPolygon;
  arcs: readonly OutlineArc[];
  depth_mm: number;
  width_mm: number;
  onLine_mm: number;
  equal_mm: number;
  /** Offset from an outer face for a line that runs just inside it. */
  inset_mm: number;
}

interface Reading {
  dimensions: SectionDimensions;
  fromArcs: boolean;
}

function fmt(value_mm: number): string {
  return String(Math.round(value_mm * 10) / 10);
}

function localOf(p: SectionPolygon): Local {
  const b = loopBounds(p.outer);
  const depth_mm = b.maxY_mm - b.minY_mm;
  const width_mm = b.maxX_mm - b.minX_mm;
  const size = Math.max(depth_mm, width_mm);
  return { p, arcs: p.arcs ?? [], depth_mm, width_mm, onLine_mm: ON_LINE_RELATIVE * size, equal_mm: EQUAL_RELATIVE * size, inset_mm: 1e-6 * size };
}

/** The one solid stretch of a line, or undefined when the line crosses the section more than once or not at all. */
function single(l: Local, axis: 'x' | 'y', level_mm: number): [number, number] | undefined {
  const found = intervals(l.p, axis, level_mm);
  return found.length === 1 ? found[0] : undefined;
}

function crossingNear(l: Local, axis: 'x' | 'y', level_mm: number, at_mm: number): Crossing | undefined {
  return crossings(l.p, axis, level_mm).find((c) => Math.abs(c.at_mm - at_mm) <= l.equal_mm);
}

/** A radius read from tangent points, replaced by the file's arc of about the same place and size when there is one. */
function refineRadius(l: Local, radius_mm: number, centre: Point2_mm): { radius_mm: number; fromArc: boolean } {
  if (radius_mm <= l.onLine_mm) return { radius_mm: 0, fromArc: false };
  const near = Math.max(l.equal_mm, 0.25 * radius_mm);
  const arc = l.arcs.find((a) => Math.abs(a.radius_mm - radius_mm) <= near && Math.hypot(a.centre[0] - centre[0], a.centre[1] - centre[1]) <= near);
  return arc ? { radius_mm: arc.radius_mm, fromArc: true } : { radius_mm, fromArc: false };
}

/** Web (or stem) read at several levels: one solid stretch each, all of the same width and centre. */
function webAt(l: Local, levels_mm: readonly number[]): { centre_mm: number; thickness_mm: number } | undefined {
  const stretches = levels_mm.map((y) => single(l, 'y', y));
  const first = stretches[0];
  if (!first) return undefined;
  const centre_mm = (first[0] + first[1]) / 2;
  const thickness_mm = first[1] - first[0];
  const alike = stretches.every((s) => s && Math.abs(s[1] - s[0] - thickness_mm) <= l.equal_mm && Math.abs((s[0] + s[1]) / 2 - centre_mm) <= l.equal_mm);
  return alike ? { centre_mm, thickness_mm } : undefined;
}

/** Where a flange's outstand is read: u runs from `axisX_mm` (the web axis, or a channel's web back) towards the tip. */
interface FlangeFrame {
  name: string;
  /** +1: outer face at the top of the outline; −1: at the bottom. */
  face: 1 | -1;
  axisX_mm: number;
  webHalf_mm: number;
  halfWidth_mm: number;
  sides: readonly (1 | -1)[];
  /** A level where the web face is straight. */
  webLevel_mm: number;
}

interface FlangeReading {
  flange: FlangeInput;
  fromArcs: boolean;
}

/** Flange thickness z from the outer face at u along the outstand on one side, or undefined if the line misses it. */
function flangeDepthAt(l: Local, f: FlangeFrame, side: 1 | -1, u_mm: number): number | undefined {
  const h = l.depth_mm / 2;
  const found = intervals(l.p, 'x', f.axisX_mm + side * u_mm);
  const stretch = f.face === 1 ? found[found.length - 1] : found[0];
  if (!stretch) return undefined;
  const [a, b] = stretch;
  const touches = f.face === 1 ? Math.abs(b - h) <= l.onLine_mm : Math.abs(a + h) <= l.onLine_mm;
  return touches ? (f.face === 1 ? h - a : b + h) : undefined;
}

/** Depth from the flange's outer face of the end of an edge nearer to (towards: 1) or farther from the face. */
function edgeEndDepth(l: Local, f: FlangeFrame, edge: Crossing, towardsFace: boolean): number {
  const ys = [edge.from[1], edge.to[1]].map((y) => l.depth_mm / 2 - f.face * y);
  return towardsFace ? Math.min(...ys) : Math.max(...ys);
}

function readOutstand(l: Local, f: FlangeFrame, side: 1 | -1): { t_mm: number; slopeTan: number; r_mm: number; r2_mm: number; fromArcs: boolean } | NearMiss {
  const outstand_mm = f.halfWidth_mm - f.webHalf_mm;
  const mid = flangeDepthAt(l, f, side, f.webHalf_mm + outstand_mm / 2);
  const [u1, u2] = SLOPE_STATIONS.map((s) => f.webHalf_mm + s * outstand_mm);
  const z1 = flangeDepthAt(l, f, side, u1);
  const z2 = flangeDepthAt(l, f, side, u2);
  if (mid === undefined || z1 === undefined || z2 === undefined) return { nearMiss: `its ${f.name} could not be measured half-way along its outstand` };
  const drop = z1 - z2;
  const slopeTan = Math.abs(drop) <= l.onLine_mm ? 0 : drop / (u2 - u1);
  if (slopeTan < 0) return { nearMiss: `its ${f.name} gets thicker towards the tip, which no rolled section does` };
  const secant = Math.sqrt(1 + slopeTan * slopeTan);
  const webFace = crossingNear(l, 'y', f.webLevel_mm, f.axisX_mm + side * f.webHalf_mm);
  const tip = crossingNear(l, 'y', f.face * (l.depth_mm / 2 - l.inset_mm), f.axisX_mm + side * f.halfWidth_mm);
  if (!webFace || !tip || Math.abs(webFace.from[0] - webFace.to[0]) > l.onLine_mm) {
    return { nearMiss: `the web face or the tip of its ${f.name} is not a straight edge` };
  }
  // A circle tangent to the web face and to the (sloped) inner face: its tangent point on the web lies
  // (T_root + r·(sec α − tan α)) from the outer face; the toe circle likewise from the tip (section.ts flangeGeometry).
  const webTangent_mm = edgeEndDepth(l, f, webFace, true);
  const tipEnd_mm = edgeEndDepth(l, f, tip, false);
  const r = (webTangent_mm - (mid + (outstand_mm / 2) * slopeTan)) / (secant - slopeTan);
  const r2 = (mid - (outstand_mm / 2) * slopeTan - tipEnd_mm) / (secant - slopeTan);
  if (r < -l.equal_mm || r2 < -l.equal_mm) return { nearMiss: `the corners of its ${f.name} are cut away (notched or coped)` };
  const y = (z: number): number => f.face * (l.depth_mm / 2 - z);
  const fillet = refineRadius(l, r, [f.axisX_mm + side * (f.webHalf_mm + r), y(webTangent_mm)]);
  const toe = refineRadius(l, r2, [f.axisX_mm + side * (f.halfWidth_mm - r2), y(tipEnd_mm)]);
  return { t_mm: mid, slopeTan, r_mm: fillet.radius_mm, r2_mm: toe.radius_mm, fromArcs: fillet.fromArc || toe.fromArc };
}

function readFlange(l: Local, f: FlangeFrame): FlangeReading | NearMiss {
  const sides = f.sides.map((side) => readOutstand(l, f, side));
  const [first, second] = sides;
  if (isNearMiss(first)) return first;
  if (second && isNearMiss(second)) return second;
  if (second && !isNearMiss(second)) {
    const differ = (a: number, b: number) => Math.abs(a - b) > l.equal_mm;
    const outstand_mm = f.halfWidth_mm - f.webHalf_mm;
    if (differ(first.t_mm, second.t_mm) || differ(first.slopeTan * outstand_mm, second.slopeTan * outstand_mm)) {
      return { nearMiss: `its ${f.name} is not the same on both sides of the web (${fmt(first.t_mm)} and ${fmt(second.t_mm)} mm thick)` };
    }
    if (differ(first.r_mm, second.r_mm) || differ(first.r2_mm, second.r2_mm)) {
      return { nearMiss: `the fillets of its ${f.name} differ on the two sides of the web (${fmt(first.r_mm)} and ${fmt(second.r_mm)} mm)` };
    }
  }
  const flange: FlangeInput = { width_mm: 2 * f.halfWidth_mm, thickness_mm: first.t_mm, filletRadius_mm: first.r_mm };
  if (first.r2_mm > 0) flange.edgeRadius_mm = first.r2_mm;
  if (first.slopeTan > 0) flange.slope_rad = Math.atan(first.slopeTan);
  return { flange, fromArcs: first.fromArcs || (second !== undefined && !isNearMiss(second) && second.fromArcs) };
}

/** The two flange stretches just inside the top and bottom faces. */
function outerStretches(l: Local): { top?: [number, number]; bottom?: [number, number] } {
  const h = l.depth_mm / 2;
  return { top: single(l, 'y', h - l.inset_mm), bottom: single(l, 'y', -h + l.inset_mm) };
}

function offCentre(l: Local, stretch: [number, number], centre_mm: number, what: string, family: string): NearMiss | undefined {
  const offset_mm = Math.abs((stretch[0] + stretch[1]) / 2 - centre_mm);
  return offset_mm > l.equal_mm ? { nearMiss: `The outline is ${family} but its ${what} is off-centre from the web by ${fmt(offset_mm)} mm` } : undefined;
}

function readI(l: Local): Reading | NearMiss | undefined {
  if (l.p.voids.length > 0) return undefined;
  const h = l.depth_mm / 2;
  const web = webAt(l, [0, h / 3, -h / 3]);
  const { top, bottom } = outerStretches(l);
  if (!web || !top || !bottom) return undefined;
  const left = web.centre_mm - web.thickness_mm / 2;
  const right = web.centre_mm + web.thickness_mm / 2;
  const beyondWeb = (s: [number, number]) => s[0] < left - l.equal_mm && s[1] > right + l.equal_mm;
  if (!beyondWeb(top) || !beyondWeb(bottom)) return undefined;
  const off = offCentre(l, top, web.centre_mm, 'top flange', 'I-like') ?? offCentre(l, bottom, web.centre_mm, 'bottom flange', 'I-like');
  if (off) return off;
  const frame = (name: string, face: 1 | -1, s: [number, number]): FlangeFrame => ({
    name,
    face,
    axisX_mm: web.centre_mm,
    webHalf_mm: web.thickness_mm / 2,
    halfWidth_mm: (s[1] - s[0]) / 2,
    sides: [1, -1],
    webLevel_mm: 0,
  });
  const topFlange = readFlange(l, frame('top flange', 1, top));
  if (isNearMiss(topFlange)) return { nearMiss: `The outline is I-like but ${topFlange.nearMiss}` };
  const bottomFlange = readFlange(l, frame('bottom flange', -1, bottom));
  if (isNearMiss(bottomFlange)) return { nearMiss: `The outline is I-like but ${bottomFlange.nearMiss}` };
  return {
    dimensions: { family: 'I', depth_mm: l.depth_mm, webThickness_mm: web.thickness_mm, topFlange: topFlange.flange, bottomFlange: bottomFlange.flange },
    fromArcs: topFlange.fromArcs || bottomFlange.fromArcs,
  };
}

function readChannel(l: Local): Reading | NearMiss | undefined {
  if (l.p.voids.length > 0) return undefined;
  const h = l.depth_mm / 2;
  const b = l.width_mm / 2;
  const web = webAt(l, [0, h / 3, -h / 3]);
  const { top, bottom } = outerStretches(l);
  if (!web || !top || !bottom) return undefined;
  const tw = web.thickness_mm;
  const atBack = (s: [number, number]) => Math.abs(s[0] + b) <= l.onLine_mm;
  if (!atBack([web.centre_mm - tw / 2, 0]) || !atBack(top) || !atBack(bottom) || tw > b) return undefined;
  if (top[1] < -b + tw + l.equal_mm || bottom[1] < -b + tw + l.equal_mm) return undefined;
  if (Math.abs(top[1] - bottom[1]) > l.equal_mm) {
    return { nearMiss: `The outline is channel-like but its flanges differ in width by ${fmt(Math.abs(top[1] - bottom[1]))} mm` };
  }
  const frame = (name: string, face: 1 | -1): FlangeFrame => ({ name, face, axisX_mm: -b, webHalf_mm: tw, halfWidth_mm: 2 * b, sides: [1], webLevel_mm: 0 });
  const readings = [readFlange(l, frame('top flange', 1)), readFlange(l, frame('bottom flange', -1))];
  const miss = readings.find(isNearMiss);
  if (miss) return { nearMiss: `The outline is channel-like but ${miss.nearMiss}` };
  const [upper, lower] = readings as FlangeReading[];
  const differ = (x = 0, y = 0) => Math.abs(x - y) > l.equal_mm;
  const f = upper.flange;
  const g = lower.flange;
  if (differ(f.thickness_mm, g.thickness_mm) || differ(f.filletRadius_mm, g.filletRadius_mm) || differ(f.edgeRadius_mm, g.edgeRadius_mm)) {
    return { nearMiss: `The outline is channel-like but its two flanges differ (${fmt(f.thickness_mm)} and ${fmt(g.thickness_mm)} mm thick)` };
  }
  const dimensions: SectionDimensions = {
    family: 'channel',
    depth_mm: l.depth_mm,
    width_mm: l.width_mm,
    webThickness_mm: tw,
    flangeThickness_mm: f.thickness_mm,
    rootRadius_mm: f.filletRadius_mm,
  };
  if (f.edgeRadius_mm) dimensions.edgeRadius_mm = f.edgeRadius_mm;
  if (f.slope_rad) dimensions.slope_rad = f.slope_rad;
  return { dimensions, fromArcs: upper.fromArcs || lower.fromArcs };
}

function readTee(l: Local): Reading | NearMiss | undefined {
  if (l.p.voids.length > 0) return undefined;
  const h = l.depth_mm / 2;
  const stem = webAt(l, [-h / 2, 0]);
  const { top, bottom } = outerStretches(l);
  if (!stem || !top || !bottom) return undefined;
  const w = stem.thickness_mm / 2;
  const beyondStem = top[0] < stem.centre_mm - w - l.equal_mm && top[1] > stem.centre_mm + w + l.equal_mm;
  if (!beyondStem || bottom[1] - bottom[0] > stem.thickness_mm + l.equal_mm) return undefined;
  const off = offCentre(l, top, stem.centre_mm, 'flange', 'tee-like');
  if (off) return off;
  const read = readFlange(l, { name: 'flange', face: 1, axisX_mm: stem.centre_mm, webHalf_mm: w, halfWidth_mm: (top[1] - top[0]) / 2, sides: [1, -1], webLevel_mm: -h / 2 });
  if (isNearMiss(read)) return { nearMiss: `The outline is tee-like but ${read.nearMiss}` };
  // Rounded corners at the foot of the stem end the straight stem face.
  const face = crossingNear(l, 'y', -h / 2, stem.centre_mm + w);
  const foot_mm = face ? Math.min(face.from[1], face.to[1]) + h : 0;
  const foot = refineRadius(l, foot_mm, [stem.centre_mm + w - foot_mm, -h + foot_mm]);
  const f = read.flange;
  const dimensions: SectionDimensions = {
    family: 'tee',
    depth_mm: l.depth_mm,
    width_mm: f.width_mm,
    webThickness_mm: stem.thickness_mm,
    flangeThickness_mm: f.thickness_mm,
    rootRadius_mm: f.filletRadius_mm,
  };
  if (f.edgeRadius_mm) dimensions.flangeEdgeRadius_mm = f.edgeRadius_mm;
  if (f.slope_rad) dimensions.flangeSlope_rad = f.slope_rad;
  if (foot.radius_mm > 0) dimensions.webEdgeRadius_mm = foot.radius_mm;
  return { dimensions, fromArcs: read.fromArcs || foot.fromArc };
}

function readAngle(l: Local): Reading | NearMiss | undefined {
  if (l.p.voids.length > 0) return undefined;
  const h = l.depth_mm / 2;
  const b = l.width_mm / 2;
  const upright = [single(l, 'y', h / 2), single(l, 'y', 0)];
  const flat = [single(l, 'x', b / 2), single(l, 'x', 0)];
  const top = single(l, 'y', h - l.inset_mm);
  const tip = single(l, 'x', b - l.inset_mm);
  // Lines along x start at the back of the upright leg (x = −b); lines along y at the underside (y = −h).
  const fromBack = (s: [number, number] | undefined, back_mm: number) => s !== undefined && Math.abs(s[0] + back_mm) <= l.onLine_mm;
  if (![...upright, top].every((s) => fromBack(s, b)) || ![...flat, tip].every((s) => fromBack(s, h))) return undefined;
  const [u1, u2] = upright as [number, number][];
  const [f1, f2] = flat as [number, number][];
  const t = u1[1] - u1[0];
  const t2 = f1[1] - f1[0];
  if (t > b || t2 > h) return undefined;
  if (Math.abs(u2[1] - u2[0] - t) > l.equal_mm || Math.abs(f2[1] - f2[0] - t2) > l.equal_mm) {
    return { nearMiss: 'The outline is angle-like but its legs taper' };
  }
  const legFace = crossingNear(l, 'y', h / 2, -b + t);
  const flatFace = crossingNear(l, 'x', b / 2, -h + t2);
  const legTop = crossingNear(l, 'x', -b + l.inset_mm, h);
  const flatTip = crossingNear(l, 'y', -h + l.inset_mm, b);
  if (!legFace || !flatFace || !legTop || !flatTip) return { nearMiss: 'The outline is angle-like but its leg faces are not straight' };
  const r = Math.min(legFace.from[1], legFace.to[1]) - (-h + t2);
  const rFlat = Math.min(flatFace.from[0], flatFace.to[0]) - (-b + t);
  const r2 = -b + t - Math.max(legTop.from[0], legTop.to[0]);
  const r2Flat = -h + t2 - Math.max(flatTip.from[1], flatTip.to[1]);
  if (Math.abs(r - rFlat) > l.equal_mm || Math.abs(r2 - r2Flat) > l.equal_mm) {
    return { nearMiss: `The outline is angle-like but its root fillet or toe radii differ between the legs (${fmt(r)} and ${fmt(rFlat)} mm)` };
  }
  if (r < -l.equal_mm || r2 < -l.equal_mm) return { nearMiss: 'The outline is angle-like but its corners are cut away' };
  const fillet = refineRadius(l, r, [-b + t + r, -h + t2 + r]);
  const toe = refineRadius(l, r2, [-b + t - r2, h - r2]);
  const dimensions: SectionDimensions = { family: 'angle', depth_mm: l.depth_mm, width_mm: l.width_mm, thickness_mm: t, rootRadius_mm: fillet.radius_mm };
  if (toe.radius_mm > 0) dimensions.edgeRadius_mm = toe.radius_mm;
  if (Math.abs(t2 - t) > l.onLine_mm) dimensions.widthLegThickness_mm = t2;
  return { dimensions, fromArcs: fillet.fromArc || toe.fromArc };
}

/** Share of its bounding box a loop fills: 1 for a rectangle, 1 − (4 − π)r²/(bh) with rounded corners. */
function fullness(loop: readonly Point2_mm[]): number {
  const b = loopBounds(loop);
  return Math.abs(signedArea_mm2(loop)) / ((b.maxX_mm - b.minX_mm) * (b.maxY_mm - b.minY_mm));
}

function readBox(l: Local): Reading | NearMiss | undefined {
  if (l.p.voids.length !== 1) return undefined;
  const opening = l.p.voids[0];
  if (fullness(l.p.outer) < 0.85 || fullness(opening) < 0.85) return undefined;
  const h = l.depth_mm / 2;
  const b = l.width_mm / 2;
  const v = loopBounds(opening);
  const [left, right, lower, upper] = [v.minX_mm + b, b - v.maxX_mm, v.minY_mm + h, h - v.maxY_mm];
  if (Math.abs(left - right) > l.equal_mm || Math.abs(lower - upper) > l.equal_mm) {
    return { nearMiss: `The outline is a hollow box but its walls differ in thickness (${fmt(left)} and ${fmt(right)} mm at the sides, ${fmt(lower)} and ${fmt(upper)} mm top and bottom)` };
  }
  // Along x = 0: the outer bottom, the opening's bottom, its top, the outer top; each edge ends where a corner radius starts.
  const across = crossings(l.p, 'x', 0);
  if (across.length !== 4) return undefined;
  const endX = (c: Crossing) => Math.max(c.from[0], c.to[0]);
  const ro = b - endX(across[3]);
  const ri = v.maxX_mm - endX(across[2]);
  const outer = refineRadius(l, ro, [b - ro, h - ro]);
  const inner = refineRadius(l, ri, [v.maxX_mm - ri, v.maxY_mm - ri]);
  const dimensions: SectionDimensions = { family: 'box', depth_mm: l.depth_mm, width_mm: l.width_mm, webThickness_mm: left, flangeThickness_mm: lower };
  if (outer.radius_mm > 0) dimensions.outerCornerRadius_mm = outer.radius_mm;
  if (inner.radius_mm > 0) dimensions.innerCornerRadius_mm = inner.radius_mm;
  return { dimensions, fromArcs: outer.fromArc || inner.fromArc };
}

function readPlate(l: Local): Reading | undefined {
  if (l.p.voids.length !== 0 || l.p.outer.length !== 4 || fullness(l.p.outer) < 1 - 1e-9) return undefined;
  return { dimensions: { family: 'plate', depth_mm: l.depth_mm, width_mm: l.width_mm }, fromArcs: false };
}

/** A Z: a web with the top flange reaching out to one side only and the bottom flange to the other. */
function isZ(l: Local): boolean {
  const h = l.depth_mm / 2;
  const web = webAt(l, [0, h / 3, -h / 3]);
  const { top, bottom } = outerStretches(l);
  if (!web || !top || !bottom) return false;
  const left = web.centre_mm - web.thickness_mm / 2;
  const right = web.centre_mm + web.thickness_mm / 2;
  const reaches = (s: [number, number]) => [s[0] < left - l.equal_mm, s[1] > right + l.equal_mm];
  const [topLeft, topRight] = reaches(top);
  const [bottomLeft, bottomRight] = reaches(bottom);
  return topLeft !== topRight && bottomLeft !== bottomRight && topLeft !== bottomLeft;
}

/** Mean distance of the loop's corners from `centre` when they all lie on one circle (within 0.1 %), else undefined. */
function circleRadius_mm(loop: readonly Point2_mm[], centre: Point2_mm): number | undefined {
  if (loop.length < 8) return undefined;
  const distances = loop.map(([x, y]) => Math.hypot(x - centre[0], y - centre[1]));
  const mean = distances.reduce((s, d) => s + d, 0) / distances.length;
  return distances.every((d) => Math.abs(d - mean) <= 1e-3 * mean) ? mean : undefined;
}

const FAMILY_WORDS: Record<SectionFamily, string> = {
  I: 'an I-section',
  channel: 'a channel',
  tee: 'a tee',
  angle: 'an angle',
  box: 'a hollow box',
  tube: 'a round tube',
  plate: 'a plate',
  other: 'a section',
};

/** Largest distance of an outline chord from the rebuilt section's arcs: how coarsely the outline draws its arcs. */
function chordError_mm(p: SectionPolygon, arcs: readonly OutlineArc[]): number {
  let worst = 0;
  for (const loop of [p.outer, ...p.voids]) {
    for (let i = 0; i < loop.length; i++) {
      const a = loop[i];
      const b = loop[(i + 1) % loop.length];
      const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
      for (const arc of arcs) {
        const r = arc.radius_mm;
        const onCircle = (q: Point2_mm) => Math.abs(Math.hypot(q[0] - arc.centre[0], q[1] - arc.centre[1]) - r) <= 1e-3 * r;
        if (length < 1.5 * r && onCircle(a) && onCircle(b)) worst = Math.max(worst, r - Math.sqrt(r * r - (length * length) / 4));
      }
    }
  }
  return worst;
}

function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), Number.MIN_VALUE);
}

/** The safety check: the section rebuilt from the dimensions, as coarsely drawn as the outline, must match it. */
function confirm(outline: SectionPolygon, props: PolygonProperties, d: SectionDimensions, options: RecognitionOptions): { coarse: boolean } | NearMiss {
  const depth_mm = overallDepth_mm(d);
  const fine_mm = FINE_CHORDS_RELATIVE * depth_mm;
  const what = FAMILY_WORDS[d.family];
  try {
    // The arcs do not depend on the chord tolerance: take them from a quick coarse drawing.
    const drawn_mm = chordError_mm(outline, sectionOutline(d, depth_mm).arcs ?? []);
    const rebuilt = sectionOutline(d, Math.max(fine_mm / 5, drawn_mm * (1 + 1e-6)));
    const r = polygonProperties(rebuilt);
    const checks: [string, number, number][] = [
      ['area', relativeDifference(r.area_mm2, props.area_mm2), options.areaTolerance ?? AREA_TOLERANCE],
      ['second moment about x', relativeDifference(r.ix_mm4, props.ix_mm4), options.inertiaTolerance ?? INERTIA_TOLERANCE],
      ['second moment about y', relativeDifference(r.iy_mm4, props.iy_mm4), options.inertiaTolerance ?? INERTIA_TOLERANCE],
    ];
    const failed = checks.find(([, difference, tolerance]) => !(difference <= tolerance));
    if (failed) {
      const [name, difference] = failed;
      return {
        nearMiss: `The outline looks like ${what} but its ${name} differs by ${(difference * 100).toFixed(1)} % from ${what} of the measured dimensions: it may have lips, stiffeners, notches or plates that the family does not describe`,
      };
    }
    return { coarse: drawn_mm > fine_mm };
  } catch (error) {
    if (error instanceof SectionInputError) return { nearMiss: `The outline looks like ${what} but its measured dimensions do not make one (${error.message})` };
    throw error;
  }
}

const READERS = [readPlate, readI, readChannel, readTee, readAngle, readBox] as const;

function wrapAngle(a: number): number {
  const wrapped = Math.atan2(Math.sin(a), Math.cos(a));
  return Math.abs(wrapped) < 1e-12 ? 0 : wrapped;
}

function recognised(dimensions: SectionDimensions, rotation_rad: number, origin_mm: Point2_mm, properties: PolygonProperties, flags: RecognitionFlag[]): RecognisedSection {
  return { status: 'recognised', dimensions, rotation_rad, origin_mm, properties, flags };
}

/** Round tubes and bars are read about their centroid: they have no edge directions to align to. */
function readRound(p: SectionPolygon, options: RecognitionOptions): SectionRecognition | NearMiss | undefined {
  const props = polygonProperties(p);
  const centre = props.centroid_mm;
  const outer = circleRadius_mm(p.outer, centre);
  if (outer === undefined || p.voids.length > 1) return undefined;
  const local = { ...p, outer: p.outer.map(([x, y]): Point2_mm => [x - centre[0], y - centre[1]]), voids: p.voids.map((v) => v.map(([x, y]): Point2_mm => [x - centre[0], y - centre[1]])) };
  const localProps = polygonProperties(local);
  if (p.voids.length === 0) return recognised({ family: 'other', depth_mm: 2 * outer, width_mm: 2 * outer, description: 'solid round bar' }, 0, centre, localProps, []);
  const b = loopBounds(p.voids[0]);
  const boreCentre: Point2_mm = [(b.minX_mm + b.maxX_mm) / 2, (b.minY_mm + b.maxY_mm) / 2];
  const inner = circleRadius_mm(p.voids[0], boreCentre);
  if (inner === undefined) return undefined;
  const offset_mm = Math.hypot(boreCentre[0] - centre[0], boreCentre[1] - centre[1]);
  if (offset_mm > EQUAL_RELATIVE * 2 * outer) return { nearMiss: `The outline is a round tube but its bore is off-centre by ${fmt(offset_mm)} mm` };
  const dimensions: SectionDimensions = { family: 'tube', diameter_mm: 2 * outer, wallThickness_mm: outer - inner };
  const confirmed = confirm(local, localProps, dimensions, options);
  if (isNearMiss(confirmed)) return confirmed;
  return recognised(dimensions, 0, centre, localProps, confirmed.coarse ? ['coarse-arcs'] : []);
}

function otherDescription(p: SectionPolygon, l: Local): string {
  if (isZ(l)) return 'Z-section';
  if (p.voids.length === 0) return 'solid section of a shape no family describes';
  return p.voids.length === 1 ? 'closed section of a shape no family describes' : `built-up section with ${p.voids.length} openings`;
}

/**
 * The family and dimensions of a section outline, or the reason it cannot be read, in words a user understands.
 * Never throws for bad input and never returns NaN.
 */
export function recogniseSection(p: SectionPolygon, options: RecognitionOptions = {}): SectionRecognition {
  const normal = normalisePolygon(p);
  if (normal.status === 'invalid') return { status: 'unrecognised', reason: normal.reason };
  const round = readRound(normal.polygon, options);
  if (round && isNearMiss(round)) return { status: 'unrecognised', reason: `${round.nearMiss}.` };
  if (round) return round;
  const aligned = alignToEdges(normal.polygon);
  const turns = [0, 1, -1, 2].sort((a, b) => Math.abs(wrapAngle(aligned.rotation_rad + (a * Math.PI) / 2)) - Math.abs(wrapAngle(aligned.rotation_rad + (b * Math.PI) / 2)));
  let nearMiss: NearMiss | undefined;
  let upright: Local | undefined;
  for (const k of turns) {
    const l = localOf(quarterTurn(aligned.polygon, k));
    upright ??= l;
    for (const read of READERS) {
      const reading = read(l);
      if (!reading) continue;
      if (isNearMiss(reading)) {
        nearMiss ??= reading;
        continue;
      }
      const props = polygonProperties(l.p);
      const confirmed = confirm(l.p, props, reading.dimensions, options);
      if (isNearMiss(confirmed)) {
        nearMiss ??= confirmed;
        continue;
      }
      const rotation_rad = wrapAngle(aligned.rotation_rad + (k * Math.PI) / 2);
      const flags: RecognitionFlag[] = [];
      if (rotation_rad !== 0) flags.push('rotated');
      if (confirmed.coarse) flags.push('coarse-arcs');
      if (reading.fromArcs) flags.push('radii-from-arcs');
      return recognised(reading.dimensions, rotation_rad, aligned.centre_mm, props, flags);
    }
  }
  if (nearMiss) return { status: 'unrecognised', reason: `${nearMiss.nearMiss}.` };
  const l = upright ?? localOf(aligned.polygon);
  const description = otherDescription(normal.polygon, l);
  return recognised({ family: 'other', depth_mm: l.depth_mm, width_mm: l.width_mm, description }, aligned.rotation_rad, aligned.centre_mm, polygonProperties(l.p), aligned.rotation_rad !== 0 ? ['rotated'] : []);
}
