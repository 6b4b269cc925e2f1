import { MEMBER_IDS } from '../../test/fixtures/bcf/sample-findings';
import type { FindingStatus } from './finding-fields';
import { type RunMemberResult, type SyncedFinding, planRunSync } from './finding-sync-plan';

// The rules under test are the product's own (issue 7: one finding per member and kind, carried across runs, Ready to
// verify when a newer revision passes; issue 18: one living finding per member and check whatever the standard, an
// accepted finding keeps the run it was accepted on); member rows are invented.
const B12 = MEMBER_IDS.beamB12;
const B14 = MEMBER_IDS.beamB14;

function row(globalId: string, status: RunMemberResult['status'], utilisation: number | null, flags: string[] = []): RunMemberResult {
  return {
    globalId,
    tag: 'B-12',
    name: 'Beam',
    storey: 'Level 2',
    profileName: 'IPE 300',
    status,
    utilisation,
    VEd_kN: utilisation === null ? null : 150 * utilisation,
    VRd_kN: 150,
    governingCombination: 'ULS-3',
    flags,
  };
}

function finding(status: FindingStatus, revisionNumber: number, kind: SyncedFinding['kind'] = 'web-shear-fail'): SyncedFinding {
  return { id: 'f1', memberKey: B12, kind, status, priority: kind === 'web-shear-fail' ? 'high' : 'normal', revisionNumber, utilisation: 1.12 };
}

const run = (revisionNumber: number) => ({ runId: `run-${revisionNumber}`, revisionNumber });

