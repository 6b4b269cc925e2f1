import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CAUTION_SUMMARY, CAUTIONS } from '../cautions';

/** The product's cautions: a one-line summary that opens to the full text, or the full text as a panel. */
@Component({
  selector: 'tl-cautions-notice',
  imports: [MatIconModule],
  templateUrl: './cautions-notice.html',
  styleUrl: './cautions-notice.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[class.panel]': "layout() === 'panel'" },
})
export class CautionsNotice {
  /** `summary` for the app footer, `panel` for pages that present results. */
  readonly layout = input<'summary' | 'panel'>('summary');

  protected readonly summary = CAUTION_SUMMARY;
  protected readonly cautions = CAUTIONS;
}
