/**
 * Member forces from an IFC structural analysis model (IFC4 / IFC4X3 structural analysis domain): for every analysis
 * member (IfcStructuralCurveMember) of every result group (IfcStructuralResultGroup, one per load combination or load
 * case), the internal forces at each station, and the physical member (IfcBeam, IfcColumn, IfcMember) each analysis
 * member stands for.
 *
 *   const results = await readStructuralResults('analysis.ifc');   // or structuralResultsOf(lines, …) on an open model
 *
 * What the schema text says, and how it is read here (buildingSMART IFC 4.3.2.0, sections 7.10 and 8.19):
 * - IfcStructuralActivity: reactions are "support reactions, internal forces, deflections, etc."; a result group
 *   "collect[s] instances from IfcStructuralReaction or its respective subclasses" (IfcStructuralResultGroup) through
 *   IfcRelAssignsToGroup, and an activity belongs to its member through IfcRelConnectsStructuralActivity. Curve actions
 *   in a result group are read the same way, as some exports write internal forces as actions.
 * - Axes (IfcStructuralCurveMember / IfcStructuralItem): "the local x axis is parallel with the tangent on the
 *   reference curve", the local z axis follows the attribute Axis, "the local y axis is directed such that x,y,z form
 *   a right-handed Cartesian coordinate system"; the reference curve is the member's topology edge, given in the
 *   analysis model's (global) coordinates. So ForceX is the axial force N, ForceY the shear Vy, ForceZ the shear Vz,
 *   MomentY the moment My about local y and MomentZ the moment Mz about local z (LOCAL_COORDS); GLOBAL_COORDS values
 *   are turned into those axes here. The schema gives no rule for the sign of a cut face: signs are kept as written.
 * - Stations (IfcStructuralLoadConfiguration): "1-dimensional locations shall be given, measured locally along the
 *   curve. The location shall not exceed the bounds of the curve activity", in ascending order.
 * - Units: IfcStructuralLoadSingleForce holds IfcForceMeasure and IfcTorqueMeasure values, in the project's FORCEUNIT
 *   and TORQUEUNIT (an IfcDerivedUnit); lengths in its LENGTHUNIT. None of them is guessed.
 *
 * The row fields follow the results import (server/results/result-row.ts): shear_N is the shear along local z, which
 * analysis programs point along the web of an I-section (common practice, no source), so it is the major-axis shear.
 * Forces are a checking aid: they must match the analysis the engineer of record approved.
 */
import {
  IFCBEAM,
  IFCCOLUMN,
  IFCCONVERSIONBASEDUNIT,
  IFCDERIVEDUNIT,
  IFCEDGE,
  IFCEDGECURVE,
  IFCMEMBER,
  IFCORIENTEDEDGE,
  IFCPROJECT,
  IFCRELASSIGNSTOGROUP,
  IFCRELASSIGNSTOPRODUCT,
  IFCRELCONNECTSSTRUCTURALACTIVITY,
  IFCSIUNIT,
  IFCSTRUCTURALCURVEACTION,
  IFCSTRUCTURALCURVEMEMBER,
  IFCSTRUCTURALCURVEREACTION,
  IFCSTRUCTURALLOADCONFIGURATION,
  IFCSTRUCTURALLOADSINGLEFORCE,
  IFCSTRUCTURALLOADSINGLEFORCEWARPING,
  IFCSTRUCTURALPOINTACTION,
  IFCSTRUCTURALPOINTREACTION,
  IFCSTRUCTURALRESULTGROUP,
  IFCTOPOLOGYREPRESENTATION,
  IFCVERTEXPOINT,
} from 'web-ifc';
import { lengthUnitOf } from './length-unit';
import { cross, dot, type Mat4, norm, normalize, scale, subtract, transformDirection, transformPoint, type Vec3 } from './matrix4';
import { MemberReader } from './member-reader';
import type { Point3_mm } from './model-read-result';
import { openModel } from './open-model';
import { readDirection, readObjectPlacement, readPoint } from './placement-reader';
import { booleanOf, enumOf, numberOf, numbersOf, refOf, refsOf, StepLines, type StepValue, textOf } from './step-lines';
import { type DeclaredUnit, projectUnits, radiansPerAngleUnit, siPrefixExponent } from './unit-assignment';

