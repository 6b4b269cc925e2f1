/**
 * Reads a member's profile definition into millimetres and radians.
 *
 * IfcIShapeProfileDef has the same attribute positions in IFC2X3 and IFC4 (IFC2X3 stops after FilletRadius).
 * IfcAsymmetricIShapeProfileDef shares positions 3–10 between the schemas (bottom flange width, depth, web, bottom
 * flange thickness and fillet, then the top flange's width, thickness and fillet); IFC2X3 then ends with
 * CentreOfGravityInY, while IFC4 adds edge radius and slope of each flange. In IFC2X3 the top flange thickness may be
 * omitted, meaning the bottom one's. The other parametric families are read by parametric-profile.ts; outlines
 * (IfcArbitraryClosedProfileDef, …WithVoids) are measured from their curves (profile-curve.ts), and a built-up
 * IfcCompositeProfileDef of plates is combined into one outline (rectangle-union.ts). A bare IfcProfileDef, an open
 * or centre-line profile, and an outline whose curve cannot be measured are left to the section catalogue by name.
 */
import {
  IFCARBITRARYCLOSEDPROFILEDEF,
  IFCARBITRARYOPENPROFILEDEF,
  IFCARBITRARYPROFILEDEFWITHVOIDS,
  IFCASYMMETRICISHAPEPROFILEDEF,
  IFCCENTERLINEPROFILEDEF,
  IFCCOMPOSITEPROFILEDEF,
  IFCDERIVEDPROFILEDEF,
  IFCISHAPEPROFILEDEF,
  IFCMIRROREDPROFILEDEF,
  IFCPROFILEDEF,
  IFCRECTANGLEPROFILEDEF,
} from 'web-ifc';
import type { SectionDimensions, SectionPolygon } from '../engine/section-family';
import type { MemberFlag } from './model-read-result';
import type { Mat4 } from './matrix4';
import { isParametricFamily, parametricDimensions } from './parametric-profile';
import { readAxisPlacement, readTransformationOperator } from './placement-reader';
import { oriented, pathExtent_mm, pathLoop, readClosedPath, signedDoubleArea_mm2, transformedPolygon } from './profile-curve';
import { type Rectangle_mm, rectangleUnion } from './rectangle-union';
import { numberOf, refOf, refsOf, type StepLines, type StepValue, textOf } from './step-lines';

export interface FlangeReading {
  width_mm: number;
  thickness_mm: number;
  filletRadius_mm: number;
  edgeRadius_mm?: number;
  slope_rad?: number;
}

export interface IShapeReading {
  kind: 'i-shape';
  ifcType: string;
  name: string | null;
  asymmetric: boolean;
  depth_mm: number;
  webThickness_mm: number;
  topFlange: FlangeReading;
  bottomFlange: FlangeReading;
  flags: MemberFlag[];
}

/** A parametric profile of any other family (U, T, L, C, Z, hollow, rectangle…), read into that family's dimensions. */
export interface ParametricReading {
  kind: 'parametric';
  ifcType: string;
  name: string | null;
  dimensions: SectionDimensions;
  flags: MemberFlag[];
}

/** A closed outline (IfcArbitraryClosedProfileDef, …WithVoids) evaluated into a polygon in millimetres. */
export interface OutlineReading {
  kind: 'outline';
  ifcType: string;
  name: string | null;
  polygon: SectionPolygon;
  flags: MemberFlag[];
}

export type ProfileReading =
  | IShapeReading
  | ParametricReading
  | OutlineReading
  /**
   * A bare profile known only by its name, or an outline whose curve cannot be measured (open, or drawn with curves
   * not read): kept for its name, with `reason` saying why its geometry was not used.
   */
  | { kind: 'name-only'; ifcType: string; name: string | null; flags: MemberFlag[]; reason?: string }
  | { kind: 'not-i-shape'; ifcType: string; name: string | null }
  | { kind: 'unreadable'; ifcType: string; name: string | null; reason: string };

const NAME_ONLY_TYPES = new Set([
  IFCARBITRARYOPENPROFILEDEF,
  IFCCENTERLINEPROFILEDEF,
  IFCPROFILEDEF,
]);

