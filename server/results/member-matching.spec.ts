import type { Point3_mm } from '../ifc/model-read-result';
import { type MatchableKey, type MatchableMember, matchResultsToMembers } from './member-matching';

const member = (
  globalId: string,
  tag: string | null,
  name: string | null,
  axis: [Point3_mm, Point3_mm] | null = null,
  status: MatchableMember['status'] = 'ok',
): MatchableMember => ({ globalId, tag, name, axis: axis && { start_mm: axis[0], end_mm: axis[1] }, status });

// A small frame: two beams along x at level 3000, a column, and a tube brace (not applicable).
const members: MatchableMember[] = [
  member('0Beam1xxxxxxxxxxxxxxxx', 'B-101', 'W18X50', [[0, 0, 3000], [6000, 0, 3000]]),
  member('0Beam2xxxxxxxxxxxxxxxx', 'B-102', 'W18X50', [[6000, 0, 3000], [12000, 0, 3000]]),
  member('0Col1xxxxxxxxxxxxxxxxx', 'C-1', 'W14X90', [[0, 0, 0], [0, 0, 3000]]),
  member('0Brace1xxxxxxxxxxxxxxx', 'BR-1', 'HSS6X6X1/2', [[0, 0, 0], [6000, 0, 3000]], 'not-applicable'),
];

const key = (memberKey: string, ends?: [Point3_mm, Point3_mm]): MatchableKey => ({ memberKey, end1_mm: ends?.[0], end2_mm: ends?.[1] });
const geometry = { tolerance_mm: 25 };

describe('matchResultsToMembers: text rules', () => {
  it('matches by GlobalId, then Tag, then Name, recording how', () => {
    const report = matchResultsToMembers([key('0Col1xxxxxxxxxxxxxxxxx'), key('B-102'), key('w14x90')], members);
    expect(report.matched).toEqual([
      { memberKey: '0Col1xxxxxxxxxxxxxxxxx', globalId: '0Col1xxxxxxxxxxxxxxxxx', method: 'globalId' },
      { memberKey: 'B-102', globalId: '0Beam2xxxxxxxxxxxxxxxx', method: 'tag' },
      { memberKey: 'w14x90', globalId: '0Col1xxxxxxxxxxxxxxxxx', method: 'name' },
    ]);
    expect(report.counts.byMethod).toEqual({ globalId: 1, tag: 1, name: 1, geometry: 0, manual: 0 });
  });

  it('never matches a GlobalId ignoring case (its case carries information)', () => {
    expect(matchResultsToMembers([key('0COL1XXXXXXXXXXXXXXXXX')], members).unmatchedKeys).toEqual(['0COL1XXXXXXXXXXXXXXXXX']);
  });

  it('matches tags ignoring case only when no tag matches exactly', () => {
    const both = [member('0Axxxxxxxxxxxxxxxxxxxx', 'b-7', null), member('0Bxxxxxxxxxxxxxxxxxxxx', 'B-7', null)];
    expect(matchResultsToMembers([key('B-7')], both).matched[0].globalId).toBe('0Bxxxxxxxxxxxxxxxxxxxx');
    expect(matchResultsToMembers([key('b-7')], both).matched[0].globalId).toBe('0Axxxxxxxxxxxxxxxxxxxx');
  });

  it('follows the key-kind hint: a tag file is not matched by names', () => {
    const report = matchResultsToMembers([key('W14X90'), key('C-1')], members, { keyKind: 'tag' });
    expect(report.unmatchedKeys).toEqual(['W14X90']);
    expect(report.matched.map((match) => match.method)).toEqual(['tag']);
  });

  it('reports a name shared by several members as ambiguous, with the candidates', () => {
    const report = matchResultsToMembers([key('W18X50')], members);
    expect(report.ambiguous).toEqual([
      { memberKey: 'W18X50', method: 'name', candidates: ['0Beam1xxxxxxxxxxxxxxxx', '0Beam2xxxxxxxxxxxxxxxx'], candidateCount: 2 },
    ]);
    expect(report.matched).toEqual([]);
  });

  it('settles a shared name by geometry when the key has end points', () => {
    const report = matchResultsToMembers([key('W18X50', [[6000, 0, 3000], [12000, 0, 3000]])], members, { geometry });
    expect(report.matched).toEqual([{ memberKey: 'W18X50', globalId: '0Beam2xxxxxxxxxxxxxxxx', method: 'geometry', distance_mm: 0 }]);
  });
});