export type StructuralResultsErrorCode =
  | 'unsupported-schema'
  | 'no-analysis-members'
  | 'no-results'
  | 'empty-result-group'
  | 'station-outside-member'
  | 'no-stations'
  | 'not-internal-forces'
  | 'member-geometry'
  | 'no-force-unit'
  | 'no-moment-unit';

/** Refuses the whole file: nothing is returned half-read. The message names the entity at fault. */
export class StructuralResultsError extends Error {
  constructor(
    readonly code: StructuralResultsErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'StructuralResultsError';
  }
}

/** One force row, in the shape of the results import's rows (N, N·mm, mm), plus the axial force and torsion. */
export interface StructuralForceRow {
  /** The physical member's GlobalId when linked, else the analysis member's GlobalId. */
  memberKey: string;
  combination: string;
  /** From the start vertex of the analysis member's edge. */
  station_mm: number;
  /** Vz (ForceZ). Each force is undefined when the file leaves it unset ('$'). */
  shear_N?: number;
  /** Vy (ForceY). */
  minorShear_N?: number;
  /** My (MomentY). */
  majorMoment_Nmm?: number;
  /** Mz (MomentZ). */
  minorMoment_Nmm?: number;
  /** N (ForceX), tension positive as exported. */
  axial_N?: number;
  /** Mx (MomentX). */
  torsion_Nmm?: number;
  /** The analysis member's ends in model coordinates, for matching by geometry against another model. */
  end1_mm: Point3_mm;
  end2_mm: Point3_mm;
  /** The activity the value was read from ('#812'), named in place of a file row. */
  entity: string;
}

export type AnalysisMemberLink =
  | { by: 'assignment'; globalId: string }
  /** Both ends within the tolerance of the physical axis; `reversed` when the analysis edge runs the other way. */
  | { by: 'coordinates'; globalId: string; distance_mm: number; reversed: boolean; startAlong_mm: number }
  | { by: 'none'; reason: string };

export interface AnalysisMember {
  expressId: number;
  globalId: string;
  name: string | null;
  start_mm: Point3_mm;
  end_mm: Point3_mm;
  length_mm: number;
  /** Unit vectors of the local axes in model coordinates. */
  axes: { x: Vec3; y: Vec3; z: Vec3 };
  link: AnalysisMemberLink;
}

export interface ResultGroup {
  expressId: number;
  globalId: string;
  /** The combination the rows name: the result group's Name, else its load group's, else '#id'. */
  combination: string;
  /** The load group it results from (ResultForLoadGroup), with its PredefinedType (LOAD_COMBINATION, LOAD_CASE, …). */
  loadGroup: { globalId: string; name: string | null; kind: string | null } | null;
  memberCount: number;
}

export interface StructuralResults {
  members: AnalysisMember[];
  groups: ResultGroup[];
  rows: StructuralForceRow[];
  units: { lengthScaleToMm: number; newtonsPerForceUnit: number; newtonMillimetresPerMomentUnit: number };
}

/** A physical member's axis in model coordinates (MemberRecord.axis), for linking by coordinates. */
export interface PhysicalMemberAxis {
  globalId: string;
  start_mm: Point3_mm;
  end_mm: Point3_mm;
}

export interface StructuralResultsOptions {
  /** The members to link to by coordinates; by default the physical members of the same file. */
  physicalMembers?: readonly PhysicalMemberAxis[];
  /** Largest distance of either analysis end from the physical axis (the results import's geometry default). */
  tolerance_mm?: number;
}

export const DEFAULT_LINK_TOLERANCE_MM = 250;
/** Stations may overshoot the member by rounding of the exported numbers, no more. */
const STATION_SLACK_MM = 1;
const PHYSICAL_TYPES = [IFCBEAM, IFCCOLUMN, IFCMEMBER] as const;
const CURVE_ACTIVITIES = new Set([IFCSTRUCTURALCURVEREACTION, IFCSTRUCTURALCURVEACTION]);
const POINT_ACTIVITIES = new Set([IFCSTRUCTURALPOINTREACTION, IFCSTRUCTURALPOINTACTION]);
const SINGLE_FORCES = new Set([IFCSTRUCTURALLOADSINGLEFORCE, IFCSTRUCTURALLOADSINGLEFORCEWARPING]);
/** Attribute positions shared by every IfcStructuralActivity subtype. */
const APPLIED_LOAD_AT = 7;
const GLOBAL_OR_LOCAL_AT = 8;
const MAX_UNIT_DEPTH = 8;

