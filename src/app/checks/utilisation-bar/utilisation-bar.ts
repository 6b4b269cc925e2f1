import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { percentText } from '../../../../server/reports/report-format';
import { rgbHexToCss, utilisationColour } from '../../viewer/utilisation-colours';

export interface UtilisationBarLook {
  text: string;
  /** Bar length, 0–100 % of the track; over capacity fills the track. */
  widthPercent: number;
  /** The 3D view's colour for the same ratio, so table and model agree. */
  colour: string;
  over: boolean;
}

/** How a utilisation ratio (1 = 100 %) is drawn; null = not checked. Percentages round up, as in reports. */
export function utilisationBarLook(ratio: number | null): UtilisationBarLook {
  const colour = rgbHexToCss(utilisationColour(ratio));
  if (ratio === null || !Number.isFinite(ratio) || ratio < 0) return { text: '—', widthPercent: 0, colour, over: false };
  return { text: percentText(ratio), widthPercent: Math.min(100, ratio * 100), colour, over: ratio > 1 };
}

/** A utilisation as a number and a bar in the 3D view's colour scale. */
@Component({
  selector: 'tl-utilisation-bar',
  template: `
    <span class="value tl-numeric" [class.over]="look().over">{{ look().text }}</span>
    <span class="track" aria-hidden="true">
      <span class="bar" [style.width.%]="look().widthPercent" [style.background-color]="look().colour"></span>
    </span>
  `,
  styleUrl: './utilisation-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UtilisationBar {
  readonly utilisation = input.required<number | null>();
  protected readonly look = computed(() => utilisationBarLook(this.utilisation()));
}
