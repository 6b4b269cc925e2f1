import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { AuthCard } from './auth-card';

@Component({
  imports: [AuthCard],
  template: `<tl-auth-card heading="Sign in" intro="Welcome back."><button>Go</button></tl-auth-card>`,
})
class Host {}

describe('AuthCard', () => {
  it('labels its region with the heading and shows the projected form', () => {
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    const region = element.querySelector('section')!;
    expect(element.querySelector(`#${region.getAttribute('aria-labelledby')}`)?.textContent).toBe('Sign in');
    expect(region.querySelector('.intro')?.textContent).toBe('Welcome back.');
    expect(region.querySelector('button')?.textContent).toBe('Go');
  });
});
