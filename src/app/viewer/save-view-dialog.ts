import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Observable } from 'rxjs';

/** Same limits as the server (server/findings/saved-viewpoints.router.ts, finding-fields.ts). */
const MAX_LENGTH = { viewpoint: 120, finding: 200, note: 4000 } as const;

export interface SaveViewRequest {
  /** A named view to reopen later, or a finding raised on the selected members. */
  purpose: 'viewpoint' | 'finding';
  /** The selected members as the dialog names them, e.g. "B-12" or "3 members". */
  selection: string;
}

export interface SavedViewText {
  name: string;
  note: string;
}

/** Asks for the name of a view to save, or the title and note of a finding raised from the view. */
@Component({
  selector: 'tl-save-view-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './save-view-dialog.html',
  styleUrl: './save-view-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveViewDialog {
  private readonly dialogRef = inject<MatDialogRef<SaveViewDialog, SavedViewText>>(MatDialogRef);
  protected readonly request = inject<SaveViewRequest>(MAT_DIALOG_DATA);
  protected readonly maxLength = MAX_LENGTH;
  protected readonly nameLength = MAX_LENGTH[this.request.purpose];

  protected readonly form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(this.nameLength), Validators.pattern(/\S/)],
    }),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(MAX_LENGTH.note)] }),
  });

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, note } = this.form.getRawValue();
    this.dialogRef.close({ name: name.trim(), note: note.trim() });
  }
}

/** Emits the text once if the user saved, nothing if they cancelled. */
export function askForViewText(dialog: MatDialog, request: SaveViewRequest): Observable<SavedViewText | undefined> {
  return dialog.open<SaveViewDialog, SaveViewRequest, SavedViewText>(SaveViewDialog, { data: request, width: '520px' }).afterClosed();
}
