import { FindingChange } from './finding';
import { changeSourceText, changeText } from './change-text';

const change = (field: string, from: string | null, to: string | null, source: FindingChange['source'] = 'user'): FindingChange => ({
  id: 'c1',
  actor: { id: 'u1', name: 'Esme Varga' },
  source,
  field,
  from,
  to,
  at: '2026-05-04T10:00:00Z',
});

describe('changeText', () => {
  it('puts statuses and priorities in words', () => {
    expect(changeText(change('status', 'ready-to-verify', 'verified'))).toBe('moved it from Ready to verify to Verified');
    expect(changeText(change('priority', 'normal', 'critical'))).toBe('changed the priority from Normal to Critical');
  });

  it('tells assigning, reassigning and unassigning apart', () => {
    expect(changeText(change('assignee', null, 'Esme Varga'))).toBe('assigned it to Esme Varga');
    expect(changeText(change('assignee', 'Esme Varga', 'Rafe Lindqvist'))).toBe('reassigned it from Esme Varga to Rafe Lindqvist');
    expect(changeText(change('assignee', 'Esme Varga', null))).toBe('unassigned Esme Varga');
  });

  it('shows the justification of an acceptance and says where system changes came from', () => {
    expect(changeText(change('justification', null, 'Covered by sheet S-301.'))).toBe('accepted it because: Covered by sheet S-301.');
    expect(changeSourceText(change('status', 'open', 'ready-to-verify', 'system'))).toBe('after a check run');
    expect(changeSourceText(change('status', 'open', 'resolved', 'bcf-import'))).toBe('from a BCF import');
    expect(changeSourceText(change('status', 'open', 'resolved'))).toBeNull();
  });
});
