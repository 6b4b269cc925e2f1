/**
 * Writes the invented warehouse frame as IFC (IFC4, IFC4X3 or IFC2X3) in mm, m, inch or foot, using every way a
 * member's section can be given: parametric I-shapes with fillets, asymmetric I-shapes (each schema's attribute
 * layout), a name-only outline, boolean-clipped ends, mapped items from a type, IfcMaterialProfileSetUsage, and non-I
 * braces, plus floor slabs as context. With the 'real-exports' patterns, beams and columns also take the paths of
 * real-export-sections.ts (outlines with arcs and voids, other families, bodies only, tapered members); with 'brep'
 * bodies, every member's body is an IfcFacetedBrep instead. Attribute orders follow the IFC schemas (as web-ifc's
 * generated ifc-schema.d.ts spells their constructors).
 */
import { type AngleDimensions, type IDimensions, overallDepth_mm, type TubeDimensions } from '../../server/engine/section-family';
import type { FrameLayout, MemberSlot, Vec3 } from './frame-layout';
import type { FrameSections, ISectionSpec, SectionSpec } from './frame-sections';
import { globalIdFor } from './global-id';
import { type BodyKind, type PathWriting, REAL_EXPORT_SECTIONS, type RealExportPath, realExportPaths } from './real-export-sections';
import { chordedLoop, type DrawableSection, sectionLoops } from './section-loops';
import { SectionWriter } from './section-writer';
import { copedMesh, loftMesh, type Mesh, placedMesh, type Point3, prismMesh, type SectionPolygons } from './solid-mesh';
import { enumValue, list, NULL, DERIVED, real, reals, type StepValue, StepWriter, text, TRUE, typed } from './step-writer';

export type FrameSchema = 'IFC4' | 'IFC4X3' | 'IFC2X3';
export type FrameUnit = 'mm' | 'm' | 'inch' | 'foot';

/** How a member's section reaches the reader; the generator's tests look members up by this name. */
export type ProfilePath =
  | 'column-ishape'
  | 'column-ishape-axis'
  | 'rolled-ishape'
  | 'material-profile-set'
  | 'mapped-type'
  | 'clipped'
  | 'name-only-outline'
  | 'extrusion-only'
  | 'asymmetric'
  | 'welded-ishape'
  | 'secondary-ishape'
  | 'tube'
  | 'angle';

export type Defect = 'zero-web' | 'negative-flange' | 'no-representation';

/** 'standard': today's paths only; 'real-exports': beams and columns also take every path of real-export-sections.ts. */
export type FramePatterns = 'standard' | 'real-exports';
/** 'extruded': each path's own body; 'brep': every member's body an IfcFacetedBrep (no profile, no extrusion). */
export type FrameBodies = 'extruded' | 'brep';
/** FILE_SCHEMA spellings other than the schema's own: IFC4X3_RC2, an IFC4X3 draft name some exporters still write. */
export type HeaderSchema = 'IFC4X3_RC2';
export type MemberPath = ProfilePath | RealExportPath;

export interface FrameWriteOptions {
  schema: FrameSchema;
  unit: FrameUnit;
  sections: FrameSections;
  layout: FrameLayout;
  /** Replace three beams of the first storey with broken ones (zero web, negative flange, no representation). */
  defects: boolean;
  /** Where the site's origin lies in the project's coordinates; far from 0 to test shifting towards the origin. */
  siteOrigin_mm: Vec3;
  fileName: string;
  patterns?: FramePatterns;
  bodies?: FrameBodies;
}

const MM_PER_UNIT: Readonly<Record<FrameUnit, number>> = { mm: 1, m: 1000, inch: 25.4, foot: 304.8 };

const BEAM_X_PATHS: readonly ProfilePath[] = [
  'rolled-ishape',
  'material-profile-set',
  'mapped-type',
  'clipped',
  'name-only-outline',
  'extrusion-only',
];
const BEAM_Y_PATHS: readonly ProfilePath[] = ['asymmetric', 'welded-ishape', 'secondary-ishape'];
const DEFECTS_BY_BEAM_INDEX: ReadonlyMap<number, Defect> = new Map([
  [6, 'zero-web'],
  [7, 'negative-flange'],
  [8, 'no-representation'],
]);

export function pathOf(slot: MemberSlot): ProfilePath {
  switch (slot.role) {
    case 'column':
      return slot.roleIndex % 2 === 0 ? 'column-ishape' : 'column-ishape-axis';
    case 'beam-x':
      return BEAM_X_PATHS[slot.roleIndex % BEAM_X_PATHS.length];
    case 'beam-y':
      return BEAM_Y_PATHS[slot.roleIndex % BEAM_Y_PATHS.length];
    case 'brace':
      return slot.roleIndex % 2 === 0 ? 'tube' : 'angle';
  }
}

/**
 * The path of a member under the given patterns. With 'real-exports', columns cycle through the column paths and the
 * tapered column, beams along x through today's x paths then every real-export beam path, beams along y through
 * today's y paths then the real-export beam paths in reverse order: a 100-member model holds every path.
 */
