import type { Action } from '../auth/permissions';
import type { ImportedTopic } from './bcf/bcf-import';
import { planBcfImport } from './bcf-import-plan';

// The rule under test is the product's own (issue 18: resolving a failing finding asks what was done); texts invented.
const engineer = (action: Action) => action === 'finding.resolve';

describe('planBcfImport: resolving a failing finding from a file', () => {
  const guid = '0a4c1f52-6c1e-4d7b-9b53-2f0e6a8d4c11';
  const target = { id: 'f1', number: 7, guid, status: 'in-progress' as const, kind: 'web-shear-fail' as const };
  const topic = (comments: ImportedTopic['comments']): ImportedTopic => ({
    guid,
    folder: guid,
    status: 'Resolved',
    statusId: 'resolved',
    title: 'Web shear over capacity: B-7',
    labels: [],
    comments,
    viewpoints: [],
  });
  const comment = { guid: '5b0d2c7e-8f3a-4e61-a2d9-7c4b1e0f3a58', author: 'eng@example.com', date: '2027-01-10T09:30:00Z', text: 'Stiffeners added both sides.' };

  it('takes a new comment of the topic as the note of what was done', () => {
    const plan = planBcfImport([topic([comment])], new Map([[guid, target]]), new Set(), engineer);
    expect(plan.problems).toEqual([]);
    expect(plan.statusChanges).toEqual([{ findingId: 'f1', from: 'in-progress', to: 'resolved', clearsJustification: false }]);
  });

  it('refuses the file when the topic brings no new comment', () => {
    const known = planBcfImport([topic([comment])], new Map([[guid, target]]), new Set([comment.guid]), engineer);
    expect(known.problems.map((problem) => problem.message)).toEqual(['F-0007: Resolving a finding whose member fails needs a note of what was done.']);
  });
});
