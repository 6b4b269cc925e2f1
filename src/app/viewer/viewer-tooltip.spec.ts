import { TestBed } from '@angular/core/testing';
import type { ViewerMember } from './viewer-member';
import { ViewerTooltip } from './viewer-tooltip';

function render(member: ViewerMember | null): HTMLElement {
  const fixture = TestBed.createComponent(ViewerTooltip);
  fixture.componentRef.setInput('member', member);
  fixture.componentRef.setInput('globalId', '2O2Fr$t4X7Zf8NOew3FLOH');
  fixture.componentRef.setInput('x_px', 100);
  fixture.componentRef.setInput('y_px', 50);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

describe('ViewerTooltip', () => {
  it('shows tag, section and utilisation in per cent beside the pointer', () => {
    const element = render({
      globalId: '2O2Fr$t4X7Zf8NOew3FLOH',
      tag: 'B-101',
      section: 'IPE 300',
      storey: 'Level 1',
      utilisationRatio: 1.0375,
      status: 'fail',
    });
    expect(element.querySelector('strong')?.textContent).toBe('B-101');
    expect(element.textContent).toContain('IPE 300');
    expect(element.textContent).toContain('103.8 %');
    expect(element.textContent).toContain('fails');
    expect(element.style.left).toBe('116px');
  });

  it('says so when the results do not know the element', () => {
    const element = render(null);
    expect(element.textContent).toContain('Member without tag');
    expect(element.textContent).toContain('no check results');
  });
});
