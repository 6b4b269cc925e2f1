import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { STATUS_LABELS } from './utilisation-colours';
import type { ViewerMember } from './viewer-member';

/** Keeps the tooltip off the pointer so it never hides what is being pointed at. */
const POINTER_OFFSET_PX = 16;

/** What the pointer rests on: tag, section and utilisation of the member under it. */
@Component({
  selector: 'tl-viewer-tooltip',
  templateUrl: './viewer-tooltip.html',
  styleUrl: './viewer-tooltip.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    role: 'tooltip',
    '[style.left.px]': 'x_px() + offset',
    '[style.top.px]': 'y_px() + offset',
  },
})
export class ViewerTooltip {
  /** The member's results, or null when the model has an element the results do not know. */
  readonly member = input<ViewerMember | null>(null);
  readonly globalId = input.required<string>();
  readonly x_px = input.required<number>();
  readonly y_px = input.required<number>();

  protected readonly offset = POINTER_OFFSET_PX;
  protected readonly utilisation = computed(() => {
    const ratio = this.member()?.utilisationRatio;
    return ratio == null ? null : `${(ratio * 100).toFixed(1)} %`;
  });
  protected readonly status = computed(() => {
    const member = this.member();
    return member === null ? 'no check results' : STATUS_LABELS[member.status];
  });
}
