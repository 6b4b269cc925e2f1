import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { Router, RouterLink } from '@angular/router';
import { filter } from 'rxjs';
import { errorMessage } from '../../core/api-error';
import { ROLE_LABELS } from '../../core/permissions';
import { Session } from '../../core/session';
import { Project, standardLabel } from '../project';
import { ProjectCreateDialog } from '../project-create-dialog/project-create-dialog';

/** The projects the user belongs to (all of them for a site admin), active or archived. */
@Component({
  selector: 'tl-project-list',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatSlideToggleModule],
  templateUrl: './project-list.html',
  styleUrl: './project-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectList {
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  protected readonly session = inject(Session);

  protected readonly showArchived = signal(false);
  protected readonly projects = httpResource<{ projects: Project[] }>(() => ({
    url: '/api/projects',
    // Archived projects join the list, marked as such, rather than replacing it.
    params: { archived: this.showArchived() ? 'all' : 'false' },
  }));

  protected readonly rows = computed(() =>
    (this.projects.hasValue() ? this.projects.value().projects : []).map((project) => ({
      ...project,
      standardLabel: standardLabel(project.standard),
      roleLabel: project.role ? ROLE_LABELS[project.role] : null,
    })),
  );
  protected readonly loadError = computed(() => {
    const error = this.projects.error();
    return error ? errorMessage(error) : null;
  });

  protected openCreateDialog(): void {
    this.dialog
      .open<ProjectCreateDialog, void, Project>(ProjectCreateDialog, { width: '640px', autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(filter((project): project is Project => !!project))
      .subscribe(async (project) => {
        // The creator is now this project's coordinator; the session must know before the guard asks.
        await this.session.refresh();
        await this.router.navigate(['/projects', project.id]);
      });
  }
}