const MAX_DERIVATION_DEPTH = 4;
/** IfcMirroredProfileDef's operator: x → −x. */
const MIRROR_ABOUT_Y: Mat4 = Float64Array.of(-1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1);
/**
 * Chords may stray from an arc by this share of the outline's extent. The issue allows 0.05 %; a tenth of it keeps the
 * area of a rolled I within 0.05 % too (chords across four root fillets at 0.05 % of the depth add 0.15 % to an IPE 300's area).
 */
const SAGITTA_SHARE = 5e-5;

export class ProfileReader {
  private readonly cache = new Map<number, ProfileReading>();

  constructor(
    private readonly lines: StepLines,
    private readonly ifc2x3: boolean,
    private readonly scaleToMm: number,
    private readonly radiansPerAngleUnit: number,
  ) {}

  read(profileId: number): ProfileReading {
    let reading = this.cache.get(profileId);
    if (!reading) {
      reading = this.readUncached(profileId, 0);
      this.cache.set(profileId, reading);
    }
    return reading;
  }

  private readUncached(profileId: number, depth: number): ProfileReading {
    const line = this.lines.line(profileId);
    if (!line) return { kind: 'unreadable', ifcType: 'unknown', name: null, reason: `its profile #${profileId} is missing from the file` };
    const ifcType = this.lines.typeName(line.type);
    const name = textOf(line.args[1]);
    if (line.type === IFCISHAPEPROFILEDEF || line.type === IFCASYMMETRICISHAPEPROFILEDEF) {
      return this.ishape(line.type === IFCASYMMETRICISHAPEPROFILEDEF, line.args, ifcType, name);
    }
    if (line.type === IFCDERIVEDPROFILEDEF || line.type === IFCMIRROREDPROFILEDEF) {
      return this.derived(line.type === IFCMIRROREDPROFILEDEF, line.args, ifcType, name, depth);
    }
    if (line.type === IFCARBITRARYCLOSEDPROFILEDEF || line.type === IFCARBITRARYPROFILEDEFWITHVOIDS) {
      return this.outline(line.type === IFCARBITRARYPROFILEDEFWITHVOIDS ? refsOf(line.args[3]) : [], refOf(line.args[2]), ifcType, name);
    }
    if (isParametricFamily(line.type)) return this.parametric(line.type, line.args, ifcType, name);
    if (line.type === IFCCOMPOSITEPROFILEDEF) return this.composite(line.args, ifcType, name, depth);
    if (NAME_ONLY_TYPES.has(line.type)) return { kind: 'name-only', ifcType, name, flags: [] };
    return { kind: 'not-i-shape', ifcType, name };
  }

  private length(value: StepValue | undefined): number | undefined {
    const v = numberOf(value);
    return v === undefined ? undefined : v * this.scaleToMm;
  }

  private angle(value: StepValue | undefined): number | undefined {
    const v = numberOf(value);
    return v === undefined ? undefined : v * this.radiansPerAngleUnit;
  }

  private parametric(type: number, args: StepValue[], ifcType: string, name: string | null): ProfileReading {
    const read = parametricDimensions(type, (i) => this.length(args[i]), (i) => this.angle(args[i]));
    if ('problem' in read) return { kind: 'unreadable', ifcType, name, reason: `its profile '${name ?? ifcType}' ${read.problem}` };
    return { kind: 'parametric', ifcType, name, dimensions: read.dimensions, flags: [] };
  }

  /**
   * IfcCompositeProfileDef: one part is read as that part; several are combined into one outline when all are
   * rectangles square to the profile's axes (plates of a welded I or box), else the built-up section is not read.
   */
  private composite(args: StepValue[], ifcType: string, name: string | null, depth: number): ProfileReading {
    const partIds = refsOf(args[2]);
    const label = name ?? textOf(args[3]) ?? ifcType;
    if (partIds.length === 1 && depth < MAX_DERIVATION_DEPTH) {
      const part = this.readUncached(partIds[0], depth + 1);
      return { ...part, name: name ?? part.name };
    }
    const built = `its profile '${label}' is a built-up section of ${partIds.length} profiles`;
    const rectangles = partIds.map((id) => this.placedRectangle(id));
    if (partIds.length === 0 || rectangles.some((r) => r === undefined)) {
      return { kind: 'unreadable', ifcType, name, reason: `${built}, which is read only when its parts are rectangles square to its axes` };
    }
    const union = rectangleUnion(rectangles as Rectangle_mm[]);
    if ('problem' in union) return { kind: 'unreadable', ifcType, name, reason: `${built}: ${union.problem}` };
    return { kind: 'outline', ifcType, name, polygon: union, flags: [] };
  }

