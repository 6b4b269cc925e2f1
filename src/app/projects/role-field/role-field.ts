import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { PROJECT_ROLES, ProjectRole, ROLE_LABELS } from '../../core/permissions';

/** Picks a project role, for adding members and for invitations into a project. */
@Component({
  selector: 'tl-role-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatSelectModule],
  templateUrl: './role-field.html',
  styleUrl: './role-field.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoleField {
  readonly control = input.required<FormControl<ProjectRole>>();

  protected readonly roles = PROJECT_ROLES;
  protected readonly roleLabels = ROLE_LABELS;
}