export function memberPathOf(slot: MemberSlot, patterns: FramePatterns = 'standard', schema: FrameSchema = 'IFC4'): MemberPath {
  if (patterns === 'standard' || slot.role === 'brace') return pathOf(slot);
  const cycle = (paths: readonly MemberPath[]): MemberPath => paths[slot.roleIndex % paths.length];
  const beams = realExportPaths(schema, 'beam');
  switch (slot.role) {
    case 'column':
      return cycle(['column-ishape', 'column-ishape-axis', ...realExportPaths(schema, 'column')]);
    case 'beam-x':
      return cycle([...BEAM_X_PATHS, ...beams]);
    case 'beam-y':
      return cycle([...BEAM_Y_PATHS, ...beams.reverse()]);
  }
}

export function isRealExportPath(path: MemberPath): path is RealExportPath {
  return path in REAL_EXPORT_SECTIONS;
}

function defectOf(slot: MemberSlot, defects: boolean): Defect | undefined {
  return defects && slot.role === 'beam-x' && slot.storey === 0 ? DEFECTS_BY_BEAM_INDEX.get(slot.roleIndex) : undefined;
}

/** The section a path uses in this schema. */
export function sectionOf(path: ProfilePath, sections: FrameSections, schema: FrameSchema): SectionSpec {
  switch (path) {
    case 'column-ishape':
      return sections.columns[0];
    case 'column-ishape-axis':
      return sections.columns[1];
    case 'rolled-ishape':
      return sections.rolledBeam;
    case 'material-profile-set':
      return sections.profileSetBeam;
    case 'mapped-type':
      return sections.mappedBeam;
    case 'clipped':
      return sections.clippedBeam;
    case 'name-only-outline':
      return sections.outlineBeam;
    case 'extrusion-only':
      return sections.extrusionOnlyBeam;
    case 'asymmetric':
      return sections.asymmetricGirder;
    case 'welded-ishape':
      return sections.weldedGirder;
    case 'secondary-ishape':
      return schema === 'IFC2X3' ? sections.secondaryBeam.ifc2x3 : sections.secondaryBeam.ifc4;
    case 'tube':
      return sections.tube;
    case 'angle':
      return sections.angle;
  }
}

/** Material names per path: EN grades in the metric variant, ASTM in the imperial one; 'Steel' names no grade. */
function materialName(path: MemberPath, imperial: boolean): string {
  if (isRealExportPath(path)) {
    const hollow = ['box', 'tube'].includes(REAL_EXPORT_SECTIONS[path].expected.dimensions.family);
    return imperial ? (hollow ? 'ASTM A500 Gr C' : 'ASTM A992') : hollow ? 'S355J2H' : 'S355JR';
  }
  const names: Record<ProfilePath, [string, string]> = {
    'column-ishape': ['S355JR', 'ASTM A992'],
    'column-ishape-axis': ['S355JR', 'ASTM A992'],
    'rolled-ishape': ['S355JR', 'ASTM A992'],
    'material-profile-set': ['S460M', 'A572 Gr 50'],
    'mapped-type': ['S275JR', 'A36'],
    clipped: ['S355J2', 'ASTM A992'],
    'name-only-outline': ['S235JR', 'ASTM A992'],
    'extrusion-only': ['Steel', 'Steel'],
    asymmetric: ['S355ML', 'A572 Grade 50'],
    'welded-ishape': ['S355J2+N', 'A572 Gr.50'],
    'secondary-ishape': ['S355JR', 'ASTM A992'],
    tube: ['S275', 'A36'],
    angle: ['S275', 'A36'],
  };
  return names[path][imperial ? 1 : 0];
}

const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const lengthOf = (v: Vec3): number => Math.hypot(v[0], v[1], v[2]);
const unit = (v: Vec3): Vec3 => {
  const l = lengthOf(v);
  return [v[0] / l, v[1] / l, v[2] / l];
};

/** Outline of an I-section without fillets, counter-clockwise, centred on the bounding box (for name-only profiles). */
function iOutline(spec: ISectionSpec): [number, number][] {
  const { depth_mm: d, webThickness_mm: tw, topFlange: top, bottomFlange: bottom } = spec.input;
  const h = d / 2;
  const w = tw / 2;
  const bt = top.width_mm / 2;
  const bb = bottom.width_mm / 2;
  return [
    [-bb, -h], [bb, -h], [bb, -h + bottom.thickness_mm], [w, -h + bottom.thickness_mm], [w, h - top.thickness_mm],
    [bt, h - top.thickness_mm], [bt, h], [-bt, h], [-bt, h - top.thickness_mm], [-w, h - top.thickness_mm],
    [-w, -h + bottom.thickness_mm], [-bb, -h + bottom.thickness_mm], [-bb, -h],
  ];
}

/** A generator section spec in the shared vocabulary (sloped flanges drawn parallel, at their nominal thickness). */
export function dimensionsOf(spec: SectionSpec): DrawableSection {
  switch (spec.kind) {
    case 'i': {
      const { depth_mm, webThickness_mm, topFlange, bottomFlange } = spec.input;
      return { family: 'I', depth_mm, webThickness_mm, topFlange, bottomFlange } satisfies IDimensions;
    }
    case 'tube':
      return { family: 'tube', diameter_mm: 2 * spec.radius_mm, wallThickness_mm: spec.wall_mm } satisfies TubeDimensions;
    case 'angle':
      return { family: 'angle', depth_mm: spec.leg_mm, width_mm: spec.leg_mm, thickness_mm: spec.thickness_mm, rootRadius_mm: spec.fillet_mm } satisfies AngleDimensions;
  }
}

