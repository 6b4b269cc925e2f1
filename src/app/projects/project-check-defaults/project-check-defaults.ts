import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { errorMessage } from '../../core/api-error';
import { gradesFor } from '../../checks/check-parameter-fields';
import type { Project } from '../project';
import { ProjectsApi } from '../projects-api';
import {
  type CheckDefaultsForm,
  checkDefaultsOf,
  createCheckDefaultsForm,
  ETA_RANGE,
  FACTOR_RANGE,
  usesEnFactors,
  WARNING_PERCENT_RANGE,
} from './check-defaults-form';

/**
 * The starting values of every new check run in this project, shown to every member and edited by those who may
 * edit the project. National annexes choose γM0, γM1 and η, so they live with the project, not with the code.
 */
@Component({
  selector: 'tl-project-check-defaults',
  imports: [DecimalPipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './project-check-defaults.html',
  styleUrl: './project-check-defaults.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectCheckDefaults {
  private readonly api = inject(ProjectsApi);

  readonly project = input.required<Project>();
  readonly canEdit = input(false);
  /** After a save, with the saved project. */
  readonly saved = output<Project>();

  protected readonly form = signal<CheckDefaultsForm | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly enFactors = computed(() => usesEnFactors(this.project().standard));
  protected readonly grades = computed(() => gradesFor(this.project().standard));
  protected readonly factorRange = FACTOR_RANGE;
  protected readonly etaRange = ETA_RANGE;
  protected readonly warningRange = WARNING_PERCENT_RANGE;

  protected startEditing(): void {
    this.failure.set(null);
    this.form.set(createCheckDefaultsForm(this.project().standard, this.project().settings));
  }

  protected cancel(): void {
    this.form.set(null);
  }

  protected save(form: CheckDefaultsForm): void {
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    const project = this.project();
    this.busy.set(true);
    this.failure.set(null);
    this.api.update(project.id, { settings: checkDefaultsOf(project.standard, form) }).subscribe({
      next: (updated) => {
        this.busy.set(false);
        this.form.set(null);
        this.saved.emit(updated);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(errorMessage(error));
      },
    });
  }
}
