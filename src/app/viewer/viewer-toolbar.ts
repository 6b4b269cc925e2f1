import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, model, output, signal, viewChild } from '@angular/core';
import { MatAutocompleteModule, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDividerModule } from '@angular/material/divider';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTooltipModule } from '@angular/material/tooltip';
import { STANDARD_VIEWS, type StandardView } from './camera-framing';
import type { Projection } from './camera-rig';
import { COLOUR_MODE_LABELS, type ColourMode } from './member-colouring';
import { type MemberFilters, NO_MEMBER_FILTERS, searchMembers, storeysOf } from './member-filters';
import { SECTION_AXIS_LABELS, type SectionAxis } from './section-plane';
import type { ViewerMember } from './viewer-member';

/** What the toolbar asks the view to do; colour mode and filters are two-way bindings instead. */
export type ViewerCommand =
  | { kind: 'fit-all' }
  | { kind: 'fit-selection' }
  | { kind: 'standard-view'; view: StandardView }
  | { kind: 'projection'; projection: Projection }
  | { kind: 'section'; axis: SectionAxis | null }
  | { kind: 'flip-section' }
  | { kind: 'hide-selection' }
  | { kind: 'isolate-selection' }
  | { kind: 'show-all' }
  | { kind: 'find'; globalId: string }
  | { kind: 'snapshot' };

const SEARCH_SUGGESTIONS = 8;

interface ToolbarAction {
  command: ViewerCommand;
  /** Material Symbols ligature. */
  icon: string;
  label: string;
  needsSelection: boolean;
}

const FRAMING_ACTIONS: readonly ToolbarAction[] = [
  { command: { kind: 'fit-all' }, icon: 'fit_screen', label: 'Frame the whole model (F)', needsSelection: false },
  {
    command: { kind: 'fit-selection' },
    icon: 'center_focus_strong',
    label: 'Frame the selection (F)',
    needsSelection: true,
  },
];

const VISIBILITY_ACTIONS: readonly ToolbarAction[] = [
  { command: { kind: 'hide-selection' }, icon: 'visibility_off', label: 'Hide the selection', needsSelection: true },
  {
    command: { kind: 'isolate-selection' },
    icon: 'filter_center_focus',
    label: 'Show only the selection',
    needsSelection: true,
  },
  { command: { kind: 'show-all' }, icon: 'visibility', label: 'Show everything hidden', needsSelection: false },
];

@Component({
  selector: 'tl-viewer-toolbar',
  imports: [
    NgTemplateOutlet,
    MatAutocompleteModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatDividerModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatTooltipModule,
  ],
  templateUrl: './viewer-toolbar.html',
  styleUrl: './viewer-toolbar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerToolbar {
  readonly colourMode = model<ColourMode>('utilisation');
  readonly filters = model<MemberFilters>(NO_MEMBER_FILTERS);
  readonly members = input<readonly ViewerMember[]>([]);
  readonly hasSelection = input(false);
  /** The cut shown: null for none; its axis is null for a cut at an angle. */
  readonly section = input<{ axis: SectionAxis | null } | null>(null);
  readonly projection = input<Projection>('perspective');

  readonly command = output<ViewerCommand>();

  protected readonly framingActions = FRAMING_ACTIONS;
  protected readonly visibilityActions = VISIBILITY_ACTIONS;
  protected readonly colourModes = Object.keys(COLOUR_MODE_LABELS) as ColourMode[];
  protected readonly colourModeLabels = COLOUR_MODE_LABELS;
  protected readonly standardViews = Object.entries(STANDARD_VIEWS).map(([view, definition]) => ({
    view: view as StandardView,
    label: definition.label,
  }));
  protected readonly sectionAxes = Object.entries(SECTION_AXIS_LABELS).map(([axis, label]) => ({
    axis: axis as SectionAxis,
    label,
  }));
  protected readonly storeys = computed(() => storeysOf(this.members()));
  protected readonly query = signal('');
  protected readonly matches = computed(() => searchMembers(this.members(), this.query(), SEARCH_SUGGESTIONS));
  protected readonly noMatch = computed(() => this.query().trim() !== '' && this.matches().length === 0);
  private readonly suggestions = viewChild.required(MatAutocompleteTrigger);

  protected emit(command: ViewerCommand): void {
    this.command.emit(command);
  }

  protected setOnlyFailing(onlyFailing: boolean): void {
    this.filters.update((filters) => ({ ...filters, onlyFailing }));
  }

  protected setStorey(storey: string | null): void {
    this.filters.update((filters) => ({ ...filters, storey }));
  }

  protected toggleProjection(): void {
    this.emit({ kind: 'projection', projection: this.projection() === 'perspective' ? 'orthogonal' : 'perspective' });
  }

  protected updateQuery(event: Event): void {
    this.query.set((event.target as HTMLInputElement).value);
  }

  protected findFirstMatch(): void {
    const first = this.matches()[0];
    if (first === undefined) return;
    this.suggestions().closePanel();
    this.findMember(first.globalId);
  }

  protected findMember(globalId: string): void {
    this.emit({ kind: 'find', globalId });
  }

  protected describe(member: ViewerMember): string {
    return [member.tag ?? 'no tag', member.section, member.storey].filter(Boolean).join(' · ');
  }
}
