import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { errorMessage } from '../../core/api-error';
import { ProjectContext } from '../../projects/project-context';
import { changeText, fieldLabel } from '../change-text';
import { Comparison, modelsUrl, RevisionView } from '../models-api';
import { revisionLabel } from '../model-words';

/** Two ready revisions side by side: members added, removed, and changed in section, grade, length or position. */
@Component({
  selector: 'tl-revision-compare',
  imports: [RouterLink, MatFormFieldModule, MatSelectModule],
  templateUrl: './revision-compare.html',
  styleUrl: './revision-compare.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionCompare {
  protected readonly context = inject(ProjectContext);

  protected readonly revisionLabel = revisionLabel;
  protected readonly changeText = changeText;
  protected readonly fieldLabel = fieldLabel;

  protected readonly revisions = httpResource<{ revisions: RevisionView[] }>(() => {
    const id = this.context.projectId();
    return id ? modelsUrl(id) : undefined;
  });
  /** Newest first. */
  protected readonly ready = computed(() => (this.revisions.hasValue() ? this.revisions.value().revisions.filter((r) => r.status === 'ready') : []));
  /** The previous ready revision against the newest one, until the user picks others. */
  protected readonly fromId = linkedSignal(() => this.ready()[1]?.id ?? null);
  protected readonly toId = linkedSignal(() => this.ready()[0]?.id ?? null);

  protected readonly comparison = httpResource<Comparison>(() => {
    const [from, to] = [this.fromId(), this.toId()];
    if (!from || !to || from === to) return undefined;
    return { url: `${modelsUrl(this.context.projectId())}/compare`, params: { from, to } };
  });
  protected readonly result = computed(() => (this.comparison.hasValue() ? this.comparison.value() : null));
  protected readonly loadError = computed(() => {
    const error = this.comparison.error() ?? this.revisions.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly sameChosen = computed(() => this.fromId() !== null && this.fromId() === this.toId());

  protected chooseFrom(id: string): void {
    this.fromId.set(id);
  }

  protected chooseTo(id: string): void {
    this.toId.set(id);
  }
}
