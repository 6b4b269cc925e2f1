import {
  ChangeDetectionStrategy,
  Component,
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
import { CautionsNotice } from '../core/cautions-notice/cautions-notice';
import { BlobDownload } from './blob-download';
import type { Projection } from './camera-rig';
import type { ColourMode } from './member-colouring';
import { type MemberFilters, NO_MEMBER_FILTERS } from './member-filters';
import type { SectionAxis } from './section-plane';
import { ViewerCanvas } from './viewer-canvas';
import type { GlbSource, ModelSummary, ViewerEngine, ViewerHit } from './viewer-engine';
import { ViewerLegend } from './viewer-legend';
import type { ViewerMember } from './viewer-member';
import { ViewerStats } from './viewer-stats';
import { type ViewerCommand, ViewerToolbar } from './viewer-toolbar';
import { ViewerTooltip } from './viewer-tooltip';
import type { ViewerViewpoint } from './viewpoint';

/** Past this distance from the right or bottom edge the tooltip opens towards the other side. */
const TOOLTIP_ROOM_PX = { x: 240, y: 140 };

/**
 * The whole 3D view: toolbar, model, legend, hover tooltip and the cautions. A page gives it the revision's .glb
 * and the check results; "show in 3D" from elsewhere sets `focusGlobalId`.
 */
@Component({
  selector: 'tl-viewer-workspace',
  imports: [CautionsNotice, ViewerCanvas, ViewerLegend, ViewerStats, ViewerToolbar, ViewerTooltip],
  templateUrl: './viewer-workspace.html',
  styleUrl: './viewer-workspace.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerWorkspace {
  private readonly download = inject(BlobDownload);

  readonly glb = input<GlbSource | null>(null);
  readonly members = input<readonly ViewerMember[]>([]);
  /** A member to select and fly to, e.g. from the results table. */
  readonly focusGlobalId = input<string | null>(null);
  /** Used in the snapshot's file name. */
  readonly snapshotName = input('taulens-3d-view');

  readonly selected = output<readonly string[]>();
  readonly snapshot = output<Blob>();

  protected readonly canvas = viewChild.required(ViewerCanvas);
  protected readonly colourMode = signal<ColourMode>('utilisation');
  protected readonly filters = signal<MemberFilters>(NO_MEMBER_FILTERS);
  protected readonly selection = signal<readonly string[]>([]);
  protected readonly hover = signal<ViewerHit | null>(null);
  protected readonly sectionAxis = signal<SectionAxis | null>(null);
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

  /** Restores a finding's view; throws a ViewpointError, leaving the view as it was, when the viewpoint is bad. */
  applyViewpoint(viewpoint: ViewerViewpoint): void {
    const engine = this.canvas().engine();
    if (engine === null) return;
    engine.setViewpoint(viewpoint);
    // The viewpoint says what is visible, so the filter controls go back to showing everything.
    this.filters.set(NO_MEMBER_FILTERS);
    this.sectionAxis.set(viewpoint.clippingPlanes.length > 0 ? (this.sectionAxis() ?? 'z') : null);
    this.projection.set(viewpoint.camera.kind);
    this.changeSelection(engine.selection());
  }

  protected tooltipLeft(hit: ViewerHit): number {
    const width = this.canvasWidth();
    return hit.x_px > width - TOOLTIP_ROOM_PX.x ? hit.x_px - TOOLTIP_ROOM_PX.x : hit.x_px;
  }

  protected tooltipTop(hit: ViewerHit): number {
    const height = this.canvasHeight();
    return hit.y_px > height - TOOLTIP_ROOM_PX.y ? hit.y_px - TOOLTIP_ROOM_PX.y : hit.y_px;
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
        return this.sectionAxis.set(command.axis);
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
      // An encoding failure is rare and not the user's doing; the app's error handler reports it.
      .catch((error: unknown) => queueMicrotask(() => { throw error; }));
  }

  private canvasWidth(): number {
    return this.canvas().engine() === null ? 0 : (this.canvasElement()?.clientWidth ?? 0);
  }

  private canvasHeight(): number {
    return this.canvasElement()?.clientHeight ?? 0;
  }

  private canvasElement(): HTMLElement | null {
    return document.querySelector('tl-viewer-canvas');
  }
}