/** Chords a quarter circle gets in bodies given as faces: a few facets for fillets, more for a tube's wall. */
function bodyChordsPerQuarter(section: DrawableSection): number {
  return section.family === 'tube' ? 6 : 3;
}

function bodyPolygons(section: DrawableSection): SectionPolygons {
  const loops = sectionLoops(section);
  const chords = bodyChordsPerQuarter(section);
  return { outer: chordedLoop(loops.outer, chords), voids: loops.voids.map((loop) => chordedLoop(loop, chords)) };
}

const depthOf = (section: DrawableSection): number => (section.family === 'z' ? section.depth_mm : overallDepth_mm(section));

/** An I-section in the frame writer's own spec, for writing it as IfcIShapeProfileDef. */
function iSpec(name: string, d: IDimensions): ISectionSpec {
  const { depth_mm, webThickness_mm, topFlange, bottomFlange } = d;
  const fabrication = topFlange.filletRadius_mm > 0 ? 'rolled' : 'welded';
  return { kind: 'i', name, input: { depth_mm, webThickness_mm, topFlange, bottomFlange, fabrication } };
}

/** What a member's path writes: its representations (null: none at all), material select and names. */
interface MemberBody {
  representations: StepValue[] | null;
  select: StepValue | undefined;
  /** ObjectType; null writes '$'. */
  objectType: string | null;
  /** Name instead of the member's mark. */
  name: string | undefined;
  /** The member is an occurrence of the mapped beam type. */
  mapped: boolean;
}

/** Where a sweep's own axes sit in the member's placement: its origin and its x, y (up the section) and z axes. */
interface SweepFrame {
  origin: Point3;
  x: Point3;
  y: Point3;
  z: Point3;
}

/** Columns and braces sweep along the placement's z. */
const ALONG_Z: SweepFrame = { origin: [0, 0, 0], x: [1, 0, 0], y: [0, 1, 0], z: [0, 0, 1] };

/** Beams sweep along the placement's x, the section's y up, hanging below the reference line (top of steel). */
function beamSweep(depth_mm: number): SweepFrame {
  return { origin: [0, 0, -depth_mm / 2], x: [0, 1, 0], y: [0, 0, 1], z: [1, 0, 0] };
}

export class FrameWriter {
  private readonly w: StepWriter;
  private readonly scale: number;
  private readonly ifc2x3: boolean;
  private readonly imperial: boolean;
  private guidIndex = 0;
  private ownerHistory: StepValue = NULL;
  private bodyContext: StepValue = NULL;
  private axisContext: StepValue = NULL;
  private readonly profiles = new Map<string, StepValue>();
  private readonly materials = new Map<string, StepValue>();
  /** Material select → elements (or types) it is associated with. */
  private readonly associations = new Map<StepValue, StepValue[]>();
  private readonly storeyElements: StepValue[][] = [];
  private mappedType: { type: StepValue; map: StepValue; spanFor: number; members: StepValue[] } | undefined;
  private profileSetUsage: StepValue | undefined;
  private readonly sectionWriter: SectionWriter;

  constructor(
    private readonly options: FrameWriteOptions,
    sink: (text: string) => void,
  ) {
    this.w = new StepWriter(sink);
    this.scale = MM_PER_UNIT[options.unit];
    this.ifc2x3 = options.schema === 'IFC2X3';
    this.imperial = options.unit === 'inch' || options.unit === 'foot';
    this.sectionWriter = new SectionWriter({
      w: this.w,
      ifc2x3: this.ifc2x3,
      len: (value_mm) => this.len(value_mm),
      angle: (value_rad) => this.angle(value_rad),
      profilePosition: () => this.profilePosition(),
    });
  }

  static header(options: Pick<FrameWriteOptions, 'schema' | 'fileName'> & { headerSchema?: HeaderSchema }): string {
    if (options.headerSchema && options.schema !== 'IFC4X3') throw new Error(`${options.headerSchema} is a name of IFC4X3, not of ${options.schema}`);
    const schema = options.headerSchema ?? (options.schema === 'IFC4X3' ? 'IFC4X3_ADD2' : options.schema);
    return [
      'ISO-10303-21;',
      'HEADER;',
      "FILE_DESCRIPTION(('ViewDefinition [ReferenceView]'),'2;1');",
      `FILE_NAME(${text(options.fileName)},'2026-01-15T09:00:00',('Taulens test generator'),('Taulens'),'taulens frame generator','taulens frame generator','');`,
      `FILE_SCHEMA(('${schema}'));`,
      'ENDSEC;',
      'DATA;',
      '',
    ].join('\n');
  }

  static footer(): string {
    return 'ENDSEC;\nEND-ISO-10303-21;\n';
  }

