import { TestBed } from '@angular/core/testing';
import { NO_MEMBER_FILTERS } from './member-filters';
import type { ViewerMember } from './viewer-member';
import { type ViewerCommand, ViewerToolbar } from './viewer-toolbar';

// Invented members.
const member = (globalId: string, tag: string, storey: string, utilisationRatio: number): ViewerMember => ({
  globalId,
  tag,
  section: 'IPE 300',
  storey,
  utilisationRatio,
  status: utilisationRatio > 1 ? 'fail' : 'pass',
});
const members = [
  member('2O2Fr$t4X7Zf8NOew3FLOH', 'B-101', 'Level 1', 0.4),
  member('1kTvXnbbzCWw8lcMd1dR4o', 'B-102', 'Level 2', 1.2),
];

function setUp(hasSelection = false) {
  const fixture = TestBed.createComponent(ViewerToolbar);
  fixture.componentRef.setInput('members', members);
  fixture.componentRef.setInput('hasSelection', hasSelection);
  const commands: ViewerCommand[] = [];
  fixture.componentInstance.command.subscribe((command) => commands.push(command));
  fixture.detectChanges();
  const element = fixture.nativeElement as HTMLElement;
  const button = (label: string) => {
    const found = element.querySelector<HTMLButtonElement>(`button[aria-label="${label}"]`);
    if (!found) throw new Error(`no button "${label}"`);
    return found;
  };
  return { fixture, element, commands, button };
}

describe('ViewerToolbar', () => {
  it('asks to frame the whole model', () => {
    const { commands, button } = setUp();
    button('Frame the whole model (F)').click();
    expect(commands).toEqual([{ kind: 'fit-all' }]);
  });

  it('offers hide and isolate only with a selection', () => {
    expect(setUp(false).button('Hide the selection').disabled).toBe(true);
    const { commands, button } = setUp(true);
    button('Show only the selection').click();
    expect(commands).toEqual([{ kind: 'isolate-selection' }]);
  });

  it('turns "only failing" on through the filters binding', () => {
    const { fixture, element } = setUp();
    (element.querySelector('mat-slide-toggle button') as HTMLButtonElement).click();
    expect(fixture.componentInstance.filters()).toEqual({ ...NO_MEMBER_FILTERS, onlyFailing: true });
  });

  it('finds the best match for a tag on Enter, and says when nothing matches', async () => {
    const { fixture, element, commands } = setUp();
    const search = element.querySelector('input[matinput]') as HTMLInputElement;
    search.value = 'b-102';
    search.dispatchEvent(new Event('input'));
    search.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    expect(commands).toEqual([{ kind: 'find', globalId: '1kTvXnbbzCWw8lcMd1dR4o' }]);

    search.value = 'C-9';
    search.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(element.textContent).toContain('No member with that tag or GlobalId');
  });
});
