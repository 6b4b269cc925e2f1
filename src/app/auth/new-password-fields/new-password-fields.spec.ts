import { TestBed } from '@angular/core/testing';
import { createNewPasswordForm } from '../password-rules';
import { NewPasswordFields } from './new-password-fields';

describe('NewPasswordFields', () => {
  it('says so when the repeated password differs', () => {
    const fixture = TestBed.createComponent(NewPasswordFields);
    const form = createNewPasswordForm();
    fixture.componentRef.setInput('form', form);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('[role="alert"]')).toBeNull();

    form.setValue({ password: 'abcdefghij', repeat: 'abcdefghik' });
    form.controls.repeat.markAsTouched();
    fixture.detectChanges();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('differ');
  });
});
