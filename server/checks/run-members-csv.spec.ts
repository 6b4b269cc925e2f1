import { REPORT_CAUTIONS_TEXT } from '../reports/report-cautions';
import type { CheckRunView, RunMemberRow } from './checks-api-types';
import { formulaSafe, runMembersCsv } from './run-members-csv';

const run = {
  id: 'run-1',
  standard: 'en1993-1-1',
  modelRevision: { id: 'r', number: 4, sha256: 'ab'.repeat(32), fileName: 'depot.ifc' },
  resultSet: { id: 's', name: 'ULS shear', sha256: 'cd'.repeat(32) },
  engineVersion: 'taulens 0.1.0+engine.000000000000',
  createdBy: { id: 'u', name: 'Esme Varga' },
  createdAt: '2026-03-02T10:00:00.000Z',
} as CheckRunView;

const row: RunMemberRow = {
  globalId: '2Xq$9bTgT0uPq4u1dVc3Lk',
  tag: '=1+2',
  name: '@SUM(A1)',
  storey: 'Level 2',
  profileName: 'IPE 300',
  grade: 'S355',
  governingCombination: '-ULS 3',
  governingAxis: 'major',
  governingCheck: 'shear with bending',
  VEd_kN: -152.5,
  VRd_kN: 407.8,
  utilisation: 0.374,
  tauMax_MPa: 80.1,
  tauAvgWeb_MPa: 75.3,
  status: 'pass',
  flags: ['assumed-grade', 'catalogue-section'],
};

describe('run members CSV', () => {
  // The usual CSV-injection defence (common practice, no source): text starting with = + - @ is not run as a formula.
  it('defuses text a spreadsheet would run, and leaves numbers as numbers', () => {
    expect(formulaSafe('=HYPERLINK("x")')).toBe('\'=HYPERLINK("x")');
    expect(formulaSafe('\uFF0B1')).toBe("'\uFF0B1");
    expect(formulaSafe('IPE 300')).toBe('IPE 300');
    expect(formulaSafe(null)).toBe('');
    const lines = runMembersCsv(run, [row]).replace(/^\uFEFF/, '').split('\r\n');
    expect(lines).toContain(`2Xq$9bTgT0uPq4u1dVc3Lk,'=1+2,'@SUM(A1),Level 2,IPE 300,S355,pass,'-ULS 3,major,shear with bending,-152.5,407.8,0.374,80.1,75.3,assumed-grade catalogue-section`);
  });

  it('starts with the run record and ends with the cautions', () => {
    const text = runMembersCsv(run, []);
    expect(text.startsWith('\uFEFFCheck run,run-1\r\nStandard,EN 1993-1-1 §6.2.6 with EN 1993-1-5 §5\r\n')).toBe(true);
    expect(text).toContain(`Model,"revision 4, depot.ifc, sha256 ${'ab'.repeat(32)}"`);
    expect(text.trimEnd().endsWith(`Cautions,${REPORT_CAUTIONS_TEXT.includes(',') ? `"${REPORT_CAUTIONS_TEXT}"` : REPORT_CAUTIONS_TEXT}`)).toBe(true);
  });
});
