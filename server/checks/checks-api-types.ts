/**
 * The checks API's answers as plain types (no entities, no TypeORM), so the client imports them instead of keeping
 * copies: a check run, the results table and a member's calculation sheet.
 */
import type { Standard } from '../engine/check';
import type { GradeId } from '../engine/grades';
import type { ISectionInput } from '../engine/section';
import type { SectionDimensions, SectionPolygon } from '../engine/section-family';
import type { SectionPropertyValues } from '../engine/section-properties';
import type { JunctionStress } from '../engine/shear-stress';
import type { ShearAxis } from '../engine/shear-axis';
import type { TraceStep } from '../engine/trace';
import type { MemberRecord } from '../ifc/model-read-result';
import type { CheckParameters } from './check-parameters';
import type { GoverningCheck, MemberCheck, RunFlag } from './check-run-compute';
import type { RunSummaryView } from './run-summary';

export const CHECK_RUN_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type CheckRunStatus = (typeof CHECK_RUN_STATUSES)[number];

export const RESULT_STATUSES = ['pass', 'warning', 'fail', 'not-checked', 'not-applicable'] as const;
/** As the results table shows it: a passing member at or above the warning ratio is a 'warning'. */
export type ResultStatus = (typeof RESULT_STATUSES)[number];

/** An immutable record of one check run: what went in (hashes, parameters, engine version) and what came out. */
export interface CheckRunView {
  id: string;
  status: CheckRunStatus;
  /** While queued or running. */
  progress: { fraction: number } | null;
  error: string | null;
  standard: Standard;
  parameters: CheckParameters;
  modelRevision: { id: string; number: number; sha256: string; fileName: string };
  resultSet: { id: string; name: string; sha256: string };
  engineVersion: string;
  createdBy: { id: string; name: string };
  createdAt: string;
  finishedAt: string | null;
  /** The engineer ran it although almost nothing in the results matched the model. */
  poorMatchConfirmed: boolean;
  summary: RunSummaryView | null;
}

/** One row of the results table, `GET …/checks/:runId/members`. */
export interface RunMemberRow {
  globalId: string;
  tag: string | null;
  name: string | null;
  storey: string | null;
  profileName: string | null;
  grade: string | null;
  governingCombination: string | null;
  /** The axis and check that govern; null when the member was not checked. */
  governingAxis: NonNullable<GoverningCheck['axis']> | null;
  governingCheck: NonNullable<GoverningCheck['check']> | null;
  /** The governing axis's shear, its resistance and the governing utilisation. */
  VEd_kN: number | null;
  VRd_kN: number | null;
  utilisation: number | null;
  tauMax_MPa: number | null;
  tauAvgWeb_MPa: number | null;
  status: ResultStatus;
  flags: RunFlag[];
}

export interface RunFacets {
  storeys: string[];
  profiles: string[];
}

export interface RunMembersPage {
  total: number;
  rows: RunMemberRow[];
  facets: RunFacets;
}

/** `GET …/checks/:runId/members/:globalId/sheet`: everything a calculation sheet shows. */
export interface MemberSheet {
  member: MemberRecord;
  standard: Standard;
  parameters: CheckParameters;
  status: ResultStatus;
  /** Why the member was not checked or is not applicable. */
  reason: string | null;
  /** The member's result as the run recorded it (with its per-combination list). */
  check: MemberCheck;
  /** An I-section as checked; null for every other family, which comes in `familySection`. */
  section: { input: ISectionInput; properties: SectionPropertyValues } | null;
  /** A checked member of another family (channel, tee, angle, box, tube): its section along the governing axis. */
  familySection?: FamilySheetSection;
  /** How the section was found and, for a tapered member, which of its sections the check used and why. */
  sectionNote: string | null;
  grade: GradeId | null;
  fy_MPa: number | null;
  gradeRule: string | null;
  stress: {
    shear_kN: number;
    samples: { y_mm: number; tau_MPa: number }[];
    tauMax_MPa: number;
    at_mm: number;
    junctions: { top: JunctionStress; bottom: JunctionStress };
    webAverageClear_MPa: number;
    webAverageFullDepth_MPa: number;
    /** EN 1993-1-1 (6.19): fy/(√3·γM0); absent for AISC, whose check is not a stress check. */
    elasticLimit_MPa?: number;
  } | null;
  /** τ(s) of a member of another family for the governing shear, with `familySection`. */
  familyStress?: FamilySheetStress;
  governing: {
    combination: string;
    station_mm: number | null;
    VEd_kN: number;
    VRd_kN: number;
    utilisation: number;
    status: ResultStatus;
    flags: RunFlag[];
  } | null;
  trace: TraceStep[];
  combinations: { combination: string; station_mm: number | null; VEd_kN: number; utilisation: number; memberKey: string; row: number }[];
  suggestion: {
    /** The lightest section of the same catalogue series that carries the governing shear (null: none, or not a catalogue section). */
    lighterPassing: { name: string; utilisation: number } | null;
    /** Web thickness that would bring the utilisation to 1.0, other dimensions kept; null when no web that fits would. */
    requiredWebThickness_mm: number | null;
  } | null;
  engineVersion: { run: string; sheet: string };
  cautions: string[];
}

/** A section of another family on its calculation sheet: enough to draw it to scale, voids included. */
export interface FamilySheetSection {
  dimensions: Exclude<SectionDimensions, { family: 'I' }>;
  /** The idealised outline in the section's own frame (mm, centred on its bounding box; voids clockwise). */
  outline: SectionPolygon;
  /** The axis of the governing shear: 'major' loads the web(s) (parallel to y), 'minor' the flanges (parallel to x). */
  axis: ShearAxis;
  /** Along that axis, s measured in the direction of the shear (y for 'major', x for 'minor'). */
  properties: {
    area_mm2: number;
    neutralAxis_mm: number;
    i_mm4: number;
    elasticModulus_mm3: number;
    plasticNeutralAxis_mm: number;
    plasticModulus_mm3: number;
    from_mm: number;
    to_mm: number;
    /** False when the bending axis is not principal (an angle): τ = V·Q/(I·b) is then an estimate. */
    principal: boolean;
  };
}

/** τ(s) = V·Q(s)/(I·b(s)) over the section for the governing shear, along `FamilySheetSection.axis`. */
export interface FamilySheetStress {
  shear_kN: number;
  /** Ascending in s; both sides of each width jump, the side below first. */
  samples: { s_mm: number; width_mm: number; tau_MPa: number }[];
  tauMax_MPa: number;
  at_mm: number;
  /** Jumps inside the section worth a label: τ just below and just above the level. */
  jumps: { level_mm: number; below_MPa: number; above_MPa: number }[];
  /** V/A over the whole section, for comparison. */
  average_MPa: number;
  /** Major axis: V over the plates parallel to the shear (engine/section-family.ts webShearArea_mm2); null otherwise. */
  webAverage_MPa: number | null;
  /** EN 1993-1-1 (6.19): fy/(√3·γM0); absent for AISC. */
  elasticLimit_MPa?: number;
}
