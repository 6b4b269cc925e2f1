import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { errorMessage } from '../../core/api-error';
import { ProjectContext } from '../../projects/project-context';
import { MemberDetail } from '../member-detail/member-detail';
import { MemberTable, MemberTableView } from '../member-table/member-table';
import { MemberRow, revisionUrl, RevisionView } from '../models-api';
import { progressText, REVISION_STATUS_LABELS } from '../model-words';

/** One revision: its members with the sections read, and what was skipped and why. */
@Component({
  selector: 'tl-revision-members',
  imports: [RouterLink, MatButtonModule, MatButtonToggleModule, MatIconModule, MemberDetail, MemberTable],
  templateUrl: './revision-members.html',
  styleUrl: './revision-members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionMembers {
  protected readonly context = inject(ProjectContext);

  /** From the route. */
  readonly revisionId = input.required<string>();

  protected readonly statusLabels = REVISION_STATUS_LABELS;
  protected readonly progressText = progressText;
  protected readonly view = signal<MemberTableView>('sections');
  protected readonly chosen = signal<string | null>(null);

  protected readonly revisionResource = httpResource<{ revision: RevisionView }>(() => {
    const projectId = this.context.projectId();
    return projectId ? revisionUrl(projectId, this.revisionId()) : undefined;
  });
  protected readonly revision = computed(() => (this.revisionResource.hasValue() ? this.revisionResource.value().revision : null));
  protected readonly loadError = computed(() => {
    const error = this.revisionResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly skippedCount = computed(() => {
    const counts = this.revision()?.counts;
    return counts ? counts.notApplicable + counts.flagged : 0;
  });

  protected showView(view: MemberTableView): void {
    this.view.set(view);
    this.chosen.set(null);
  }

  protected showMember(row: MemberRow): void {
    this.chosen.set(row.globalId);
  }

  protected closeMember(): void {
    this.chosen.set(null);
  }
}
