import { TestBed } from '@angular/core/testing';
import type { ColourMode } from './member-colouring';
import { OVER_CAPACITY_COLOUR, SECTION_PALETTE, rgbHexToCss } from './utilisation-colours';
import { ViewerLegend } from './viewer-legend';
import type { ViewerMember } from './viewer-member';

function render(mode: ColourMode, members: ViewerMember[] = []): HTMLElement {
  const fixture = TestBed.createComponent(ViewerLegend);
  fixture.componentRef.setInput('mode', mode);
  fixture.componentRef.setInput('members', members);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

function labels(element: HTMLElement): string[] {
  return [...element.querySelectorAll('li')].map((li) => li.textContent?.trim() ?? '');
}

// jsdom reports inline colours as rgb(); compare through a throwaway element.
function cssColour(hex: string): string {
  const probe = document.createElement('span');
  probe.style.backgroundColor = hex;
  return probe.style.backgroundColor;
}

describe('ViewerLegend', () => {
  it('shows over 100 %, the ten bins and not checked for utilisation', () => {
    const element = render('utilisation');
    expect(labels(element)).toHaveLength(12);
    expect(labels(element)[0]).toBe('over 100 %');
    expect(labels(element)[10]).toBe('0–10 %');
    const over = element.querySelector('[data-legend-key="over"] .swatch') as HTMLElement;
    expect(over.style.backgroundColor).toBe(cssColour(rgbHexToCss(OVER_CAPACITY_COLOUR)));
  });

  it('switches to the status colours', () => {
    expect(labels(render('status'))).toEqual([
      'passes',
      'close to capacity',
      'fails',
      'not checked',
      'no web shear rule for this section',
    ]);
  });

  it('lists the sections present and says when colours repeat', () => {
    const member = (i: number): ViewerMember => ({
      globalId: `id-${i}`,
      tag: null,
      section: `IPE ${100 + 20 * i}`,
      storey: null,
      utilisationRatio: null,
      status: 'not-checked',
    });
    const few = render('section', [member(0), member(1)]);
    expect(labels(few)).toEqual(['IPE 100', 'IPE 120', 'no section']);
    expect(few.textContent).not.toContain('some colours stand for several sections');
    const many = render('section', Array.from({ length: SECTION_PALETTE.length + 1 }, (_, i) => member(i)));
    expect(many.textContent).toContain('some colours stand for several sections');
  });
});
