import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import { askToConfirm } from './confirm-dialog';

describe('askToConfirm', () => {
  async function answer(buttonText: string): Promise<boolean> {
    const dialog = TestBed.inject(MatDialog);
    const answered = firstValueFrom(askToConfirm(dialog, { title: 'Archive?', message: 'Sure?', confirmLabel: 'Archive' }));
    TestBed.tick();
    const buttons = [...document.querySelectorAll<HTMLButtonElement>('mat-dialog-actions button')];
    expect(buttons.map((button) => button.textContent?.trim())).toEqual(['Cancel', 'Archive']);
    buttons.find((button) => button.textContent?.trim() === buttonText)!.click();
    return answered;
  }

  afterEach(() => TestBed.inject(MatDialog).closeAll());

  it('answers true when the user confirms', async () => {
    expect(await answer('Archive')).toBe(true);
  });

  it('answers false when the user cancels', async () => {
    expect(await answer('Cancel')).toBe(false);
  });
});
