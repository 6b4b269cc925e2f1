// Invented findings for client specs. Not imported by the app.
import { Member } from '../projects/project';
import { Finding, FindingDetail } from './finding';

export const TEST_MEMBERS: Member[] = [
  { userId: 'user-coordinator', email: 'coordinator@example.test', name: 'Test coordinator', role: 'coordinator' },
  { userId: 'user-engineer', email: 'engineer@example.test', name: 'Test engineer', role: 'engineer' },
  { userId: 'user-reviewer', email: 'reviewer@example.test', name: 'Test reviewer', role: 'reviewer' },
];

export function testFinding(overrides: Partial<Finding> = {}): Finding {
  return {
    id: 'finding-1',
    guid: '7f3c9a52-1d44-4c1e-8a0f-3b5d2e9c6a71',
    number: 12,
    kind: 'web-shear-fail',
    title: 'Web shear over capacity: G-101',
    description: '112.5 % utilisation under ULS-2 in the check of model revision 2.',
    status: 'open',
    priority: 'high',
    assignee: null,
    dueDate: null,
    labels: ['Canopy'],
    memberGlobalIds: ['2O2Fr$t4X7Zf8NOew3FLOH'],
    memberTag: 'G-101',
    runId: 'run-1',
    utilisation: 1.1241,
    justification: null,
    viewpoint: null,
    hasSnapshot: false,
    createdBy: null,
    createdAt: '2026-03-05T09:00:05Z',
    updatedAt: '2026-03-05T09:00:05Z',
    ...overrides,
  };
}

export function testDetail(overrides: Partial<FindingDetail> = {}): FindingDetail {
  return {
    finding: testFinding(),
    comments: [],
    history: [{ id: 'c1', actor: { id: null, name: 'System' }, source: 'system', field: 'created', from: null, to: 'open', at: '2026-03-05T09:00:05Z' }],
    allowedTransitions: [],
    ...overrides,
  };
}
