import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { filter, Observable } from 'rxjs';
import { percentText } from '../../../../server/reports/report-format';
import { errorMessage } from '../../core/api-error';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { ProjectContext } from '../../projects/project-context';
import { projectPeople } from '../project-people';
import { askForJustification, askForResolution } from '../status-note-dialog/status-note-dialog';
import { changeSourceText, changeText } from '../change-text';
import {
  FindingDetail as Detail,
  FindingPatch,
  FindingPriority,
  FindingStatus,
  findingReference,
  KIND_LABELS,
  moveAction,
  PRIORITIES,
  PRIORITY_LABELS,
  STATUS_LABELS,
} from '../finding';
import { FindingsApi, findingUrl } from '../findings-api';

/** Same limits as the server (server/findings/finding-fields.ts). */
const MAX_COMMENT = 4000;
const MAX_LABEL = 60;
const MAX_LABELS = 20;
const MAX_MENTION_CHOICES = 8;

/** One finding: status actions the role allows, triage fields, comments with mentions, history and its view in 3D. */
@Component({
  selector: 'tl-finding-detail',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatAutocompleteModule,
    MatButtonModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    CautionsNotice,
  ],
  templateUrl: './finding-detail.html',
  styleUrl: './finding-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FindingDetail {
  private readonly api = inject(FindingsApi);
  private readonly dialog = inject(MatDialog);
  protected readonly context = inject(ProjectContext);

  readonly findingId = input.required<string>();

  protected readonly statusLabels = STATUS_LABELS;
  protected readonly kindLabels = KIND_LABELS;
  protected readonly priorities = PRIORITIES;
  protected readonly priorityLabels = PRIORITY_LABELS;
  protected readonly moveAction = moveAction;
  protected readonly changeText = changeText;
  protected readonly changeSourceText = changeSourceText;
  protected readonly maxComment = MAX_COMMENT;

  protected readonly detail = httpResource<Detail>(() => {
    const projectId = this.context.projectId();
    return projectId ? findingUrl(projectId, this.findingId()) : undefined;
  });
  protected readonly loaded = computed(() => (this.detail.hasValue() ? this.detail.value() : null));
  protected readonly finding = computed(() => this.loaded()?.finding ?? null);
  protected readonly loadError = computed(() => {
    const error = this.detail.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly reference = computed(() => {
    const finding = this.finding();
    return finding ? findingReference(finding.number) : '';
  });
  protected readonly utilisation = computed(() => {
    const value = this.finding()?.utilisation;
    return value === null || value === undefined ? null : percentText(value);
  });
  protected readonly snapshotUrl = computed(() => findingUrl(this.context.projectId(), this.findingId(), '/snapshot.png'));
  protected readonly viewLink = computed(() => ['/projects', this.context.projectId(), '3d-view']);
  /** The member's calculation sheet in the run the finding follows (for an accepted finding, the run it was accepted on). */
  protected readonly sheetLink = computed(() => {
    const finding = this.finding();
    if (!finding?.runId || finding.kind === 'manual' || finding.memberGlobalIds.length !== 1) return null;
    return ['/projects', this.context.projectId(), 'checks', finding.runId, 'members', finding.memberGlobalIds[0]];
  });

  protected readonly people = projectPeople(() => this.context.projectId());

  protected readonly canAssign = computed(() => this.context.can('finding.assign'));
  protected readonly canTakePart = computed(() => this.context.can('finding.comment'));

  protected readonly busy = signal(false);
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);

  protected readonly triage = new FormGroup({
    assigneeId: new FormControl<string | null>(null),
    priority: new FormControl<FindingPriority>('normal', { nonNullable: true }),
    dueDate: new FormControl('', { nonNullable: true }),
    labels: new FormControl<string[]>([], { nonNullable: true }),
  });
  protected readonly commentForm = new FormGroup({
    text: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(MAX_COMMENT), Validators.pattern(/\S/)] }),
  });
  protected readonly comment = this.commentForm.controls.text;
  private readonly commentText = toSignal(this.comment.valueChanges, { initialValue: '' });

  /**
   * Members matching the "@…" being typed at the end of the comment, by name or address; each option's value is the
   * whole comment with the mention written out as the address, which the server recognises unambiguously.
   */
  protected readonly mentionChoices = computed(() => {
    const text = this.commentText();
    const typing = /(^|\s)@([^\s@]*)$/.exec(text);
    if (!typing) return [];
    const typed = typing[2].toLowerCase();
    const head = text.slice(0, typing.index + typing[1].length);
    return this.people()
      .filter((person) => person.name.toLowerCase().includes(typed) || person.email.toLowerCase().startsWith(typed))
      .slice(0, MAX_MENTION_CHOICES)
      .map((person) => ({ person, text: `${head}@${person.email} ` }));
  });

  constructor() {
    // The form shows the stored values again after every load (and after a refused change).
    effect(() => {
      const finding = this.finding();
      if (!finding) return;
      this.triage.reset({
        assigneeId: finding.assignee?.id ?? null,
        priority: finding.priority,
        dueDate: finding.dueDate ?? '',
        labels: finding.labels,
      });
      if (this.canAssign()) this.triage.enable();
      else {
        this.triage.disable();
        if (this.canTakePart()) this.triage.controls.labels.enable();
      }
    });
  }

  protected move(to: FindingStatus): void {
    const finding = this.finding();
    if (!finding) return;
    const projectId = this.context.projectId();
    const ref = { reference: this.reference(), title: finding.title };
    const confirmed = (reason: Observable<string | undefined>) => reason.pipe(filter((text): text is string => text !== undefined));
    if (to === 'accepted') {
      confirmed(askForJustification(this.dialog, ref)).subscribe((justification) =>
        this.write(this.api.moveTo(projectId, finding.id, to, { justification }), `${this.reference()} was accepted.`),
      );
    } else if (to === 'resolved' && finding.kind === 'web-shear-fail') {
      // A failing member is not closed by a click: the reviewer verifies against what the engineer says was done.
      confirmed(askForResolution(this.dialog, { ...ref, utilisation: this.utilisation() })).subscribe((note) =>
        this.write(this.api.moveTo(projectId, finding.id, to, { note }), `${this.reference()} is now ${STATUS_LABELS[to]}.`),
      );
    } else {
      this.write(this.api.moveTo(projectId, finding.id, to), `${this.reference()} is now ${STATUS_LABELS[to]}.`);
    }
  }

  protected addLabel(event: MatChipInputEvent): void {
    const label = event.value.trim().slice(0, MAX_LABEL);
    const labels = this.triage.controls.labels.value;
    if (label && !labels.includes(label) && labels.length < MAX_LABELS) this.triage.controls.labels.setValue([...labels, label]);
    event.chipInput.clear();
  }

  protected removeLabel(label: string): void {
    this.triage.controls.labels.setValue(this.triage.controls.labels.value.filter((value) => value !== label));
  }

  protected saveTriage(): void {
    const finding = this.finding();
    if (!finding) return;
    const value = this.triage.getRawValue();
    const patch: FindingPatch = {};
    if (this.canAssign()) {
      if (value.assigneeId !== (finding.assignee?.id ?? null)) patch.assigneeId = value.assigneeId;
      if (value.priority !== finding.priority) patch.priority = value.priority;
      if ((value.dueDate || null) !== finding.dueDate) patch.dueDate = value.dueDate || null;
    }
    if (value.labels.join('\n') !== finding.labels.join('\n')) patch.labels = value.labels;
    if (Object.keys(patch).length === 0) {
      this.notice.set({ text: 'Nothing to save.', failed: false });
      return;
    }
    this.write(this.api.update(this.context.projectId(), finding.id, patch), 'Saved.');
  }

  protected postComment(): void {
    const finding = this.finding();
    if (!finding) return;
    if (this.comment.invalid) {
      this.comment.markAsTouched();
      return;
    }
    this.write(this.api.comment(this.context.projectId(), finding.id, this.comment.value.trim()), 'Comment added.', () => this.comment.reset(''));
  }

  private write(request: Observable<unknown>, success: string, done?: () => void): void {
    this.busy.set(true);
    this.notice.set(null);
    request.subscribe({
      next: () => {
        this.busy.set(false);
        this.notice.set({ text: success, failed: false });
        done?.();
        this.detail.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.notice.set({ text: errorMessage(error), failed: true });
        this.detail.reload();
      },
    });
  }
}