describe('planRunSync', () => {
  it('raises one finding per member and kind the run shows', () => {
    const plan = planRunSync(run(1), [row(B12, 'fail', 1.124, ['assumed-grade', 'web-proportion-limit']), row(B14, 'warning', 0.93), row(MEMBER_IDS.columnC3, 'pass', 0.4)], []);
    expect(plan.update).toEqual([]);
    expect(plan.create.map((draft) => [draft.globalId, draft.kind, draft.priority])).toEqual([
      [B12, 'web-shear-fail', 'high'],
      [B12, 'flag', 'normal'],
      [B14, 'web-shear-warning', 'normal'],
    ]);
    expect(plan.create[0]).toMatchObject({
      title: 'Web shear over capacity: B-12',
      description: '112.4 % utilisation under ULS-3 (VEd 168.6 kN, VRd 150 kN) in the check of model revision 1.',
      memberLabel: 'B-12 · IPE 300 · Level 2',
      utilisation: 1.124,
    });
    expect(plan.create[1].description).toBe('The check of model revision 1 flagged: web-proportion-limit.');
  });

  it('raises nothing for members that were not checked, whatever their flags', () => {
    expect(planRunSync(run(1), [row(B12, 'not-checked', null, ['tapered']), row(B14, 'not-applicable', null)], [])).toEqual({ create: [], update: [] });
  });

  it('updates a finding that still fails rather than raising a second one', () => {
    const plan = planRunSync(run(1), [row(B12, 'fail', 1.2)], [finding('in-progress', 1)]);
    expect(plan.create).toEqual([]);
    expect(plan.update).toEqual([
      {
        id: 'f1',
        utilisation: 1.2,
        revisionNumber: 1,
        description: '120 % utilisation under ULS-3 (VEd 180 kN, VRd 150 kN) in the check of model revision 1.',
        memberTag: 'B-12',
        memberLabel: 'B-12 · IPE 300 · Level 2',
      },
    ]);
  });

  it.each<[FindingStatus, number, FindingStatus]>([
    ['open', 2, 'ready-to-verify'],
    ['in-progress', 2, 'ready-to-verify'],
    ['resolved', 2, 'ready-to-verify'],
    ['verified', 2, 'verified'],
    ['resolved', 1, 'resolved'],
  ])('a %s finding whose member passes in revision %i becomes %s', (status, revision, expected) => {
    const [update] = planRunSync(run(revision), [row(B12, 'pass', 0.7)], [finding(status, 1)]).update;
    expect(update.status?.to ?? status).toBe(expected);
    // The revision it was last seen failing in stays, so a later failure still counts as newer.
    expect(update.revisionNumber).toBe(1);
  });

  it.each<[FindingStatus, number, FindingStatus]>([
    ['verified', 1, 'open'],
    ['ready-to-verify', 2, 'open'],
    ['resolved', 2, 'open'],
    ['resolved', 1, 'resolved'],
    ['in-progress', 2, 'in-progress'],
  ])('a %s finding whose member fails again in revision %i becomes %s', (status, revision, expected) => {
    const [update] = planRunSync(run(revision), [row(B12, 'fail', 1.3)], [finding(status, 1)]).update;
    expect(update.status?.to ?? status).toBe(expected);
    expect(update.revisionNumber).toBe(revision);
  });

  it('turns a warning finding into a failure when the member now fails, instead of raising a second finding', () => {
    const plan = planRunSync(run(2), [row(B12, 'fail', 1.05)], [finding('resolved', 2, 'web-shear-warning')]);
    expect(plan.create).toEqual([]);
    expect(plan.update).toEqual([
      expect.objectContaining({
        id: 'f1',
        status: { from: 'resolved', to: 'open' },
        escalated: { kind: 'web-shear-fail', title: 'Web shear over capacity: B-12', priority: 'high' },
        description: '105 % utilisation under ULS-3 (VEd 157.5 kN, VRd 150 kN) in the check of model revision 2.',
      }),
    ]);
  });

  it('keeps one finding when a run by another standard shows the failing member only close to capacity', () => {
    const other = { ...run(1), standardLabel: 'AISC 360-22 LRFD' };
    const plan = planRunSync(other, [row(B12, 'warning', 0.96)], [finding('open', 1)]);
    expect(plan.create).toEqual([]);
    const [update] = plan.update;
    // Same revision: the numbers follow the run, the status does not (a re-run of the same model shows no fix).
    expect(update).toMatchObject({ id: 'f1', utilisation: 0.96, revisionNumber: 1 });
    expect(update.status).toBeUndefined();
    expect(update.escalated).toBeUndefined();
    expect(update.description).toBe('96 % utilisation under ULS-3 (VEd 144 kN, VRd 150 kN) in the AISC 360-22 LRFD check of model revision 1. Within capacity in this run.');
  });

  it('names the standard of the run in a new finding', () => {
    const [draft] = planRunSync({ ...run(3), standardLabel: 'EN 1993-1-1' }, [row(B12, 'fail', 1.5)], []).create;
    expect(draft.description).toBe('150 % utilisation under ULS-3 (VEd 225 kN, VRd 150 kN) in the EN 1993-1-1 check of model revision 3.');
  });

  it.each<[string, RunMemberResult]>([
    ['fails more', row(B12, 'fail', 1.4)],
    ['passes', row(B12, 'pass', 0.6)],
  ])('leaves an accepted failure as it was accepted when a newer revision %s', (_label, result) => {
    expect(planRunSync(run(2), [result], [finding('accepted', 1)]).update).toEqual([]);
  });

  it('reopens an accepted warning finding as a failure when the member now fails: the lesser condition was accepted', () => {
    const [update] = planRunSync(run(1), [row(B12, 'fail', 1.22)], [finding('accepted', 1, 'web-shear-warning')]).update;
    expect(update.status).toEqual({ from: 'accepted', to: 'open' });
    expect(update.escalated?.kind).toBe('web-shear-fail');
  });

  it('keeps the more severe of two findings an older version left for one member, and raises no third', () => {
    const twins = [{ ...finding('open', 1, 'web-shear-warning'), id: 'old-warning' }, { ...finding('open', 1), id: 'old-failure' }];
    const plan = planRunSync(run(1), [row(B12, 'fail', 1.3)], twins);
    expect(plan.create).toEqual([]);
    expect(plan.update.map((update) => update.id)).toEqual(['old-failure']);
  });

  it('leaves findings alone for runs of older revisions and for members the run did not check', () => {
    expect(planRunSync(run(1), [row(B12, 'pass', 0.5)], [finding('open', 2)]).update).toEqual([]);
    expect(planRunSync(run(3), [row(B12, 'not-checked', null)], [finding('open', 2)]).update).toEqual([]);
    expect(planRunSync(run(3), [], [finding('open', 2)]).update).toEqual([]);
  });

  it('clears a flag finding once the flags to review are gone', () => {
    const [update] = planRunSync(run(2), [row(B12, 'pass', 0.5, ['catalogue-section', 'assumed-grade', 'elastic-check-exceeded'])], [finding('open', 1, 'flag')]).update;
    expect(update.status).toEqual({ from: 'open', to: 'ready-to-verify' });
  });
});

describe('planRunSync: the governing check in words', () => {
  it('names a governing check other than the plain major-axis web shear in the description', () => {
    const minor: RunMemberResult = { ...row(B12, 'fail', 1.5), governingAxis: 'minor', governingCheck: 'shear with bending' };
    const [draft] = planRunSync({ ...run(3), standardLabel: 'EN 1993-1-1' }, [minor], []).create;
    expect(draft.description).toBe('150 % utilisation under ULS-3 (shear with bending, minor axis) (VEd 225 kN, VRd 150 kN) in the EN 1993-1-1 check of model revision 3.');
    const major: RunMemberResult = { ...row(B12, 'fail', 1.5), governingAxis: 'major', governingCheck: 'major-axis shear' };
    expect(planRunSync({ ...run(3), standardLabel: 'EN 1993-1-1' }, [major], []).create[0].description).toBe(
      '150 % utilisation under ULS-3 (VEd 225 kN, VRd 150 kN) in the EN 1993-1-1 check of model revision 3.',
    );
  });
});