/** Opens the file, reads its results and closes it. Throws StructuralResultsError (or IfcReadError for a bad file). */
export async function readStructuralResults(source: Uint8Array | string, options: StructuralResultsOptions = {}): Promise<StructuralResults> {
  const opened = await openModel(source);
  try {
    if (opened.header.schema === 'IFC2X3') {
      throw new StructuralResultsError(
        'unsupported-schema',
        'IFC2X3 analysis models cannot carry forces at stations (IfcStructuralLoadConfiguration came with IFC4): export the analysis model as IFC4 or IFC4X3.',
      );
    }
    return structuralResultsOf(new StepLines(opened.api, opened.modelId, opened.text), options);
  } finally {
    opened.close();
  }
}

/** The results of a model already open (the import reads the checked model and its forces from one file). */
export function structuralResultsOf(lines: StepLines, options: StructuralResultsOptions = {}): StructuralResults {
  const memberIds = lines.idsOfType(IFCSTRUCTURALCURVEMEMBER, true);
  if (memberIds.length === 0) {
    throw new StructuralResultsError('no-analysis-members', 'The file holds no analysis members (IfcStructuralCurveMember), so it has no member forces to read.');
  }
  const groupIds = lines.idsOfType(IFCSTRUCTURALRESULTGROUP);
  if (groupIds.length === 0) {
    throw new StructuralResultsError(
      'no-results',
      `The file holds ${memberIds.length} analysis members (IfcStructuralCurveMember) but no results (no IfcStructuralResultGroup): ` +
        'export the analysis model again with its results.',
    );
  }
  const declared = projectUnits(lines);
  const scaleToMm = lengthUnitOf(declared).scaleToMm;
  const units = { lengthScaleToMm: scaleToMm, newtonsPerForceUnit: newtonsPerForceUnit(declared), newtonMillimetresPerMomentUnit: newtonMillimetresPerMomentUnit(lines) };
  const relations = structuralRelations(lines);
  const geometry = new Map(memberIds.map((id) => [id, memberGeometry(lines, id, scaleToMm)]));
  const physical = options.physicalMembers ?? physicalAxesOf(lines, declared, scaleToMm);
  const tolerance_mm = options.tolerance_mm ?? DEFAULT_LINK_TOLERANCE_MM;
  const members = memberIds.map((id): AnalysisMember => {
    const g = geometry.get(id)!;
    const link = linkByAssignment(lines, relations.assignedProduct.get(id)) ?? linkByCoordinates(g, physical, tolerance_mm);
    return { expressId: id, globalId: globalIdOf(lines, id), name: textOf(lines.line(id)?.args[2]), ...g, link };
  });
  const byId = new Map(members.map((m) => [m.expressId, m]));

  const groups: ResultGroup[] = [];
  const rows: StructuralForceRow[] = [];
  for (const groupId of groupIds) {
    const group = resultGroupOf(lines, groupId);
    const onMembers = (relations.groupMembers.get(groupId) ?? []).flatMap((activity) => {
      const member = byId.get(relations.activityItem.get(activity) ?? 0);
      return member ? [{ activity, member }] : [];
    });
    if (onMembers.length === 0) {
      throw new StructuralResultsError('empty-result-group', `${entityName(lines, groupId)} holds no forces on any analysis member: export it again with its member results, or leave it out.`);
    }
    for (const { activity, member } of onMembers) {
      for (const sample of activitySamples(lines, activity, member, units)) {
        rows.push({
          memberKey: member.link.by === 'none' ? member.globalId : member.link.globalId,
          combination: group.combination,
          ...sample,
          end1_mm: member.start_mm,
          end2_mm: member.end_mm,
          entity: `#${activity}`,
        });
      }
    }
    groups.push({ ...group, memberCount: new Set(onMembers.map((o) => o.member.expressId)).size });
  }
  return { members, groups, rows, units };
}

interface StructuralRelations {
  /** Result (or load) group → the activities assigned to it. */
  groupMembers: Map<number, number[]>;
  /** Activity → the structural item it acts on. */
  activityItem: Map<number, number>;
  /** Analysis item → the physical product it is assigned to (either direction of IfcRelAssignsToProduct). */
  assignedProduct: Map<number, number>;
}

