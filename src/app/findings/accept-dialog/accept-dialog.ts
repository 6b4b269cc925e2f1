import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Observable } from 'rxjs';

/** Same limit as the server (server/findings/finding-fields.ts). */
const MAX_JUSTIFICATION = 4000;

export interface AcceptRequest {
  reference: string;
  title: string;
}

/** Asks the reviewer why a finding may stay as it is; accepting is refused without a written reason. */
@Component({
  selector: 'tl-accept-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './accept-dialog.html',
  styleUrl: './accept-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptDialog {
  private readonly dialogRef = inject<MatDialogRef<AcceptDialog, string>>(MatDialogRef);
  protected readonly request = inject<AcceptRequest>(MAT_DIALOG_DATA);
  protected readonly maxLength = MAX_JUSTIFICATION;

  protected readonly form = new FormGroup({
    justification: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(MAX_JUSTIFICATION), Validators.pattern(/\S/)],
    }),
  });
  protected readonly justification = this.form.controls.justification;

  protected accept(): void {
    if (this.justification.invalid) {
      this.justification.markAsTouched();
      return;
    }
    this.dialogRef.close(this.justification.value.trim());
  }
}

/** Emits the justification once if the reviewer accepted, nothing if they cancelled. */
export function askForJustification(dialog: MatDialog, request: AcceptRequest): Observable<string | undefined> {
  return dialog.open<AcceptDialog, AcceptRequest, string>(AcceptDialog, { data: request, width: '520px' }).afterClosed();
}
