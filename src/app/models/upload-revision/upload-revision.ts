import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subscription } from 'rxjs';
import { errorMessage } from '../../core/api-error';
import { ModelsApi, RevisionView } from '../models-api';
import { sizeText } from '../model-words';

const NOTE_MAX = 2000;

/** Choose an IFC file, add a note, send it with a progress bar; the server's refusal is shown as it says it. */
@Component({
  selector: 'tl-upload-revision',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  templateUrl: './upload-revision.html',
  styleUrl: './upload-revision.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadRevision {
  private readonly api = inject(ModelsApi);

  readonly projectId = input.required<string>();
  /** The revision the server queued for reading. */
  readonly uploaded = output<RevisionView>();

  protected readonly noteMax = NOTE_MAX;
  protected readonly form = new FormGroup({
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(NOTE_MAX)] }),
  });
  protected readonly file = signal<File | null>(null);
  protected readonly fileSize = computed(() => {
    const file = this.file();
    return file ? sizeText(file.size) : '';
  });
  /** Fraction sent while uploading (null when the browser cannot tell); undefined when idle. */
  protected readonly sent = signal<number | null | undefined>(undefined);
  protected readonly failure = signal<string | null>(null);
  private sending?: Subscription;

  protected chooseFile(event: Event): void {
    const input = event.target as HTMLInputElement;
    this.file.set(input.files?.[0] ?? null);
    this.failure.set(null);
  }

  protected uploadFile(): void {
    const file = this.file();
    if (!file || this.form.invalid) return;
    this.failure.set(null);
    this.sent.set(0);
    this.sending = this.api.uploadRevision(this.projectId(), file, this.form.controls.note.value.trim()).subscribe({
      next: (event) => {
        if (event.kind === 'sending') {
          this.sent.set(event.fraction);
          return;
        }
        this.sent.set(undefined);
        this.file.set(null);
        this.form.reset({ note: '' });
        this.uploaded.emit(event.revision);
      },
      error: (error: unknown) => {
        this.sent.set(undefined);
        this.failure.set(errorMessage(error));
      },
    });
  }

  protected cancelUpload(): void {
    this.sending?.unsubscribe();
    this.sent.set(undefined);
  }

  protected percent(fraction: number): number {
    return Math.round(fraction * 100);
  }
}
