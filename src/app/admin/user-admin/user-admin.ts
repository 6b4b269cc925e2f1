import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { filter, Observable } from 'rxjs';
import { errorMessage } from '../../core/api-error';
import { askToConfirm } from '../../core/confirm-dialog/confirm-dialog';
import { Session } from '../../core/session';
import { AdminUser } from '../admin-user';
import { InviteUserDialog } from '../invite-user-dialog/invite-user-dialog';
import { UsersApi } from '../users-api';

/** Site admins: everyone with an account, invitations, deactivation and reset e-mails. */
@Component({
  selector: 'tl-user-admin',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatMenuModule],
  templateUrl: './user-admin.html',
  styleUrl: './user-admin.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserAdmin {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject(MatDialog);
  private readonly session = inject(Session);

  protected readonly users = httpResource<{ users: AdminUser[] }>(() => '/api/users');
  protected readonly rows = computed(() => (this.users.hasValue() ? this.users.value().users : []));
  protected readonly loadError = computed(() => {
    const error = this.users.error();
    return error ? errorMessage(error) : null;
  });
  protected readonly currentUserId = computed(() => this.session.user()?.id);
  protected readonly busy = signal(false);
  protected readonly notice = signal<{ text: string; failed: boolean } | null>(null);

  protected openInviteDialog(): void {
    this.dialog
      .open<InviteUserDialog, void, string>(InviteUserDialog, { width: '560px' })
      .afterClosed()
      .pipe(filter((email): email is string => !!email))
      .subscribe((email) => this.notice.set({ text: `Invitation sent to ${email}.`, failed: false }));
  }

  protected toggleActive(user: AdminUser): void {
    if (!user.active) {
      this.write(this.api.setActive(user.id, true), `${user.name} can sign in again.`);
      return;
    }
    askToConfirm(this.dialog, {
      title: `Deactivate ${user.name}?`,
      message: `${user.name} is signed out everywhere and cannot sign in until reactivated. Their work stays.`,
      confirmLabel: 'Deactivate',
    })
      .pipe(filter(Boolean))
      .subscribe(() => this.write(this.api.setActive(user.id, false), `${user.name} was deactivated.`));
  }

  protected sendPasswordReset(user: AdminUser): void {
    this.write(this.api.sendPasswordReset(user.id), `A password reset link was sent to ${user.email}.`);
  }

  private write(request: Observable<unknown>, success: string): void {
    this.busy.set(true);
    this.notice.set(null);
    request.subscribe({
      next: () => {
        this.busy.set(false);
        this.notice.set({ text: success, failed: false });
        this.users.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.notice.set({ text: errorMessage(error), failed: true });
      },
    });
  }
}
