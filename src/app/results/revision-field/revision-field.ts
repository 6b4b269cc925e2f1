import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, input, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { RevisionChoice, revisionsUrl } from '../results-api';

/**
 * Picks one of the project's model revisions that has been read; fills in the newest when nothing is chosen yet.
 * Used wherever shear results meet a model: the import and the start of a check.
 */
@Component({
  selector: 'tl-revision-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatSelectModule],
  template: `
    <mat-form-field class="field">
      <mat-label>Model revision</mat-label>
      <mat-select [formControl]="control()" required>
        @for (revision of ready(); track revision.id) {
          <mat-option [value]="revision.id">Revision {{ revision.number }} · {{ revision.fileName }}</mat-option>
        }
      </mat-select>
      @if (!ready().length && !revisions.isLoading()) {
        <mat-hint>No revision has been read yet: upload a model under Models and wait until it is ready.</mat-hint>
      } @else if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
  `,
  styles: ':host { display: block; } .field { width: 100%; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionField {
  readonly projectId = input.required<string>();
  readonly control = input.required<FormControl<string>>();
  readonly hint = input('');

  protected readonly revisions = httpResource<{ revisions: RevisionChoice[] }>(() => {
    const id = this.projectId();
    return id ? revisionsUrl(id) : undefined;
  });
  /** Newest first, as the server lists them. */
  protected readonly ready = computed(() =>
    this.revisions.hasValue() ? this.revisions.value().revisions.filter((revision) => revision.status === 'ready') : [],
  );

  constructor() {
    effect(() => {
      const newest = this.ready()[0];
      const control = this.control();
      untracked(() => {
        if (newest && !control.value) control.setValue(newest.id);
      });
    });
  }
}
