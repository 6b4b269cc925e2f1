import { DatePipe, PercentPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { parameterRows, STANDARD_LABELS } from '../../../../server/reports/report-format';
import { errorMessage } from '../../core/api-error';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { ProjectContext } from '../../projects/project-context';
import { CheckRun, isActive, RUN_STATUS_NAMES, runUrl } from '../checks-api';
import { backgroundContext, reloadWhile } from '../reload-while';
import { RunResults } from '../run-results/run-results';

/** One check run: its immutable record of inputs, its progress while it runs, then its results. */
@Component({
  selector: 'tl-check-run',
  imports: [DatePipe, PercentPipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, CautionsNotice, RunResults],
  templateUrl: './check-run.html',
  styleUrl: './check-run.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckRunPage {
  protected readonly context = inject(ProjectContext);

  readonly runId = input.required<string>();

  protected readonly statusNames = RUN_STATUS_NAMES;

  protected readonly runResource = httpResource<{ run: CheckRun }>(() => ({
    url: runUrl(this.context.projectId(), this.runId()),
    context: backgroundContext(),
  }));
  protected readonly run = computed(() => (this.runResource.hasValue() ? this.runResource.value().run : null));
  protected readonly loadError = computed(() => {
    const error = this.runResource.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly standardLabel = computed(() => {
    const run = this.run();
    return run ? STANDARD_LABELS[run.standard] : '';
  });
  protected readonly parameters = computed(() => {
    const run = this.run();
    return run ? parameterRows(run.parameters) : [];
  });
  protected readonly reportUrl = computed(() => `${runUrl(this.context.projectId(), this.runId())}/report.pdf`);
  protected readonly canExport = computed(() => this.context.can('export'));

  constructor() {
    reloadWhile(this.runResource, () => {
      const run = this.run();
      return run !== null && isActive(run);
    });
  }
}
