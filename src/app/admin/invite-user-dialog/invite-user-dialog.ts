import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { errorMessage } from '../../core/api-error';
import { ProjectRole } from '../../core/permissions';
import { Project } from '../../projects/project';
import { RoleField } from '../../projects/role-field/role-field';
import { InvitationRequest } from '../admin-user';
import { UsersApi } from '../users-api';

/** Invites someone by e-mail, optionally straight into a project with a role. Closes with the address. */
@Component({
  selector: 'tl-invite-user-dialog',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    RoleField,
  ],
  templateUrl: './invite-user-dialog.html',
  styleUrl: './invite-user-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteUserDialog {
  private readonly api = inject(UsersApi);
  private readonly dialogRef = inject<MatDialogRef<InviteUserDialog, string>>(MatDialogRef);

  protected readonly projects = httpResource<{ projects: Project[] }>(() => ({
    url: '/api/projects',
    params: { archived: 'false' },
  }));
  protected readonly projectOptions = computed(() => (this.projects.hasValue() ? this.projects.value().projects : []));

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
    name: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(120)] }),
    isAdmin: new FormControl(false, { nonNullable: true }),
    projectId: new FormControl('', { nonNullable: true }),
    role: new FormControl<ProjectRole>('engineer', { nonNullable: true }),
  });
  protected readonly sending = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected sendInvitation(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const request = invitationRequestOf(this.form.getRawValue());
    this.sending.set(true);
    this.failure.set(null);
    this.api.invite(request).subscribe({
      next: () => this.dialogRef.close(request.email),
      error: (error: unknown) => {
        this.sending.set(false);
        this.failure.set(errorMessage(error));
      },
    });
  }
}

/** Leaves out what the admin left empty; a role is only sent with a project. */
export function invitationRequestOf(value: {
  email: string;
  name: string;
  isAdmin: boolean;
  projectId: string;
  role: ProjectRole;
}): InvitationRequest {
  const request: InvitationRequest = { email: value.email.trim(), isAdmin: value.isAdmin };
  if (value.name.trim()) request.name = value.name.trim();
  if (value.projectId) {
    request.projectId = value.projectId;
    request.role = value.role;
  }
  return request;
}