function structuralRelations(lines: StepLines): StructuralRelations {
  const groupMembers = new Map<number, number[]>();
  for (const id of lines.idsOfType(IFCRELASSIGNSTOGROUP, true)) {
    const args = lines.line(id)?.args ?? [];
    const group = refOf(args[6]);
    if (group !== undefined) groupMembers.set(group, [...(groupMembers.get(group) ?? []), ...refsOf(args[4])]);
  }
  const activityItem = new Map<number, number>();
  for (const id of lines.idsOfType(IFCRELCONNECTSSTRUCTURALACTIVITY)) {
    const args = lines.line(id)?.args ?? [];
    const item = refOf(args[4]);
    const activity = refOf(args[5]);
    if (item !== undefined && activity !== undefined) activityItem.set(activity, item);
  }
  const physical = new Set(PHYSICAL_TYPES.flatMap((type) => lines.idsOfType(type, true)));
  const assignedProduct = new Map<number, number>();
  for (const id of lines.idsOfType(IFCRELASSIGNSTOPRODUCT)) {
    const args = lines.line(id)?.args ?? [];
    const product = refOf(args[6]);
    const related = refsOf(args[4]);
    if (product === undefined) continue;
    if (physical.has(product)) for (const item of related) assignedProduct.set(item, product);
    else for (const element of related.filter((r) => physical.has(r))) assignedProduct.set(product, element);
  }
  return { groupMembers, activityItem, assignedProduct };
}

function globalIdOf(lines: StepLines, id: number): string {
  return textOf(lines.line(id)?.args[0]) ?? `#${id}`;
}

/** "IfcStructuralResultGroup #40 'ULS 1' (GlobalId 0x…)": what a message names. */
function entityName(lines: StepLines, id: number): string {
  const line = lines.line(id);
  const name = textOf(line?.args[2]);
  return `${lines.typeName(line?.type ?? 0)} #${id}${name ? ` '${name}'` : ''} (GlobalId ${globalIdOf(lines, id)})`;
}

function resultGroupOf(lines: StepLines, id: number): Omit<ResultGroup, 'memberCount'> {
  const args = lines.line(id)?.args ?? [];
  const loadGroupId = refOf(args[6]);
  const loadArgs = lines.line(loadGroupId)?.args;
  const loadGroup = loadArgs ? { globalId: textOf(loadArgs[0]) ?? `#${loadGroupId}`, name: textOf(loadArgs[2]), kind: enumOf(loadArgs[5]) } : null;
  const combination = textOf(args[2])?.trim() || loadGroup?.name?.trim() || `#${id}`;
  return { expressId: id, globalId: globalIdOf(lines, id), combination, loadGroup };
}

// --- units ----------------------------------------------------------------------------------------------------------

function newtonsPerForceUnit(units: readonly DeclaredUnit[]): number {
  const force = units.find((u) => u.unitType === 'FORCEUNIT');
  if (!force?.scaleToSi) {
    throw new StructuralResultsError(
      'no-force-unit',
      `The model declares ${force ? `a force unit "${force.name}" with no conversion to newtons` : 'no force unit (its IfcUnitAssignment has no FORCEUNIT)'}, so its forces cannot be read. ` +
        'Export it again with the project units included.',
    );
  }
  return force.scaleToSi;
}

/** N·mm per unit of the project's TORQUEUNIT (an IfcDerivedUnit such as kN × m). */
function newtonMillimetresPerMomentUnit(lines: StepLines): number {
  const project = lines.idsOfType(IFCPROJECT)[0];
  const assignment = refOf(lines.line(project)?.args[8]);
  const torque = refsOf(lines.line(assignment)?.args[0]).find((id) => lines.typeOf(id) === IFCDERIVEDUNIT && enumOf(lines.line(id)?.args[1]) === 'TORQUEUNIT');
  const newtonMetres = torque === undefined ? undefined : derivedUnitScaleToSi(lines, torque);
  if (newtonMetres === undefined) {
    throw new StructuralResultsError(
      'no-moment-unit',
      torque === undefined
        ? "The model declares no moment unit (its IfcUnitAssignment has no IfcDerivedUnit of type TORQUEUNIT), so its moments cannot be read. Export it again with the project units included."
        : `The model's moment unit (IfcDerivedUnit #${torque}, TORQUEUNIT) has no usable conversion to newton metres, so its moments cannot be read.`,
    );
  }
  return newtonMetres * 1000;
}