  /** An IfcRectangleProfileDef where its Position puts it, when its sides are parallel to the axes. */
  private placedRectangle(id: number): Rectangle_mm | undefined {
    const line = this.lines.line(id);
    const x = this.length(line?.args[3]);
    const y = this.length(line?.args[4]);
    if (line?.type !== IFCRECTANGLEPROFILEDEF || !(x! > 0) || !(y! > 0)) return undefined;
    const m = readAxisPlacement(this.lines, refOf(line.args[2]));
    const along = Math.abs(m[1]) <= 1e-9;
    if (!along && Math.abs(m[0]) > 1e-9) return undefined;
    const [halfX, halfY] = along ? [x! / 2, y! / 2] : [y! / 2, x! / 2];
    const cx = m[12] * this.scaleToMm;
    const cy = m[13] * this.scaleToMm;
    return { minX: cx - halfX, maxX: cx + halfX, minY: cy - halfY, maxY: cy + halfY };
  }

  /**
   * An outline measured from its curves: the outer loop counter-clockwise, voids clockwise. A curve that cannot be
   * measured leaves the profile to its name, with the reason.
   */
  private outline(voidIds: number[], outerId: number | undefined, ifcType: string, name: string | null): ProfileReading {
    const units = { scaleToMm: this.scaleToMm, radiansPerAngleUnit: this.radiansPerAngleUnit };
    const label = name ?? ifcType;
    const paths = [outerId, ...voidIds].map((id) => ({ id, path: readClosedPath(this.lines, id, units) }));
    const loops = [];
    let sagitta_mm = 0;
    for (const { id, path } of paths) {
      const which = id === outerId ? 'outer' : 'inner';
      if (!path.ok) return { kind: 'name-only', ifcType, name, flags: [], reason: `the ${which} curve #${id ?? '?'} of its outline '${label}' cannot be measured: ${path.reason}` };
      sagitta_mm ||= SAGITTA_SHARE * pathExtent_mm(path.pieces);
      const loop = pathLoop(path.pieces, sagitta_mm);
      if (loop.points.length < 3 || signedDoubleArea_mm2(loop.points) === 0) {
        return { kind: 'name-only', ifcType, name, flags: [], reason: `the ${which} curve #${id ?? '?'} of its outline '${label}' encloses no area` };
      }
      loops.push(loop);
    }
    const [outer, ...voids] = loops;
    const arcs = loops.flatMap((l) => l.arcs);
    return {
      kind: 'outline',
      ifcType,
      name,
      polygon: { outer: oriented(outer.points, true), voids: voids.map((v) => oriented(v.points, false)), ...(arcs.length ? { arcs } : {}) },
      flags: [],
    };
  }

  private ishape(asymmetric: boolean, args: StepValue[], ifcType: string, name: string | null): ProfileReading {
    const [width, depth, web, flange, fillet] = [3, 4, 5, 6, 7].map((i) => this.length(args[i]));
    const required = asymmetric
      ? { BottomFlangeWidth: width, OverallDepth: depth, WebThickness: web, BottomFlangeThickness: flange, TopFlangeWidth: this.length(args[8]) }
      : { OverallWidth: width, OverallDepth: depth, WebThickness: web, FlangeThickness: flange };
    const missing = Object.entries(required).filter(([, v]) => v === undefined).map(([k]) => k);
    if (missing.length > 0) return { kind: 'unreadable', ifcType, name, reason: `its profile '${name ?? ifcType}' has no ${missing.join(', ')}` };
    const optional = (flangeEdge: number | undefined, slope: number | undefined): Partial<FlangeReading> => ({
      ...(flangeEdge !== undefined ? { edgeRadius_mm: flangeEdge } : {}),
      ...(slope !== undefined ? { slope_rad: slope } : {}),
    });
    const flags: MemberFlag[] = [];
    if (!asymmetric) {
      const both = { width_mm: width!, thickness_mm: flange!, filletRadius_mm: fillet ?? 0, ...optional(this.length(args[8]), this.angle(args[9])) };
      return { kind: 'i-shape', ifcType, name, asymmetric, depth_mm: depth!, webThickness_mm: web!, topFlange: { ...both }, bottomFlange: { ...both }, flags };
    }
    let topThickness = this.length(args[9]);
    if (topThickness === undefined) {
      topThickness = flange!;
      flags.push('top-flange-assumed');
    }
    const bottomExtras = this.ifc2x3 ? {} : optional(this.length(args[11]), this.angle(args[12]));
    const topExtras = this.ifc2x3 ? {} : optional(this.length(args[13]), this.angle(args[14]));
    return {
      kind: 'i-shape',
      ifcType,
      name,
      asymmetric,
      depth_mm: depth!,
      webThickness_mm: web!,
      bottomFlange: { width_mm: width!, thickness_mm: flange!, filletRadius_mm: fillet ?? 0, ...bottomExtras },
      topFlange: { width_mm: this.length(args[8])!, thickness_mm: topThickness, filletRadius_mm: this.length(args[10]) ?? 0, ...topExtras },
      flags,
    };
  }

