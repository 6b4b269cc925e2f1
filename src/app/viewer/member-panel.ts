import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { type RunMemberRow, type RunMembersPage, runUrl, STATUS_NAMES } from '../checks/checks-api';
import { backgroundContext } from '../checks/reload-while';
import { flagLabel } from '../checks/flag-labels';
import { UtilisationBar } from '../checks/utilisation-bar/utilisation-bar';
import { errorMessage } from '../core/api-error';
import type { ViewerMember } from './viewer-member';

/** The run's result row of one member; the members search also matches parts of other fields, so pick exactly. */
export function rowOf(page: RunMembersPage, globalId: string): RunMemberRow | null {
  return page.rows.find((row) => row.globalId === globalId) ?? null;
}

/** Beside the model: the clicked member's results in the shown check run and the way to its calculation sheet. */
@Component({
  selector: 'tl-member-panel',
  imports: [RouterLink, MatButtonModule, MatIconModule, UtilisationBar],
  templateUrl: './member-panel.html',
  styleUrl: './member-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberPanel {
  readonly projectId = input.required<string>();
  /** The check run the view is coloured by; null when the revision has none. */
  readonly runId = input<string | null>(null);
  readonly globalId = input.required<string>();
  /** What the view already knows of the member (names from the revision, results from the run). */
  readonly member = input<ViewerMember | null>(null);

  readonly closed = output<void>();

  protected readonly statusNames = STATUS_NAMES;
  protected readonly flagLabel = flagLabel;

  protected readonly rowResource = httpResource<RunMembersPage>(() => {
    const runId = this.runId();
    if (runId === null) return undefined;
    return {
      url: `${runUrl(this.projectId(), runId)}/members`,
      params: { q: this.globalId(), pageSize: 20 },
      context: backgroundContext(),
    };
  });
  protected readonly row = computed(() => (this.rowResource.hasValue() ? rowOf(this.rowResource.value(), this.globalId()) : null));
  protected readonly loadError = computed(() => {
    const error = this.rowResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly heading = computed(() => this.row()?.tag ?? this.member()?.tag ?? this.row()?.name ?? this.globalId());
  protected readonly sheetLink = computed(() => {
    const runId = this.runId();
    return runId === null ? null : ['/projects', this.projectId(), 'checks', runId, 'members', this.globalId()];
  });

  protected numberText(value: number | null, digits = 1): string {
    return value === null ? '—' : value.toLocaleString('en', { maximumFractionDigits: digits, minimumFractionDigits: digits });
  }
}
