import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { type SectionProperties, sectionProperties } from '../../../../server/engine/section-properties';
import { formatNumber } from '../../../../server/engine/trace';
import { percentText, STANDARD_LABELS } from '../../../../server/reports/report-format';
import { errorMessage } from '../../core/api-error';
import { CAUTIONS } from '../../core/cautions';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { ProjectContext } from '../../projects/project-context';
import { MemberSheet, sheetUrl, STATUS_NAMES } from '../checks-api';
import { flagLabel } from '../flag-labels';
import { UtilisationBar } from '../utilisation-bar/utilisation-bar';
import { familyFrame, familySectionFigure, familyStressInput, figureFrame, SectionFigure, sectionFigure, StressFigure, stressFigure } from './sheet-figures';

interface Figures {
  section: SectionFigure;
  stress: StressFigure;
}

/** One member's calculation sheet: section and τ(y) drawings, the clause-by-clause trace, every combination, cautions. */
@Component({
  selector: 'tl-calculation-sheet',
  imports: [RouterLink, MatButtonModule, MatIconModule, CautionsNotice, UtilisationBar],
  templateUrl: './calculation-sheet.html',
  styleUrl: './calculation-sheet.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalculationSheet {
  protected readonly context = inject(ProjectContext);

  readonly runId = input.required<string>();
  readonly globalId = input.required<string>();

  protected readonly statusNames = STATUS_NAMES;
  protected readonly flagLabel = flagLabel;
  protected readonly formatNumber = formatNumber;
  protected readonly percentText = percentText;

  protected readonly sheetResource = httpResource<MemberSheet>(() => sheetUrl(this.context.projectId(), this.runId(), this.globalId()));
  protected readonly sheet = computed(() => (this.sheetResource.hasValue() ? this.sheetResource.value() : null));
  protected readonly loadError = computed(() => {
    const error = this.sheetResource.error();
    return error ? errorMessage(error) : null;
  });

  protected readonly title = computed(() => {
    const member = this.sheet()?.member;
    return member ? member.tag || member.name || member.globalId : 'Calculation sheet';
  });
  protected readonly standardLabel = computed(() => {
    const sheet = this.sheet();
    return sheet ? STANDARD_LABELS[sheet.standard] : '';
  });

  // The outline is traced from the engine's width function, which JSON cannot carry: rebuilt here from the input.
  private readonly properties = computed((): SectionProperties | string | null => {
    const section = this.sheet()?.section;
    if (!section) return null;
    try {
      return sectionProperties(section.input);
    } catch (error) {
      return error instanceof Error ? error.message : 'The section cannot be drawn.';
    }
  });
  protected readonly drawingProblem = computed(() => {
    const props = this.properties();
    return typeof props === 'string' ? props : null;
  });

  protected readonly figures = computed((): Figures | null => {
    const sheet = this.sheet();
    if (sheet?.familySection && sheet.familyStress) {
      const frame = familyFrame(sheet.familySection);
      return {
        section: familySectionFigure(sheet.familySection, sheet.standard, frame),
        stress: stressFigure(familyStressInput(sheet.familySection, sheet.familyStress), frame),
      };
    }
    const stress = sheet?.stress;
    const props = this.properties();
    if (!stress || props === null || typeof props === 'string') return null;
    const frame = figureFrame(props);
    return {
      section: sectionFigure(props, frame),
      stress: stressFigure(
        {
          samples: stress.samples,
          tauMax_MPa: stress.tauMax_MPa,
          tauMaxAt_mm: stress.at_mm,
          junctions: [stress.junctions.top, stress.junctions.bottom],
          webAverage: { tau_MPa: stress.webAverageClear_MPa, from_mm: props.bottomJunctionFromBottom_mm, to_mm: props.topJunctionFromBottom_mm },
          elasticLimit_MPa: stress.elasticLimit_MPa,
        },
        frame,
      ),
    };
  });

  /** Cautions the sheet adds for this member, beyond the product's general ones shown in the panel. */
  protected readonly memberCautions = computed(() => (this.sheet()?.cautions ?? []).filter((caution) => !CAUTIONS.includes(caution)));

  protected resultText(result: number | string): string {
    return typeof result === 'number' ? formatNumber(result) : result;
  }

  protected printSheet(): void {
    window.print();
  }
}
