import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  ErrorHandler,
  computed,
  effect,
  inject,
  input,
  isDevMode,
  output,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { BlobDownload } from './blob-download';
import type { Projection } from './camera-rig';
import type { ColourMode } from './member-colouring';
import { type MemberFilters, NO_MEMBER_FILTERS } from './member-filters';
import { ViewerCanvas } from './viewer-canvas';
import type { GlbSource, ModelSummary, ViewerEngine, ViewerHit } from './viewer-engine';
import { ViewerLegend } from './viewer-legend';
import type { ViewerMember } from './viewer-member';
import { ViewerStats } from './viewer-stats';
import { type ViewerCommand, ViewerToolbar } from './viewer-toolbar';
import { ViewerTooltip } from './viewer-tooltip';
import type { ViewerViewpoint } from './viewpoint';

/** Closer than this to the right or bottom edge, the tooltip opens towards the other side. */
const TOOLTIP_ROOM_PX = { x: 240, y: 140 };

/**
 * The whole 3D view: toolbar, model, legend, hover tooltip and the cautions. A page gives it the revision's .glb
 * and the check results; "show in 3D" from elsewhere sets `focusGlobalId`.
 */
@Component({
  selector: 'tl-viewer-workspace',
  imports: [ViewerCanvas, ViewerLegend, ViewerStats, ViewerToolbar, ViewerTooltip],
  templateUrl: './viewer-workspace.html',
  styleUrl: './viewer-workspace.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerWorkspace {
  private readonly download = inject(BlobDownload);
  private readonly errorHandler = inject(ErrorHandler);

  readonly glb = input<GlbSource | null>(null);
  readonly members = input<readonly ViewerMember[]>([]);
  /** A member to select and fly to, e.g. from the results table. */
  readonly focusGlobalId = input<string | null>(null);
  /** The snapshot's file name, without extension. */
  readonly snapshotName = input('taulens-3d-view');

  readonly selected = output<readonly string[]>();
  readonly snapshot = output<Blob>();
  /** A model has loaded and is drawn; viewpoints can be applied from now on. */
  readonly loaded = output<ModelSummary>();

  protected readonly canvas = viewChild.required(ViewerCanvas);
  private readonly canvasElement = viewChild.required(ViewerCanvas, { read: ElementRef<HTMLElement> });
  protected readonly colourMode = signal<ColourMode>('utilisation');
  protected readonly filters = signal<MemberFilters>(NO_MEMBER_FILTERS);
  protected readonly selection = signal<readonly string[]>([]);
  protected readonly hover = signal<ViewerHit | null>(null);
  protected readonly section = signal<ReturnType<ViewerEngine['sectionState']>>(null);
  protected readonly projection = signal<Projection>('perspective');
  protected readonly summary = signal<ModelSummary | null>(null);
  protected readonly devMode = isDevMode();

  private readonly membersById = computed(() => new Map(this.members().map((member) => [member.globalId, member])));
  protected readonly hoveredMember = computed(() => {
    const hit = this.hover();
    return hit === null ? null : (this.membersById().get(hit.globalId) ?? null);
  });
  protected readonly missingFromModel = computed(() => this.canvas().colouring()?.notInModel ?? 0);

  constructor() {
    effect(() => {
      const globalId = this.focusGlobalId();
      const engine = this.canvas().engine();
      if (globalId === null || engine === null || this.summary() === null) return;
      untracked(() => this.selectAndFrame(engine, globalId));
    });
  }

  /** The current view for a finding: camera, selection, visibility and cut, in BCF terms. */
  viewpoint(): ViewerViewpoint | null {
    return this.canvas().engine()?.getViewpoint() ?? null;
  }

  /** The view as a PNG, e.g. for a finding; null until WebGL has started. */
  snapshotPng(): Promise<Blob> | null {
    return this.canvas().engine()?.snapshotPng() ?? null;
  }

  /** Restores a finding's view; a bad viewpoint throws a ViewpointError and leaves the view as it was. */
  applyViewpoint(viewpoint: ViewerViewpoint): void {
    const engine = this.canvas().engine();
    if (engine === null) return;
    engine.setViewpoint(viewpoint);
    // The viewpoint says what is visible, so the filter controls go back to showing everything.
    this.filters.set(NO_MEMBER_FILTERS);
    this.section.set(engine.sectionState());
    this.projection.set(engine.projection());
    this.changeSelection(engine.selection());
  }

  /** Tooltip position, flipped to the other side of the pointer near the canvas's right and bottom edges. */
  protected tooltipPosition(hit: ViewerHit): { x_px: number; y_px: number } {
    const { clientWidth, clientHeight } = this.canvasElement().nativeElement;
    return {
      x_px: hit.x_px > clientWidth - TOOLTIP_ROOM_PX.x ? hit.x_px - TOOLTIP_ROOM_PX.x : hit.x_px,
      y_px: hit.y_px > clientHeight - TOOLTIP_ROOM_PX.y ? hit.y_px - TOOLTIP_ROOM_PX.y : hit.y_px,
    };
  }

  /** A new model starts with nothing selected, no cut and all filters still as the toolbar shows them. */
  protected showModel(summary: ModelSummary): void {
    this.summary.set(summary);
    this.hover.set(null);
    this.section.set(null);
    this.changeSelection([]);
    this.loaded.emit(summary);
  }

  protected changeSelection(globalIds: readonly string[]): void {
    this.selection.set(globalIds);
    this.selected.emit(globalIds);
  }

  protected run(command: ViewerCommand): void {
    const engine = this.canvas().engine();
    if (engine === null) return;
    switch (command.kind) {
      case 'fit-all':
        return engine.fitAll();
      case 'fit-selection':
        return engine.fitTo(this.selection());
      case 'standard-view':
        return engine.setStandardView(command.view);
      case 'projection':
        engine.setProjection(command.projection);
        return this.projection.set(command.projection);
      case 'section':
        engine.setSection(command.axis);
        return this.section.set(engine.sectionState());
      case 'flip-section':
        return engine.flipSection();
      case 'hide-selection':
        return engine.hide(this.selection());
      case 'isolate-selection':
        return engine.isolate(this.selection());
      case 'show-all':
        return engine.showAll();
      case 'find':
        return this.selectAndFrame(engine, command.globalId);
      case 'snapshot':
        return this.saveSnapshot(engine);
    }
  }

  private selectAndFrame(engine: ViewerEngine, globalId: string): void {
    engine.select([globalId]);
    engine.fitTo([globalId]);
    this.changeSelection(engine.selection());
  }

  private saveSnapshot(engine: ViewerEngine): void {
    engine
      .snapshotPng()
      .then((png) => {
        this.download.save(png, `${this.snapshotName()}.png`);
        this.snapshot.emit(png);
      })
      // Encoding fails only when the browser is out of memory or similar; report it like any unexpected error.
      .catch((error: unknown) => this.errorHandler.handleError(error));
  }
}