  write(): void {
    const w = this.w;
    this.ownerHistory = this.writeOwnerHistory();
    const origin = this.point([0, 0, 0]);
    const worldCs = w.add('IFCAXIS2PLACEMENT3D', origin, NULL, NULL);
    const context = w.add('IFCGEOMETRICREPRESENTATIONCONTEXT', NULL, text('Model'), '3', real(1e-5), worldCs, NULL);
    this.bodyContext = w.add('IFCGEOMETRICREPRESENTATIONSUBCONTEXT', text('Body'), text('Model'), DERIVED, DERIVED, DERIVED, DERIVED, context, NULL, enumValue('MODEL_VIEW'), NULL);
    this.axisContext = w.add('IFCGEOMETRICREPRESENTATIONSUBCONTEXT', text('Axis'), text('Model'), DERIVED, DERIVED, DERIVED, DERIVED, context, NULL, enumValue('GRAPH_VIEW'), NULL);
    const project = w.add('IFCPROJECT', this.guid(), this.ownerHistory, text('Harbour warehouse'), NULL, NULL, text('Invented demo frame'), NULL, list([context]), this.writeUnits());

    const sitePlacement = this.placement(NULL, this.options.siteOrigin_mm);
    const site = w.add('IFCSITE', this.guid(), this.ownerHistory, text('Quay 4'), NULL, NULL, sitePlacement, NULL, NULL, enumValue('ELEMENT'), NULL, NULL, NULL, NULL, NULL);
    const buildingPlacement = this.placement(sitePlacement, [0, 0, 0]);
    const building = w.add('IFCBUILDING', this.guid(), this.ownerHistory, text('Warehouse'), NULL, NULL, buildingPlacement, NULL, NULL, enumValue('ELEMENT'), NULL, NULL, NULL);
    const { layout } = this.options;
    const storeys: StepValue[] = [];
    const storeyPlacements: StepValue[] = [];
    for (let s = 0; s < layout.storeys; s++) {
      const elevation_mm = s * layout.storeyHeight_mm;
      const placement = this.placement(buildingPlacement, [0, 0, elevation_mm]);
      storeyPlacements.push(placement);
      storeys.push(w.add('IFCBUILDINGSTOREY', this.guid(), this.ownerHistory, text(`Level ${String(s + 1).padStart(2, '0')}`), NULL, NULL, placement, NULL, NULL, enumValue('ELEMENT'), this.len(elevation_mm)));
      this.storeyElements.push([]);
    }
    w.add('IFCRELAGGREGATES', this.guid(), this.ownerHistory, NULL, NULL, project, list([site]));
    w.add('IFCRELAGGREGATES', this.guid(), this.ownerHistory, NULL, NULL, site, list([building]));
    w.add('IFCRELAGGREGATES', this.guid(), this.ownerHistory, NULL, NULL, building, list(storeys));

    layout.slots.forEach((slot, i) => {
      const element = this.writeMember(slot, i, storeyPlacements[slot.storey]);
      this.storeyElements[slot.storey].push(element);
    });
    for (let s = 0; s < layout.storeys; s++) this.storeyElements[s].push(this.writeSlab(s, storeyPlacements[s]));

    storeys.forEach((storey, s) => {
      w.add('IFCRELCONTAINEDINSPATIALSTRUCTURE', this.guid(), this.ownerHistory, NULL, NULL, list(this.storeyElements[s]), storey);
    });
    if (this.mappedType && this.mappedType.members.length > 0) {
      w.add('IFCRELDEFINESBYTYPE', this.guid(), this.ownerHistory, NULL, NULL, list(this.mappedType.members), this.mappedType.type);
    }
    for (const [material, objects] of this.associations) {
      w.add('IFCRELASSOCIATESMATERIAL', this.guid(), this.ownerHistory, NULL, NULL, list(objects), material);
    }
    w.flush();
  }

  private guid(): StepValue {
    return text(globalIdFor(this.guidIndex++));
  }

  /** A length in model units. */
  private len(value_mm: number): StepValue {
    return real(value_mm / this.scale);
  }

  private point(p_mm: readonly number[]): StepValue {
    return this.w.add('IFCCARTESIANPOINT', list(p_mm.map((v) => this.len(v))));
  }

  private direction(v: readonly number[]): StepValue {
    return this.w.add('IFCDIRECTION', reals(v));
  }

  private axis3d(location_mm: Vec3, z?: Vec3, x?: Vec3): StepValue {
    return this.w.add('IFCAXIS2PLACEMENT3D', this.point(location_mm), z ? this.direction(z) : NULL, x ? this.direction(x) : NULL);
  }

  private placement(relativeTo: StepValue, location_mm: Vec3, z?: Vec3, x?: Vec3): StepValue {
    return this.w.add('IFCLOCALPLACEMENT', relativeTo, this.axis3d(location_mm, z, x));
  }

  /** IFC2X3 requires a profile position; IFC4 lets it default to the origin. */
  private profilePosition(): StepValue {
    return this.ifc2x3 ? this.w.add('IFCAXIS2PLACEMENT2D', this.w.add('IFCCARTESIANPOINT', reals([0, 0])), NULL) : NULL;
  }

