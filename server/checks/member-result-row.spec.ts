import type { MemberCheck } from './check-run-compute';
import { combinationsOf, memberCheckOf, memberResultRow, resultStatusOf } from './member-result-row';

const member = { tag: 'B-12', name: 'Beam 12', storey: 'Level 2', profile: null };
const combinationIndex = new Map([['ULS-1', 0], ['ULS-2', 1], ['ULS-3', 2]]);
const RUN_COMBINATIONS = ['ULS-1', 'ULS-2', 'ULS-3'];
const VRd_N = 400e3;

function check(overrides: Partial<MemberCheck> = {}): MemberCheck {
  return {
    globalId: '2Xq$9bTgT0uPq4u1dVc3Lk',
    status: 'pass',
    warning: false,
    grade: 'S355',
    fy_MPa: 355,
    fabrication: 'rolled',
    governing: { combination: 'ULS-2', VEd_N: -300e3, utilisation: 0.75, station_mm: 6000, row: 5, memberKey: 'E12', VRd_N, tauMax_MPa: 120, tauAvgWeb_MPa: 110, elasticUtilisation: 0.6 },
    combinations: [
      { combination: 'ULS-1', VEd_N: 100e3, utilisation: 100e3 / VRd_N, row: 2, memberKey: 'E12' },
      { combination: 'ULS-2', VEd_N: -300e3, utilisation: 300e3 / VRd_N, station_mm: 6000, row: 5, memberKey: 'E12' },
      { combination: 'ULS-3', VEd_N: 250e3, utilisation: 250e3 / VRd_N, station_mm: 0, row: 9, memberKey: 'E12b' },
    ],
    flags: ['several-result-keys'],
    ...overrides,
  };
}

describe('member result rows', () => {
  it('hold the table columns in kN and the governing values as the run computed them', () => {
    const row = memberResultRow(7, member, check(), combinationIndex);
    expect(row).toMatchObject({
      ordinal: 7,
      globalId: '2Xq$9bTgT0uPq4u1dVc3Lk',
      tag: 'B-12',
      profileName: null,
      status: 'pass',
      governingCombination: 'ULS-2',
      VEd_kN: -300,
      VRd_kN: 400,
      utilisation: 0.75,
      flags: ['several-result-keys'],
    });
    expect(row.detail).not.toHaveProperty('combinations');
  });

  it('give back exactly the per-combination list, keys and stations included', () => {
    const original = check();
    const row = memberResultRow(0, member, original, combinationIndex);
    expect(combinationsOf(row, RUN_COMBINATIONS)).toEqual(original.combinations);
    expect(memberCheckOf(row, RUN_COMBINATIONS)).toEqual(original);
  });

  it('give back the utilisation of each axis and the minor-axis shear where the results gave more than Vz', () => {
    const original = check({
      governing: { ...check().governing!, axis: 'minor', check: 'minor-axis shear', VEd_N: 40e3, utilisation: 0.8, VRd_N: 50e3 },
      combinations: [
        { combination: 'ULS-1', VEd_N: 100e3, utilisation: 0.8, row: 2, memberKey: 'E12', byAxis: { major: 0.25, minor: 0.8 }, minorVEd_N: 40e3 },
        { combination: 'ULS-2', VEd_N: -300e3, utilisation: 0.77, station_mm: 6000, row: 5, memberKey: 'E12', byAxis: { major: 0.77, minor: null } },
      ],
    });
    const row = memberResultRow(0, member, original, combinationIndex);
    expect(row).toMatchObject({ governingAxis: 'minor', governingCheck: 'minor-axis shear' });
    expect(memberCheckOf(row, RUN_COMBINATIONS)).toEqual(original);
  });

  it('store nothing per combination for a member that was not checked', () => {
    const row = memberResultRow(0, member, check({ status: 'not-checked', governing: null, combinations: [], reason: 'No shear results were matched to this member.' }), combinationIndex);
    expect(row).toMatchObject({ status: 'not-checked', utilisation: null, VEd_kN: null, governingCombination: null });
    expect(combinationsOf(row, RUN_COMBINATIONS)).toEqual([]);
  });

  it('call a passing member at or above the warning ratio a warning', () => {
    expect(resultStatusOf({ status: 'pass', warning: true })).toBe('warning');
    expect(resultStatusOf({ status: 'fail', warning: false })).toBe('fail');
    expect(resultStatusOf({ status: 'not-applicable', warning: false })).toBe('not-applicable');
  });
});
