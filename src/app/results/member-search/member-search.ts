import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { debounceTime, map } from 'rxjs';
import { MemberCandidate, revisionsUrl } from '../results-api';

/** Members offered per search: enough to pick from, few enough to read. */
const SEARCH_PAGE_SIZE = 10;
// Waits for a pause in typing so each keystroke does not cost a request.
const TYPING_PAUSE_MS = 250;

/** Finds a member of a model revision by tag, name or GlobalId. */
@Component({
  selector: 'tl-member-search',
  imports: [ReactiveFormsModule, MatAutocompleteModule, MatFormFieldModule, MatInputModule],
  templateUrl: './member-search.html',
  styleUrl: './member-search.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberSearch {
  readonly projectId = input.required<string>();
  readonly revisionId = input.required<string>();
  readonly label = input('Member (tag, name or GlobalId)');
  readonly chosen = output<MemberCandidate>();

  protected readonly query = new FormControl<string | MemberCandidate>('', { nonNullable: true });
  private readonly text = toSignal(
    this.query.valueChanges.pipe(
      debounceTime(TYPING_PAUSE_MS),
      map((value) => (typeof value === 'string' ? value.trim() : '')),
    ),
    { initialValue: '' },
  );

  protected readonly found = httpResource<{ members: MemberCandidate[] }>(() => {
    const q = this.text();
    if (!q) return undefined;
    return {
      url: `${revisionsUrl(this.projectId())}/${encodeURIComponent(this.revisionId())}/members`,
      params: { q, page: 0, pageSize: SEARCH_PAGE_SIZE, sort: 'tag', dir: 'asc' },
    };
  });
  protected readonly options = computed(() => (this.found.hasValue() && this.text() ? this.found.value().members : []));

  protected describe(member: MemberCandidate | string | null): string {
    if (member === null || typeof member === 'string') return member ?? '';
    return memberLabel(member);
  }

  protected choose(member: MemberCandidate): void {
    this.chosen.emit(member);
  }
}

/** Tag, then name, then GlobalId: the first a person would recognise. */
export function memberLabel(member: MemberCandidate): string {
  return [member.tag, member.name].filter(Boolean).join(' · ') || member.globalId;
}
