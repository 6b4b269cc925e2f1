import { TestBed } from '@angular/core/testing';
import { ProjectAction } from '../../core/permissions';
import { ProjectContext } from '../project-context';
import { SectionPlaceholder } from './section-placeholder';

describe('SectionPlaceholder', () => {
  function render(allowed: ProjectAction[]): HTMLElement {
    TestBed.configureTestingModule({
      providers: [{ provide: ProjectContext, useValue: { can: (action: ProjectAction) => allowed.includes(action) } }],
    });
    const fixture = TestBed.createComponent(SectionPlaceholder);
    fixture.componentRef.setInput('heading', 'Shear results');
    fixture.componentRef.setInput('summary', 'Shear forces from the analysis.');
    fixture.componentRef.setInput('plannedActions', [
      { label: 'Import shear results', icon: 'upload_file', permission: 'results.upload' },
      { label: 'Fix member matching', icon: 'link', permission: 'matching.edit' },
    ]);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('lists only the coming actions the role may take, as disabled buttons', () => {
    const buttons = [...render(['results.upload']).querySelectorAll('button')];
    expect(buttons.map((b) => b.textContent?.includes('Import shear results'))).toEqual([true]);
    expect(buttons[0].disabled).toBe(true);
  });

  it('tells a reading role that it will read the section', () => {
    const element = render(['model.read']);
    expect(element.querySelector('button')).toBeNull();
    expect(element.textContent).toContain('You will be able to read this section.');
  });
});