  /**
   * IfcDerivedProfileDef: the parent profile through a 2D operator; IfcMirroredProfileDef mirrors it about its y axis
   * (its operator is derived: '*'). An outline takes any operator. A parametric family keeps its dimensions under a
   * uniform scale and mirrors (a mirrored channel is still a channel); a mirror about the x axis swaps an I-section's
   * flanges; a rotation or an uneven scale is not supported for them.
   */
  private derived(mirrored: boolean, args: StepValue[], ifcType: string, name: string | null, depth: number): ProfileReading {
    const parentId = refOf(args[2]);
    if (parentId === undefined || depth >= MAX_DERIVATION_DEPTH) return { kind: 'unreadable', ifcType, name, reason: `its derived profile '${name ?? ifcType}' has no readable parent profile` };
    const parent = this.readUncached(parentId, depth + 1);
    const label = textOf(args[4]);
    const ownName = name ?? label ?? parent.name;
    if (parent.kind === 'not-i-shape' || parent.kind === 'unreadable') return { ...parent, name: ownName };
    const flags: MemberFlag[] = [...parent.flags, 'derived-profile'];
    if (parent.kind === 'name-only') return { ...parent, name: ownName, flags };
    const m = mirrored ? MIRROR_ABOUT_Y : readTransformationOperator(this.lines, refOf(args[3]));
    if (parent.kind === 'outline') return { ...parent, name: ownName, polygon: transformedPolygon(parent.polygon, m, this.scaleToMm), flags };
    const sx = Math.hypot(m[0], m[1]);
    const sy = Math.hypot(m[4], m[5]);
    const rotated = Math.abs(m[1]) > 1e-9 * sx || Math.abs(m[4]) > 1e-9 * sy;
    if (rotated || Math.abs(sx - sy) > 1e-9 * sx) {
      return { kind: 'unreadable', ifcType, name: ownName, reason: `its derived profile '${ownName ?? ifcType}' is rotated or scaled unevenly, which is not supported` };
    }
    const s = sx;
    if (parent.kind === 'parametric') return { ...parent, name: ownName, dimensions: scaledDimensions(parent.dimensions, s), flags };
    const scaled = (f: FlangeReading): FlangeReading => ({
      ...f,
      width_mm: f.width_mm * s,
      thickness_mm: f.thickness_mm * s,
      filletRadius_mm: f.filletRadius_mm * s,
      ...(f.edgeRadius_mm !== undefined ? { edgeRadius_mm: f.edgeRadius_mm * s } : {}),
    });
    const flipped = m[5] < 0;
    return {
      ...parent,
      name: ownName,
      depth_mm: parent.depth_mm * s,
      webThickness_mm: parent.webThickness_mm * s,
      topFlange: scaled(flipped ? parent.bottomFlange : parent.topFlange),
      bottomFlange: scaled(flipped ? parent.topFlange : parent.bottomFlange),
      flags,
    };
  }
}

/** Every length of a family's dimensions times s (the families read here have no nested lengths). */
function scaledDimensions(d: SectionDimensions, s: number): SectionDimensions {
  if (s === 1) return d;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(d)) out[key] = typeof value === 'number' && key.endsWith('_mm') ? value * s : value;
  return out as unknown as SectionDimensions;
}
