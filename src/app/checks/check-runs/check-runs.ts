import { DatePipe, PercentPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { filter } from 'rxjs';
import { percentText, STANDARD_LABELS } from '../../../../server/reports/report-format';
import { errorMessage } from '../../core/api-error';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { ProjectContext } from '../../projects/project-context';
import { CheckRun, checksUrl, isActive, RUN_STATUS_NAMES } from '../checks-api';
import { backgroundContext, reloadWhile } from '../reload-while';
import { StartCheckData, StartCheckDialog } from '../start-check-dialog/start-check-dialog';

/** The project's check runs, newest first; engineers start new ones. */
@Component({
  selector: 'tl-check-runs',
  imports: [DatePipe, PercentPipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, CautionsNotice],
  templateUrl: './check-runs.html',
  styleUrl: './check-runs.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckRuns {
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  protected readonly context = inject(ProjectContext);

  protected readonly statusNames = RUN_STATUS_NAMES;
  protected readonly standardLabels = STANDARD_LABELS;

  protected readonly runs = httpResource<{ runs: CheckRun[] }>(() => {
    const id = this.context.projectId();
    return id ? { url: checksUrl(id), context: backgroundContext() } : undefined;
  });
  protected readonly rows = computed(() => (this.runs.hasValue() ? this.runs.value().runs : []));
  protected readonly loadError = computed(() => {
    const error = this.runs.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly canRun = computed(() => this.context.can('check.run'));

  constructor() {
    reloadWhile(this.runs, () => this.rows().some(isActive));
  }

  protected summaryText(run: CheckRun): string {
    const summary = run.summary;
    if (!summary) return '—';
    const highest = summary.maxUtilisation === null ? '' : ` · highest ${percentText(summary.maxUtilisation)}`;
    return `${summary.fail} fail · ${summary.warning} near the limit · ${summary.pass} pass${highest}`;
  }

  protected startCheck(): void {
    const project = this.context.project();
    if (!project) return;
    const settings = project.settings;
    this.dialog
      .open<StartCheckDialog, StartCheckData, CheckRun>(StartCheckDialog, {
        data: { projectId: project.id, standard: project.standard, settings },
        width: '760px',
        maxWidth: '96vw',
        autoFocus: 'first-tabbable',
      })
      .afterClosed()
      // Cancel (mat-dialog-close) closes with an empty string, Escape with undefined.
      .pipe(filter((run): run is CheckRun => typeof run === 'object' && run !== null))
      .subscribe((run) => void this.router.navigate([run.id], { relativeTo: this.route }));
  }
}
