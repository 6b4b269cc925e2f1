import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { errorMessage } from '../../core/api-error';
import { Project } from '../project';
import { createProjectForm, ProjectFields, projectDraftOf } from '../project-fields/project-fields';
import { ProjectsApi } from '../projects-api';

/** Creates a project; closes with the new project, whose creator becomes its coordinator. */
@Component({
  selector: 'tl-project-create-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, ProjectFields],
  templateUrl: './project-create-dialog.html',
  styleUrl: './project-create-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectCreateDialog {
  private readonly api = inject(ProjectsApi);
  private readonly dialogRef = inject<MatDialogRef<ProjectCreateDialog, Project>>(MatDialogRef);

  protected readonly form = createProjectForm();
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected createProject(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.create(projectDraftOf(this.form)).subscribe({
      next: (project) => this.dialogRef.close(project),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(errorMessage(error));
      },
    });
  }
}
