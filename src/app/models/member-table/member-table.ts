import { DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, linkedSignal, output, untracked } from '@angular/core';
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
import { debounceTime } from 'rxjs';
import { SECTION_FAMILY_LABELS } from '../../../../server/engine/section-family';
import { PROFILE_SOURCE_LABELS } from '../../../../server/ifc/model-read-result';
import { flagLabel } from '../../checks/flag-labels';
import { errorMessage } from '../../core/api-error';
import { DEFAULT_MEMBER_QUERY, isMemberSort, MEMBER_PAGE_SIZES, memberApiParams, MemberQuery } from '../member-query';
import { MemberFacets, MemberPage, MemberRow, MemberStatus, ProfileSource, revisionUrl, SectionFamily } from '../models-api';
import { MEMBER_STATUS_LABELS, mmText } from '../model-words';

// The text filter waits for a pause in typing before asking the server.
const TYPING_PAUSE_MS = 300;

/** 'sections': the members with what was read of each; 'skipped': those that cannot be checked, and why. */
export type MemberTableView = 'sections' | 'skipped';

const COLUMNS: Readonly<Record<MemberTableView, readonly string[]>> = {
  sections: ['tag', 'ifcClass', 'storey', 'profileName', 'profileFamily', 'depth_mm', 'webThickness_mm', 'flangeWidth_mm', 'grade', 'fy_MPa', 'length_mm', 'status', 'flags'],
  skipped: ['tag', 'ifcClass', 'storey', 'profileFamily', 'status', 'reason', 'flags'],
};

const SKIPPED: MemberStatus[] = ['not-applicable', 'flagged'];

const NO_FACETS: MemberFacets = { storeys: [], profiles: [], families: [], sources: [], skipped: [] };

/** A ready revision's members, sorted, filtered and paged by the server. */
@Component({
  selector: 'tl-member-table',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
  ],
  templateUrl: './member-table.html',
  styleUrl: './member-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberTable {
  readonly projectId = input.required<string>();
  readonly revisionId = input.required<string>();
  readonly view = input<MemberTableView>('sections');
  /** A member the user wants to read in full. */
  readonly memberChosen = output<MemberRow>();

  protected readonly statusLabels = MEMBER_STATUS_LABELS;
  protected readonly familyLabels = SECTION_FAMILY_LABELS;
  protected readonly sourceLabels = PROFILE_SOURCE_LABELS;
  protected readonly pageSizes = MEMBER_PAGE_SIZES;
  protected readonly flagLabel = flagLabel;
  protected readonly mmText = mmText;
  protected readonly columns = computed(() => COLUMNS[this.view()]);
  protected readonly statusChoices = computed((): MemberStatus[] => (this.view() === 'skipped' ? SKIPPED : ['ok', ...SKIPPED]));

  /** Starts over whenever the view changes. */
  protected readonly query = linkedSignal<MemberTableView, MemberQuery>({
    source: this.view,
    computation: (view) => ({ ...DEFAULT_MEMBER_QUERY, statuses: view === 'skipped' ? SKIPPED : [] }),
  });

  protected readonly filters = new FormGroup({
    status: new FormControl<MemberStatus | ''>('', { nonNullable: true }),
    storey: new FormControl('', { nonNullable: true }),
    profile: new FormControl('', { nonNullable: true }),
    family: new FormControl<SectionFamily | ''>('', { nonNullable: true }),
    source: new FormControl<ProfileSource | ''>('', { nonNullable: true }),
    q: new FormControl('', { nonNullable: true }),
  });

  private readonly baseUrl = computed(() => revisionUrl(this.projectId(), this.revisionId()));
  protected readonly members = httpResource<MemberPage>(() => ({ url: `${this.baseUrl()}/members`, params: memberApiParams(this.query()) }));
  private readonly facetResource = httpResource<MemberFacets>(() => `${this.baseUrl()}/members/facets`);
  protected readonly facets = computed(() => (this.facetResource.hasValue() ? this.facetResource.value() : NO_FACETS));
  protected readonly rows = computed(() => (this.members.hasValue() ? this.members.value().members : []));
  protected readonly total = computed(() => (this.members.hasValue() ? this.members.value().total : 0));
  protected readonly loadError = computed(() => {
    const error = this.members.error();
    return error ? errorMessage(error) : null;
  });

  constructor() {
    this.filters.valueChanges.pipe(debounceTime(TYPING_PAUSE_MS), takeUntilDestroyed(inject(DestroyRef))).subscribe(() => {
      const { status, ...rest } = this.filters.getRawValue();
      this.update({ ...rest, statuses: status ? [status] : this.view() === 'skipped' ? SKIPPED : [], page: 0 });
    });
    // A new view starts without filters, as its query does; the fields must not show filters no longer applied.
    effect(() => {
      this.view();
      untracked(() => this.filters.reset(undefined, { emitEvent: false }));
    });
  }

  protected sortBy(sort: Sort): void {
    if (!sort.direction || !isMemberSort(sort.active)) this.update({ sort: 'expressId', dir: 'asc', page: 0 });
    else this.update({ sort: sort.active, dir: sort.direction, page: 0 });
  }

  protected showPage(event: PageEvent): void {
    this.update({ page: event.pageIndex, pageSize: event.pageSize });
  }

  protected clearFilters(): void {
    this.filters.reset();
  }

  protected statusLabel(row: MemberRow): string {
    return MEMBER_STATUS_LABELS[row.status];
  }

  protected familyLabel(row: MemberRow): string {
    return row.profileFamily ? SECTION_FAMILY_LABELS[row.profileFamily] : '—';
  }

  /** How the section was found; for an I-section also whether it is rolled or welded (other families are not told apart yet). */
  protected sectionOrigin(row: MemberRow): string | null {
    if (!row.profileSource) return null;
    const source = PROFILE_SOURCE_LABELS[row.profileSource];
    return row.profileFamily === 'I' && row.fabrication ? `${row.fabrication}, ${source}` : source;
  }

  protected chooseMember(row: MemberRow): void {
    this.memberChosen.emit(row);
  }

  private update(change: Partial<MemberQuery>): void {
    this.query.update((query) => ({ ...query, ...change }));
  }
}
