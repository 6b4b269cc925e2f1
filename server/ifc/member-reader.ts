/**
 * One MemberRecord per IfcBeam, IfcColumn and IfcMember (with their subtypes, e.g. the IFC4 *StandardCase classes):
 * identity and placement in the building, material and grade, axis and length, and the section. A member that cannot
 * be read fully is kept with status 'flagged' and the reason, never dropped and never a crash.
 */
import { IFCBEAM, IFCCOLUMN, IFCEXTRUDEDAREASOLID, IFCEXTRUDEDAREASOLIDTAPERED, IFCMEMBER } from 'web-ifc';
import type { CatalogueSection } from '../catalogue/catalogue-section';
import { type GradeId, gradeFromMaterialName, GradeError, yieldStrength, type EnYieldRule } from '../engine/grades';
import { thickestPlate_mm } from '../engine/section-family';
import { type Mat4, transformPoint, type Vec3 } from './matrix4';
import { MaterialReader, type MaterialReading } from './material-reader';
import { type BodyCut, cutMemberBody } from './body-cut';
import { governingOfSections, SectionResolver, type SectionOutcome } from './member-section';
import type { MemberFlag, MemberMaterial, MemberRecord, MemberStatus, Point3_mm } from './model-read-result';
import { readObjectPlacement } from './placement-reader';
import { ProfileReader } from './profile-reader';
import { PropertyNames } from './property-names';
import { type ElementShape, type MemberLine, ShapeReader, type SweptSolid } from './shape-reader';
import { SpatialIndex } from './spatial-index';
import { enumOf, numberOf, refOf, type StepLines, textOf } from './step-lines';

const MEMBER_TYPES = [IFCBEAM, IFCCOLUMN, IFCMEMBER] as const;

export interface MemberReaderOptions {
  ifc2x3: boolean;
  scaleToMm: number;
  radiansPerAngleUnit: number;
  /** Grade for members whose material names none (the project's default grade). */
  defaultGrade: GradeId;
  yieldRule: EnYieldRule;
  projectCatalogue?: readonly CatalogueSection[];
}

/** What the geometry step needs to build a member's mesh itself when web-ifc cannot tessellate its profile. */
export interface MemberSolid {
  solid: SweptSolid;
  /** Element placement in model units. */
  placement: Mat4;
}

/** IfcElementType.PredefinedType: position 9 of IfcBeamType, IfcColumnType and IfcMemberType. */
const TYPE_PREDEFINED_AT = 9;
const MIN_LENGTH_MM = 1;
/** Flags of a section that a designation might still resolve. */
const NAME_COULD_HELP: ReadonlySet<MemberFlag> = new Set(['profile-not-in-catalogue', 'section-unrecognised', 'geometry-unread']);
/** EndSweptArea of IfcExtrudedAreaSolidTapered and IfcRevolvedAreaSolidTapered. */
const TAPERED_END_PROFILE_AT = 4;
const UNSET_PREDEFINED = new Set(['NOTDEFINED']);

export class MemberReader {
  private readonly spatial: SpatialIndex;
  private readonly materials: MaterialReader;
  private readonly shapes: ShapeReader;
  private readonly profiles: ProfileReader;
  private readonly sections: SectionResolver;
  private readonly properties: PropertyNames;
  private readonly typePredefined = new Map<number, string | null>();

  constructor(
    private readonly lines: StepLines,
    private readonly options: MemberReaderOptions,
  ) {
    this.spatial = new SpatialIndex(lines);
    this.materials = new MaterialReader(lines);
    this.shapes = new ShapeReader(lines, options.radiansPerAngleUnit);
    this.profiles = new ProfileReader(lines, options.ifc2x3, options.scaleToMm, options.radiansPerAngleUnit);
    this.sections = new SectionResolver(options.projectCatalogue);
    this.properties = new PropertyNames(lines);
  }

  /** Express ids of all beams, columns and members, in file order. */
  memberIds(): number[] {
    return MEMBER_TYPES.flatMap((type) => this.lines.idsOfType(type, true)).sort((a, b) => a - b);
  }

