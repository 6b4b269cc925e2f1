import { DatePipe, DecimalPipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { errorMessage } from '../../core/api-error';
import { ProjectContext } from '../../projects/project-context';
import { ResultSet, resultsUrl, RevisionChoice, revisionsUrl } from '../results-api';

/** The imported result sets of the project, each with how well its member keys matched the model. */
@Component({
  selector: 'tl-result-sets',
  imports: [DatePipe, DecimalPipe, RouterLink, MatButtonModule, MatIconModule],
  templateUrl: './result-sets.html',
  styleUrl: './result-sets.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultSets {
  protected readonly context = inject(ProjectContext);

  protected readonly resultSets = httpResource<{ resultSets: ResultSet[] }>(() => {
    const id = this.context.projectId();
    return id ? resultsUrl(id) : undefined;
  });
  private readonly revisions = httpResource<{ revisions: RevisionChoice[] }>(() => {
    const id = this.context.projectId();
    return id ? revisionsUrl(id) : undefined;
  });

  protected readonly rows = computed(() => (this.resultSets.hasValue() ? this.resultSets.value().resultSets : []));
  protected readonly loadError = computed(() => {
    const error = this.resultSets.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly canImport = computed(() => this.context.can('results.upload'));
  private readonly revisionNumbers = computed(
    () => new Map((this.revisions.hasValue() ? this.revisions.value().revisions : []).map((revision) => [revision.id, revision.number])),
  );

  protected revisionLabel(resultSet: ResultSet): string {
    const number = this.revisionNumbers().get(resultSet.modelRevisionId);
    return number === undefined ? '—' : `Revision ${number}`;
  }
}
