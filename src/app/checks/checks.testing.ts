// Invented check runs and results for client specs. Not imported by the app.
import { CheckRun, MemberSheet, RunMemberRow } from './checks-api';

export const TEST_RUN: CheckRun = {
  id: 'run-1',
  status: 'done',
  progress: null,
  error: null,
  standard: 'en1993-1-1',
  parameters: {
    standard: 'en1993-1-1',
    warningRatio: 0.9,
    stiffenerSpacing_mm: null,
    fabricationOverrides: {},
    defaultGrade: 'S355',
    gammaM0: 1,
    gammaM1: 1,
    eta: null,
    yieldRule: 'en10025-2',
    endPost: 'non-rigid',
  },
  modelRevision: { id: 'rev-2', number: 2, sha256: 'a'.repeat(64), fileName: 'canopy-rev-B.ifc' },
  resultSet: { id: 'set-1', name: 'canopy-shears', sha256: 'b'.repeat(64) },
  engineVersion: 'engine-test',
  createdBy: { id: 'user-engineer', name: 'Test engineer' },
  createdAt: '2026-03-05T09:00:00Z',
  finishedAt: '2026-03-05T09:00:04Z',
  poorMatchConfirmed: false,
  summary: {
    members: 50,
    pass: 40,
    warning: 3,
    fail: 2,
    notChecked: 1,
    notApplicable: 4,
    maxUtilisation: 1.1241,
    maxUtilisationGlobalId: '2O2Fr$t4X7Zf8NOew3FLOH',
    unmatchedResults: 5,
    ambiguousResults: 0,
  },
};

export function memberRow(overrides: Partial<RunMemberRow> = {}): RunMemberRow {
  return {
    globalId: '2O2Fr$t4X7Zf8NOew3FLOH',
    tag: 'G-101',
    name: 'Girder G-101',
    storey: 'Level 2',
    profileName: 'IPE 300',
    grade: 'S355',
    governingCombination: 'ULS-2',
    VEd_kN: 405.2,
    VRd_kN: 360.5,
    utilisation: 1.1241,
    tauMax_MPa: 210.4,
    tauAvgWeb_MPa: 193.2,
    status: 'fail',
    flags: ['assumed-grade'],
    ...overrides,
  };
}

export type { MemberSheet };
