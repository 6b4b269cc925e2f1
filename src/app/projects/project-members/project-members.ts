import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { filter, Observable } from 'rxjs';
import { errorMessage } from '../../core/api-error';
import { askToConfirm } from '../../core/confirm-dialog/confirm-dialog';
import { PROJECT_ROLES, ProjectRole, ROLE_LABELS } from '../../core/permissions';
import { Session } from '../../core/session';
import { Member } from '../project';
import { ProjectContext } from '../project-context';
import { membersUrl, ProjectMembersApi } from '../project-members-api';
import { RoleField } from '../role-field/role-field';

/** Who is in the project and in which role; coordinators add, re-role and remove members. */
@Component({
  selector: 'tl-project-members',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    RoleField,
  ],
  templateUrl: './project-members.html',
  styleUrl: './project-members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectMembers {
  private readonly api = inject(ProjectMembersApi);
  private readonly dialog = inject(MatDialog);
  private readonly session = inject(Session);
  protected readonly context = inject(ProjectContext);

  protected readonly roles = PROJECT_ROLES;
  protected readonly roleLabels = ROLE_LABELS;

  protected readonly members = httpResource<{ members: Member[] }>(() => {
    const id = this.context.projectId();
    return id ? membersUrl(id) : undefined;
  });
  protected readonly rows = computed(() => (this.members.hasValue() ? this.members.value().members : []));
  protected readonly loadError = computed(() => {
    const error = this.members.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly canManage = computed(() => this.context.can('members.manage'));
  protected readonly currentUserId = computed(() => this.session.user()?.id);

  protected readonly busy = signal(false);
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);

  protected readonly addForm = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
    role: new FormControl<ProjectRole>('engineer', { nonNullable: true }),
  });

  protected addMember(): void {
    if (this.addForm.invalid) {
      this.addForm.markAllAsTouched();
      return;
    }
    const { email, role } = this.addForm.getRawValue();
    this.write(this.api.add(this.context.projectId(), email.trim(), role), (addition) => {
      this.addForm.reset({ email: '', role });
      return `An invitation was sent to ${addition.invitation.email}. They join as ${ROLE_LABELS[role].toLowerCase()} once they accept it.`;
    });
  }

  protected changeRole(member: Member, role: ProjectRole): void {
    if (role === member.role) return;
    this.write(
      this.api.changeRole(this.context.projectId(), member.userId, role),
      () => `${member.name} is now ${ROLE_LABELS[role].toLowerCase()}.`,
    );
  }

  protected removeMember(member: Member): void {
    askToConfirm(this.dialog, {
      title: `Remove ${member.name}?`,
      message: `${member.name} will no longer see this project. Their past work stays in its records.`,
      confirmLabel: 'Remove',
    })
      .pipe(filter(Boolean))
      .subscribe(() =>
        this.write(this.api.remove(this.context.projectId(), member.userId), () => `${member.name} was removed.`),
      );
  }

  private write<T>(request: Observable<T>, describe: (result: T) => string): void {
    this.busy.set(true);
    this.notice.set(null);
    request.subscribe({
      next: (result) => {
        this.busy.set(false);
        this.notice.set({ text: describe(result), failed: false });
        this.members.reload();
        // One's own role may have changed.
        this.context.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.notice.set({ text: errorMessage(error), failed: true });
        // A refused role change leaves the select showing the old role again.
        this.members.reload();
      },
    });
  }
}
