import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Project, PROJECT_CODE_PATTERN, PROJECT_FIELD_LIMITS, ProjectDraft, StandardId, STANDARDS } from '../project';

export type ProjectForm = FormGroup<{
  name: FormControl<string>;
  code: FormControl<string>;
  standard: FormControl<StandardId>;
  client: FormControl<string>;
  location: FormControl<string>;
  description: FormControl<string>;
}>;

// Spaces alone would pass `required` and then be trimmed to nothing.
function notBlank(control: AbstractControl<string>): ValidationErrors | null {
  return control.value.trim() ? null : { required: true };
}

function text(value: string, maxLength: number, required = false): FormControl<string> {
  const validators = [Validators.maxLength(maxLength), ...(required ? [notBlank] : [])];
  return new FormControl(value, { nonNullable: true, validators });
}

/** The project form, filled from `project` when editing. */
export function createProjectForm(project?: Project): ProjectForm {
  return new FormGroup({
    name: text(project?.name ?? '', PROJECT_FIELD_LIMITS.name, true),
    code: new FormControl(project?.code ?? '', {
      nonNullable: true,
      validators: [notBlank, Validators.pattern(PROJECT_CODE_PATTERN)],
    }),
    standard: new FormControl<StandardId>(project?.standard ?? 'aisc360-22-lrfd', { nonNullable: true }),
    client: text(project?.client ?? '', PROJECT_FIELD_LIMITS.client),
    location: text(project?.location ?? '', PROJECT_FIELD_LIMITS.location),
    description: text(project?.description ?? '', PROJECT_FIELD_LIMITS.description),
  });
}

export function projectDraftOf(form: ProjectForm): ProjectDraft {
  const value = form.getRawValue();
  return {
    name: value.name.trim(),
    code: value.code.trim(),
    standard: value.standard,
    client: value.client.trim(),
    location: value.location.trim(),
    description: value.description.trim(),
  };
}

/** The fields of a project, shared by the create dialog and the overview's edit form. */
@Component({
  selector: 'tl-project-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  templateUrl: './project-fields.html',
  styleUrl: './project-fields.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectFields {
  readonly form = input.required<ProjectForm>();

  protected readonly standards = STANDARDS;
  protected readonly limits = PROJECT_FIELD_LIMITS;
}