  private writeOwnerHistory(): StepValue {
    const w = this.w;
    const person = w.add('IFCPERSON', NULL, text('Moreau'), text('Ines'), NULL, NULL, NULL, NULL, NULL);
    const organisation = w.add('IFCORGANIZATION', NULL, text('Taulens'), NULL, NULL, NULL);
    const user = w.add('IFCPERSONANDORGANIZATION', person, organisation, NULL);
    const application = w.add('IFCAPPLICATION', organisation, text('0.1'), text('Taulens frame generator'), text('taulens-generator'));
    return w.add('IFCOWNERHISTORY', user, application, NULL, enumValue('ADDED'), '1768467600', NULL, NULL, '1768467600');
  }

  private conversionUnit(type: 'LENGTHUNIT' | 'PLANEANGLEUNIT', name: string, factor: number, exponents: string): StepValue {
    const w = this.w;
    const dimensions = w.add('IFCDIMENSIONALEXPONENTS', ...exponents.split(','));
    const siName = type === 'LENGTHUNIT' ? 'METRE' : 'RADIAN';
    const si = w.add('IFCSIUNIT', DERIVED, enumValue(type), NULL, enumValue(siName));
    const measure = type === 'LENGTHUNIT' ? 'IFCLENGTHMEASURE' : 'IFCPLANEANGLEMEASURE';
    const factorValue = w.add('IFCMEASUREWITHUNIT', typed(measure, real(factor)), si);
    return w.add('IFCCONVERSIONBASEDUNIT', dimensions, enumValue(type), text(name), factorValue);
  }

  private writeUnits(): StepValue {
    const w = this.w;
    const length = {
      mm: () => w.add('IFCSIUNIT', DERIVED, enumValue('LENGTHUNIT'), enumValue('MILLI'), enumValue('METRE')),
      m: () => w.add('IFCSIUNIT', DERIVED, enumValue('LENGTHUNIT'), NULL, enumValue('METRE')),
      inch: () => this.conversionUnit('LENGTHUNIT', 'INCH', 0.0254, '1,0,0,0,0,0,0'),
      foot: () => this.conversionUnit('LENGTHUNIT', 'FOOT', 0.3048, '1,0,0,0,0,0,0'),
    }[this.options.unit]();
    // Imperial models commonly state angles in degrees: exercises the conversion of FlangeSlope.
    const angle = this.imperial
      ? this.conversionUnit('PLANEANGLEUNIT', 'DEGREE', Math.PI / 180, '0,0,0,0,0,0,0')
      : w.add('IFCSIUNIT', DERIVED, enumValue('PLANEANGLEUNIT'), NULL, enumValue('RADIAN'));
    const time = w.add('IFCSIUNIT', DERIVED, enumValue('TIMEUNIT'), NULL, enumValue('SECOND'));
    return w.add('IFCUNITASSIGNMENT', list([length, angle, time]));
  }

  /** A plane angle in the model's angle unit. */
  private angle(value_rad: number): StepValue {
    return real(this.imperial ? (value_rad * 180) / Math.PI : value_rad);
  }

  private material(name: string): StepValue {
    let material = this.materials.get(name);
    if (!material) {
      material = this.ifc2x3 ? this.w.add('IFCMATERIAL', text(name)) : this.w.add('IFCMATERIAL', text(name), NULL, text(name.startsWith('C') || name.includes('concrete') ? 'Concrete' : 'Steel'));
      this.materials.set(name, material);
    }
    return material;
  }

  private associate(select: StepValue, object: StepValue): void {
    const objects = this.associations.get(select);
    if (objects) objects.push(object);
    else this.associations.set(select, [object]);
  }

  private ishapeProfile(spec: ISectionSpec, override?: Partial<{ webThickness_mm: number; flangeThickness_mm: number }>): StepValue {
    const { input } = spec;
    const top = input.topFlange;
    const optional = (v_mm: number | undefined): StepValue => (v_mm ? this.len(v_mm) : NULL);
    const common = [enumValue('AREA'), text(spec.name), this.profilePosition()];
    if (input.fabrication === 'welded' && (top.width_mm !== input.bottomFlange.width_mm || top.thickness_mm !== input.bottomFlange.thickness_mm)) {
      const bottom = input.bottomFlange;
      const asymmetric = [...common, this.len(bottom.width_mm), this.len(input.depth_mm), this.len(input.webThickness_mm), this.len(bottom.thickness_mm), optional(bottom.filletRadius_mm), this.len(top.width_mm), this.len(top.thickness_mm), optional(top.filletRadius_mm)];
      // IFC2X3 ends with CentreOfGravityInY; IFC4 adds edge radius and slope of each flange instead.
      const tail = this.ifc2x3 ? [NULL] : [NULL, NULL, NULL, NULL];
      return this.w.add('IFCASYMMETRICISHAPEPROFILEDEF', ...asymmetric, ...tail);
    }
    const web_mm = override?.webThickness_mm ?? input.webThickness_mm;
    const flange_mm = override?.flangeThickness_mm ?? top.thickness_mm;
    const symmetric = [...common, this.len(top.width_mm), this.len(input.depth_mm), real(web_mm / this.scale), real(flange_mm / this.scale), optional(top.filletRadius_mm)];
    if (this.ifc2x3) return this.w.add('IFCISHAPEPROFILEDEF', ...symmetric);
    return this.w.add('IFCISHAPEPROFILEDEF', ...symmetric, optional(top.edgeRadius_mm), top.slope_rad ? this.angle(top.slope_rad) : NULL);
  }

