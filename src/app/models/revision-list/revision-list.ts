import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { backgroundContext, reloadWhile } from '../../checks/reload-while';
import { errorMessage } from '../../core/api-error';
import { ProjectContext } from '../../projects/project-context';
import { modelsUrl, RevisionView } from '../models-api';
import { isRunning, progressText, REVISION_STATUS_LABELS, sizeText } from '../model-words';
import { ProjectCatalogue } from '../project-catalogue/project-catalogue';
import { UploadRevision } from '../upload-revision/upload-revision';

/** How often the list asks about revisions still being read (the server writes progress about twice a second). */
const PROGRESS_POLL_MS = 700;

/** The Models page: the project's IFC revisions with their reading state, the upload, and the section catalogue. */
@Component({
  selector: 'tl-revision-list',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, ProjectCatalogue, UploadRevision],
  templateUrl: './revision-list.html',
  styleUrl: './revision-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionList {
  protected readonly context = inject(ProjectContext);

  protected readonly statusLabels = REVISION_STATUS_LABELS;
  protected readonly progressText = progressText;
  protected readonly sizeText = sizeText;

  protected readonly revisions = httpResource<{ revisions: RevisionView[] }>(() => {
    const id = this.context.projectId();
    return id ? { url: modelsUrl(id), context: backgroundContext() } : undefined;
  });
  protected readonly rows = computed(() => (this.revisions.hasValue() ? this.revisions.value().revisions : []));
  protected readonly loadError = computed(() => {
    const error = this.revisions.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly canUpload = computed(() => this.context.can('model.upload'));
  protected readonly canCompare = computed(() => this.rows().filter((r) => r.status === 'ready').length >= 2);

  constructor() {
    reloadWhile(this.revisions, () => this.rows().some(isRunning), PROGRESS_POLL_MS);
  }

  protected showUploaded(): void {
    this.revisions.reload();
  }

  protected isRunning(revision: RevisionView): boolean {
    return isRunning(revision);
  }

  protected percent(revision: RevisionView): number {
    return Math.round((revision.progress?.fraction ?? 0) * 100);
  }
}