/** Product of the elements' factors to SI raised to their exponents; undefined when one is not derivable. */
function derivedUnitScaleToSi(lines: StepLines, id: number): number | undefined {
  let factor = 1;
  for (const element of refsOf(lines.line(id)?.args[0])) {
    const args = lines.line(element)?.args ?? [];
    const unit = namedUnitScaleToSi(lines, refOf(args[0]), 0);
    const exponent = numberOf(args[1]);
    if (unit === undefined || exponent === undefined) return undefined;
    factor *= unit ** exponent;
  }
  return Number.isFinite(factor) && factor > 0 ? factor : undefined;
}

/** An IfcSIUnit's prefix, or an IfcConversionBasedUnit's factor times its own unit's (unit-assignment.ts reads the same for named units). */
function namedUnitScaleToSi(lines: StepLines, id: number | undefined, depth: number): number | undefined {
  const line = lines.line(id);
  if (line?.type === IFCSIUNIT) {
    const exponent = siPrefixExponent(enumOf(line.args[2]));
    return exponent === undefined ? undefined : 10 ** exponent;
  }
  if (line?.type === IFCCONVERSIONBASEDUNIT && depth < MAX_UNIT_DEPTH) {
    const measure = lines.line(refOf(line.args[3]))?.args ?? [];
    const value = numberOf(measure[0]);
    const component = namedUnitScaleToSi(lines, refOf(measure[1]), depth + 1);
    return value !== undefined && component !== undefined ? value * component : undefined;
  }
  return undefined;
}

// --- geometry -------------------------------------------------------------------------------------------------------

type MemberGeometry = Pick<AnalysisMember, 'start_mm' | 'end_mm' | 'length_mm' | 'axes'>;

/** The start and end vertex of an edge item, in its placement's coordinates. */
function edgeEnds(lines: StepLines, item: number | undefined): [Vec3, Vec3] | undefined {
  const line = lines.line(item);
  if (!line) return undefined;
  if (line.type === IFCORIENTEDEDGE) {
    const ends = edgeEnds(lines, refOf(line.args[2]));
    return ends && booleanOf(line.args[3]) === false ? [ends[1], ends[0]] : ends;
  }
  if (line.type !== IFCEDGE && line.type !== IFCEDGECURVE) return undefined;
  const vertex = (arg: StepValue) => {
    const v = lines.line(refOf(arg));
    return v?.type === IFCVERTEXPOINT ? readPoint(lines, refOf(v.args[0])) : undefined;
  };
  const start = vertex(line.args[0]);
  const end = vertex(line.args[1]);
  return start && end ? [start, end] : undefined;
}

/** Edge ends and local axes, in model coordinates and millimetres (curved edges are read as their chord). */
function memberGeometry(lines: StepLines, id: number, scaleToMm: number): MemberGeometry {
  const args = lines.line(id)?.args ?? [];
  const representations = refsOf(lines.line(refOf(args[6]))?.args[2]);
  const items = representations.filter((r) => lines.typeOf(r) === IFCTOPOLOGYREPRESENTATION).flatMap((r) => refsOf(lines.line(r)?.args[3]));
  const ends = items.map((item) => edgeEnds(lines, item)).find((e) => e !== undefined);
  const fail = (why: string) => new StructuralResultsError('member-geometry', `${entityName(lines, id)} ${why}, so its stations cannot be placed.`);
  if (!ends) throw fail('has no edge (an IfcTopologyRepresentation with an IfcEdge between two IfcVertexPoint)');
  const placement: Mat4 = readObjectPlacement(lines, refOf(args[5]));
  const [start_mm, end_mm] = ends.map((p) => scale(transformPoint(placement, p), scaleToMm) as Point3_mm);
  const length_mm = norm(subtract(end_mm, start_mm));
  const x = normalize(subtract(end_mm, start_mm));
  if (!x || length_mm < STATION_SLACK_MM) throw fail('has an edge of no length');
  const axis = readDirection(lines, refOf(args[8]));
  const along = axis && transformDirection(placement, axis);
  const z = along && normalize(subtract(along, scale(x, dot(along, x))));
  if (!z) throw fail('has no Axis across its edge (the direction of its local z axis)');
  return { start_mm, end_mm, length_mm, axes: { x, y: cross(z, x), z } };
}

// --- forces ---------------------------------------------------------------------------------------------------------

