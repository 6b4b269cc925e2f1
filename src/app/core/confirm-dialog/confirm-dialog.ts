import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { map, Observable } from 'rxjs';

export interface ConfirmRequest {
  title: string;
  message: string;
  confirmLabel: string;
}

/** Asks before an action that is hard to undo. */
@Component({
  selector: 'tl-confirm-dialog',
  imports: [MatDialogModule, MatButtonModule],
  templateUrl: './confirm-dialog.html',
  styleUrl: './confirm-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly request = inject<ConfirmRequest>(MAT_DIALOG_DATA);
}

/** Emits true once if the user confirmed, false if they cancelled or closed the dialog. */
export function askToConfirm(dialog: MatDialog, request: ConfirmRequest): Observable<boolean> {
  return dialog
    .open<ConfirmDialog, ConfirmRequest, boolean>(ConfirmDialog, { data: request, width: '440px' })
    .afterClosed()
    .pipe(map((confirmed) => confirmed === true));
}
