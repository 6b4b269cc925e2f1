import { ChangeDetectionStrategy, Component, effect, input, signal } from '@angular/core';
import type { ViewerEngine } from './viewer-engine';
import type { ViewerStats as EngineStats } from './viewer-probe';

const REFRESH_MS = 1000;

/** Development overlay: draw calls, triangles and GPU memory of the 3D view, to catch leaks and batching slips. */
@Component({
  selector: 'tl-viewer-stats',
  template: `
    @if (stats(); as figures) {
      <span>{{ figures.drawCalls }} draw calls</span>
      <span>{{ figures.triangles.toLocaleString('en') }} triangles</span>
      <span>{{ figures.geometries }} geometries · {{ figures.textures }} textures</span>
      <span>{{ figures.programs }} shader programs</span>
    }
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      padding: 4px 8px;
      border-radius: var(--mat-sys-corner-extra-small);
      background: var(--mat-sys-inverse-surface);
      color: var(--mat-sys-inverse-on-surface);
      font: var(--mat-sys-label-small);
      opacity: 0.85;
      pointer-events: none;
    }
  `,
  host: { class: 'tl-numeric' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerStats {
  readonly engine = input<ViewerEngine | null>(null);
  protected readonly stats = signal<EngineStats | null>(null);

  constructor() {
    effect((onCleanup) => {
      const engine = this.engine();
      if (engine === null) return;
      const timer = setInterval(() => this.stats.set(engine.stats()), REFRESH_MS);
      onCleanup(() => clearInterval(timer));
    });
  }
}
