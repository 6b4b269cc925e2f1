import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { COLOUR_MODE_LABELS, type ColourMode, legendFor } from './member-colouring';
import { SECTION_PALETTE, rgbHexToCss } from './utilisation-colours';
import type { ViewerMember } from './viewer-member';

/** The key to the member colours, always on screen beside the model; follows the colour mode. */
@Component({
  selector: 'tl-viewer-legend',
  templateUrl: './viewer-legend.html',
  styleUrl: './viewer-legend.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ViewerLegend {
  readonly mode = input<ColourMode>('utilisation');
  readonly members = input<readonly ViewerMember[]>([]);

  protected readonly title = computed(() => COLOUR_MODE_LABELS[this.mode()]);
  protected readonly entries = computed(() =>
    legendFor(this.mode(), this.members()).map((entry) => ({ ...entry, css: rgbHexToCss(entry.colour) })),
  );
  /** Sections beyond the palette share colours; the legend says so rather than let two look unique. */
  protected readonly coloursRepeat = computed(
    () => this.mode() === 'section' && this.entries().length - 1 > SECTION_PALETTE.length,
  );
}