describe('matchResultsToMembers: geometry', () => {
  const only = (ends: [Point3_mm, Point3_mm], options = geometry) => matchResultsToMembers([key('E12', ends)], members, { geometry: options });

  it('matches end points on the axis ends, in either direction', () => {
    expect(only([[0, 0, 3000], [6000, 0, 3000]]).matched[0]).toEqual({ memberKey: 'E12', globalId: '0Beam1xxxxxxxxxxxxxxxx', method: 'geometry', distance_mm: 0 });
    expect(only([[6000, 0, 3000], [0, 0, 3000]]).matched[0].globalId).toBe('0Beam1xxxxxxxxxxxxxxxx');
  });

  it('accepts end points within the tolerance of the axis and refuses them just outside', () => {
    const near = only([[0, 20, 3000], [6000, -20, 3000]]);
    expect(near.matched[0]).toMatchObject({ globalId: '0Beam1xxxxxxxxxxxxxxxx', distance_mm: 20 });
    expect(only([[0, 30, 3000], [6000, 0, 3000]]).unmatchedKeys).toEqual(['E12']);
  });

  it('matches an analysis member split at an intermediate node to the beam it lies on', () => {
    expect(only([[1500, 0, 3000], [3000, 0, 3000]]).matched[0].globalId).toBe('0Beam1xxxxxxxxxxxxxxxx');
  });

  it('does not match a member that only touches the axis at one end', () => {
    expect(only([[6000, 0, 3000], [6000, 4000, 3000]]).unmatchedKeys).toEqual(['E12']);
  });

  it('applies the scale, then the offset, to the analysis coordinates', () => {
    // Analysis model in metres read as millimetres, with its origin at model point (10 m, 5 m, 0).
    const model = [member('0Movedxxxxxxxxxxxxxxxx', null, null, [[10000, 5000, 3000], [16000, 5000, 3000]])];
    const report = matchResultsToMembers([key('E1', [[0, 0, 3], [6, 0, 3]])], model, {
      geometry: { tolerance_mm: 10, scale: 1000, offset_mm: [10000, 5000, 0] },
    });
    expect(report.matched[0]).toMatchObject({ globalId: '0Movedxxxxxxxxxxxxxxxx', method: 'geometry' });
  });

  it('reports coincident members as ambiguous', () => {
    const doubled = [...members, member('0Beam1copyxxxxxxxxxxxx', 'B-101a', null, [[0, 0, 3000], [6000, 0, 3000]])];
    const report = matchResultsToMembers([key('E1', [[0, 0, 3000], [6000, 0, 3000]])], doubled, { geometry });
    expect(report.ambiguous[0]).toMatchObject({ method: 'geometry', candidateCount: 2 });
    expect(new Set(report.ambiguous[0].candidates)).toEqual(new Set(['0Beam1xxxxxxxxxxxxxxxx', '0Beam1copyxxxxxxxxxxxx']));
  });

  it('refuses a tolerance that is not a positive length', () => {
    expect(() => only([[0, 0, 0], [1, 0, 0]], { tolerance_mm: 0 })).toThrow(/positive number of millimetres/);
  });
});

describe('matchResultsToMembers: manual matches and the report', () => {
  it('applies manual matches first, and keeps those whose member or key is gone as stale', () => {
    const report = matchResultsToMembers([key('B-101'), key('E7')], members, {
      manual: [
        { memberKey: 'B-101', globalId: '0Beam2xxxxxxxxxxxxxxxx' },
        { memberKey: 'E7', globalId: '0Removedxxxxxxxxxxxxxx' },
        { memberKey: 'E99', globalId: '0Col1xxxxxxxxxxxxxxxxx' },
      ],
    });
    expect(report.matched).toEqual([{ memberKey: 'B-101', globalId: '0Beam2xxxxxxxxxxxxxxxx', method: 'manual' }]);
    expect(report.unmatchedKeys).toEqual(['E7']);
    expect(report.staleManual.map((match) => match.memberKey)).toEqual(['E7', 'E99']);
  });

  it('lists members without results, leaving out not-applicable ones', () => {
    const report = matchResultsToMembers([key('B-101')], members);
    expect(report.membersWithoutResults).toEqual(['0Beam2xxxxxxxxxxxxxxxx', '0Col1xxxxxxxxxxxxxxxxx']);
    expect(report.counts).toMatchObject({ keys: 1, matched: 1, members: 3, membersWithResults: 1 });
  });

  it('counts members fed by several keys', () => {
    const report = matchResultsToMembers(
      [key('E1', [[0, 0, 3000], [3000, 0, 3000]]), key('E2', [[3000, 0, 3000], [6000, 0, 3000]])],
      members,
      { geometry },
    );
    expect(report.matched.map((match) => match.globalId)).toEqual(['0Beam1xxxxxxxxxxxxxxxx', '0Beam1xxxxxxxxxxxxxxxx']);
    expect(report.counts.membersWithSeveralKeys).toBe(1);
  });

  it('warns loudly when almost nothing matches: the file is probably for another model', () => {
    const keys = [key('B-101'), ...Array.from({ length: 9 }, (_, i) => key(`OTHER-${i}`))];
    const report = matchResultsToMembers(keys, members);
    expect(report.matchedShare).toBeCloseTo(0.1, 12);
    expect(report.likelyOtherModel).toBe(true);
    const mostly = matchResultsToMembers([key('B-101'), key('B-102'), key('C-1'), key('X')], members);
    expect(mostly.likelyOtherModel).toBe(false);
  });

  it('does not warn for an empty key list (there is nothing to compare)', () => {
    expect(matchResultsToMembers([], members).likelyOtherModel).toBe(false);
  });
});
