/**
 * Reads a member's profile definition into millimetres and radians.
 *
 * IfcIShapeProfileDef has the same attribute positions in IFC2X3 and IFC4 (IFC2X3 stops after FilletRadius).
 * IfcAsymmetricIShapeProfileDef shares positions 3–10 between the schemas (bottom flange width, depth, web, bottom
 * flange thickness and fillet, then the top flange's width, thickness and fillet); IFC2X3 then ends with
 * CentreOfGravityInY, while IFC4 adds edge radius and slope of each flange. In IFC2X3 the top flange thickness may be
 * omitted, meaning the bottom one's. Profiles that only carry a name (outlines such as IfcArbitraryClosedProfileDef, or
 * a bare IfcProfileDef) are left to the section catalogue; every other profile type is not an I-section.
 */
import {
  IFCARBITRARYCLOSEDPROFILEDEF,
  IFCARBITRARYOPENPROFILEDEF,
  IFCARBITRARYPROFILEDEFWITHVOIDS,
  IFCASYMMETRICISHAPEPROFILEDEF,
  IFCCENTERLINEPROFILEDEF,
  IFCDERIVEDPROFILEDEF,
  IFCISHAPEPROFILEDEF,
  IFCMIRROREDPROFILEDEF,
  IFCPROFILEDEF,
} from 'web-ifc';
import type { MemberFlag } from './model-read-result';
import { readTransformationOperator } from './placement-reader';
import { numberOf, refOf, type StepLines, type StepValue, textOf } from './step-lines';

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

export type ProfileReading =
  | IShapeReading
  /** An outline or bare profile known only by its name. */
  | { kind: 'name-only'; ifcType: string; name: string | null; flags: MemberFlag[] }
  | { kind: 'not-i-shape'; ifcType: string; name: string | null }
  | { kind: 'unreadable'; ifcType: string; name: string | null; reason: string };

const NAME_ONLY_TYPES = new Set([
  IFCARBITRARYCLOSEDPROFILEDEF,
  IFCARBITRARYPROFILEDEFWITHVOIDS,
  IFCARBITRARYOPENPROFILEDEF,
  IFCCENTERLINEPROFILEDEF,
  IFCPROFILEDEF,
]);

const MAX_DERIVATION_DEPTH = 4;

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
   * IfcDerivedProfileDef: the parent profile through a 2D operator. A uniform scale and a mirror about the x axis
   * (which swaps the flanges) are applied; a mirror about the web leaves an I-section as it is (IfcMirroredProfileDef,
   * whose operator is derived: '*').
   */
  private derived(mirrored: boolean, args: StepValue[], ifcType: string, name: string | null, depth: number): ProfileReading {
    const parentId = refOf(args[2]);
    if (parentId === undefined || depth >= MAX_DERIVATION_DEPTH) return { kind: 'unreadable', ifcType, name, reason: `its derived profile '${name ?? ifcType}' has no readable parent profile` };
    const parent = this.readUncached(parentId, depth + 1);
    const label = textOf(args[4]);
    const ownName = name ?? label ?? parent.name;
    if (parent.kind === 'not-i-shape' || parent.kind === 'unreadable') return { ...parent, name: ownName };
    const flags: MemberFlag[] = [...parent.flags, 'derived-profile'];
    if (parent.kind === 'name-only' || mirrored) return { ...parent, name: ownName, flags };
    const m = readTransformationOperator(this.lines, refOf(args[3]));
    const sx = Math.hypot(m[0], m[1]);
    const sy = Math.hypot(m[4], m[5]);
    const rotated = Math.abs(m[1]) > 1e-9 * sx || Math.abs(m[4]) > 1e-9 * sy;
    if (rotated || Math.abs(sx - sy) > 1e-9 * sx) {
      return { kind: 'unreadable', ifcType, name: ownName, reason: `its derived profile '${ownName ?? ifcType}' is rotated or scaled unevenly, which is not supported` };
    }
    const s = sx;
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
      ifcType: parent.ifcType,
      name: ownName,
      depth_mm: parent.depth_mm * s,
      webThickness_mm: parent.webThickness_mm * s,
      topFlange: scaled(flipped ? parent.bottomFlange : parent.topFlange),
      bottomFlange: scaled(flipped ? parent.topFlange : parent.bottomFlange),
      flags,
    };
  }
}
