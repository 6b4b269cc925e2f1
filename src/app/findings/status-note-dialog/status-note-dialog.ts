import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Observable } from 'rxjs';

/** Same limits as the server (server/findings/finding-fields.ts: justification and comment). */
const MAX_NOTE = 4000;

export interface FindingRef {
  reference: string;
  title: string;
}

/** The words of one status change that the server refuses without a written reason. */
interface NoteRequest extends FindingRef {
  heading: string;
  explanation: string;
  label: string;
  missing: string;
  confirm: string;
}

/**
 * Asks for the written reason a status change needs before it is sent: why a finding may stay as it is (accepting),
 * or what was done to a failing member (resolving).
 */
@Component({
  selector: 'tl-status-note-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './status-note-dialog.html',
  styleUrl: './status-note-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusNoteDialog {
  private readonly dialogRef = inject<MatDialogRef<StatusNoteDialog, string>>(MatDialogRef);
  protected readonly request = inject<NoteRequest>(MAT_DIALOG_DATA);
  protected readonly maxLength = MAX_NOTE;

  protected readonly form = new FormGroup({
    note: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(MAX_NOTE), Validators.pattern(/\S/)],
    }),
  });
  protected readonly note = this.form.controls.note;

  protected confirm(): void {
    if (this.note.invalid) {
      this.note.markAsTouched();
      return;
    }
    this.dialogRef.close(this.note.value.trim());
  }
}

function askForNote(dialog: MatDialog, request: NoteRequest): Observable<string | undefined> {
  return dialog.open<StatusNoteDialog, NoteRequest, string>(StatusNoteDialog, { data: request, width: '520px' }).afterClosed();
}

/** Emits the justification once if the reviewer accepted, nothing if they cancelled. */
export function askForJustification(dialog: MatDialog, finding: FindingRef): Observable<string | undefined> {
  return askForNote(dialog, {
    ...finding,
    heading: `Accept ${finding.reference} as it is?`,
    explanation:
      'Accepting closes the finding without a change to the model. Say why the member is acceptable, for example the ' +
      "calculation or drawing that covers it; the reason is kept in the finding's history and in every export.",
    label: 'Justification',
    missing: 'Write why the finding may stay as it is.',
    confirm: 'Accept finding',
  });
}

/** Emits the note once if the engineer confirmed that a failing member was dealt with, nothing if they cancelled. */
export function askForResolution(dialog: MatDialog, finding: FindingRef & { utilisation: string | null }): Observable<string | undefined> {
  const over = finding.utilisation ? ` at ${finding.utilisation} utilisation` : '';
  return askForNote(dialog, {
    ...finding,
    heading: `Mark ${finding.reference} resolved?`,
    explanation:
      `The member fails its check${over}. Say what was done, for example the new section, the added plates or the ` +
      'revised forces and where they are shown; a reviewer verifies the change against your note.',
    label: 'What was done',
    missing: 'Write what was done about the failing member.',
    confirm: 'Mark resolved',
  });
}
