import type { Action } from '../auth/permissions';
import { checkTransition } from './finding-workflow';

// The rule under test is the product's own (issue 18: resolving a failing finding asks what was done); texts invented.
const engineer = (action: Action) => action === 'finding.resolve';

describe('checkTransition: resolving', () => {
  it.each([undefined, '', '  \n '])('refuses to resolve a failing finding with the note %j', (note) => {
    expect(() => checkTransition({ from: 'in-progress', to: 'resolved', failing: true, note }, engineer)).toThrow(
      expect.objectContaining({ code: 'resolution_note_required' }),
    );
  });

  it('resolves a failing finding with a note, and any other finding without one', () => {
    expect(checkTransition({ from: 'open', to: 'resolved', failing: true, note: 'Web plate thickened to 12 mm.' }, engineer)).toBeNull();
    expect(checkTransition({ from: 'open', to: 'resolved', failing: false }, engineer)).toBeNull();
  });

  it('names the missing permission before the missing note', () => {
    expect(() => checkTransition({ from: 'open', to: 'resolved', failing: true }, () => false)).toThrow(expect.objectContaining({ code: 'transition_not_allowed' }));
  });
});