  private outlineProfile(spec: ISectionSpec): StepValue {
    const points = iOutline(spec).map(([x, y]) => this.w.add('IFCCARTESIANPOINT', list([this.len(x), this.len(y)])));
    return this.w.add('IFCARBITRARYCLOSEDPROFILEDEF', enumValue('AREA'), text(spec.name), this.w.add('IFCPOLYLINE', list(points)));
  }

  /** One profile entity per key, shared by all members that use it (as authoring tools do). */
  private cachedProfile(key: string, write: () => StepValue): StepValue {
    let profile = this.profiles.get(key);
    if (!profile) {
      profile = write();
      this.profiles.set(key, profile);
    }
    return profile;
  }

  private profile(path: ProfilePath, spec: SectionSpec): StepValue {
    return this.cachedProfile(`${path === 'name-only-outline' ? 'outline' : 'param'}:${spec.name}`, () => {
      if (spec.kind !== 'i') return this.sectionWriter.parametric(spec.name, dimensionsOf(spec));
      return path === 'name-only-outline' ? this.outlineProfile(spec) : this.ishapeProfile(spec);
    });
  }

  private shapeRepresentation(context: StepValue, identifier: string, type: string, items: StepValue[]): StepValue {
    return this.w.add('IFCSHAPEREPRESENTATION', context, text(identifier), text(type), list(items));
  }

  private axisRepresentation(end_mm: Vec3): StepValue {
    const line = this.w.add('IFCPOLYLINE', list([this.point([0, 0, 0]), this.point(end_mm)]));
    return this.shapeRepresentation(this.axisContext, 'Axis', 'Curve3D', [line]);
  }

  /** An extrusion along the sweep's z; tapered towards `endProfile` when one is given (IFC4 and later). */
  private extrusion(profile: StepValue, sweep: SweepFrame, length_mm: number, endProfile?: StepValue): StepValue {
    const position = sweep === ALONG_Z ? this.axis3d([0, 0, 0]) : this.axis3d([...sweep.origin], [...sweep.z], [...sweep.x]);
    const args = [profile, position, this.direction([0, 0, 1]), this.len(length_mm)];
    return endProfile ? this.w.add('IFCEXTRUDEDAREASOLIDTAPERED', ...args, endProfile) : this.w.add('IFCEXTRUDEDAREASOLID', ...args);
  }

  private beamExtrusion(profile: StepValue, depth_mm: number, length_mm: number): StepValue {
    return this.extrusion(profile, beamSweep(depth_mm), length_mm);
  }

  /** Angled end cuts: the removed half space lies beyond a plane 60 mm in from each end. */
  private clippedEnds(solid: StepValue, length_mm: number): StepValue {
    const cut = (at_mm: number, normal: Vec3): StepValue =>
      this.w.add('IFCHALFSPACESOLID', this.w.add('IFCPLANE', this.axis3d([at_mm, 0, 0], unit(normal), undefined)), TRUE);
    const first = this.w.add('IFCBOOLEANCLIPPINGRESULT', enumValue('DIFFERENCE'), solid, cut(60, [1, 0, 0.25]));
    return this.w.add('IFCBOOLEANCLIPPINGRESULT', enumValue('DIFFERENCE'), first, cut(length_mm - 60, [-1, 0, 0.25]));
  }

  private mappedItem(spec: ISectionSpec, length_mm: number, material: StepValue): StepValue {
    if (!this.mappedType) {
      const solid = this.beamExtrusion(this.profile('mapped-type', spec), spec.input.depth_mm, length_mm);
      const body = this.shapeRepresentation(this.bodyContext, 'Body', 'SweptSolid', [solid]);
      const map = this.w.add('IFCREPRESENTATIONMAP', this.axis3d([0, 0, 0]), body);
      const type = this.w.add('IFCBEAMTYPE', this.guid(), this.ownerHistory, text(`${spec.name} beam`), NULL, NULL, NULL, list([map]), NULL, text(spec.name), enumValue('BEAM'));
      this.associate(material, type);
      this.mappedType = { type, map, spanFor: length_mm, members: [] };
    }
    if (Math.abs(this.mappedType.spanFor - length_mm) > 1e-6) throw new Error('mapped beams must share one span');
    const target = this.w.add('IFCCARTESIANTRANSFORMATIONOPERATOR3D', NULL, NULL, this.point([0, 0, 0]), NULL, NULL);
    return this.w.add('IFCMAPPEDITEM', this.mappedType.map, target);
  }

  private materialProfileSetUsage(spec: ISectionSpec, material: StepValue): StepValue {
    if (!this.profileSetUsage) {
      const materialProfile = this.w.add('IFCMATERIALPROFILE', text(spec.name), NULL, material, this.profile('material-profile-set', spec), NULL, NULL);
      const set = this.w.add('IFCMATERIALPROFILESET', text(spec.name), NULL, list([materialProfile]), NULL);
      // Cardinal point 8: top centre, matching the reference line at the top of steel.
      this.profileSetUsage = this.w.add('IFCMATERIALPROFILESETUSAGE', set, '8', NULL);
    }
    return this.profileSetUsage;
  }