  read(expressId: number): MemberRecord {
    const line = this.lines.line(expressId);
    const args = line?.args ?? [];
    const typeId = this.spatial.typeOf(expressId);
    const objectType = textOf(args[4]);
    const shape = this.shapes.read(refOf(args[6]));
    const material = this.materials.materialOf(expressId, typeId);
    const flags: MemberFlag[] = [...(material?.flags ?? [])];

    const solid = shape.solids[0];
    if (shape.solids.length > 1 && new Set(shape.solids.map((s) => s.profileId)).size > 1) flags.push('several-profiles');
    if (solid?.tapered) flags.push('tapered');
    const names = [material?.profileName ?? null, objectType, textOf(args[2]), this.typeName(typeId)];
    const axisLine = this.shapes.axisLine(shape);
    const cut = material?.profileId === undefined && solid?.profileId === undefined && shape.bodyItems.length > 0 ? this.cutBody(shape, axisLine) : undefined;
    let outcome = this.section(shape, material, names, cut);
    if (outcome.status === 'flagged' && outcome.flags.some((f) => NAME_COULD_HELP.has(f))) {
      // Some exporters name the section only in a property set: looked up only when the other names gave nothing.
      const fromProperties = this.properties.sectionNamesOf(expressId, typeId);
      if (fromProperties.length > 0) outcome = this.section(shape, material, [...names, ...fromProperties], cut);
    }
    flags.push(...outcome.flags);

    const placement = readObjectPlacement(this.lines, refOf(args[5]));
    const line3d = this.memberLine(axisLine ?? (cut?.status === 'cut' ? { ...cut.axis, curved: false } : undefined), solid, placement);
    if (line3d?.curved) flags.push('curved');
    if (shape.hasRepresentation && !line3d) flags.push('no-axis');

    let status: MemberStatus = outcome.status;
    let reason = outcome.status === 'ok' ? undefined : outcome.reason;
    if (!shape.hasRepresentation) {
      flags.push('no-representation');
      status = 'flagged';
      const missing = shape.danglingReference === undefined ? 'has no shape representation' : `refers to representation #${shape.danglingReference}, which is not in the file`;
      reason = `The member ${missing}, so it has no axis, length or geometry.` + (reason ? ` ${reason}` : '');
    }
    if (status !== 'flagged' && this.hasZeroLength(line3d, solid)) {
      flags.push('zero-length');
      status = 'flagged';
      reason = 'The member has no length (its axis or extrusion is shorter than 1 mm), so it is not checked.';
    }
    const grade = this.material(material, outcome, flags);
    if (grade.error && status === 'ok') {
      status = 'flagged';
      reason = grade.error;
    }

    const record: MemberRecord = {
      globalId: textOf(args[0]) ?? `#${expressId}`,
      expressId,
      ifcClass: this.lines.typeName(line?.type ?? 0),
      name: textOf(args[2]),
      tag: textOf(args[7]),
      objectType,
      predefinedType: this.predefinedType(enumOf(args[8]), typeId),
      storey: this.spatial.storeyOf(expressId),
      material: grade.material,
      length_mm: line3d ? line3d.length * this.options.scaleToMm : null,
      axis: line3d ? { start_mm: this.toMm(line3d.start), end_mm: this.toMm(line3d.end) } : null,
      status,
      ...(reason ? { reason } : {}),
      profile: outcome.status === 'flagged' ? null : (outcome.profile ?? null),
      section: outcome.status === 'ok' ? outcome.section : null,
      flags: [...new Set(flags)],
    };
    return record;
  }

  /**
   * The first swept solid of a member and its placement, read again on demand: only the few members web-ifc cannot
   * tessellate need it, so it is not kept for all of them.
   */
  solidOf(expressId: number): MemberSolid | undefined {
    const args = this.lines.line(expressId)?.args ?? [];
    const solid = this.shapes.read(refOf(args[6])).solids[0];
    return solid ? { solid, placement: readObjectPlacement(this.lines, refOf(args[5])) } : undefined;
  }

  /** Frame, direction and depth of a member's extruded solid, for building its mesh (undefined if not extruded). */
  extrusionOf(solid: SweptSolid): ReturnType<ShapeReader['extrusion']> {
    return this.shapes.extrusion(solid);
  }

  private section(shape: ElementShape, material: MaterialReading | undefined, names: (string | null)[], cut: BodyCut | undefined): SectionOutcome {
    const solid = shape.solids[0];
    if (solid?.tapered) return this.taperedSection(solid, names);
    const profileId = material?.profileId ?? solid?.profileId;
    if (profileId !== undefined) return this.sections.resolve(this.profiles.read(profileId), names);
    if (cut?.status === 'cut') {
      return this.sections.fromOutline(cut.polygon, { name: '', source: 'body-cut', ifcType: cut.ifcType, flags: [] }, names);
    }
    if (cut?.status === 'failed' && cut.notOneSection) {
      return { status: 'flagged', reason: `The body cannot be one member's section: ${cut.reason}`, flags: ['section-unrecognised'] };
    }
    if (cut) return this.sections.fromNamesOnly(names, `its body gives no section (${cut.reason})`, shape.otherBodyTypes[0] ?? 'body', ['geometry-unread']);
    if (!shape.hasRepresentation) return { status: 'flagged', reason: '', flags: ['no-profile'] };
    const body = shape.otherBodyTypes.length ? `its body is ${[...new Set(shape.otherBodyTypes)].join(', ')}` : 'it has no body representation';
    return { status: 'flagged', reason: `No profile to read the section from: ${body}.`, flags: ['no-profile'] };
  }

