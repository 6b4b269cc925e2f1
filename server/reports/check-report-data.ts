/**
 * Everything the PDF check report prints, as plain data taken from one immutable check run. The report only
 * recomputes what it draws: the section outline and τ(y), sampled by the engine from the section and the governing
 * shear force recorded here.
 */
import type { CheckParameters } from '../checks/check-parameters';
import type { CheckRunSummary, MemberCheck } from '../checks/check-run-compute';
import type { FamilySheetSection, FamilySheetStress } from '../checks/checks-api-types';
import type { ISectionInput } from '../engine/section';
import type { TraceStep } from '../engine/trace';
import type { FindingExport } from '../findings/export/finding-export';

export interface ReportInputFile {
  /** What the file is to the run, e.g. "IFC model" or "Shear results". */
  role: string;
  fileName: string;
  sha256: string;
}

export interface ReportRun {
  id: string;
  startedBy: string;
  /** ISO 8601 date-times. */
  startedAt: string;
  finishedAt?: string;
  engineVersion: string;
  inputFiles: readonly ReportInputFile[];
}

export interface CalculationSheetData {
  memberLabel: string;
  profileName: string;
  storey?: string;
  /** An I-section as checked (after any fabrication override of the run); absent for other families. */
  section?: ISectionInput;
  /** A section of another family and τ(s) for the governing shear, as the member's calculation sheet gives them. */
  family?: { section: FamilySheetSection; stress: FamilySheetStress };
  /** How the section was found and, for a tapered member, which section was checked (member-sheet.ts sectionNoteOf). */
  sectionNote?: string;
  /** The member's result in the run: failing, or passing with a warning; it must have a governing combination. */
  check: MemberCheck;
  /** Clause-by-clause trace of the governing combination, as the engine's evaluateCapacity wrote it. */
  trace: readonly TraceStep[];
  /** EN 1993-1-1 (6.19) limit fy/(√3·γM0) from the prepared capacity, drawn on the τ(y) plot; absent for AISC. */
  elasticLimit_MPa?: number;
}

export interface SignOffEntry {
  name: string;
  /** ISO 8601 date. */
  date?: string;
}

export interface CheckReportData {
  project: { name: string; reference?: string };
  revision: { label: string; fileName: string };
  /** The run's parameters as stored, and the national annex or project basis they come from, as people name it. */
  parameters: CheckParameters;
  parametersBasis?: string;
  run: ReportRun;
  summary: CheckRunSummary;
  /** How people name the member with the highest utilisation (summary.maxUtilisationGlobalId). */
  highestMemberLabel?: string;
  findings: readonly FindingExport[];
  sheets: readonly CalculationSheetData[];
  signOff: { prepared?: SignOffEntry; checked?: SignOffEntry; approved?: SignOffEntry };
  generatedAt: string;
  generatedBy: string;
}