  private entityFor(path: MemberPath, slot: MemberSlot): { entity: string; predefined: string } {
    const standardCase = this.options.schema === 'IFC4' && path === 'material-profile-set' && this.options.bodies !== 'brep';
    if (slot.role === 'column') return { entity: 'IFCCOLUMN', predefined: 'COLUMN' };
    if (slot.role === 'brace') return { entity: 'IFCMEMBER', predefined: 'BRACE' };
    return { entity: standardCase ? 'IFCBEAMSTANDARDCASE' : 'IFCBEAM', predefined: 'BEAM' };
  }

  private writeMember(slot: MemberSlot, index: number, storeyPlacement: StepValue): StepValue {
    const { schema, layout } = this.options;
    const path = memberPathOf(slot, this.options.patterns, schema);
    const span = sub(slot.end_mm, slot.start_mm);
    const length_mm = lengthOf(span);
    const local: Vec3 = [slot.start_mm[0], slot.start_mm[1], slot.start_mm[2] - slot.storey * layout.storeyHeight_mm];
    const materialEntity = this.material(materialName(path, this.imperial));
    // Columns and braces run along local Z (braces lean in the XZ plane, so global Y stays their local X); beams run
    // along local X with Z up.
    const placement =
      slot.role === 'column'
        ? this.placement(storeyPlacement, local)
        : slot.role === 'brace'
          ? this.placement(storeyPlacement, local, unit(span), [0, 1, 0])
          : this.placement(storeyPlacement, local, [0, 0, 1], unit(span));
    const body = isRealExportPath(path) ? this.realExportBody(path, slot, length_mm, materialEntity) : this.standardBody(path, slot, length_mm, materialEntity);
    const shape = body.representations ? this.w.add('IFCPRODUCTDEFINITIONSHAPE', NULL, NULL, list(body.representations)) : NULL;
    const { entity, predefined } = this.entityFor(path, slot);
    const mark = `${slot.role === 'column' ? 'C' : slot.role === 'brace' ? 'BR' : 'B'}${index + 1}`;
    const objectType = body.objectType === null ? NULL : text(body.objectType);
    const attributes = [this.guid(), this.ownerHistory, text(body.name ?? mark), NULL, objectType, placement, shape, text(`T${index + 1}`)];
    const element = this.w.add(entity, ...attributes, ...(this.ifc2x3 ? [] : [enumValue(predefined)]));
    if (body.select) this.associate(body.select, element);
    if (body.mapped) this.mappedType?.members.push(element);
    return element;
  }

  /** The body of one of today's paths (or its faceted BREP), with the defects the options ask for. */
  private standardBody(path: ProfilePath, slot: MemberSlot, length_mm: number, material: StepValue): MemberBody {
    const { schema, sections, defects } = this.options;
    const defect = defectOf(slot, defects);
    const spec = sectionOf(path, sections, schema);
    const brep = this.options.bodies === 'brep';
    const representations: StepValue[] = [];
    let select: StepValue | undefined = material;
    if (slot.role === 'column' || slot.role === 'brace') {
      if (path !== 'column-ishape') representations.push(this.axisRepresentation([0, 0, length_mm]));
      const solid = brep ? undefined : this.extrusion(this.profile(path, spec), ALONG_Z, length_mm);
      representations.push(solid ? this.shapeRepresentation(this.bodyContext, 'Body', 'SweptSolid', [solid]) : this.faceBody('faceted-brep', this.sweptMesh(dimensionsOf(spec), length_mm), ALONG_Z));
    } else {
      if (spec.kind !== 'i') throw new Error(`beam path ${path} needs an I-section`);
      if (path !== 'extrusion-only') representations.push(this.axisRepresentation([length_mm, 0, 0]));
      if (brep) {
        representations.push(this.faceBody('faceted-brep', this.sweptMesh(dimensionsOf(spec), length_mm), beamSweep(spec.input.depth_mm)));
      } else {
        let profile = this.profile(path, spec);
        if (defect === 'zero-web') profile = this.ishapeProfile({ ...spec, name: `${spec.name} zero web` }, { webThickness_mm: 0 });
        if (defect === 'negative-flange') profile = this.ishapeProfile({ ...spec, name: `${spec.name} negative flange` }, { flangeThickness_mm: -spec.input.topFlange.thickness_mm });
        if (path === 'mapped-type' && !defect) {
          select = undefined;
          representations.push(this.shapeRepresentation(this.bodyContext, 'Body', 'MappedRepresentation', [this.mappedItem(spec, length_mm, material)]));
        } else if (path === 'clipped') {
          representations.push(this.shapeRepresentation(this.bodyContext, 'Body', 'Clipping', [this.clippedEnds(this.beamExtrusion(profile, spec.input.depth_mm, length_mm), length_mm)]));
        } else {
          representations.push(this.shapeRepresentation(this.bodyContext, 'Body', 'SweptSolid', [this.beamExtrusion(profile, spec.input.depth_mm, length_mm)]));
        }
        if (path === 'material-profile-set' && !defect) {
          select = this.ifc2x3 ? this.w.add('IFCMATERIALLIST', list([material])) : this.materialProfileSetUsage(spec, material);
        }
      }
    }
    return {
      representations: defect === 'no-representation' ? null : representations,
      select,
      objectType: spec.name,
      name: defect ? `DEFECT ${defect}` : undefined,
      mapped: path === 'mapped-type' && !defect && !brep,
    };
  }

