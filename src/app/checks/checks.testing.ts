// Invented check runs and results for client specs. Not imported by the app.
import { recommendedParameters } from '../../../server/checks/check-parameters';
import { sectionProperties, sectionPropertyValues } from '../../../server/engine/section-properties';
import { shearStressProfile } from '../../../server/engine/shear-stress';
import { iSection } from '../../../server/engine/test-sections';
import { CAUTIONS } from '../core/cautions';
import { CheckRun, MemberSheet, RunMemberRow } from './checks-api';

export const TEST_RUN: CheckRun = {
  id: 'run-1',
  status: 'done',
  progress: null,
  error: null,
  standard: 'en1993-1-1',
  parameters: recommendedParameters('en1993-1-1'),
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
    governingAxis: 'major',
    governingCheck: 'major-axis shear',
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

/** An invented member's sheet: IPE 300 dimensions (EN 10365), τ(y) from the engine for its governing shear. */
export function memberSheet(overrides: Partial<MemberSheet> = {}): MemberSheet {
  const input = iSection(300, 7.1, [150, 10.7, 15]);
  const profile = shearStressProfile(sectionProperties(input), 405_200);
  const governing = { combination: 'ULS-2', station_mm: 0, VEd_kN: 405.2, VRd_kN: 360.5, utilisation: 1.1241, status: 'fail' as const, flags: ['assumed-grade' as const] };
  return {
    member: {
      globalId: '2O2Fr$t4X7Zf8NOew3FLOH',
      expressId: 812,
      ifcClass: 'IfcBeam',
      name: 'Girder G-101',
      tag: 'G-101',
      objectType: null,
      predefinedType: 'BEAM',
      storey: 'Level 2',
      material: { name: 'Steel', grade: 'S355', fy_MPa: 355, assumed: true },
      length_mm: 6000,
      axis: { start_mm: [0, 0, 3000], end_mm: [6000, 0, 3000] },
      status: 'ok',
      profile: { name: 'IPE 300', family: 'I', source: 'ifc-profile', ifcType: 'IfcIShapeProfileDef', ...input },
      section: null,
      flags: ['assumed-grade'],
    },
    standard: 'en1993-1-1',
    parameters: TEST_RUN.parameters,
    status: 'fail',
    reason: null,
    check: {
      globalId: '2O2Fr$t4X7Zf8NOew3FLOH',
      status: 'fail',
      warning: false,
      grade: 'S355',
      fy_MPa: 355,
      fabrication: 'rolled',
      governing: null,
      combinations: [],
      flags: ['assumed-grade'],
    },
    section: { input, properties: sectionPropertyValues(sectionProperties(input)) },
    grade: 'S355',
    fy_MPa: 355,
    gradeRule: 'EN 10025-2 by nominal thickness',
    stress: {
      shear_kN: 405.2,
      samples: profile.points.map((point) => ({ y_mm: point.y_mm, tau_MPa: point.tau_MPa })),
      tauMax_MPa: profile.tauMax_MPa,
      at_mm: profile.tauMaxAt_mm,
      junctions: { top: profile.topJunction, bottom: profile.bottomJunction },
      webAverageClear_MPa: profile.webAverageClear_MPa,
      webAverageFullDepth_MPa: profile.webAverageFullDepth_MPa,
      elasticLimit_MPa: 355 / Math.sqrt(3),
    },
    governing,
    trace: [
      { clause: 'EN 1993-1-1 §6.2.6(3)', what: 'Shear area', formula: 'Av = A − 2b·tf + (tw + 2r)·tf', substituted: 'invented', result: 2568, unit: 'mm²' },
      { clause: 'EN 1993-1-1 (6.18)', what: 'Plastic shear resistance', formula: 'Vpl,Rd = Av·(fy/√3)/γM0', substituted: 'invented', result: 360.5, unit: 'kN' },
    ],
    combinations: [
      { combination: 'ULS-1', station_mm: 0, VEd_kN: 310.1, utilisation: 0.86, memberKey: 'G-101', row: 2 },
      { combination: 'ULS-2', station_mm: 0, VEd_kN: 405.2, utilisation: 1.1241, memberKey: 'G-101', row: 3 },
    ],
    suggestion: { lighterPassing: null, requiredWebThickness_mm: 8.2 },
    sectionNote: 'Section dimensions written in the model.',
    engineVersion: { run: 'engine-test', sheet: 'engine-test' },
    cautions: [...CAUTIONS],
    ...overrides,
  };
}
