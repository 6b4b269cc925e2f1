import { TestBed } from '@angular/core/testing';
import { CautionsNotice } from './cautions-notice';

describe('CautionsNotice', () => {
  function render(layout: 'summary' | 'panel'): HTMLElement {
    const fixture = TestBed.createComponent(CautionsNotice);
    fixture.componentRef.setInput('layout', layout);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('lists every caution of the product brief in the panel', () => {
    const items = [...render('panel').querySelectorAll('li')].map((li) => li.textContent?.trim());
    // PRODUCT.md "Cautions": each of these sentences must reach the user.
    expect(items).toEqual([
      "Results depend on the imported forces, the model's section data and the chosen parameters.",
      'They are a checking aid for qualified engineers, not a design.',
      'Follow the governing local building code, its national annex and the engineer of record.',
      'Verify connections, coped ends, concentrated loads, fatigue and combined actions separately.',
    ]);
  });

  it('keeps the full list one click away in the summary layout', () => {
    const element = render('summary');
    expect(element.querySelector('summary')?.textContent).toContain('engineer of record');
    expect(element.querySelectorAll('details li')).toHaveLength(4);
  });
});
