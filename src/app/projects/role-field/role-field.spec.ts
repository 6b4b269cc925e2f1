import { TestBed } from '@angular/core/testing';
import { FormControl } from '@angular/forms';
import { ProjectRole } from '../../core/permissions';
import { settle } from '../../core/http.testing';
import { RoleField } from './role-field';

describe('RoleField', () => {
  it('offers the three project roles and writes the choice to the control', async () => {
    const control = new FormControl<ProjectRole>('engineer', { nonNullable: true });
    const fixture = TestBed.createComponent(RoleField);
    fixture.componentRef.setInput('control', control);
    await fixture.whenStable();
    (fixture.nativeElement as HTMLElement).querySelector<HTMLElement>('.mat-mdc-select-trigger')!.click();
    await settle();
    const options = [...document.querySelectorAll<HTMLElement>('mat-option')];
    expect(options.map((option) => option.textContent!.trim())).toEqual(['Coordinator', 'Engineer', 'Reviewer']);
    options[2].click();
    expect(control.value).toBe('reviewer');
  });
});
