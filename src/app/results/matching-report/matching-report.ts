import { DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { RouterLink } from '@angular/router';
import { errorMessage } from '../../core/api-error';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { ProjectContext } from '../../projects/project-context';
import { MemberSearch, memberLabel } from '../member-search/member-search';
import {
  MatchingFilter,
  MatchingItem,
  MatchingPage,
  MatchingSummary,
  MatchMethod,
  MemberCandidate,
  ResultsApi,
  ResultSet,
  resultSetUrl,
} from '../results-api';

const METHOD_LABELS: Readonly<Record<MatchMethod, string>> = {
  globalId: 'GlobalId',
  tag: 'Tag',
  name: 'Name',
  geometry: 'End points',
  manual: 'By hand',
};

const FILTERS: readonly { value: MatchingFilter; label: string; count?: keyof MatchingSummary }[] = [
  { value: 'all', label: 'All' },
  { value: 'matched', label: 'Matched', count: 'matched' },
  { value: 'ambiguous', label: 'Ambiguous', count: 'ambiguous' },
  { value: 'unmatched', label: 'No member', count: 'unmatchedResults' },
  { value: 'members-without-results', label: 'Members without results', count: 'membersWithoutResults' },
];

/** How a result set's member keys matched the model; coordinators choose or clear members by hand. */
@Component({
  selector: 'tl-matching-report',
  imports: [DecimalPipe, RouterLink, MatButtonModule, MatButtonToggleModule, MatIconModule, MatPaginatorModule, CautionsNotice, MemberSearch],
  templateUrl: './matching-report.html',
  styleUrl: './matching-report.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MatchingReport {
  private readonly api = inject(ResultsApi);
  protected readonly context = inject(ProjectContext);

  readonly resultSetId = input.required<string>();

  protected readonly filters = FILTERS;
  protected readonly filter = signal<MatchingFilter>('all');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(50);
  /** The result key whose member is being chosen by hand. */
  protected readonly editing = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);

  protected readonly resultSet = httpResource<{ resultSet: ResultSet }>(() => resultSetUrl(this.context.projectId(), this.resultSetId()));
  protected readonly set = computed(() => (this.resultSet.hasValue() ? this.resultSet.value().resultSet : null));

  protected readonly matching = httpResource<MatchingPage>(() => {
    const set = this.set();
    if (!set) return undefined;
    return {
      url: `${resultSetUrl(this.context.projectId(), set.id)}/matching`,
      params: { modelRevisionId: set.modelRevisionId, filter: this.filter(), page: this.pageIndex(), pageSize: this.pageSize() },
    };
  });
  protected readonly items = computed(() => (this.matching.hasValue() ? this.matching.value().items : []));
  protected readonly total = computed(() => (this.matching.hasValue() ? this.matching.value().total : 0));
  protected readonly summary = computed(() => (this.matching.hasValue() ? this.matching.value().summary : (this.set()?.matching ?? null)));
  protected readonly loadError = computed(() => {
    const error = this.resultSet.error() ?? this.matching.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly canEdit = computed(() => this.context.can('matching.edit'));

  protected methodLabel(method: MatchMethod | null): string {
    return method ? METHOD_LABELS[method] : '—';
  }

  protected memberOf(item: MatchingItem): string {
    return item.globalId ? memberLabel({ globalId: item.globalId, tag: item.tag, name: item.name }) : '';
  }

  protected readonly candidateLabel = memberLabel;

  protected countOf(key: keyof MatchingSummary): number | null {
    const value = this.summary()?.[key];
    return typeof value === 'number' ? value : null;
  }

  protected showFilter(filter: MatchingFilter): void {
    this.filter.set(filter);
    this.pageIndex.set(0);
    this.editing.set(null);
  }

  protected showPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }

  protected startEditing(resultKey: string): void {
    this.notice.set(null);
    this.editing.set(resultKey);
  }

  /** The item's result key while its member is being chosen, else null. */
  protected editedKey(item: MatchingItem): string | null {
    return item.resultKey !== null && this.editing() === item.resultKey ? item.resultKey : null;
  }

  protected stopEditing(): void {
    this.editing.set(null);
  }

  protected assign(resultKey: string, member: MemberCandidate | null): void {
    const set = this.set();
    if (!set) return;
    this.busy.set(true);
    this.notice.set(null);
    this.api.setMatch(this.context.projectId(), set.id, resultKey, member?.globalId ?? null).subscribe({
      next: () => {
        this.busy.set(false);
        this.editing.set(null);
        this.notice.set({
          text: member ? `${resultKey} now goes to ${memberLabel(member)}.` : `${resultKey} no longer goes to any member.`,
          failed: false,
        });
        this.matching.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.notice.set({ text: errorMessage(error), failed: true });
      },
    });
  }
}
