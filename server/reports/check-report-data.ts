/**
 * Everything the PDF check report prints, as plain data taken from one immutable check run. The report only
 * recomputes what it draws: the section outline and τ(y), sampled by the engine from the section and the governing
 * shear force recorded here.
 */
import type { CheckFlag, ResolvedCheckParams, Standard } from '../engine/check';
import type { GradeId } from '../engine/grades';
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

export interface ReportCombination {
  name: string;
  /** Signed shear force from the analysis; the check uses |VEd|. */
  shear_kN: number;
  capacity_kN: number;
  utilisation: number;
}

export interface CalculationSheetData {
  memberLabel: string;
  globalId: string;
  profileName: string;
  grade?: GradeId;
  storey?: string;
  section: ISectionInput;
  fy_MPa: number;
  /** 'fail' above 100 %, 'warning' for a flagged member that passes. */
  status: 'fail' | 'warning';
  flags: readonly CheckFlag[];
  /** The load combination with the largest utilisation. */
  governing: ReportCombination;
  combinations: readonly ReportCombination[];
  /** Clause-by-clause trace of the governing combination, as the engine wrote it. */
  trace: readonly TraceStep[];
  /** EN 1993-1-1 (6.19) limit fy/(√3·γM0), drawn on the τ(y) plot; absent for AISC. */
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
  parameters: {
    standard: Standard;
    params: ResolvedCheckParams;
    /** National annex or project basis the γ factors come from, as people name it. */
    basis?: string;
  };
  run: ReportRun;
  members: { passed: number; flagged: number; failed: number; notChecked: number };
  highest?: { memberLabel: string; combination: string; utilisation: number };
  findings: readonly FindingExport[];
  sheets: readonly CalculationSheetData[];
  signOff: { prepared?: SignOffEntry; checked?: SignOffEntry; approved?: SignOffEntry };
  generatedAt: string;
  generatedBy: string;
}
