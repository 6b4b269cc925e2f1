import { DatePipe, DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime, Observable } from 'rxjs';
import { percentText } from '../../../../server/reports/report-format';
import { errorMessage } from '../../core/api-error';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { ProjectContext } from '../../projects/project-context';
import { projectPeople } from '../project-people';
import {
  BcfImportSummary,
  Finding,
  FINDING_KINDS,
  FINDING_STATUSES,
  FindingKind,
  FindingPriority,
  FindingsPage,
  FindingStatus,
  findingReference,
  KIND_LABELS,
  PRIORITIES,
  PRIORITY_LABELS,
  STATUS_LABELS,
} from '../finding';
import { exportUrl, ExportFormat, FindingsApi, findingsUrl } from '../findings-api';
import {
  FINDING_SORTS,
  FindingSort,
  FindingsQuery,
  findingsApiParams,
  findingsFilterParams,
  findingsQueryFromUrl,
  findingsUrlParams,
  PAGE_SIZES,
} from '../findings-query';
import { openNotificationSettings } from '../notification-settings/notification-settings';

// Typing in the text filter waits for a pause before asking the server.
const TYPING_PAUSE_MS = 300;

const EXPORTS: readonly { format: ExportFormat; label: string }[] = [
  { format: 'bcf-2.1', label: 'BCF 2.1' },
  { format: 'bcf-3.0', label: 'BCF 3.0' },
  { format: 'csv', label: 'CSV' },
];