type ForceSample = Pick<StructuralForceRow, 'station_mm' | 'shear_N' | 'minorShear_N' | 'majorMoment_Nmm' | 'minorMoment_Nmm' | 'axial_N' | 'torsion_Nmm'>;

/** The samples of one activity: a configuration's values at its locations, a constant force at both ends, or a point force. */
function activitySamples(lines: StepLines, activity: number, member: AnalysisMember, units: StructuralResults['units']): ForceSample[] {
  const line = lines.line(activity)!;
  const loadId = refOf(line.args[APPLIED_LOAD_AT]);
  const global = enumOf(line.args[GLOBAL_OR_LOCAL_AT]) === 'GLOBAL_COORDS';
  const where = `${entityName(lines, activity)} on ${entityName(lines, member.expressId)}`;
  const sample = (forceId: number, station_mm: number): ForceSample => {
    if (!SINGLE_FORCES.has(lines.typeOf(forceId))) {
      throw new StructuralResultsError(
        'not-internal-forces',
        `${where} holds ${lines.typeName(lines.typeOf(forceId))} values, not internal forces: member forces are read from IfcStructuralLoadSingleForce values (forces and moments at stations).`,
      );
    }
    if (station_mm < -STATION_SLACK_MM || station_mm > member.length_mm + STATION_SLACK_MM) {
      throw new StructuralResultsError(
        'station-outside-member',
        `${where} gives forces at ${round(station_mm)} mm, outside the member's length of ${round(member.length_mm)} mm.`,
      );
    }
    return { station_mm, ...forcesOf(lines, forceId, global ? member.axes : undefined, units) };
  };
  if (POINT_ACTIVITIES.has(line.type)) return [sample(loadId!, pointStation(lines, line.args[5], line.args[6], member, units.lengthScaleToMm, where))];
  if (!CURVE_ACTIVITIES.has(line.type)) return [];
  if (lines.typeOf(loadId) === IFCSTRUCTURALLOADCONFIGURATION) {
    const config = lines.line(loadId)!.args;
    const values = refsOf(config[1]);
    const locations = Array.isArray(config[2]) ? config[2].map((l) => numbersOf(l)) : [];
    if (locations.length !== values.length || locations.some((l) => l.length !== 1 || !Number.isFinite(l[0]))) {
      throw new StructuralResultsError('no-stations', `${where} gives ${values.length} values but not one station (a list of one length) for each.`);
    }
    return values.map((value, i) => sample(value, locations[i][0] * units.lengthScaleToMm));
  }
  // A single value on a curve is constant along it (PredefinedType CONST): it holds at both ends.
  return [sample(loadId!, 0), sample(loadId!, member.length_mm)];
}

/** A point activity's station: its vertex projected on the member's edge, which it must lie on. */
function pointStation(lines: StepLines, placementArg: StepValue, shapeArg: StepValue, member: AnalysisMember, scaleToMm: number, where: string): number {
  const items = refsOf(lines.line(refOf(shapeArg))?.args[2]).flatMap((r) => refsOf(lines.line(r)?.args[3]));
  const vertex = items.map((i) => lines.line(i)).find((l) => l?.type === IFCVERTEXPOINT);
  const point = vertex && readPoint(lines, refOf(vertex.args[0]));
  if (!point) throw new StructuralResultsError('no-stations', `${where} has no vertex (IfcVertexPoint) to place it along the member.`);
  const at = scale(transformPoint(readObjectPlacement(lines, refOf(placementArg)), point), scaleToMm);
  const offset = subtract(at, member.start_mm);
  const station_mm = dot(offset, member.axes.x);
  const off_mm = norm(subtract(offset, scale(member.axes.x, station_mm)));
  if (off_mm > STATION_SLACK_MM) {
    throw new StructuralResultsError('station-outside-member', `${where} lies ${round(off_mm)} mm away from the member's edge, not on it.`);
  }
  return station_mm;
}

