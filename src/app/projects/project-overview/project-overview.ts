import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { filter, Observable } from 'rxjs';
import { errorMessage } from '../../core/api-error';
import { CautionsNotice } from '../../core/cautions-notice/cautions-notice';
import { askToConfirm } from '../../core/confirm-dialog/confirm-dialog';
import { ROLE_LABELS } from '../../core/permissions';
import { Project, standardLabel } from '../project';
import { ProjectCheckDefaults } from '../project-check-defaults/project-check-defaults';
import { ProjectContext } from '../project-context';
import { createProjectForm, ProjectFields, ProjectForm, projectDraftOf } from '../project-fields/project-fields';
import { ProjectsApi } from '../projects-api';

/** The project's details and check defaults, editable by coordinators, with archiving and the cautions. */
@Component({
  selector: 'tl-project-overview',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatIconModule, CautionsNotice, ProjectCheckDefaults, ProjectFields],
  templateUrl: './project-overview.html',
  styleUrl: './project-overview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectOverview {
  private readonly api = inject(ProjectsApi);
  private readonly dialog = inject(MatDialog);
  protected readonly context = inject(ProjectContext);

  protected readonly editForm = signal<ProjectForm | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected readonly standard = computed(() => {
    const project = this.context.project();
    return project ? standardLabel(project.standard) : '';
  });
  protected readonly roleLabel = computed(() => {
    const role = this.context.role();
    return role ? ROLE_LABELS[role] : 'Site admin (not a member)';
  });

  protected startEditing(project: Project): void {
    this.failure.set(null);
    this.editForm.set(createProjectForm(project));
  }

  protected cancelEditing(): void {
    this.editForm.set(null);
  }

  protected saveChanges(form: ProjectForm): void {
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    this.run(this.api.update(this.context.projectId(), projectDraftOf(form)), () => this.editForm.set(null));
  }

  protected toggleArchived(project: Project): void {
    const archiving = !project.archived;
    const request = archiving
      ? {
          title: `Archive ${project.name}?`,
          message: 'The project becomes a read-only record: nothing can be uploaded, run or changed until it is restored.',
          confirmLabel: 'Archive',
        }
      : {
          title: `Restore ${project.name}?`,
          message: 'Members can work in the project again.',
          confirmLabel: 'Restore',
        };
    askToConfirm(this.dialog, request)
      .pipe(filter(Boolean))
      .subscribe(() => this.run(this.api.setArchived(project.id, archiving)));
  }

  // Shared by every write on this page: one busy flag, one failure line, then a fresh project.
  private run(write: Observable<unknown>, done?: () => void): void {
    this.busy.set(true);
    this.failure.set(null);
    write.subscribe({
      next: () => {
        this.busy.set(false);
        done?.();
        this.context.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(errorMessage(error));
      },
    });
  }
}
