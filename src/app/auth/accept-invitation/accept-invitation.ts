import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { Session } from '../../core/session';
import { errorMessage } from '../../core/api-error';
import { AuthApi, invitationUrl, InvitationPreview, linkProblemOf } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';
import { NewPasswordFields } from '../new-password-fields/new-password-fields';
import { createNewPasswordForm } from '../password-rules';

/**
 * Opened from the e-mailed link `/invitations/:token`: name and password create the account, or the holder of an
 * existing account signs in and joins the project.
 */
@Component({
  selector: 'tl-accept-invitation',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    AuthCard,
    NewPasswordFields,
  ],
  templateUrl: './accept-invitation.html',
  styleUrl: './accept-invitation.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitation {
  private readonly api = inject(AuthApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  readonly token = input.required<string>();

  protected readonly invitation = httpResource<InvitationPreview>(() => invitationUrl(this.token()));
  protected readonly problem = computed(() => {
    const error = this.invitation.error();
    return error ? linkProblemOf(error) : null;
  });

  protected readonly signedInAsInvitee = computed(
    () => this.invitation.hasValue() && this.session.user()?.email === this.invitation.value().email,
  );
  protected readonly signInLink = computed(() => ({ returnUrl: `/invitations/${this.token()}` }));

  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    password: createNewPasswordForm(),
  });
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    // The admin may have typed a name already; the invitee can still change it.
    effect(() => {
      const name = this.form.controls.name;
      if (this.invitation.hasValue() && !name.dirty) name.setValue(this.invitation.value().name ?? '');
    });
  }

  protected async acceptInvitation(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, password } = this.form.getRawValue();
    this.saving.set(true);
    this.failure.set(null);
    try {
      await firstValueFrom(this.api.acceptInvitation(this.token(), name.trim(), password.password));
      await this.session.signedInByServer();
      await this.router.navigateByUrl('/projects');
    } catch (error) {
      this.failure.set(errorMessage(error));
    } finally {
      this.saving.set(false);
    }
  }

  protected async joinProject(): Promise<void> {
    this.saving.set(true);
    this.failure.set(null);
    try {
      const { projectId } = await firstValueFrom(this.api.joinInvitation(this.token()));
      await this.session.signedInByServer();
      await this.router.navigateByUrl(projectId ? `/projects/${projectId}` : '/projects');
    } catch (error) {
      this.failure.set(errorMessage(error));
    } finally {
      this.saving.set(false);
    }
  }
}
