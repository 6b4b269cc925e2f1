import { summariseMatching } from './matching-summary';
import { matchResultsToMembers } from './member-matching';

const members = ['A', 'B', 'C'].map((tag, i) => ({ globalId: `0000000000000000000${i}AA`, tag, name: null, axis: null }));

describe('summariseMatching', () => {
  it('counts matched, ambiguous and unmatched keys and the members no key reached', () => {
    const report = matchResultsToMembers([{ memberKey: 'A' }, { memberKey: 'B' }, { memberKey: 'Z' }], [...members, { ...members[0], globalId: '0000000000000000000XAA' }]);
    expect(summariseMatching(report, 'revision 2 (frame.ifc)')).toEqual({
      keys: 3,
      matched: 1,
      ambiguous: 1,
      unmatchedResults: 1,
      membersWithoutResults: 3,
      byMethod: { globalId: 0, tag: 1, name: 0, geometry: 0, manual: 0 },
      likelyOtherModel: false,
      warning: null,
    });
  });

  it('warns in words when almost nothing matches', () => {
    const keys = Array.from({ length: 10 }, (_, i) => ({ memberKey: i === 0 ? 'A' : `X${i}` }));
    const summary = summariseMatching(matchResultsToMembers(keys, members), 'revision 1 (depot.ifc)');
    expect(summary.likelyOtherModel).toBe(true);
    expect(summary.warning).toBe(
      'Only 1 of 10 result keys (10 %) match a member of revision 1 (depot.ifc). These results are probably for another model: check the file and the model before running a check.',
    );
  });
});