  /** The body of a real-export path, named where real exports name it. */
  private realExportBody(path: RealExportPath, slot: MemberSlot, length_mm: number, material: StepValue): MemberBody {
    const { designation, designationIn, writing } = REAL_EXPORT_SECTIONS[path];
    const sweep = slot.role === 'column' ? ALONG_Z : beamSweep(depthOf(writing.kind === 'tapered' ? writing.start : writing.section));
    const representations: StepValue[] = [];
    // Faceted BREP members come without an Axis representation, as many exports write them; the rest have one.
    if (!(writing.kind === 'body' && writing.body === 'faceted-brep')) {
      representations.push(this.axisRepresentation(slot.role === 'column' ? [0, 0, length_mm] : [length_mm, 0, 0]));
    }
    if (this.options.bodies === 'brep') {
      representations.push(this.faceBody('faceted-brep', this.realExportMesh(writing, length_mm), sweep));
    } else if (writing.kind === 'body') {
      representations.push(this.faceBody(writing.body, this.realExportMesh(writing, length_mm), sweep));
    } else {
      const name = designation ?? path;
      let solid: StepValue;
      if (writing.kind === 'tapered') {
        const start = this.cachedProfile(`${path}:start`, () => this.ishapeProfile(iSpec(name, writing.start)));
        const end = this.cachedProfile(`${path}:end`, () => this.ishapeProfile(iSpec(writing.endDesignation, writing.end)));
        solid = this.extrusion(start, sweep, length_mm, end);
      } else {
        const profile = this.cachedProfile(path, () =>
          writing.kind === 'outline' ? this.sectionWriter.outline(name, writing.section, writing.curve) : this.sectionWriter.parametric(name, writing.section),
        );
        solid = this.extrusion(profile, sweep, length_mm);
      }
      representations.push(this.shapeRepresentation(this.bodyContext, 'Body', 'SweptSolid', [solid]));
    }
    return {
      representations,
      select: material,
      objectType: designationIn === 'ObjectType' ? designation : null,
      name: designationIn === 'Name' && designation ? designation : undefined,
      mapped: false,
    };
  }

  private realExportMesh(writing: PathWriting, length_mm: number): Mesh {
    if (writing.kind === 'tapered') return loftMesh(bodyPolygons(writing.start), bodyPolygons(writing.end), length_mm);
    if (writing.kind === 'body' && writing.cope) {
      const cut_mm = depthOf(writing.section) / 2 - writing.cope.depth_mm;
      return copedMesh(bodyPolygons(writing.section).outer, length_mm, writing.cope.length_mm, cut_mm);
    }
    return this.sweptMesh(writing.section, length_mm);
  }

  private sweptMesh(section: DrawableSection, length_mm: number): Mesh {
    return prismMesh(bodyPolygons(section), length_mm);
  }

  /** A body given by its faces, placed in the member's coordinates as the sweep it stands for. */
  private faceBody(kind: BodyKind, mesh: Mesh, sweep: SweepFrame): StepValue {
    const item = this.sectionWriter.body(kind, placedMesh(mesh, sweep.origin, sweep.x, sweep.y, sweep.z));
    return this.shapeRepresentation(this.bodyContext, 'Body', kind === 'faceted-brep' ? 'Brep' : 'Tessellation', [item]);
  }

  private writeSlab(storey: number, storeyPlacement: StepValue): StepValue {
    const { layout } = this.options;
    const x_mm = layout.bays * layout.spanX_mm;
    const y_mm = layout.bays * layout.spanY_mm;
    const position = this.w.add('IFCAXIS2PLACEMENT2D', this.w.add('IFCCARTESIANPOINT', list([this.len(x_mm / 2), this.len(y_mm / 2)])), NULL);
    const rectangle = this.w.add('IFCRECTANGLEPROFILEDEF', enumValue('AREA'), text('Floor plate'), position, this.len(x_mm), this.len(y_mm));
    const solid = this.w.add('IFCEXTRUDEDAREASOLID', rectangle, this.axis3d([0, 0, 0]), this.direction([0, 0, 1]), this.len(200));
    const shape = this.w.add('IFCPRODUCTDEFINITIONSHAPE', NULL, NULL, list([this.shapeRepresentation(this.bodyContext, 'Body', 'SweptSolid', [solid])]));
    const placement = this.placement(storeyPlacement, [0, 0, layout.storeyHeight_mm]);
    const slab = this.w.add('IFCSLAB', this.guid(), this.ownerHistory, text(`Floor ${storey + 2}`), NULL, NULL, placement, shape, NULL, enumValue('FLOOR'));
    this.associate(this.material(this.imperial ? '4000 psi concrete' : 'C30/37'), slab);
    return slab;
  }
}
