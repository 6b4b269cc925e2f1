import { DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime } from 'rxjs';
import { governingCheckText } from '../../../../server/checks/governing-check-text';
import { percentText } from '../../../../server/reports/report-format';
import { errorMessage } from '../../core/api-error';
import { CheckRun, MemberCheckStatus, RunMemberRow, RunMembersPage, runUrl, STATUS_NAMES } from '../checks-api';
import { flagLabel } from '../flag-labels';
import {
  PAGE_SIZES,
  RUN_MEMBER_SORTS,
  RUN_MEMBER_STATUSES,
  RunMemberSort,
  RunMembersQuery,
  runMembersApiParams,
  runMembersFilterParams,
  runMembersQueryFromUrl,
  runMembersUrlParams,
} from '../run-members-query';
import { UtilisationBar } from '../utilisation-bar/utilisation-bar';

// Typing in the number and text filters waits for a pause before asking the server.
const TYPING_PAUSE_MS = 300;

const COLUMNS = ['tag', 'storey', 'profileName', 'grade', 'governingCombination', 'governingCheck', 'VEd_kN', 'VRd_kN', 'utilisation', 'status', 'flags'] as const;

interface SummaryCard {
  key: string;
  label: string;
  value: string;
  status?: MemberCheckStatus;
}

/** A finished run's members: summary cards, filters and a server-sorted, server-paged table. */
@Component({
  selector: 'tl-run-results',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
    UtilisationBar,
  ],
  templateUrl: './run-results.html',
  styleUrl: './run-results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunResults {
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);

  readonly projectId = input.required<string>();
  readonly run = input.required<CheckRun>();

  protected readonly columns = COLUMNS;
  protected readonly statuses = RUN_MEMBER_STATUSES;
  protected readonly statusNames = STATUS_NAMES;
  protected readonly pageSizes = PAGE_SIZES;
  protected readonly flagLabel = flagLabel;

  protected readonly query = signal<RunMembersQuery>(runMembersQueryFromUrl(this.route.snapshot.queryParams));

  protected readonly filters = new FormGroup({
    status: new FormControl<MemberCheckStatus | null>(this.query().status),
    storey: new FormControl(this.query().storey, { nonNullable: true }),
    profile: new FormControl(this.query().profile, { nonNullable: true }),
    minUtilPercent: new FormControl<number | null>(this.query().minUtilPercent),
    maxUtilPercent: new FormControl<number | null>(this.query().maxUtilPercent),
    q: new FormControl(this.query().q, { nonNullable: true }),
  });

  protected readonly members = httpResource<RunMembersPage>(() => ({
    url: `${runUrl(this.projectId(), this.run().id)}/members`,
    params: runMembersApiParams(this.query()),
  }));
  protected readonly rows = computed(() => (this.members.hasValue() ? this.members.value().rows : []));
  protected readonly total = computed(() => (this.members.hasValue() ? this.members.value().total : 0));
  protected readonly facets = computed(() => (this.members.hasValue() ? this.members.value().facets : { storeys: [], profiles: [] }));
  protected readonly loadError = computed(() => {
    const error = this.members.error();
    return error ? errorMessage(error) : null;
  });

  protected readonly csvUrl = computed(() => {
    const params = new URLSearchParams(runMembersFilterParams(this.query())).toString();
    return `${runUrl(this.projectId(), this.run().id)}/members.csv${params ? `?${params}` : ''}`;
  });

  protected readonly cards = computed((): SummaryCard[] => {
    const summary = this.run().summary;
    if (!summary) return [];
    const count = (key: string, label: string, value: number, status?: MemberCheckStatus): SummaryCard => ({
      key,
      label,
      value: value.toLocaleString('en'),
      status,
    });
    return [
      count('fail', 'Fail', summary.fail, 'fail'),
      count('warning', STATUS_NAMES.warning, summary.warning, 'warning'),
      count('pass', 'Pass', summary.pass, 'pass'),
      count('not-checked', 'Not checked', summary.notChecked, 'not-checked'),
      count('not-applicable', 'Not applicable', summary.notApplicable, 'not-applicable'),
      { key: 'max', label: 'Highest utilisation', value: summary.maxUtilisation === null ? '—' : percentText(summary.maxUtilisation) },
      count('unmatched', 'Result keys without a member', summary.unmatchedResults),
      ...(summary.ambiguousResults > 0 ? [count('ambiguous', 'Result keys with several members', summary.ambiguousResults)] : []),
    ];
  });

  constructor() {
    this.filters.valueChanges.pipe(debounceTime(TYPING_PAUSE_MS), takeUntilDestroyed(inject(DestroyRef))).subscribe(() => {
      const value = this.filters.getRawValue();
      this.update({
        status: value.status,
        storey: value.storey,
        profile: value.profile,
        minUtilPercent: numberOrNull(value.minUtilPercent),
        maxUtilPercent: numberOrNull(value.maxUtilPercent),
        q: value.q,
        page: 0,
      });
    });
  }

  protected showStatus(status: MemberCheckStatus | undefined): void {
    if (!status) return;
    this.filters.controls.status.setValue(this.query().status === status ? null : status);
  }

  protected sortBy(sort: Sort): void {
    const active = RUN_MEMBER_SORTS.find((name) => name === sort.active);
    if (!active) return;
    // Clearing the sort (third click) returns to most utilised first.
    if (!sort.direction) this.update({ sort: 'utilisation', dir: 'desc', page: 0 });
    else this.update({ sort: active as RunMemberSort, dir: sort.direction, page: 0 });
  }

  protected showPage(event: PageEvent): void {
    this.update({ page: event.pageIndex, pageSize: event.pageSize });
  }

  protected clearFilters(): void {
    this.filters.reset({ status: null, storey: '', profile: '', minUtilPercent: null, maxUtilPercent: null, q: '' });
  }

  protected statusName(status: MemberCheckStatus): string {
    return STATUS_NAMES[status];
  }

  protected threeDParams(globalId: string): Record<string, string> {
    return { run: this.run().id, member: globalId };
  }

  protected checkText(row: RunMemberRow): string {
    return governingCheckText(row.governingAxis, row.governingCheck) ?? '—';
  }

  protected numberText(value: number | null): string {
    return value === null ? '—' : value.toLocaleString('en', { maximumFractionDigits: 1, minimumFractionDigits: 1 });
  }

  private update(change: Partial<RunMembersQuery>): void {
    const next = { ...this.query(), ...change };
    this.query.set(next);
    void this.router.navigate([], { relativeTo: this.route, queryParams: runMembersUrlParams(next), replaceUrl: true });
  }
}

function numberOrNull(value: number | null): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}
