import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  ErrorHandler,
  afterNextRender,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { type ColourMode, memberColours } from './member-colouring';
import { type MemberFilters, NO_MEMBER_FILTERS, filteredGlobalIds } from './member-filters';
import type { ViewerMember } from './viewer-member';
import {
  type ColourResult,
  type GlbSource,
  type ModelSummary,
  type Shading,
  ViewerEngine,
  type ViewerHit,
  WebGlUnavailableError,
} from './viewer-engine';
import { installViewerTestHook } from './viewer-test-hook';
import { type LoadProgress, ModelLoadError } from './glb-download';

type CanvasState = 'starting' | 'loading' | 'ready' | 'unavailable' | 'failed';

/**
 * Hosts the viewer engine. The engine is created after the first render, runs outside change detection and is
 * driven from the inputs through effects; only hover, selection and load results come back, as outputs.
 */
@Component({
  selector: 'tl-viewer-canvas',
  imports: [MatIconModule, MatProgressBarModule],
  templateUrl: './viewer-canvas.html',
  styleUrl: './viewer-canvas.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerCanvas {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly destroyRef = inject(DestroyRef);
  private readonly errorHandler = inject(ErrorHandler);

  /** The revision's .glb: its URL or its bytes. */
  readonly glb = input<GlbSource | null>(null);
  /** Check results per member; they colour the model and feed the filters. */
  readonly members = input<readonly ViewerMember[]>([]);
  readonly colourMode = input<ColourMode>('utilisation');
  readonly filters = input<MemberFilters>(NO_MEMBER_FILTERS);
  readonly shading = input<Shading>('lit');
  readonly showContext = input(true);

  readonly selected = output<readonly string[]>();
  readonly hovered = output<ViewerHit | null>();
  readonly loaded = output<ModelSummary>();

  /** The running engine, for commands (framing, views, cuts, snapshots); null until WebGL has started. */
  readonly engine = signal<ViewerEngine | null>(null);
  /** How the last colouring matched the model: members coloured and results naming no element of it. */
  readonly colouring = signal<ColourResult | null>(null);

  protected readonly canvas = viewChild.required<ElementRef<HTMLCanvasElement>>('canvas');
  protected readonly state = signal<CanvasState>('starting');
  protected readonly progress = signal<LoadProgress | null>(null);
  protected readonly message = signal<string | null>(null);
  protected readonly progressPercent = computed(() => {
    const fraction = this.progress()?.fraction;
    return fraction == null ? null : Math.round(fraction * 100);
  });
  /** Bumped when a model has loaded, so colours and filters are applied to it. */
  private readonly modelVersion = signal(0);

  constructor() {
    afterNextRender(() => this.startEngine());
    effect(() => this.loadModel(this.engine(), this.glb()));
    effect(() => {
      const engine = this.engine();
      if (engine === null || this.modelVersion() === 0) return;
      this.colouring.set(engine.setColours(memberColours(this.members(), this.colourMode())));
    });
    effect(() => {
      const engine = this.engine();
      if (engine === null || this.modelVersion() === 0) return;
      engine.setVisible(filteredGlobalIds(this.members(), this.filters()));
    });
    effect(() => this.engine()?.setShading(this.shading()));
    effect(() => this.engine()?.setContextVisible(this.showContext()));
  }

  private startEngine(): void {
    const engine = new ViewerEngine({
      hovered: (hit) => this.hovered.emit(hit),
      selectionChanged: (globalIds) => this.selected.emit(globalIds),
      contextLost: () => this.fail('The graphics card stopped the 3D view. Reload the page to start it again.'),
    });
    try {
      engine.init(this.canvas().nativeElement);
    } catch (error) {
      if (!(error instanceof WebGlUnavailableError)) this.errorHandler.handleError(error);
      this.state.set('unavailable');
      return;
    }
    // The canvas is opaque; it takes its background from the theme surface the host is styled with.
    engine.setBackground(getComputedStyle(this.host.nativeElement).backgroundColor);
    const observer = new ResizeObserver(([entry]) => engine.resize(entry.contentRect.width, entry.contentRect.height));
    observer.observe(this.host.nativeElement);
    const removeTestHook = installViewerTestHook(engine);
    this.destroyRef.onDestroy(() => {
      observer.disconnect();
      removeTestHook();
      engine.dispose();
    });
    this.engine.set(engine);
  }

  private loadModel(engine: ViewerEngine | null, glb: GlbSource | null): void {
    if (engine === null || glb === null) return;
    untracked(() => {
      this.state.set('loading');
      this.progress.set({ phase: 'download', fraction: 0 });
    });
    engine
      .loadGlb(glb, (progress) => this.progress.set(progress))
      .then((summary) => {
        if (summary === null) return;
        this.state.set('ready');
        this.modelVersion.update((version) => version + 1);
        this.loaded.emit(summary);
      })
      .catch((error: unknown) => {
        if (!(error instanceof ModelLoadError)) this.errorHandler.handleError(error);
        this.fail(error instanceof ModelLoadError ? error.message : 'The 3D model could not be shown.');
      });
  }

  private fail(message: string): void {
    this.message.set(message);
    this.state.set('failed');
  }
}
