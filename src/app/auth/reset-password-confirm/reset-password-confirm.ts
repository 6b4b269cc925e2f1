import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { errorMessage } from '../../core/api-error';
import { AuthApi, passwordResetUrl, linkProblemOf } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';
import { NewPasswordFields } from '../new-password-fields/new-password-fields';
import { createNewPasswordForm } from '../password-rules';

/** Opened from the e-mailed link `/reset-password/:token`. */
@Component({
  selector: 'tl-reset-password-confirm',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, AuthCard, NewPasswordFields],
  templateUrl: './reset-password-confirm.html',
  styleUrl: './reset-password-confirm.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordConfirm {
  private readonly api = inject(AuthApi);

  readonly token = input.required<string>();

  protected readonly link = httpResource<{ email: string }>(() => passwordResetUrl(this.token()));
  protected readonly linkProblem = computed(() => {
    const error = this.link.error();
    return error ? linkProblemOf(error) : null;
  });

  protected readonly form = createNewPasswordForm();
  protected readonly saving = signal(false);
  protected readonly done = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected setPassword(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.resetPassword(this.token(), this.form.getRawValue().password).subscribe({
      next: () => {
        this.saving.set(false);
        this.done.set(true);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(errorMessage(error));
      },
    });
  }
}