/** The six components in N and N·mm, in the member's local axes (turned from global axes when `axes` is given). */
function forcesOf(lines: StepLines, id: number, axes: AnalysisMember['axes'] | undefined, units: StructuralResults['units']): Omit<ForceSample, 'station_mm'> {
  const args = lines.line(id)!.args;
  const f = [1, 2, 3, 4, 5, 6].map((i) => numberOf(args[i]));
  const force = toLocal(f.slice(0, 3), axes).map((v) => (v === undefined ? undefined : v * units.newtonsPerForceUnit));
  const moment = toLocal(f.slice(3, 6), axes).map((v) => (v === undefined ? undefined : v * units.newtonMillimetresPerMomentUnit));
  return { axial_N: force[0], minorShear_N: force[1], shear_N: force[2], torsion_Nmm: moment[0], majorMoment_Nmm: moment[1], minorMoment_Nmm: moment[2] };
}

/** Global components onto the local axes; an unset global component counts as zero once any is set. */
function toLocal(v: (number | undefined)[], axes: AnalysisMember['axes'] | undefined): (number | undefined)[] {
  if (!axes || v.every((c) => c === undefined)) return v;
  const g: Vec3 = [v[0] ?? 0, v[1] ?? 0, v[2] ?? 0];
  return [dot(g, axes.x), dot(g, axes.y), dot(g, axes.z)];
}

function round(value_mm: number): string {
  return String(Math.round(value_mm * 10) / 10);
}

// --- links ----------------------------------------------------------------------------------------------------------

function linkByAssignment(lines: StepLines, product: number | undefined): AnalysisMemberLink | undefined {
  return product === undefined ? undefined : { by: 'assignment', globalId: globalIdOf(lines, product) };
}

/** Distance of a point from a segment, and where its foot lies along it. */
function fromSegment(p: Vec3, a: Vec3, b: Vec3): { distance_mm: number; along_mm: number } {
  const ab = subtract(b, a);
  const length = norm(ab);
  const t = length === 0 ? 0 : Math.min(1, Math.max(0, dot(subtract(p, a), ab) / (length * length)));
  return { distance_mm: norm(subtract(p, [a[0] + ab[0] * t, a[1] + ab[1] * t, a[2] + ab[2] * t])), along_mm: t * length };
}

/**
 * The physical member whose axis passes within the tolerance of both analysis ends (the rule of the results import's
 * geometry matching, so an analysis member split at a node still finds its beam); the nearest when several do.
 */
export function linkByCoordinates(member: Pick<AnalysisMember, 'start_mm' | 'end_mm'>, physical: readonly PhysicalMemberAxis[], tolerance_mm: number): AnalysisMemberLink {
  let best: (AnalysisMemberLink & { by: 'coordinates' }) | undefined;
  let tied = false;
  for (const p of physical) {
    const start = fromSegment(member.start_mm, p.start_mm, p.end_mm);
    const end = fromSegment(member.end_mm, p.start_mm, p.end_mm);
    const distance_mm = Math.max(start.distance_mm, end.distance_mm);
    if (distance_mm > tolerance_mm) continue;
    if (best && Math.abs(distance_mm - best.distance_mm) < 1e-6) tied = true;
    if (!best || distance_mm < best.distance_mm - 1e-6) {
      best = { by: 'coordinates', globalId: p.globalId, distance_mm, reversed: end.along_mm < start.along_mm, startAlong_mm: start.along_mm };
      tied = false;
    }
  }
  if (tied && best) return { by: 'none', reason: `Its ends lie as near to two or more physical member axes (${round(best.distance_mm)} mm) as to ${best.globalId}; link it in the analysis export (IfcRelAssignsToProduct).` };
  if (best) return best;
  return {
    by: 'none',
    reason:
      physical.length === 0
        ? 'It is assigned to no physical member (IfcRelAssignsToProduct) and there are no physical members to compare its coordinates with.'
        : `It is assigned to no physical member (IfcRelAssignsToProduct) and no physical member's axis passes within ${tolerance_mm} mm of both its ends.`,
  };
}

/** Axes of the file's own beams, columns and members, read the way the model import reads them. */
function physicalAxesOf(lines: StepLines, units: readonly DeclaredUnit[], scaleToMm: number): PhysicalMemberAxis[] {
  const reader = new MemberReader(lines, {
    ifc2x3: false,
    scaleToMm,
    radiansPerAngleUnit: radiansPerAngleUnit(units),
    defaultGrade: 'S355',
    yieldRule: 'en10025-2',
  });
  return reader.memberIds().flatMap((id) => {
    const record = reader.read(id);
    return record.axis ? [{ globalId: record.globalId, start_mm: record.axis.start_mm, end_mm: record.axis.end_mm }] : [];
  });
}