  private cutBody(shape: ElementShape, axisLine: MemberLine | undefined): BodyCut {
    const axis = axisLine && !axisLine.curved ? { start: axisLine.start, end: axisLine.end } : undefined;
    return cutMemberBody(this.lines, shape.bodyItems, { scaleToMm: this.options.scaleToMm, ...(axis ? { axis } : {}) });
  }

  /**
   * A tapered solid between two profiles, or a sectioned solid through several: every section is kept, and the member
   * takes the smallest (web area), never a larger one.
   */
  private taperedSection(solid: SweptSolid, names: (string | null)[]): SectionOutcome {
    const sections = solid.crossSections ?? [
      { profileId: solid.profileId, at: 0 },
      { profileId: refOf(solid.args[TAPERED_END_PROFILE_AT]), at: 1 },
    ];
    return governingOfSections(
      sections.map(({ profileId, at }) => ({ at, outcome: profileId === undefined ? undefined : this.sections.resolve(this.profiles.read(profileId), names) })),
    );
  }

  /** An axis shorter than 1 mm, or an extrusion of no depth (which gives no axis at all). */
  private hasZeroLength(line3d: MemberLine | undefined, solid: SweptSolid | undefined): boolean {
    if (line3d) return line3d.length * this.options.scaleToMm < MIN_LENGTH_MM;
    const depth = solid && (solid.solidType === IFCEXTRUDEDAREASOLID || solid.solidType === IFCEXTRUDEDAREASOLIDTAPERED) ? numberOf(solid.args[3]) : undefined;
    return depth !== undefined && !(depth * this.options.scaleToMm >= MIN_LENGTH_MM);
  }

  private typeName(typeId: number | undefined): string | null {
    return typeId === undefined ? null : textOf(this.lines.line(typeId)?.args[2]);
  }

  /** Axis from the Axis representation (or the body cut), else from the first swept solid, placed in model coordinates. */
  private memberLine(axisLine: MemberLine | undefined, solid: SweptSolid | undefined, placement: Mat4): MemberLine | undefined {
    const local = axisLine ?? (solid ? this.shapes.solidLine(solid) : undefined);
    if (!local) return undefined;
    const start = transformPoint(placement, local.start);
    const end = transformPoint(placement, local.end);
    // A straight line's length follows its placed end points; a curve's is measured along it (rigid placements).
    return { ...local, start, end, length: local.curved ? local.length : Math.hypot(end[0] - start[0], end[1] - start[1], end[2] - start[2]) };
  }

  private toMm(p: Vec3): Point3_mm {
    const s = this.options.scaleToMm;
    return [p[0] * s, p[1] * s, p[2] * s];
  }

  private predefinedType(own: string | null, typeId: number | undefined): string | null {
    if (own && !UNSET_PREDEFINED.has(own)) return own;
    if (typeId === undefined) return own;
    let fromType = this.typePredefined.get(typeId);
    if (fromType === undefined) {
      fromType = enumOf(this.lines.line(typeId)?.args[TYPE_PREDEFINED_AT]);
      this.typePredefined.set(typeId, fromType);
    }
    return fromType ?? own;
  }

  /**
   * Grade from the material name, else the default grade (flagged 'assumed-grade'); fy for the thickest plate of the
   * section, so only members with a section get one (and only they carry the grade flags).
   */
  private material(material: MaterialReading | undefined, outcome: SectionOutcome, flags: MemberFlag[]): { material: MemberMaterial | null; error?: string } {
    const name = material?.name ?? null;
    const named = name === null ? null : gradeFromMaterialName(name);
    const grade = named ?? this.options.defaultGrade;
    const assumed = named === null;
    if (outcome.status !== 'ok') return { material: name === null ? null : { name, grade, fy_MPa: null, assumed } };
    if (name === null) flags.push('no-material');
    if (assumed) flags.push('assumed-grade');
    const p = outcome.profile;
    const thickness_mm = thickestPlate_mm(p);
    try {
      return { material: { name, grade, fy_MPa: yieldStrength(grade, thickness_mm, this.options.yieldRule).fy_MPa, assumed } };
    } catch (error) {
      if (!(error instanceof GradeError)) throw error;
      return { material: { name, grade, fy_MPa: null, assumed }, error: `No yield strength for the grade: ${error.message}.` };
    }
  }
}