/** The project's findings: filters, a server-sorted and server-paged table, bulk assignment, exports and BCF import. */
@Component({
  selector: 'tl-findings-list',
  imports: [
    DatePipe,
    DecimalPipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    CautionsNotice,
  ],
  templateUrl: './findings-list.html',
  styleUrl: './findings-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FindingsList {
  private readonly api = inject(FindingsApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  protected readonly context = inject(ProjectContext);

  protected readonly statuses = FINDING_STATUSES;
  protected readonly kinds = FINDING_KINDS;
  protected readonly priorities = PRIORITIES;
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly kindLabels = KIND_LABELS;
  protected readonly priorityLabels = PRIORITY_LABELS;
  protected readonly pageSizes = PAGE_SIZES;
  protected readonly exports = EXPORTS;
  protected readonly reference = findingReference;

  protected readonly query = signal<FindingsQuery>(findingsQueryFromUrl(this.route.snapshot.queryParams));

  protected readonly filters = new FormGroup({
    status: new FormControl<FindingStatus[]>(this.query().status, { nonNullable: true }),
    kind: new FormControl<FindingKind | null>(this.query().kind),
    priority: new FormControl<FindingPriority | null>(this.query().priority),
    assignee: new FormControl(this.query().assignee, { nonNullable: true }),
    q: new FormControl(this.query().q, { nonNullable: true }),
  });

  protected readonly page = httpResource<FindingsPage>(() => {
    const projectId = this.context.projectId();
    return projectId ? { url: findingsUrl(projectId), params: findingsApiParams(this.query()) } : undefined;
  });
  protected readonly rows = computed(() => (this.page.hasValue() ? this.page.value().findings : []));
  protected readonly total = computed(() => (this.page.hasValue() ? this.page.value().total : 0));
  protected readonly loadError = computed(() => {
    const error = this.page.error();
    return error ? errorMessage(error) : null;
  });

  protected readonly people = projectPeople(() => this.context.projectId());

  protected readonly canAssign = computed(() => this.context.can('finding.assign'));
  protected readonly canExport = computed(() => this.context.can('export'));
  protected readonly canImport = computed(() => this.context.can('finding.comment'));
  protected readonly columns = computed(() => [
    ...(this.canAssign() ? ['select'] : []),
    'number',
    'title',
    'member',
    'status',
    'priority',
    'assignee',
    'dueDate',
    'utilisation',
  ]);

  protected readonly selected = signal<ReadonlySet<string>>(new Set());
  protected readonly allSelected = computed(() => this.rows().length > 0 && this.rows().every((row) => this.selected().has(row.id)));
  protected readonly someSelected = computed(() => this.selected().size > 0 && !this.allSelected());
  protected readonly bulkAssignee = new FormControl<string | null>(null);

  protected readonly busy = signal(false);
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);
  protected readonly importSummary = signal<BcfImportSummary | null>(null);

  protected readonly exportLinks = computed(() => {
    const projectId = this.context.projectId();
    const filters = findingsFilterParams(this.query());
    return EXPORTS.map((entry) => ({ ...entry, url: exportUrl(projectId, entry.format, filters) }));
  });

  constructor() {
    this.filters.valueChanges.pipe(debounceTime(TYPING_PAUSE_MS), takeUntilDestroyed(inject(DestroyRef))).subscribe(() => {
      const value = this.filters.getRawValue();
      this.update({ ...value, page: 0 });
    });
  }

  protected sortBy(sort: Sort): void {
    const active = FINDING_SORTS.find((name) => name === sort.active);
    if (!active || !sort.direction) this.update({ sort: 'number', dir: 'desc', page: 0 });
    else this.update({ sort: active as FindingSort, dir: sort.direction, page: 0 });
  }

  protected showPage(event: PageEvent): void {
    this.update({ page: event.pageIndex, pageSize: event.pageSize });
  }

  protected clearFilters(): void {
    this.filters.reset({ status: [], kind: null, priority: null, assignee: '', q: '' });
  }

  protected toggleRow(finding: Finding): void {
    const next = new Set(this.selected());
    if (next.has(finding.id)) next.delete(finding.id);
    else next.add(finding.id);
    this.selected.set(next);
  }

  protected toggleAll(): void {
    this.selected.set(this.allSelected() ? new Set() : new Set(this.rows().map((row) => row.id)));
  }

  protected assignSelected(): void {
    const assigneeId = this.bulkAssignee.value;
    const ids = [...this.selected()];
    if (ids.length === 0) return;
    const person = this.people().find((member) => member.userId === assigneeId);
    this.run(this.api.assignAll(this.context.projectId(), ids, assigneeId), () => {
      this.selected.set(new Set());
      return person ? `${ids.length} finding(s) assigned to ${person.name}.` : `${ids.length} finding(s) unassigned.`;
    });
  }

  protected importFile(input: HTMLInputElement): void {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.importSummary.set(null);
    this.run(this.api.importBcf(this.context.projectId(), file), (result) => {
      this.importSummary.set(result.import);
      return `${file.name} was imported.`;
    });
  }

  protected openSettings(): void {
    openNotificationSettings(this.dialog);
  }

  protected statusLabel(finding: Finding): string {
    return STATUS_LABELS[finding.status];
  }

  protected kindLabel(finding: Finding): string {
    return KIND_LABELS[finding.kind];
  }

  protected priorityLabel(finding: Finding): string {
    return PRIORITY_LABELS[finding.priority];
  }

  protected utilisationText(finding: Finding): string {
    return finding.utilisation === null ? '—' : percentText(finding.utilisation);
  }

  protected memberText(finding: Finding): string {
    if (finding.memberTag) return finding.memberTag;
    const count = finding.memberGlobalIds.length;
    return count === 1 ? finding.memberGlobalIds[0] : `${count} members`;
  }

  private run<T>(request: Observable<T>, describe: (result: T) => string): void {
    this.busy.set(true);
    this.notice.set(null);
    request.subscribe({
      next: (result) => {
        this.busy.set(false);
        this.notice.set({ text: describe(result), failed: false });
        this.page.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.notice.set({ text: errorMessage(error), failed: true });
      },
    });
  }

  private update(change: Partial<FindingsQuery>): void {
    const next = { ...this.query(), ...change };
    this.query.set(next);
    this.selected.set(new Set());
    void this.router.navigate([], { relativeTo: this.route, queryParams: findingsUrlParams(next), replaceUrl: true });
  }
}
